// What every style hands on to become pieces, and the parts most styles share: a side seam below the
// hip line, the hem squared to the seams, the back vent, the notches a cutter snips.
import type { Block } from '../block';
import type { BodySide } from '../fit';
import {
	P,
	add,
	alongPath,
	hermite,
	line,
	mul,
	normalOf,
	sub,
	unit,
	type Point,
	type Segment
} from '../geometry';
import type { ResolvedMeasurements } from '../measurements';
import type { ResolvedChoice } from '../options';
import type { DartGeom, Panel } from '../panel';
import type { HouseRules } from '../rules';

/** A notch to snip, on the seam line; `double` marks the back (two ticks), as the trade does. */
export interface NotchSpec {
	at: Point;
	double?: boolean;
	label?: string;
}

/** A marking line inside a piece (drawn pencil grey, dashed). */
export interface MarkLine {
	kind: 'hip-line' | 'fold-line' | 'band-fold' | 'vent-line' | 'trim-line';
	points: Point[];
}

/** A piece before allowances: its seam line, darts and markings, how it is cut. */
export interface Outline {
	id: string;
	name: string;
	fabric: 'shell' | 'lining';
	/** 'panel' pieces make up the skirt itself (they count toward the hem girth). */
	role: 'panel' | 'waistband' | 'facing' | 'lining' | 'pocket';
	cut: { count: number; onFold: boolean };
	segments: Segment[];
	darts: DartGeom[];
	/** Waist seam parts between the darts (for facings and checks), centre first. */
	waistParts: Segment[][];
	/** Side seam from the waist down, when the piece has one. */
	side: Segment[];
	notches: NotchSpec[];
	lines: MarkLine[];
	notes: string[];
	/** x of the grain line; it runs parallel to the centre line. */
	grainX: number;
}

/** Everything a style builder needs. */
export interface StyleContext {
	m: ResolvedMeasurements;
	rules: HouseRules;
	choice: ResolvedChoice;
	block: Block;
	/** Set when the wearer's left and right halves are drafted apart: which one this is. */
	bodySide?: BodySide;
}

/** A style's own pieces (before waist finish, lining and pockets are added) and its own figures. */
export interface StyleResult {
	panels: Outline[];
	waistRadius?: number;
	/** Builds the same panels at another length with no vent (for the lining). */
	lining: (length: number) => Outline[];
}

/** Side seam below the hip line: from the hip point, `length` cm along a direction turned out by `flare`
 * (cm at the hem; negative takes it in), so every seam below the hip keeps the same length. */
export function sideBelowHip(hip: Point, below: number, flare: number, outward: 1 | -1): Point {
	return add(hip, mul(unit(P(outward * flare, below)), below));
}

/** Hem from a seam corner to the centre hem, square to the seam at the corner and to the centre line. */
export function hemToCentre(corner: Point, seamDir: Point, centreHem: Point): Segment {
	const across = unit(sub(centreHem, corner));
	let t0 = normalOf(seamDir);
	if (t0.x * across.x + t0.y * across.y < 0) t0 = mul(t0, -1);
	return hermite(corner, t0, centreHem, P(Math.sign(centreHem.x - corner.x) || -1, 0), 'hem');
}

/** The back's centre edge from the hem up to the waist, with a vent or kick pleat extension when asked. */
export function backCentre(panel: Panel, length: number, vent: { kind: 'vent' | 'kick-pleat' | 'none'; length: number; extension: number }): Segment[] {
	const C = panel.centreTop;
	const hipC = panel.centreHip;
	const upper: Segment[] = [];
	if (vent.kind === 'none') upper.push(line(P(0, length), hipC, 'centre'));
	else {
		const e = vent.extension;
		const top = length - vent.length;
		upper.push(
			line(P(0, length), P(-e, length), 'vent-hem'),
			line(P(-e, length), P(-e, top + e), 'vent'),
			line(P(-e, top + e), P(0, top), 'vent'),
			line(P(0, top), hipC, 'centre')
		);
	}
	if (C.x > 1e-9) upper.push(line(hipC, C, 'centre'));
	else upper[upper.length - 1] = line(upper[upper.length - 1].from, C, 'centre');
	return upper;
}

/** Point on a run of segments at a distance from its start, with the seam's outward side ignored. */
export const at = (segs: Segment[], d: number) => alongPath(segs, d).point;

/** Notches every panel carries: hip line on the side seam (single front, double back), dart leg tops,
 * the zip's end, pocket openings. */
export function panelNotches(kind: 'front' | 'back', side: Segment[], hipAlongSide: number, darts: DartGeom[], ctx: StyleContext, centreZip?: Segment[]): NotchSpec[] {
	const out: NotchSpec[] = [];
	const back = kind === 'back';
	out.push({ at: at(side, hipAlongSide), double: back, label: 'hip' });
	for (const d of darts) out.push({ at: d.top1 }, { at: d.top2 });
	const { closure, pockets } = ctx.choice;
	if (closure.position === 'side') out.push({ at: at(side, closure.length), label: 'zip (left side)' });
	else if (back && centreZip) out.push({ at: at(centreZip, closure.length), label: 'zip' });
	if (pockets) {
		const p = ctx.rules.pocket;
		// With the zip in the left side seam, the pocket goes in the right one only.
		const label = closure.position === 'side' ? 'pocket (right side)' : 'pocket';
		out.push({ at: at(side, p.fromWaist), label }, { at: at(side, p.fromWaist + p.opening), label });
	}
	return out;
}

/** How the back is cut: with a centre back seam (a pair) when the zip or a vent is there, else on the fold. */
export const backCut = (ctx: StyleContext, hasVent: boolean) =>
	ctx.choice.closure.position === 'centre-back' || hasVent ? { count: 2, onFold: false } : { count: 1, onFold: true };

/** The waist seam of a block panel with its darts closed, from the centre to the side (for facings). */
export function waistPartsOf(panel: Panel): Segment[][] {
	return panel.waistParts.map((p) => [...p]);
}

/** Where the grain line goes on a panel: near `preferred` (a share of the hip width from the centre line),
 * but never across a dart, so the arrow and the dart legs stay apart. */
export function grainClearOfDarts(hip: number, darts: DartGeom[], preferred: number, from = 0): number {
	const clear = (x: number) => darts.every((d) => x < Math.min(d.top1.x, d.point.x) - 1.5 || x > Math.max(d.top2.x, d.point.x) + 1.5);
	for (const share of [preferred, preferred - 0.08, preferred + 0.1, preferred + 0.2, preferred - 0.15, 0.5]) {
		const x = from + share * (hip - from);
		if (clear(x)) return x;
	}
	return from + preferred * (hip - from);
}
