// Where outlines meet: the corner joins of the cutting line need the exact crossing of two offset
// stretches, and the checks need to know an outline never crosses itself.
import { cross, dot, pointAt, sub, type Point, type Segment } from './geometry';

/** A crossing: parameters on the first and second item. */
export interface Hit {
	a: number;
	b: number;
	at: Point;
}

/** Crossing of the infinite lines p + s·d and q + t·e (null when parallel). */
export function rayRay(p: Point, d: Point, q: Point, e: Point): { s: number; t: number } | null {
	const den = cross(d, e);
	if (Math.abs(den) < 1e-12) return null;
	const w = sub(q, p);
	return { s: cross(w, e) / den, t: cross(w, d) / den };
}

/** Real roots in [lo, hi] of a polynomial given by its coefficients, lowest power first (found by sign
 * changes on a fixed grid, then bisection: deterministic and safe for the low degrees used here). */
// Hot paths here use plain module functions rather than local named closures: some TypeScript runners
// wrap every named local function at each call, which costs more than the arithmetic.
function poly(c: number[], t: number): number {
	let acc = 0;
	for (let i = c.length - 1; i >= 0; i--) acc = acc * t + c[i];
	return acc;
}

function roots(c: number[], lo: number, hi: number): number[] {
	const n = 16;
	const out: number[] = [];
	let t0 = lo;
	let f0 = poly(c, t0);
	for (let i = 1; i <= n; i++) {
		const t1 = lo + ((hi - lo) * i) / n;
		const f1 = poly(c, t1);
		if (f0 === 0) out.push(t0);
		else if (f0 * f1 < 0) {
			let a = t0;
			let b = t1;
			let fa = f0;
			for (let k = 0; k < 46; k++) {
				const m = (a + b) / 2;
				const fm = poly(c, m);
				if (fa * fm <= 0) b = m;
				else {
					a = m;
					fa = fm;
				}
			}
			out.push((a + b) / 2);
		}
		t0 = t1;
		f0 = f1;
	}
	if (f0 === 0) out.push(t0);
	return out;
}

/** Crossings of the infinite line p + s·d with a segment (s free, segment parameter within [0, 1]). */
export function lineSegment(p: Point, d: Point, seg: Segment, slack = 1e-6): Hit[] {
	const n = { x: -d.y, y: d.x };
	if (seg.kind === 'line') {
		const r = rayRay(p, d, seg.from, sub(seg.to, seg.from));
		if (!r || r.t < -slack || r.t > 1 + slack) return [];
		return [{ a: r.s, b: r.t, at: pointAt(seg, r.t) }];
	}
	// Distance from the line is a cubic polynomial in t: solve it.
	const a0 = dot(sub(seg.from, p), n);
	const a1 = dot(sub(seg.c1, p), n);
	const a2 = dot(sub(seg.c2, p), n);
	const a3 = dot(sub(seg.to, p), n);
	const dd = dot(d, d);
	const coeffs = [a0, 3 * (a1 - a0), 3 * (a2 - 2 * a1 + a0), a3 - 3 * a2 + 3 * a1 - a0];
	return roots(coeffs, -slack, 1 + slack).map((t) => {
		const at = pointAt(seg, Math.min(1, Math.max(0, t)));
		return { a: dot(sub(at, p), d) / dd, b: t, at };
	});
}

function chordsOf(s: Segment): Point[] {
	const out: Point[] = [];
	for (let i = 0; i <= 16; i++) out.push(pointAt(s, i / 16));
	return out;
}

/** Crossings of two segments, parameters within [0, 1] on both. */
export function segmentSegment(s1: Segment, s2: Segment, slack = 1e-6): Hit[] {
	if (s1.kind === 'line') {
		const d = sub(s1.to, s1.from);
		return lineSegment(s1.from, d, s2, slack).filter((h) => h.a >= -slack && h.a <= 1 + slack);
	}
	if (s2.kind === 'line') return segmentSegment(s2, s1, slack).map((h) => ({ a: h.b, b: h.a, at: h.at }));
	// Two curves: cross their polylines (16 chords each), then polish each crossing by Newton steps.
	const f1 = chordsOf(s1);
	const f2 = chordsOf(s2);
	const hits: Hit[] = [];
	for (let i = 0; i < f1.length - 1; i++) {
		const ax0 = Math.min(f1[i].x, f1[i + 1].x);
		const ax1 = Math.max(f1[i].x, f1[i + 1].x);
		const ay0 = Math.min(f1[i].y, f1[i + 1].y);
		const ay1 = Math.max(f1[i].y, f1[i + 1].y);
		for (let j = 0; j < f2.length - 1; j++) {
			const q0 = f2[j];
			const q1 = f2[j + 1];
			if (Math.min(q0.x, q1.x) > ax1 || Math.max(q0.x, q1.x) < ax0 || Math.min(q0.y, q1.y) > ay1 || Math.max(q0.y, q1.y) < ay0) continue;
			const r = rayRay(f1[i], sub(f1[i + 1], f1[i]), q0, sub(q1, q0));
			if (!r || r.s < 0 || r.s > 1 || r.t < 0 || r.t > 1) continue;
			let a = (i + r.s) / (f1.length - 1);
			let b = (j + r.t) / (f2.length - 1);
			for (let k = 0; k < 6; k++) {
				const pa = pointAt(s1, a);
				const pb = pointAt(s2, b);
				const e = 1e-6;
				const da = sub(pointAt(s1, Math.min(1, a + e)), pa);
				const db = sub(pointAt(s2, Math.min(1, b + e)), pb);
				const q = rayRay(pa, da, pb, db);
				if (!q) break;
				a = Math.min(1, Math.max(0, a + q.s * e));
				b = Math.min(1, Math.max(0, b + q.t * e));
			}
			hits.push({ a, b, at: pointAt(s1, a) });
		}
	}
	return hits;
}

function properCross(p1: Point, p2: Point, q1: Point, q2: Point): boolean {
	const d1 = cross(sub(p2, p1), sub(q1, p1));
	const d2 = cross(sub(p2, p1), sub(q2, p1));
	const d3 = cross(sub(q2, q1), sub(p1, q1));
	const d4 = cross(sub(q2, q1), sub(p2, q1));
	const eps = 1e-9;
	return ((d1 > eps && d2 < -eps) || (d1 < -eps && d2 > eps)) && ((d3 > eps && d4 < -eps) || (d3 < -eps && d4 > eps));
}

/** True when a closed polygon crosses itself (edges sorted by left end and swept, so long outlines stay fast). */
export function selfIntersects(pts: Point[]): boolean {
	const n = pts.length;
	const edges = pts.map((p, i) => {
		const q = pts[(i + 1) % n];
		return { i, p, q, minX: Math.min(p.x, q.x), maxX: Math.max(p.x, q.x), minY: Math.min(p.y, q.y), maxY: Math.max(p.y, q.y) };
	});
	edges.sort((a, b) => a.minX - b.minX);
	for (let a = 0; a < edges.length; a++) {
		const e = edges[a];
		for (let b = a + 1; b < edges.length && edges[b].minX <= e.maxX; b++) {
			const f = edges[b];
			if (f.minY > e.maxY || f.maxY < e.minY) continue;
			const gap = Math.abs(e.i - f.i);
			if (gap === 1 || gap === n - 1) continue;
			if (properCross(e.p, e.q, f.p, f.q)) return true;
		}
	}
	return false;
}
