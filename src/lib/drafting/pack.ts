// Laying pieces on a length of fabric: rows across the width, each row as tall as its tallest piece,
// pieces slid against each other by their outlines (1 cm bands along the grain), turned end for end
// when the fabric has no nap. Rows are filled "next fit" in a fixed order of decreasing height, and a
// row is only ever tested against its own pieces: so a narrower fabric can never need less length.
import type { Point } from './geometry';

/** How a piece may lie: as cut, mirrored (turned over), turned end for end, or both. */
export type Orientation = 'as-cut' | 'mirrored' | 'turned' | 'turned-mirrored';

/** One piece to place: its outline in piece coordinates (grain along y) and how it may lie. */
export interface LayItem {
	key: string;
	pieceId: string;
	polygon: Point[];
	/** Must touch the fold at x = 0 (its fold edge lies there already). */
	atFold: boolean;
	orientations: Orientation[];
	layers: 1 | 2;
}

/** Where one item went (x across the width from the fold or selvedge, y along the length). */
export interface LayPlacement {
	item: LayItem;
	orientation: Orientation;
	x: number;
	y: number;
	/** The outline as placed, in lay coordinates. */
	outline: Point[];
}

const BAND = 1;

interface Shape {
	orientation: Orientation;
	height: number;
	minX: Float64Array;
	maxX: Float64Array;
	/** Leftmost and rightmost x over all bands. */
	lo: number;
	hi: number;
	/** The outline as it lies (made only for the pieces finally placed). */
	points: () => Point[];
}

const flipX = (o: Orientation) => o === 'mirrored' || o === 'turned';
const flipY = (o: Orientation) => o === 'turned' || o === 'turned-mirrored';

/** The outline as it lies in a given way (turned end for end about its own length). */
export const oriented = (points: Point[], o: Orientation): Point[] => points.map((p) => ({ x: flipX(o) ? -p.x : p.x, y: flipY(o) ? -p.y : p.y }));

/** x-extent of the outline in each 1 cm band along y (covering every part of the outline in the band),
 * for the outline as cut (fy = 1) or turned end for end (fy = −1); mirror images reuse these. */
function bands(points: Point[], fy: 1 | -1) {
	let top = Infinity;
	let bottom = -Infinity;
	for (const p of points) {
		top = Math.min(top, fy * p.y);
		bottom = Math.max(bottom, fy * p.y);
	}
	const height = bottom - top;
	const n = Math.max(1, Math.ceil(height / BAND - 1e-9));
	const minX = new Float64Array(n).fill(Infinity);
	const maxX = new Float64Array(n).fill(-Infinity);
	const m = points.length;
	for (let i = 0; i < m; i++) {
		const p = points[i];
		const q = points[(i + 1) % m];
		const py = fy * p.y - top;
		const qy = fy * q.y - top;
		const lo = Math.min(py, qy);
		const hi = Math.max(py, qy);
		const b0 = Math.max(0, Math.floor(lo / BAND));
		const b1 = Math.min(n - 1, Math.floor(hi / BAND));
		for (let b = b0; b <= b1; b++) {
			const y0 = Math.max(lo, b * BAND);
			const y1 = Math.min(hi, (b + 1) * BAND);
			const flat = hi - lo < 1e-12;
			const xa = flat ? p.x : p.x + ((y0 - py) / (qy - py)) * (q.x - p.x);
			const xb = flat ? q.x : p.x + ((y1 - py) / (qy - py)) * (q.x - p.x);
			if (xa < minX[b]) minX[b] = xa;
			if (xb < minX[b]) minX[b] = xb;
			if (xa > maxX[b]) maxX[b] = xa;
			if (xb > maxX[b]) maxX[b] = xb;
		}
	}
	return { height, top, minX, maxX };
}

const bandCache = new WeakMap<Point[], Partial<Record<1 | -1, ReturnType<typeof bands>>>>();
const shapeCache = new WeakMap<Point[], Map<Orientation, Shape>>();

function shapeOf(points: Point[], o: Orientation): Shape {
	let byOrientation = shapeCache.get(points);
	if (!byOrientation) shapeCache.set(points, (byOrientation = new Map()));
	const hit = byOrientation.get(o);
	if (hit) return hit;
	const fy = flipY(o) ? -1 : 1;
	const fx = flipX(o) ? -1 : 1;
	let cached = bandCache.get(points);
	if (!cached) bandCache.set(points, (cached = {}));
	const base = (cached[fy] ??= bands(points, fy));
	const minX = fx === 1 ? base.minX : base.maxX.map((v) => -v);
	const maxX = fx === 1 ? base.maxX : base.minX.map((v) => -v);
	let lo = Infinity;
	let hi = -Infinity;
	for (let b = 0; b < minX.length; b++) {
		lo = Math.min(lo, minX[b]);
		hi = Math.max(hi, maxX[b]);
	}
	const shape: Shape = { orientation: o, height: base.height, minX, maxX, lo, hi, points: () => points.map((p) => ({ x: fx * p.x, y: fy * p.y - base.top })) };
	byOrientation.set(o, shape);
	return shape;
}

const itemShapes = new WeakMap<LayItem, Shape[]>();
function shapesOf(item: LayItem): Shape[] {
	let s = itemShapes.get(item);
	if (!s) itemShapes.set(item, (s = item.orientations.map((o) => shapeOf(item.polygon, o))));
	return s;
}

/** Length an item takes along the fabric. */
export const itemHeight = (item: LayItem) => shapesOf(item)[0].height;

/** A row being filled, laid out once for each way its fold piece may lie (the narrowest wins). */
interface Row {
	height: number;
	hasFold: boolean;
	layouts: Layout[];
}

interface Layout {
	right: Float64Array;
	width: number;
	placed: { item: LayItem; shape: Shape; x: number }[];
}


function put(l: Layout, item: LayItem, shape: Shape, x: number) {
	l.placed.push({ item, shape, x });
	for (let b = 0; b < shape.maxX.length; b++) if (shape.maxX[b] + x > l.right[b]) l.right[b] = shape.maxX[b] + x;
	l.width = Math.max(l.width, shape.hi + x);
}

/** Where an item would go in a layout: slid in from the right until it meets what is there, in the way
 * of lying that keeps the row narrowest. */
function slot(l: Layout, item: LayItem) {
	let pick: { shape: Shape; x: number; extent: number } | null = null;
	for (const shape of shapesOf(item)) {
		let x = -shape.lo;
		for (let b = 0; b < shape.minX.length; b++) if (l.right[b] - shape.minX[b] > x) x = l.right[b] - shape.minX[b];
		const extent = Math.max(l.width, x + shape.hi);
		if (!pick || extent < pick.extent - 1e-9) pick = { shape, x, extent };
	}
	return pick!;
}

const fresh = (depth: number): Layout => ({ right: new Float64Array(depth).fill(-Infinity), width: -Infinity, placed: [] });

/** A row from its items: the fold piece first at x = 0, the rest in order. */
function rowOf(items: LayItem[], depth: number): Row {
	const fold = items.find((i) => i.atFold);
	const firsts = fold ? shapesOf(fold) : [null];
	const layouts = firsts.map((first) => {
		const l = fresh(depth);
		if (fold && first) put(l, fold, first, 0);
		for (const item of items) if (item !== fold) appendTo(l, item);
		return l;
	});
	return { height: Math.max(...items.map(itemHeight)), hasFold: !!fold, layouts };
}

function appendTo(l: Layout, item: LayItem) {
	const s = slot(l, item);
	put(l, item, s.shape, s.x);
}

const rowWidth = (r: Row) => Math.min(...r.layouts.map((l) => l.width));

/** Adds an item to a row if the row stays within the width (appending keeps what is laid; a fold piece
 * joining a row re-lays it with the fold piece first). */
function tryAdd(row: Row, item: LayItem, width: number, depth: number): Row | null {
	if (item.atFold) {
		if (row.hasFold) return null;
		const next = rowOf([...row.layouts[0].placed.map((p) => p.item), item], depth);
		return rowWidth(next) <= width + 1e-9 ? next : null;
	}
	const widths = row.layouts.map((l) => {
		const s = slot(l, item);
		return Math.max(l.width, s.x + s.shape.hi);
	});
	if (Math.min(...widths) > width + 1e-9) return null;
	for (const l of row.layouts) appendTo(l, item);
	row.height = Math.max(row.height, itemHeight(item));
	return row;
}

/** Packs the items into rows across `width`; null when some item is wider than the fabric. */
export function packRows(items: LayItem[], width: number): { length: number; placements: LayPlacement[] } | null {
	const heights = new Map(items.map((it) => [it, itemHeight(it)]));
	const order = [...items].sort((a, b) => heights.get(b)! - heights.get(a)! || a.key.localeCompare(b.key));
	const depth = Math.ceil(Math.max(...heights.values()) / BAND) + 1;
	const rows: Row[] = [];
	let i = 0;
	while (i < order.length) {
		let row = rowOf([order[i]], depth);
		if (rowWidth(row) > width + 1e-9) return null;
		let j = i + 1;
		for (; j < order.length; j++) {
			const next = tryAdd(row, order[j], width, depth);
			if (!next) break;
			row = next;
		}
		rows.push(row);
		i = j;
	}
	const placements: LayPlacement[] = [];
	let y = 0;
	for (const row of rows) {
		const best = row.layouts.reduce((a, b) => (b.width < a.width - 1e-9 ? b : a));
		for (const p of best.placed) {
			placements.push({ item: p.item, orientation: p.shape.orientation, x: p.x, y, outline: p.shape.points().map((q) => ({ x: q.x + p.x, y: q.y + y })) });
		}
		y += row.height;
	}
	return { length: y, placements };
}
