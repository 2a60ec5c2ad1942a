// A-line: slash from the point of the dart nearest the side straight down to the hem, close the dart
// (the side part turns about the dart point) so the hem opens; close only as much as the house flare
// wants, and let the side seam add whatever flare is still missing.
import {
	P,
	add,
	angleBetween,
	dist,
	line,
	mapSegments,
	mul,
	rotate,
	rotateAbout,
	segmentLength,
	sub,
	tangentAt,
	unit,
	type CubicSegment,
	type Point,
	type Segment
} from '../geometry';
import { rayRay } from '../intersect';
import { waistWithCaps, type DartGeom, type Panel } from '../panel';
import { backCentre, backCut, grainClearOfDarts, hemToCentre, panelNotches, type Outline, type StyleContext, type StyleResult } from './common';

/** The panel with its side-most dart closed by up to `flare` cm at the hem. */
export function closeDartIntoFlare(panel: Panel, length: number, flare: number, minIntake = 0) {
	const k = panel.darts.length - 1;
	if (k < 0) return { panel, opened: 0, turn: 0 };
	const dart = panel.darts[k];
	const pivot = dart.point;
	const full = angleBetween(sub(dart.top2, pivot), sub(dart.top1, pivot));
	const reach = length - pivot.y;
	let share = Math.min(1, flare / (Math.abs(full) * reach));
	// What is left open must be a dart worth sewing: a sliver under the house's smallest is closed too
	// (the hem flares that little more).
	if ((1 - share) * dart.intake < minIntake) share = 1;
	const turn = full * share;
	const rot = (p: Point) => rotateAbout(p, pivot, turn);
	const last = mapSegments(panel.waistParts[k + 1], rot) as CubicSegment[];
	const closed = Math.abs(turn - full) < 1e-12;
	const parts = panel.waistParts.slice(0, k + 1).map((p) => [...p]);
	const darts: DartGeom[] = panel.darts.slice(0, k);
	if (closed) parts[k] = [...parts[k], ...last];
	else {
		const top2 = rot(dart.top2);
		const end = parts[k][parts[k].length - 1];
		const m = rayRay(dart.top1, tangentAt(end, 1), top2, tangentAt(last[0], 0));
		const cap = m && m.s > 0 && m.s < dist(dart.top1, top2) ? add(dart.top1, mul(tangentAt(end, 1), m.s)) : P((dart.top1.x + top2.x) / 2, (dart.top1.y + top2.y) / 2);
		darts.push({ ...dart, top2, cap, intake: dist(dart.top1, top2) });
		parts.push(last);
	}
	const hipCurve = mapSegments([panel.hipCurve], rot)[0] as CubicSegment;
	const turned: Panel = { ...panel, waistParts: parts, darts, sideTop: rot(panel.sideTop), hipPoint: rot(panel.hipPoint), hipCurve };
	return { panel: turned, opened: Math.abs(turn) * reach, turn, pivot };
}

function aLinePanel(block: Panel, ctx: StyleContext, length: number, lining: boolean): Outline {
	const kind = block.spec.kind;
	const d = block.spec.hipDepth;
	const below = length - d;
	const flare = ctx.rules.styles.aLineFlare * below;
	// Front and back both turn their side-most dart into flare, so the flare is shared round the body
	// and the two side seams, equal in length, hang alike.
	const { panel, opened, turn, pivot } = closeDartIntoFlare(block, length, flare, ctx.rules.darts.minIntake);
	const H = panel.hipPoint;
	const down = rotate(P(0, 1), turn);
	const sideFlare = Math.max(0, flare - opened);
	const corner = add(H, mul(unit(add(mul(down, below), P(sideFlare, 0))), below));
	const side: Segment[] = [panel.hipCurve, line(H, corner, 'side')];
	const centreHem = P(0, length);
	const hem = hemToCentre(corner, unit(sub(corner, H)), centreHem);
	const cut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, false);
	const centre = kind === 'back' && !cut.onFold ? backCentre(panel, length, { kind: 'none', length: 0, extension: 0 }) : [line(centreHem, panel.centreTop, 'fold')];
	const centreDown: Segment[] = centre.map((s) => line(s.to, s.from, s.edge)).reverse();
	const hipLine: Point[][] = pivot
		? [
				[panel.centreHip, P(pivot.x, d)],
				[rotateAbout(P(pivot.x, d), pivot, turn), H]
			]
		: [[panel.centreHip, H]];
	return {
		id: `${kind}${lining ? '-lining' : ''}`,
		name: `${kind === 'front' ? 'Front' : 'Back'}${lining ? ' lining' : ''}`,
		fabric: lining ? 'lining' : 'shell',
		role: lining ? 'lining' : 'panel',
		cut,
		segments: [...waistWithCaps(panel), ...side, hem, ...centre],
		darts: panel.darts,
		waistParts: panel.waistParts,
		side,
		notches: panelNotches(kind, side, segmentLength(panel.hipCurve), panel.darts, ctx, cut.onFold ? undefined : centreDown),
		lines: hipLine.map((points) => ({ kind: 'hip-line' as const, points })),
		notes: [],
		grainX: grainClearOfDarts(block.spec.hip, panel.darts, 0.3)
	};
}

/** The A-line style. */
export function aLineStyle(ctx: StyleContext): StyleResult {
	const build = (length: number, lining: boolean) => [aLinePanel(ctx.block.front, ctx, length, lining), aLinePanel(ctx.block.back, ctx, length, lining)];
	return { panels: build(ctx.m.length, false), lining: (length) => build(length, true) };
}
