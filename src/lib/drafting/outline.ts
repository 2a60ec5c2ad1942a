// Outlines as wholes: polylines for drawing and laying, areas, which way round they run, boxes, arcs.
import { GW, GX, P, cubic, derivativeAt, pointAt, dist, reversePath, type CubicSegment, type Edge, type Point, type Segment } from './geometry';

/** Polyline through a segment: lines as they are, curves in `perCm` points a centimetre (at least 4). */
export function flattenSegment(s: Segment, perCm = 1): Point[] {
	if (s.kind === 'line') return [s.from, s.to];
	const rough = dist(s.from, s.c1) + dist(s.c1, s.c2) + dist(s.c2, s.to);
	const n = Math.max(4, Math.min(64, Math.ceil(rough * perCm)));
	const pts: Point[] = [];
	for (let i = 0; i <= n; i++) pts.push(pointAt(s, i / n));
	return pts;
}

/** Polygon of a closed path (no repeated closing point). */
export function flatten(segs: Segment[], perCm = 1): Point[] {
	const pts: Point[] = [];
	for (const s of segs) {
		const f = flattenSegment(s, perCm);
		for (let i = 0; i < f.length - 1; i++) pts.push(f[i]);
	}
	return pts;
}

/** Signed area by the shoelace formula; positive for outlines running clockwise on the y-down page. */
export function polygonArea(pts: Point[]): number {
	let a = 0;
	for (let i = 0; i < pts.length; i++) {
		const p = pts[i];
		const q = pts[(i + 1) % pts.length];
		a += p.x * q.y - q.x * p.y;
	}
	return a / 2;
}

/** Exact signed area of a closed path of lines and cubics (Green's theorem; the integrand is a polynomial of
 * degree 5, which the 16-point Gauss–Legendre rule integrates exactly). */
export function pathArea(segs: Segment[]): number {
	let a = 0;
	for (const s of segs) {
		if (s.kind === 'line') {
			a += (s.from.x * s.to.y - s.to.x * s.from.y) / 2;
			continue;
		}
		for (let i = 0; i < 16; i++) {
			const p = pointAt(s, GX[i]);
			const d = derivativeAt(s, GX[i]);
			a += (GW[i] * (p.x * d.y - p.y * d.x)) / 2;
		}
	}
	return a;
}

/** Makes a closed path run the positive (clockwise-on-the-page) way, so its left normal points outward. */
export const orientPositive = (segs: Segment[]): Segment[] => (pathArea(segs) < 0 ? reversePath(segs) : segs);

/** The box a shape fits in (cm). */
export interface Bounds {
	minX: number;
	minY: number;
	maxX: number;
	maxY: number;
}

/** Box round a set of points. */
export function boundsOf(pts: Point[]): Bounds {
	const b = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
	for (const p of pts) {
		b.minX = Math.min(b.minX, p.x);
		b.minY = Math.min(b.minY, p.y);
		b.maxX = Math.max(b.maxX, p.x);
		b.maxY = Math.max(b.maxY, p.y);
	}
	return b;
}

/** Arc of a circle as cubics, no more than 45° each (radial error under 0.0005 % of the radius). */
export function arc(centre: Point, r: number, a0: number, a1: number, edge: Edge): CubicSegment[] {
	const n = Math.max(1, Math.ceil(Math.abs(a1 - a0) / (Math.PI / 4) - 1e-9));
	const step = (a1 - a0) / n;
	const k = (4 / 3) * Math.tan(step / 4) * r;
	const out: CubicSegment[] = [];
	for (let i = 0; i < n; i++) {
		const s = a0 + step * i;
		const e = s + step;
		const p0 = P(centre.x + r * Math.cos(s), centre.y + r * Math.sin(s));
		const p3 = P(centre.x + r * Math.cos(e), centre.y + r * Math.sin(e));
		out.push(cubic(p0, P(p0.x - k * Math.sin(s), p0.y + k * Math.cos(s)), P(p3.x + k * Math.sin(e), p3.y - k * Math.cos(e)), p3, edge));
	}
	return out;
}
