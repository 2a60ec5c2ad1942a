// The cutting line: a true offset of the seam line, edge by edge with each edge's own allowance.
// A uniform polygon offset (such as a clipping library gives) cannot do what a cutter needs here:
// allowances differ per edge (zip seam 2 cm, seam 1.5, hem 4, fold 0), corners are mitred as a cutter
// extends the allowance lines until they meet, curves must stay curves, and at the hem the seam
// allowance below the hem line mirrors the seam above it, so the hem folds up flat on a flared skirt.
import { add, cross, cubic, dist, dot, line, mul, normalOf, pointAt, split, sub, tangentAt, unit, type Edge, type Point, type Segment } from './geometry';
import { lineSegment, rayRay, segmentSegment } from './intersect';
import { mergeLines, minRadius, removeLoops } from './loops';
import { orientPositive } from './outline';

const TOLERANCE = 0.01; // cm (0.1 mm): how far the fitted offset curve may stray from the exact offset

/** The exact offset of the point at t, d along the left normal. */
function offsetPoint(s: Segment, t: number, d: number): Point {
	return add(pointAt(s, t), mul(normalOf(tangentAt(s, t)), d));
}

/** Offset of one segment by d along its left normal (outward on a positive outline), as a chain of segments. */
export function offsetSegment(s: Segment, d: number, depth = 0): Segment[] {
	if (Math.abs(d) < 1e-12) return [s];
	if (s.kind === 'line') {
		const n = mul(normalOf(unit(sub(s.to, s.from))), d);
		return [line(add(s.from, n), add(s.to, n), s.edge)];
	}
	const p0 = offsetPoint(s, 0, d);
	const p3 = offsetPoint(s, 1, d);
	const t0 = tangentAt(s, 0);
	const t1 = tangentAt(s, 1);
	// Handle lengths by least squares against the exact offset at three inner points.
	let m00 = 0;
	let m01 = 0;
	let m11 = 0;
	let r0 = 0;
	let r1 = 0;
	for (const t of [0.25, 0.5, 0.75]) {
		const u = 1 - t;
		const b1 = 3 * u * u * t;
		const b2 = 3 * u * t * t;
		const base = add(mul(p0, u * u * u + b1), mul(p3, b2 + t * t * t));
		const r = sub(offsetPoint(s, t, d), base);
		const A = mul(t0, b1);
		const B = mul(t1, -b2);
		m00 += dot(A, A);
		m01 += dot(A, B);
		m11 += dot(B, B);
		r0 += dot(A, r);
		r1 += dot(B, r);
	}
	const det = m00 * m11 - m01 * m01;
	const chord = dist(p0, p3) / 3;
	let alpha = chord;
	let beta = chord;
	if (Math.abs(det) > 1e-12) {
		alpha = (r0 * m11 - r1 * m01) / det;
		beta = (m00 * r1 - m01 * r0) / det;
	}
	if (!(alpha > 0) || !(beta > 0) || alpha > 4 * chord + 1 || beta > 4 * chord + 1) {
		alpha = chord;
		beta = chord;
	}
	const fit = cubic(p0, add(p0, mul(t0, alpha)), sub(p3, mul(t1, beta)), p3, s.edge);
	let err = 0;
	for (let i = 1; i < 8; i++) err = Math.max(err, dist(pointAt(fit, i / 8), offsetPoint(s, i / 8, d)));
	if (err <= TOLERANCE || depth >= 5) return [fit];
	const [a, b] = split(s, 0.5);
	return [...offsetSegment(a, d, depth + 1), ...offsetSegment(b, d, depth + 1)];
}

const SEAM_EDGES: Edge[] = ['side', 'centre', 'fold', 'vent', 'gore', 'bag-seam'];
const isHem = (e: Edge) => e === 'hem' || e === 'vent-hem';

/** Moves the end of a chain's last segment (a line) to p. */
function setEnd(chain: Segment[], p: Point) {
	const s = chain[chain.length - 1];
	chain[chain.length - 1] = s.kind === 'line' ? line(s.from, p, s.edge) : { ...s, to: p, c2: add(s.c2, sub(p, s.to)) };
}
function setStart(chain: Segment[], p: Point) {
	const s = chain[0];
	chain[0] = s.kind === 'line' ? line(p, s.to, s.edge) : { ...s, from: p, c1: add(s.c1, sub(p, s.from)) };
}

/** Cuts the end of chain A and the start of chain B at their crossing nearest the corner. */
function trimAtCrossing(A: Segment[], B: Segment[]): boolean {
	for (let i = A.length - 1; i >= Math.max(0, A.length - 4); i--) {
		for (let j = 0; j < Math.min(B.length, 4); j++) {
			const hits = segmentSegment(A[i], B[j]);
			if (!hits.length) continue;
			const h = hits.reduce((best, x) => (x.a - x.b > best.a - best.b ? x : best));
			const keepA = h.a < 1 - 1e-9 ? split(A[i], h.a)[0] : A[i];
			const keepB = h.b > 1e-9 ? split(B[j], h.b)[1] : B[j];
			A.splice(i, A.length - i, keepA);
			B.splice(0, j + 1, keepB);
			setEnd(A, h.at);
			setStart(B, h.at);
			return true;
		}
	}
	return false;
}

/** Mirrors vector v about the line with unit direction u. */
const mirror = (v: Point, u: Point) => sub(mul(u, 2 * dot(v, u)), v);

/** Seam edge arriving at the hem (seam chain A, hem chain B): the allowance below the hem line is the seam
 * mirrored in the hem line. Returns the connecting segments, or null when the shape does not allow it. */
function hemCornerIn(seam: Segment, A: Segment[], hem: Segment, B: Segment[]): Segment[] | null {
	if (seam.kind !== 'line' || A[A.length - 1].kind !== 'line') return null;
	const corner = seam.to;
	const dA = unit(sub(seam.to, seam.from));
	const th = tangentAt(hem, 0);
	const end = A[A.length - 1].to;
	const onHemLine = rayRay(end, dA, corner, th);
	if (!onHemLine) return null;
	const a = add(end, mul(dA, onHemLine.s));
	const e = mul(mirror(dA, th), -1);
	for (let j = 0; j < Math.min(B.length, 3); j++) {
		const hits = lineSegment(a, e, B[j]).filter((h) => h.a > 1e-9);
		if (!hits.length) continue;
		const h = hits.reduce((best, x) => (x.a < best.a ? x : best));
		setEnd(A, a);
		const keep = h.b > 1e-9 ? split(B[j], Math.min(1, h.b))[1] : B[j];
		B.splice(0, j + 1, keep);
		setStart(B, h.at);
		return [line(a, h.at, seam.edge)];
	}
	// The mirrored line meets the hem allowance line beyond its start: carry that line back to it.
	const r = rayRay(a, e, B[0].from, tangentAt(B[0], 0));
	if (!r || r.s <= 1e-9 || r.t > 1e-9) return null;
	const at = add(a, mul(e, r.s));
	setEnd(A, a);
	if (B[0].kind === 'line') setStart(B, at);
	else B.unshift(line(at, B[0].from, hem.edge));
	return [line(a, at, seam.edge)];
}

/** Reverses a chain in place semantics: returns the reversed copy. */
const rev = (c: Segment[]): Segment[] =>
	c.map((s) => (s.kind === 'line' ? line(s.to, s.from, s.edge) : cubic(s.to, s.c2, s.c1, s.from, s.edge))).reverse();

/** The join at one corner between offset chains A (ending) and B (starting). May edit A and B. */
function join(seamA: Segment, A: Segment[], seamB: Segment, B: Segment[], aA: number, aB: number, state: { untrimmed: boolean }): Segment[] {
	const end = A[A.length - 1].to;
	const start = B[0].from;
	if (dist(end, start) < 1e-7) return [];
	if (isHem(seamB.edge) && SEAM_EDGES.includes(seamA.edge)) {
		const c = hemCornerIn(seamA, A, seamB, B);
		if (c) return c;
	}
	if (isHem(seamA.edge) && SEAM_EDGES.includes(seamB.edge)) {
		// The same construction seen from the other way round the outline.
		const rA = rev(B);
		const rB = rev(A);
		const c = hemCornerIn(rev([seamB])[0], rA, rev([seamA])[0], rB);
		if (c) {
			B.splice(0, B.length, ...rev(rA));
			A.splice(0, A.length, ...rev(rB));
			return rev(c);
		}
	}
	const dA = tangentAt(A[A.length - 1], 1);
	const dB = tangentAt(B[0], 0);
	const turn = cross(tangentAt(seamA, 1), tangentAt(seamB, 0));
	if (turn < -1e-9) {
		if (trimAtCrossing(A, B)) return [];
		state.untrimmed = true;
	}
	const m = rayRay(end, dA, start, dB);
	const limit = 4 * Math.max(aA, aB, 0.1);
	if (m && m.s > -1e-9 && m.t < 1e-9) {
		const x = add(end, mul(dA, m.s));
		if (dist(x, seamA.to) <= limit) {
			const out: Segment[] = [];
			if (dist(end, x) > 1e-7) out.push(line(end, x, seamA.edge));
			if (dist(x, start) > 1e-7) out.push(line(x, start, seamB.edge));
			return out;
		}
	}
	return [line(end, start, seamB.edge)];
}

/** The cutting line round a closed seam line, each segment offset by allowance(segment). */
export function cuttingLine(seam: Segment[], allowance: (s: Segment) => number): Segment[] {
	const state = { untrimmed: false };
	const segs = orientPositive(seam);
	const widths = segs.map(allowance);
	const chains = segs.map((s, i) => offsetSegment(s, widths[i]));
	const joins: Segment[][] = [];
	for (let i = 0; i < segs.length; i++) {
		const k = (i + 1) % segs.length;
		joins.push(join(segs[i], chains[i], segs[k], chains[k], widths[i], widths[k], state));
	}
	const out: Segment[] = [];
	for (let i = 0; i < segs.length; i++) out.push(...chains[i], ...joins[i]);
	// Close every tiny gap left by rounding so the path is exactly closed.
	for (let i = 0; i < out.length; i++) {
		const next = out[(i + 1) % out.length];
		if (dist(out[i].to, next.from) > 0) {
			const s = out[i];
			out[i] = s.kind === 'line' ? line(s.from, next.from, s.edge) : { ...s, to: next.from, c2: add(s.c2, sub(next.from, s.to)) };
		}
	}
	const merged = mergeLines(out.filter((s) => dist(s.from, s.to) > 1e-9 || s.kind === 'cubic'));
	// Loops only come from curves bent tighter than about their allowance, or corners that would not trim.
	const tight = segs.some((s, i) => s.kind === 'cubic' && minRadius(s) < 2 * widths[i] + 0.5);
	return tight || state.untrimmed ? removeLoops(merged) : merged;
}
