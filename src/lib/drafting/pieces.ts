// From outline to cuttable piece: the seam line set to run one way, the cutting line offset from it by
// each edge's allowance, notches moved out to the cutting line, grain line, fold, labels.
import { add, controlBox, dist, dot, sub, mul, normalOf, pointAt, segmentLength, tangentAt, type ClosedPath, type Edge, type Point, type Segment } from './geometry';
import { boundsOf, flatten, orientPositive, type Bounds } from './outline';
import { cuttingLine } from './offset';
import type { ResolvedChoice } from './options';
import type { HouseRules } from './rules';
import type { MarkLine, Outline } from './styles/common';
import { formatLength, type Units } from './units';

/** How a piece is cut: how many, and whether on the fold (one piece opened out from a folded layer). */
export interface CutInstruction {
	count: number;
	onFold: boolean;
}

/** A notch: a short tick cut into the allowance at `at` on the cutting line, pointing into the piece. */
export interface Notch {
	at: Point;
	inward: Point;
	depth: number;
	double: boolean;
	label?: string;
}

/** A dart as marked on the piece: leg tops, point, intake and length. */
export interface PieceDart {
	top1: Point;
	point: Point;
	top2: Point;
	intake: number;
	length: number;
}

/** Text on a piece (Lora), in cm of the piece's own coordinates. */
export interface Label {
	text: string;
	at: Point;
	size: number;
	angle: number;
	/** 'allowances' is written again in the drawing's units when drawn. */
	kind: 'name' | 'cut' | 'note' | 'allowances';
}

/** A pattern piece ready to cut: seam and cutting lines as closed paths of lines and cubic curves. */
export interface Piece {
	id: string;
	name: string;
	/** Shell (the skirt fabric) or lining fabric. */
	fabric: 'shell' | 'lining';
	role: Outline['role'];
	cut: CutInstruction;
	/** "Cut 1 on the fold", "Cut 2 (a pair)"... */
	cutText: string;
	seam: ClosedPath;
	cutting: ClosedPath;
	/** Allowance (cm) on each kind of edge this piece has. */
	allowances: Partial<Record<Edge, number>>;
	grain: { from: Point; to: Point };
	fold?: { from: Point; to: Point };
	darts: PieceDart[];
	notches: Notch[];
	lines: MarkLine[];
	labels: Label[];
	/** Extent of the cutting line. */
	bounds: Bounds;
}

/** The allowance on an edge of a piece, from the house rules and the choice. */
export function allowanceFor(edge: Edge, o: Pick<Outline, 'role'>, choice: ResolvedChoice, rules: HouseRules): number {
	const a = rules.allowances;
	switch (edge) {
		case 'fold':
			return 0;
		case 'hem':
		case 'vent-hem':
			return o.role === 'lining' ? a.liningHem : choice.hemDepth;
		case 'side':
			return choice.closure.position === 'side' ? a.zipSeam : a.seam;
		case 'centre':
			return choice.closure.position === 'centre-back' ? a.zipSeam : a.seam;
		case 'facing-edge':
			return a.facingEdge;
		default:
			return a.seam;
	}
}

const CUT_WORDS: Record<number, string> = { 1: 'Cut 1', 2: 'Cut 2 (a pair)', 4: 'Cut 4 (two pairs)' };
/** The cut instruction in words, as printed on the piece. */
export const cutText = (c: CutInstruction) => (c.onFold ? 'Cut 1 on the fold' : (CUT_WORDS[c.count] ?? `Cut ${c.count}`));

/** How far p lies outside a segment's control box (0 inside it). */
function boxGap(s: Segment, p: Point): number {
	const { x0, x1, y0, y1 } = controlBox(s);
	return Math.max(x0 - p.x, p.x - x1, y0 - p.y, p.y - y1, 0);
}

/** Nearest point on a path to p, with the segment it lies on and the direction there. Only segments whose
 * control box comes near p are searched (a curve lies inside its control points' box). */
function nearest(segs: Segment[], p: Point) {
	const gaps = segs.map((s) => boxGap(s, p));
	const near = Math.min(...gaps) + 1e-6;
	let best = { d: Infinity, seg: segs[0], t: 0 };
	segs.forEach((s, k) => {
		if (gaps[k] > near + 0.5) return;
		if (s.kind === 'line') {
			const d = sub(s.to, s.from);
			const t = Math.min(1, Math.max(0, dot(sub(p, s.from), d) / Math.max(dot(d, d), 1e-12)));
			const e = dist(pointAt(s, t), p);
			if (e < best.d) best = { d: e, seg: s, t };
			return;
		}
		for (let i = 0; i <= 24; i++) {
			const d = dist(pointAt(s, i / 24), p);
			if (d < best.d) best = { d, seg: s, t: i / 24 };
		}
	});
	let { t } = best;
	for (let step = best.seg.kind === 'line' ? 0 : 1 / 48; step > 1e-7; step /= 2) {
		for (const c of [t - step, t + step]) {
			if (c >= 0 && c <= 1 && dist(pointAt(best.seg, c), p) < dist(pointAt(best.seg, t), p)) t = c;
		}
	}
	return { seg: best.seg, tangent: tangentAt(best.seg, t), point: pointAt(best.seg, t) };
}

/** The run across the piece at height y that is widest (x0..x1). */
function runAt(poly: Point[], y: number): [number, number] | null {
	const xs: number[] = [];
	for (let i = 0; i < poly.length; i++) {
		const p = poly[i];
		const q = poly[(i + 1) % poly.length];
		if ((p.y <= y && q.y > y) || (q.y <= y && p.y > y)) xs.push(p.x + ((y - p.y) / (q.y - p.y)) * (q.x - p.x));
	}
	xs.sort((a, c) => a - c);
	let best: [number, number] | null = null;
	for (let i = 0; i + 1 < xs.length; i += 2) if (!best || xs[i + 1] - xs[i] > best[1] - best[0]) best = [xs[i], xs[i + 1]];
	return best;
}

/** The widest level run across the piece, weighted toward its middle: a good place for its name. */
function labelAnchor(poly: Point[], b: Bounds): { y: number; run: [number, number] } {
	let best = { y: (b.minY + b.maxY) / 2, run: [b.minX, b.maxX] as [number, number], score: 0 };
	for (let k = 1; k < 10; k++) {
		const y = b.minY + ((b.maxY - b.minY) * k) / 10;
		const run = runAt(poly, y);
		const score = run ? (run[1] - run[0]) * (1 - Math.abs(k - 5) / 10) : 0;
		if (run && score > best.score) best = { y, run, score };
	}
	return best;
}

/** The part of a run beside the grain line with the more room, so labels never sit on the arrow. */
function besideGrain(run: [number, number], gx: number): [number, number] {
	if (gx <= run[0] || gx >= run[1]) return run;
	const left: [number, number] = [run[0], gx - 0.8];
	const right: [number, number] = [gx + 0.8, run[1]];
	return right[1] - right[0] >= left[1] - left[0] ? right : left;
}

/** Vertical run of the grain line at x, kept inside the seam line. */
function grainAt(poly: Point[], x: number): { from: Point; to: Point } {
	const ys: number[] = [];
	for (let i = 0; i < poly.length; i++) {
		const p = poly[i];
		const q = poly[(i + 1) % poly.length];
		if ((p.x <= x && q.x > x) || (q.x <= x && p.x > x)) ys.push(p.y + ((x - p.x) / (q.x - p.x)) * (q.y - p.y));
	}
	ys.sort((a, b) => a - b);
	let lo = ys[0] ?? 0;
	let hi = ys[1] ?? 0;
	for (let i = 0; i + 1 < ys.length; i += 2) if (ys[i + 1] - ys[i] > hi - lo) [lo, hi] = [ys[i], ys[i + 1]];
	const inset = Math.min(6, (hi - lo) * 0.15);
	return { from: { x, y: lo + inset }, to: { x, y: hi - inset } };
}

/** The allowances a piece carries, in words ("Allowances included: seams 1.5 cm / 2 cm · hem 4 cm"). */
export function allowanceText(a: Partial<Record<Edge, number>>, units: Units = 'cm'): string {
	const parts: string[] = [];
	const seamKinds: Edge[] = ['waist', 'side', 'centre', 'gore', 'vent', 'band-edge', 'band-end', 'bag', 'bag-seam'];
	const values = [...new Set(seamKinds.map((k) => a[k]).filter((v): v is number => v !== undefined))].sort((x, y) => x - y);
	if (values.length) parts.push(`seams ${values.map((v) => formatLength(v, units)).join(' / ')}`);
	if (a.hem !== undefined) parts.push(`hem ${formatLength(a.hem, units)}`);
	if (a['facing-edge'] !== undefined) parts.push(`lower edge ${formatLength(a['facing-edge'], units)}`);
	return `Allowances included: ${parts.join(' · ')}`;
}

/** Name, cut instruction, notes and allowances stacked at the widest part of the piece, sized to fit
 * (Lora's figures run about half an em wide); along the piece when it is long and narrow. */
function layoutLabels(o: Outline, allowances: Partial<Record<Edge, number>>, poly: Point[]): Label[] {
	const sb = boundsOf(poly);
	const lines: { text: string; kind: Label['kind']; rel: number }[] = [
		{ text: o.name, kind: 'name', rel: 1 },
		{ text: o.fabric === 'lining' ? `${cutText(o.cut)} · lining fabric` : cutText(o.cut), kind: 'cut', rel: 0.62 },
		...o.notes.map((text) => ({ text, kind: 'note' as const, rel: 0.5 })),
		{ text: allowanceText(allowances), kind: 'allowances', rel: 0.42 }
	];
	const thickness = (b: number) => lines.reduce((t, l) => t + l.rel * b * 1.35, 0);
	// Size of the name that fits a room `along` the lines and `across` them.
	const fit = (along: number, across: number) => {
		let base = Math.min(2, ...lines.map((l) => along / (0.52 * l.text.length * l.rel)));
		if (thickness(base) > across) base *= across / thickness(base);
		return Math.max(0.35, base);
	};
	const midY = (sb.minY + sb.maxY) / 2;
	const level = labelAnchor(poly, sb);
	const [h0, h1] = besideGrain(level.run, o.grainX);
	const flat = { base: fit((h1 - h0) * 0.9, (sb.maxY - sb.minY) * 0.5), cx: (h0 + h1) / 2, y: level.y, upright: false };
	const [u0, u1] = besideGrain(runAt(poly, midY) ?? [sb.minX, sb.maxX], o.grainX);
	const tall = { base: fit((sb.maxY - sb.minY) * 0.7, (u1 - u0) * 0.9), cx: (u0 + u1) / 2, y: midY, upright: true };
	// Written along the piece when that gives clearly larger letters (long narrow panels, the band).
	const pick = tall.base > flat.base * 1.25 ? tall : flat;
	const total = thickness(pick.base);
	let run = -total / 2;
	return lines.map((l) => {
		const size = l.rel * pick.base;
		const mid = run + (size * 1.35) / 2;
		run += size * 1.35;
		// Turned a quarter (reading down the piece), each next line stands to the left of the one before.
		const at = pick.upright ? { x: pick.cx - mid, y: pick.y } : { x: pick.cx, y: pick.y + mid };
		return { text: l.text, at, size, angle: pick.upright ? 90 : 0, kind: l.kind };
	});
}

/** Turns an outline into a piece. */
export function toPiece(o: Outline, choice: ResolvedChoice, rules: HouseRules): Piece {
	const seam = orientPositive(o.segments);
	const allowance = (s: Segment) => allowanceFor(s.edge, o, choice, rules);
	const cutting = cuttingLine(seam, allowance);
	const allowances: Partial<Record<Edge, number>> = {};
	for (const s of seam) allowances[s.edge] = allowance(s);
	const notches: Notch[] = o.notches.map((n) => {
		const near = nearest(seam, n.at);
		const a = allowance(near.seg);
		const out = normalOf(near.tangent);
		return { at: add(near.point, mul(out, a)), inward: mul(out, -1), depth: Math.max(0.4, Math.min(0.7, a * 0.5)), double: !!n.double, label: n.label };
	});
	const cutPoly = flatten(cutting, 0.5);
	const seamPoly = flatten(seam, 0.5);
	const bounds = boundsOf(cutPoly);
	const folds = seam.filter((s) => s.edge === 'fold');
	const fold = folds.length ? { from: folds[0].from, to: folds[folds.length - 1].to } : undefined;
	const labels = layoutLabels(o, allowances, seamPoly);
	return {
		id: o.id,
		name: o.name,
		fabric: o.fabric,
		role: o.role,
		cut: o.cut,
		cutText: cutText(o.cut),
		seam: { segments: seam },
		cutting: { segments: cutting },
		allowances,
		grain: grainAt(seamPoly, o.grainX),
		fold,
		darts: o.darts.map((d) => ({ top1: d.top1, point: d.point, top2: d.top2, intake: d.intake, length: d.length })),
		notches,
		lines: o.lines,
		labels,
		bounds
	};
}

/** Length of the finished hem of the skirt: every panel's hem, times how many of it go round the body. */
export function hemGirth(pieces: Piece[]): number {
	let sum = 0;
	for (const p of pieces) {
		if (p.role !== 'panel') continue;
		const hem = p.seam.segments.filter((s) => s.edge === 'hem').reduce((a, s) => a + segmentLength(s), 0);
		sum += hem * (p.cut.onFold ? 2 : p.cut.count);
	}
	return sum;
}
