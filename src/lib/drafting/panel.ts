// One quarter panel of the block, drawn as a cutter draws it: centre line, waist curve through the darts,
// side seam curving from the raised side waist point into the hip line. Then trued: the waist seam,
// measured along the curve with the darts closed, is brought to exactly the intended quarter waist by
// moving the side waist point along the waist line (as a cutter takes a little off at the side).
import {
	P,
	cubic,
	dist,
	hermite,
	line,
	pointAt,
	rotate,
	segmentLength,
	tangentAt,
	unit,
	type CubicSegment,
	type Point,
	type Segment
} from './geometry';

/** A dart as drawn: two legs of equal length from the waist to the point, and the cap across its top. */
export interface DartGeom {
	/** Leg top nearer the centre line. */
	top1: Point;
	/** Leg top nearer the side seam. */
	top2: Point;
	point: Point;
	/** Peak of the waist across the dart: folded shut, the waist runs on smoothly. */
	cap: Point;
	intake: number;
	length: number;
}

/** What a panel is drafted from (cm; x from the centre line, y down from the waist line). */
export interface PanelSpec {
	kind: 'front' | 'back';
	hip: number;
	hipDepth: number;
	/** Back: centre taken in at the waist, ruled to the hip line. */
	centreShaping: number;
	/** Front: centre waist dropped below the waist line. */
	centreDrop: number;
	raise: number;
	darts: { intake: number; fromCentre: number; length: number }[];
	/** The waist seam this panel must measure with its darts closed. */
	seam: number;
	/** Dart points stay at or above this depth (the hip line less the house clearance). */
	pointLimit?: number;
	/** High hip: the side curve this much further out at the high hip level (HIGH_HIP below the waist). */
	highHip?: number;
	/** The widest angle at a dart's point (degrees): a dart held short by `pointLimit` takes no more. */
	maxAngle?: number;
}

/** A drafted quarter panel above the hip line (below it each style goes its own way). */
export interface Panel {
	spec: PanelSpec;
	centreTop: Point;
	centreHip: Point;
	/** The waist seam in parts: centre to first dart, between darts, last dart to the side. */
	waistParts: CubicSegment[][];
	darts: DartGeom[];
	sideTop: Point;
	hipPoint: Point;
	/** Side seam from the side waist point into the hip line. */
	hipCurve: CubicSegment;
	waistSeam: number;
}

/** x(t) of a cubic is monotone here (all handles point right): find t for a given x by bisection. */
function paramAtX(s: CubicSegment, x: number): number {
	let lo = 0;
	let hi = 1;
	for (let i = 0; i < 34; i++) {
		const m = (lo + hi) / 2;
		if (pointAt(s, m).x < x) lo = m;
		else hi = m;
	}
	return (lo + hi) / 2;
}

/** Where the high hip is measured: 8–10 cm below the waist (TRADE.md), or half the hip depth if less. */
export const highHipLevel = (hipDepth: number) => Math.min(9, 0.5 * hipDepth);

/** The side seam from the side waist point S into the hip point H, arriving plumb. It leaves S turned out
 * from the straight line, so it is fullest about half way down, as the body's hip curve is (a curve that
 * left along the straight line was fullest three quarters down). `lift` (0–1) makes it fuller higher up. */
function sideCurve(S: Point, H: Point, lift: number): CubicSegment {
	const shaping = Math.max(0, H.x - S.x);
	const drop = H.y - S.y;
	// c1 moves out and up, c2 down toward H as `lift` grows: the curve stands further out at every height
	// (so the high-hip fullness found by bisection is monotone); c1.x never passes H.x, so the curve never
	// bulges past the hip line.
	return cubic(S, P(S.x + (0.8 + 0.2 * lift) * shaping, S.y + (0.4 - 0.2 * lift) * drop), P(H.x, H.y - (0.35 - 0.15 * lift) * drop), H, 'side');
}

/** x of a curve running down (y increasing along it) at height y, by bisection. */
function xAtY(c: CubicSegment, y: number): number {
	let lo = 0;
	let hi = 1;
	for (let i = 0; i < 30; i++) {
		const m = (lo + hi) / 2;
		if (pointAt(c, m).y < y) lo = m;
		else hi = m;
	}
	return pointAt(c, (lo + hi) / 2).x;
}

/** The side curve, fuller at the high hip by `more` cm where the block allows (bisection on the lift). */
function fittedSideCurve(S: Point, H: Point, more: number, hipDepth: number): CubicSegment {
	const base = sideCurve(S, H, 0);
	if (more <= 1e-9 || H.x - S.x < 1e-6) return base;
	const y = highHipLevel(hipDepth);
	if (y <= S.y) return base;
	const target = xAtY(base, y) + more;
	let lo = 0;
	let hi = 1;
	if (xAtY(sideCurve(S, H, 1), y) <= target) return sideCurve(S, H, 1);
	for (let i = 0; i < 24; i++) {
		const m = (lo + hi) / 2;
		if (xAtY(sideCurve(S, H, m), y) < target) lo = m;
		else hi = m;
	}
	return sideCurve(S, H, (lo + hi) / 2);
}

/** The waist between two points, leaving `from` along `dir`: its start handle shortened (to no less than
 * about a fifth) until the curve sags no more than 0.5 mm below the lower of its two ends (a waist should run
 * on, never dip). The handle is found by bisection, not in fixed steps: a stepped handle made the waist seam
 * jump as the side point moved, and truing could not settle between the steps (found by the property tests). */
function waistRun(from: Point, dir: Point, to: Point, tTo: Point, h1: number): CubicSegment {
	const h = dist(from, to) / 3;
	const at = (k: number) => hermite(from, dir, to, tTo, 'waist', h * k, h1);
	const full = at(1);
	if (sag(full) <= 0.05) return full;
	const least = at(0.216);
	if (sag(least) > 0.05) return least;
	let lo = 0.216;
	let hi = 1;
	for (let i = 0; i < 40; i++) {
		const m = (lo + hi) / 2;
		if (sag(at(m)) <= 0.05) lo = m;
		else hi = m;
	}
	return at(lo);
}

/** How far a waist curve dips below the lower of its ends (y grows down the body). */
function sag(c: CubicSegment): number {
	const lower = Math.max(c.from.y, c.to.y);
	let worst = 0;
	for (let i = 1; i < 16; i++) worst = Math.max(worst, pointAt(c, i / 16).y - lower);
	return worst;
}

/** Handle at the side waist point: short enough that the waist does not dip below the line it rises from. */
function endHandle(from: Point, S: Point, tS: Point): number {
	const chord = dist(from, S) / 3;
	const sin = -tS.y;
	const rise = Math.max(0, from.y - S.y);
	return sin > 1e-6 ? Math.max(0.1 * chord, Math.min(chord, (0.8 * rise) / sin)) : chord;
}

function buildAt(spec: PanelSpec, sideX: number): Panel {
	const d = spec.hipDepth;
	const back = spec.kind === 'back';
	const C = P(back ? spec.centreShaping : 0, spec.centreDrop);
	const centreDir = back ? unit(P(-spec.centreShaping, d - C.y)) : P(0, 1);
	// The waist leaves the centre line square to it, so the pair of panels meets without a point or a dip.
	const tC = P(centreDir.y, -centreDir.x);
	const S = P(sideX, -spec.raise);
	const H = P(spec.hip, d);
	const hipCurve = fittedSideCurve(S, H, spec.highHip ?? 0, d);
	const u = tangentAt(hipCurve, 0);
	// Waist and side seam meet square, so front and back join into one smooth waist at the side.
	const tS = P(u.y, -u.x);
	const base = hermite(C, tC, S, tS, 'waist', dist(C, S) / 3, endHandle(C, S, tS));
	// The darts stay where they were planned while the side waist point keeps a tenth of the seam clear of
	// the last one; nearer, they move in with it (as shares of the width). A raised side (a higher hip) can
	// take the side point several cm in while truing: darts left in place crowded or passed it, and the waist
	// seam jumped about as the side point moved, so no truing could settle (found by the property tests).
	const last = spec.darts[spec.darts.length - 1];
	const reach = last ? last.fromCentre + last.intake / 2 + 0.1 * spec.seam : 0;
	const share = last ? Math.min(1, (sideX - C.x) / reach) : 1;
	const darts: DartGeom[] = [];
	const parts: CubicSegment[][] = [];
	let start = C;
	let startDir = tC;
	for (const dart of spec.darts) {
		const t = paramAtX(base, C.x + dart.fromCentre * share);
		const M = pointAt(base, t);
		const tM = tangentAt(base, t);
		// The point never passes the clearance above the hip line, wherever the waist meets the dart.
		const len = spec.pointLimit === undefined ? dart.length : Math.max(1, Math.min(dart.length, spec.pointLimit - M.y));
		// Where the waist dips lower than the plan allowed for (a slanted centre back under a hollow back on a
		// short depth), the dart is held shorter than planned: it then takes no more than the largest angle
		// allows and the side seam takes the rest (found by the property tests: 25.5° at depth 10).
		const intake = spec.maxAngle === undefined ? dart.intake : Math.min(dart.intake, 2 * len * Math.tan((spec.maxAngle * Math.PI) / 360));
		const half = intake / 2;
		const point = P(M.x, M.y + len);
		const beta = Math.atan2(half, len);
		const top1 = P(M.x - half, M.y);
		const top2 = P(M.x + half, M.y);
		// Each side of the dart is turned by half its angle, so folding it shut lines the two tangents up.
		const leftDir = rotate(tM, -beta);
		const rightDir = rotate(tM, beta);
		const capY = (top1.y + (leftDir.y / leftDir.x) * half + top2.y - (rightDir.y / rightDir.x) * half) / 2;
		darts.push({ top1, top2, point, cap: P(M.x, capY), intake, length: len });
		parts.push([darts.length > 1 ? waistRun(start, startDir, top1, leftDir, dist(start, top1) / 3) : hermite(start, startDir, top1, leftDir, 'waist')]);
		start = top2;
		startDir = rightDir;
	}
	parts.push([spec.darts.length ? waistRun(start, startDir, S, tS, endHandle(start, S, tS)) : hermite(start, startDir, S, tS, 'waist', dist(start, S) / 3, endHandle(start, S, tS))]);
	const waistSeam = parts.flat().reduce((sum, s) => sum + segmentLength(s), 0);
	return { spec, centreTop: C, centreHip: P(0, d), waistParts: parts, darts, sideTop: S, hipPoint: H, hipCurve, waistSeam };
}

/** Drafts the panel and trues its waist seam to spec.seam by moving the side waist point along the waist
 * line: secant steps kept inside a bracket, halving it whenever a step would leave it (plain secant steps
 * ran away on a small waist with a raised side, where the seam is far from straight in the side point). */
export function draftPanel(spec: PanelSpec): Panel {
	const total = spec.darts.reduce((s, d) => s + d.intake, 0);
	const inner = (spec.kind === 'back' ? spec.centreShaping : 0) + total;
	const at = (x: number) => {
		const p = buildAt(spec, x);
		return { x, p, e: p.waistSeam - spec.seam };
	};
	let a = at(inner + spec.seam);
	if (Math.abs(a.e) <= 1e-10) return a.p;
	// The bracket: the seam grows as the side point moves out. In from the drafted width lies the darts'
	// own width (a seam of almost nothing); out, the seam is never shorter than the straight run.
	let lo = a.e > 0 ? at(inner + 0.05 * spec.seam) : a;
	let hi = a.e > 0 ? a : at(inner + 2 * spec.seam + spec.raise);
	let b = at(a.x - a.e);
	for (let i = 0; i < 60 && Math.abs(b.e) > 1e-10; i++) {
		if (lo.e < 0 && hi.e > 0) {
			if (b.x > lo.x && b.x < hi.x) {
				if (b.e < 0) lo = b;
				else hi = b;
			}
		}
		const slope = Math.abs(b.x - a.x) > 1e-14 ? (b.e - a.e) / (b.x - a.x) : 0;
		let x = slope > 1e-3 ? b.x - b.e / slope : NaN;
		if (!(x > lo.x && x < hi.x)) x = (lo.x + hi.x) / 2;
		[a, b] = [b, at(x)];
	}
	return b.p;
}

/** The waist line as drawn on the pattern: the seam parts joined across each dart by its cap. */
export function waistWithCaps(panel: Pick<Panel, 'waistParts' | 'darts'>): Segment[] {
	const out: Segment[] = [];
	panel.waistParts.forEach((part, i) => {
		out.push(...part);
		const d = panel.darts[i];
		if (d) out.push(line(d.top1, d.cap, 'dart-cap'), line(d.cap, d.top2, 'dart-cap'));
	});
	return out;
}

/** Leg lengths of a dart (equal by construction; measured so the checks can say so). */
export const dartLegs = (d: DartGeom) => [dist(d.top1, d.point), dist(d.top2, d.point)];
