// Plane geometry for pattern pieces: points, line and cubic segments, paths. Centimetres, x to the
// right, y down the body (the waist line is y = 0, the hem y = length), as a cutter's table is read.

/** A point on the pattern, in cm. */
export interface Point {
	x: number;
	y: number;
}

/** What a stretch of outline is, so allowances, notches and checks can find it. */
export type Edge =
	| 'waist'
	| 'dart-cap'
	| 'side'
	| 'centre'
	| 'fold'
	| 'hem'
	| 'vent'
	| 'vent-hem'
	| 'gore'
	| 'band-edge'
	| 'band-end'
	| 'facing-edge'
	| 'bag'
	| 'bag-seam';

/** A straight stretch of outline. */
export interface LineSegment {
	kind: 'line';
	from: Point;
	to: Point;
	edge: Edge;
}

/** A cubic Bézier stretch of outline (curves are kept as curves, never as many tiny lines). */
export interface CubicSegment {
	kind: 'cubic';
	from: Point;
	c1: Point;
	c2: Point;
	to: Point;
	edge: Edge;
}

/** One stretch of an outline: a line or a cubic curve. */
export type Segment = LineSegment | CubicSegment;

/** A closed outline: each segment starts where the one before ends, the last ends at the first's start. */
export interface ClosedPath {
	segments: Segment[];
}

// Small vector helpers, used everywhere; each returns a new point.
export const P = (x: number, y: number): Point => ({ x, y });
export const add = (a: Point, b: Point): Point => ({ x: a.x + b.x, y: a.y + b.y });
export const sub = (a: Point, b: Point): Point => ({ x: a.x - b.x, y: a.y - b.y });
export const mul = (a: Point, k: number): Point => ({ x: a.x * k, y: a.y * k });
export const dot = (a: Point, b: Point) => a.x * b.x + a.y * b.y;
export const cross = (a: Point, b: Point) => a.x * b.y - a.y * b.x;
// Math.sqrt rather than Math.hypot: the same result for these magnitudes, many times faster in V8.
export const length = (a: Point) => Math.sqrt(a.x * a.x + a.y * a.y);
export const dist = (a: Point, b: Point) => {
	const dx = a.x - b.x;
	const dy = a.y - b.y;
	return Math.sqrt(dx * dx + dy * dy);
};
export const lerp = (a: Point, b: Point, t: number): Point => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });
export const unit = (a: Point): Point => {
	const l = length(a);
	return l < 1e-12 ? { x: 0, y: 0 } : { x: a.x / l, y: a.y / l };
};
export const rotate = (v: Point, angle: number): Point => {
	const c = Math.cos(angle);
	const s = Math.sin(angle);
	return { x: v.x * c - v.y * s, y: v.x * s + v.y * c };
};
export const rotateAbout = (p: Point, centre: Point, angle: number): Point => add(centre, rotate(sub(p, centre), angle));
/** Left-hand normal of a direction; for outlines of positive area it points out of the piece. */
export const normalOf = (d: Point): Point => ({ x: d.y, y: -d.x });
/** Signed angle turning vector a onto vector b. */
export const angleBetween = (a: Point, b: Point) => Math.atan2(cross(a, b), dot(a, b));

/** A straight segment on an edge. */
export const line = (from: Point, to: Point, edge: Edge): LineSegment => ({ kind: 'line', from, to, edge });
/** A cubic segment on an edge. */
export const cubic = (from: Point, c1: Point, c2: Point, to: Point, edge: Edge): CubicSegment => ({ kind: 'cubic', from, c1, c2, to, edge });

/** A cubic leaving `from` along direction t0 and arriving at `to` along t1, with the given handle lengths. */
export function hermite(from: Point, t0: Point, to: Point, t1: Point, edge: Edge, h0?: number, h1?: number): CubicSegment {
	const chord = dist(from, to) / 3;
	return cubic(from, add(from, mul(unit(t0), h0 ?? chord)), sub(to, mul(unit(t1), h1 ?? chord)), to, edge);
}

/** Point at parameter t (0 at the start, 1 at the end). */
export function pointAt(s: Segment, t: number): Point {
	if (s.kind === 'line') return lerp(s.from, s.to, t);
	const u = 1 - t;
	const a = u * u * u;
	const b = 3 * u * u * t;
	const c = 3 * u * t * t;
	const d = t * t * t;
	return { x: a * s.from.x + b * s.c1.x + c * s.c2.x + d * s.to.x, y: a * s.from.y + b * s.c1.y + c * s.c2.y + d * s.to.y };
}

/** Derivative (direction and speed) at parameter t. */
export function derivativeAt(s: Segment, t: number): Point {
	if (s.kind === 'line') return sub(s.to, s.from);
	const u = 1 - t;
	const a = 3 * u * u;
	const b = 6 * u * t;
	const c = 3 * t * t;
	return {
		x: a * (s.c1.x - s.from.x) + b * (s.c2.x - s.c1.x) + c * (s.to.x - s.c2.x),
		y: a * (s.c1.y - s.from.y) + b * (s.c2.y - s.c1.y) + c * (s.to.y - s.c2.y)
	};
}

/** Unit direction of travel at t; falls back to the next control point where a handle has zero length. */
export function tangentAt(s: Segment, t: number): Point {
	const d = derivativeAt(s, t);
	if (length(d) > 1e-9) return unit(d);
	if (s.kind === 'line') return { x: 1, y: 0 };
	const alt = t < 0.5 ? sub(s.c2, s.from) : sub(s.to, s.c1);
	return unit(length(alt) > 1e-9 ? alt : sub(s.to, s.from));
}

// 16-point Gauss–Legendre nodes on [0, 1]: exact enough for the smooth curves of a pattern, and fixed,
// so the same draft always measures the same.
const GL_X = [0.005299532504175031, 0.0277124884633837, 0.06718439880608412, 0.1222977958224985, 0.19106187779867811, 0.2709916111713863, 0.35919822461037054, 0.4524937450811813];
const GL_W = [0.013576229705877088, 0.031126761969323728, 0.0475792558412463, 0.062314485627767036, 0.07479799440828835, 0.08457825969750132, 0.09130170752246182, 0.09472530522753432];
/** The 16 Gauss–Legendre nodes and weights on [0, 1]. */
export const GX = [...GL_X, ...GL_X.map((x) => 1 - x).reverse()];
export const GW = [...GL_W, ...[...GL_W].reverse()];

function cubicLength(s: CubicSegment, t0: number, t1: number): number {
	// The derivative's Bernstein coefficients, then the speed at each node, without allocating points.
	const ax = 3 * (s.c1.x - s.from.x);
	const ay = 3 * (s.c1.y - s.from.y);
	const bx = 3 * (s.c2.x - s.c1.x);
	const by = 3 * (s.c2.y - s.c1.y);
	const cx = 3 * (s.to.x - s.c2.x);
	const cy = 3 * (s.to.y - s.c2.y);
	let sum = 0;
	for (let i = 0; i < 16; i++) {
		const t = t0 + (t1 - t0) * GX[i];
		const u = 1 - t;
		const dx = u * u * ax + 2 * u * t * bx + t * t * cx;
		const dy = u * u * ay + 2 * u * t * by + t * t * cy;
		sum += GW[i] * Math.sqrt(dx * dx + dy * dy);
	}
	return sum * (t1 - t0);
}

/** Length of a segment along its curve. */
export function segmentLength(s: Segment): number {
	if (s.kind === 'line') return dist(s.from, s.to);
	return cubicLength(s, 0, 0.5) + cubicLength(s, 0.5, 1);
}

/** Length from the segment's start to parameter t. */
export function lengthTo(s: Segment, t: number): number {
	if (s.kind === 'line') return dist(s.from, s.to) * t;
	return t <= 0.5 ? cubicLength(s, 0, t) : cubicLength(s, 0, 0.5) + cubicLength(s, 0.5, t);
}

/** Parameter at which the segment has run `len` cm (bisection, so always within [0, 1]). */
export function paramAtLength(s: Segment, len: number): number {
	const total = segmentLength(s);
	if (len <= 0) return 0;
	if (len >= total) return 1;
	if (s.kind === 'line') return len / total;
	let lo = 0;
	let hi = 1;
	for (let i = 0; i < 40; i++) {
		const mid = (lo + hi) / 2;
		if (lengthTo(s, mid) < len) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

/** Splits a segment at t into the part before and the part after. */
export function split(s: Segment, t: number): [Segment, Segment] {
	if (s.kind === 'line') {
		const m = lerp(s.from, s.to, t);
		return [line(s.from, m, s.edge), line(m, s.to, s.edge)];
	}
	const a = lerp(s.from, s.c1, t);
	const b = lerp(s.c1, s.c2, t);
	const c = lerp(s.c2, s.to, t);
	const d = lerp(a, b, t);
	const e = lerp(b, c, t);
	const m = lerp(d, e, t);
	return [cubic(s.from, a, d, m, s.edge), cubic(m, e, c, s.to, s.edge)];
}

/** The same segment run the other way. */
export function reverseSegment(s: Segment): Segment {
	return s.kind === 'line' ? line(s.to, s.from, s.edge) : cubic(s.to, s.c2, s.c1, s.from, s.edge);
}

/** A run of segments run the other way. */
export const reversePath = (segs: Segment[]): Segment[] => segs.map(reverseSegment).reverse();

/** Applies a point map (a rotation, mirror or move) to every point of the segments. */
export function mapSegments(segs: Segment[], f: (p: Point) => Point): Segment[] {
	return segs.map((s) => (s.kind === 'line' ? line(f(s.from), f(s.to), s.edge) : cubic(f(s.from), f(s.c1), f(s.c2), f(s.to), s.edge)));
}

/** The segments relabelled as another edge. */
export const withEdge = (segs: Segment[], edge: Edge): Segment[] => segs.map((s) => ({ ...s, edge }));

/** Length of a run of segments along its curves. */
export const pathLength = (segs: Segment[]) => segs.reduce((sum, s) => sum + segmentLength(s), 0);

/** Point and direction at a distance along a run of segments (clamped to its ends). */
export function alongPath(segs: Segment[], at: number): { point: Point; tangent: Point; index: number; t: number } {
	let left = Math.max(0, at);
	for (let i = 0; i < segs.length; i++) {
		const l = segmentLength(segs[i]);
		if (left <= l || i === segs.length - 1) {
			const t = paramAtLength(segs[i], Math.min(left, l));
			return { point: pointAt(segs[i], t), tangent: tangentAt(segs[i], t), index: i, t };
		}
		left -= l;
	}
	throw new Error('alongPath needs at least one segment');
}

/** The part of a run of segments between two distances along it. */
export function subPath(segs: Segment[], from: number, to: number): Segment[] {
	const out: Segment[] = [];
	let start = 0;
	for (const s of segs) {
		const l = segmentLength(s);
		const a = Math.max(from - start, 0);
		const b = Math.min(to - start, l);
		if (b > a + 1e-9) {
			let piece = s;
			const tb = paramAtLength(s, b);
			if (tb < 1) piece = split(piece, tb)[0];
			const ta = paramAtLength(s, a);
			if (ta > 0) piece = split(piece, tb < 1 ? ta / tb : ta)[1];
			out.push(piece);
		}
		start += l;
	}
	return out;
}

/** The box round a segment's end and control points, which always holds the curve itself. */
export interface ControlBox {
	x0: number;
	x1: number;
	y0: number;
	y1: number;
}

export function controlBox(s: Segment): ControlBox {
	const xs = s.kind === 'cubic' ? [s.from.x, s.to.x, s.c1.x, s.c2.x] : [s.from.x, s.to.x];
	const ys = s.kind === 'cubic' ? [s.from.y, s.to.y, s.c1.y, s.c2.y] : [s.from.y, s.to.y];
	return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) };
}
