// A piece as the nester sees it: its outline cut into thin slices across the strip ("bands", all the same
// height), each slice kept as the x-intervals (along the length) that the piece, grown by half the gap,
// covers anywhere in that slice. Two pieces whose intervals are apart in every band they share cannot
// overlap, and stay at least the gap apart (the growth is a square, which covers the round one).
//
// Why bands and not no-fit polygons: a no-fit polygon is a Minkowski sum, and clipper-lib's MinkowskiSum
// unions one quad per pair of edges; for two curved skirt pieces (a quarter circle flattened within 0.5 mm
// has ~180 vertices) that took 37 s here, against a quote budget of 30 ms. Bands give an exact bottom-left
// slide along the length (where lays are measured) in time linear in the outline, for any polygon, convex
// or not, with holes left by earlier pieces filled. The price is that positions across the width are
// whole bands (≤ 1/300 of the width) and slanted edges keep a sliver of up to one band's run apart.
import type { Point } from '../geometry';

/** One way a piece may lie, prepared for the strip: bands of intervals relative to its own box. */
export interface Shape {
	/** The outline as given (lay coordinates: x along the length, y across the width). */
	points: Point[];
	/** Lowest x and y of the true outline: a placement at offset (x, y) of the box puts the outline at
	 * points − (minX, minY) + (x, y). */
	minX: number;
	minY: number;
	/** True extent of the outline (without the gap). */
	length: number;
	breadth: number;
	area: number;
	/** Band index (relative to the band holding the outline's lowest y) of `bands[0]`; negative when the
	 * gap reaches below. */
	first: number;
	/** For each band, sorted disjoint intervals [lo0, hi0, lo1, hi1, …] relative to the box's x = 0. */
	bands: Float64Array[];
	/** Overall lowest lo and highest hi over the bands. */
	lo: number;
	hi: number;
}

/** Signed area (shoelace). */
export function area(points: Point[]): number {
	let a = 0;
	for (let i = 0; i < points.length; i++) {
		const p = points[i];
		const q = points[(i + 1) % points.length];
		a += p.x * q.y - q.x * p.y;
	}
	return a / 2;
}

/** Merges intervals [lo, hi, lo, hi, …] (any order) into sorted disjoint ones. */
export function mergeIntervals(raw: number[]): Float64Array {
	const n = raw.length / 2;
	const idx = Array.from({ length: n }, (_, i) => i).sort((a, b) => raw[2 * a] - raw[2 * b]);
	const out: number[] = [];
	for (const i of idx) {
		const lo = raw[2 * i];
		const hi = raw[2 * i + 1];
		if (out.length && lo <= out[out.length - 1]) out[out.length - 1] = Math.max(out[out.length - 1], hi);
		else out.push(lo, hi);
	}
	return Float64Array.from(out);
}

/** x-set of the polygon within y ∈ [y0, y1]: every edge's x-range inside the slab, plus the inside of the
 * polygon along the slab's middle line (a vertical that meets no edge is wholly in or out). */
function slab(points: Point[], y0: number, y1: number): number[] {
	const raw: number[] = [];
	const n = points.length;
	const ym = (y0 + y1) / 2;
	const cross: number[] = [];
	for (let i = 0; i < n; i++) {
		const p = points[i];
		const q = points[(i + 1) % n];
		const lo = Math.max(y0, Math.min(p.y, q.y));
		const hi = Math.min(y1, Math.max(p.y, q.y));
		if (lo <= hi) {
			if (p.y === q.y) raw.push(Math.min(p.x, q.x), Math.max(p.x, q.x));
			else {
				const xa = p.x + ((lo - p.y) / (q.y - p.y)) * (q.x - p.x);
				const xb = p.x + ((hi - p.y) / (q.y - p.y)) * (q.x - p.x);
				raw.push(Math.min(xa, xb), Math.max(xa, xb));
			}
		}
		if ((p.y <= ym && q.y > ym) || (q.y <= ym && p.y > ym)) cross.push(p.x + ((ym - p.y) / (q.y - p.y)) * (q.x - p.x));
	}
	cross.sort((a, b) => a - b);
	for (let i = 0; i + 1 < cross.length; i += 2) raw.push(cross[i], cross[i + 1]);
	return raw;
}

const cache = new WeakMap<Point[], Map<string, Shape>>();

/** Prepares one way of lying: bands of height `band`, grown by `grow` (half the gap) every way. Kept per
 * outline, so lays of the same pieces on other widths reuse it. */
export function shapeOf(points: Point[], band: number, grow: number): Shape {
	let byBand = cache.get(points);
	if (!byBand) cache.set(points, (byBand = new Map()));
	const key = `${band}/${grow}`;
	let shape = byBand.get(key);
	if (!shape) byBand.set(key, (shape = makeShape(points, band, grow)));
	return shape;
}

function makeShape(points: Point[], band: number, grow: number): Shape {
	let minX = Infinity;
	let minY = Infinity;
	let maxX = -Infinity;
	let maxY = -Infinity;
	for (const p of points) {
		if (p.x < minX) minX = p.x;
		if (p.y < minY) minY = p.y;
		if (p.x > maxX) maxX = p.x;
		if (p.y > maxY) maxY = p.y;
	}
	const local = points.map((p) => ({ x: p.x - minX, y: p.y - minY }));
	const breadth = maxY - minY;
	const first = -Math.ceil(grow / band - 1e-9);
	const last = Math.ceil((breadth + grow) / band - 1e-9) - 1;
	const bands: Float64Array[] = [];
	let lo = Infinity;
	let hi = -Infinity;
	for (let j = first; j <= Math.max(first, last); j++) {
		const raw = slab(local, j * band - grow, (j + 1) * band + grow);
		for (let i = 0; i < raw.length; i += 2) {
			raw[i] -= grow;
			raw[i + 1] += grow;
		}
		const merged = mergeIntervals(raw);
		bands.push(merged);
		if (merged.length) {
			lo = Math.min(lo, merged[0]);
			hi = Math.max(hi, merged[merged.length - 1]);
		}
	}
	return { points, minX, minY, length: maxX - minX, breadth, area: Math.abs(area(points)), first, bands, lo, hi };
}
