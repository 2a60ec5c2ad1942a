// Skirt pieces as nesting items. Piece coordinates have x across the piece (the fold at x = 0) and y
// along the grain; the nester's have x along the strip and y across it, so a piece lies as (y, x) after
// its turn or mirror is applied in its own coordinates ("as cut" is the pattern as drafted, face up).
import type { Point, Segment } from '../geometry';
import { pointAt } from '../geometry';
import type { Piece } from '../pieces';
import type { NestItem } from './engine';

/** How a piece may lie: as cut, mirrored (turned over), turned end for end, or both. */
export type Orientation = 'as-cut' | 'mirrored' | 'turned' | 'turned-mirrored';

/** The kinds of lay: folded lengthwise (pieces on the fold), open, or open with fold pieces cut as two
 * halves with a centre seam added (when the cloth is too narrow for them whole). */
export type LayKind = 'folded' | 'open' | 'seamed';

/** What an item stands for on the cloth. */
export interface ItemInfo {
	pieceId: string;
	name: string;
	/** 2: cut through both layers of a folded lay; 1: one layer. */
	layers: 1 | 2;
	orientations: Orientation[];
	/** Which order (of a combined lay) it belongs to; 0 for one order. */
	group: number;
}

/** Polyline of a cubic within `tol` of the curve (split in half until the control points lie that near
 * the chord; a cubic lies within its control polygon, so the chord is then within tol of the curve). */
function flattenCubic(s: Extract<Segment, { kind: 'cubic' }>, tol: number, out: Point[], depth = 0) {
	const dx = s.to.x - s.from.x;
	const dy = s.to.y - s.from.y;
	const len = Math.sqrt(dx * dx + dy * dy);
	const far = (p: Point) =>
		len < 1e-12
			? Math.hypot(p.x - s.from.x, p.y - s.from.y)
			: Math.abs((p.x - s.from.x) * dy - (p.y - s.from.y) * dx) / len;
	if (depth > 16 || Math.max(far(s.c1), far(s.c2)) <= tol) {
		out.push(s.from);
		return;
	}
	const m = pointAt(s, 0.5);
	const mid = (a: Point, b: Point) => ({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 });
	const p01 = mid(s.from, s.c1);
	const p12 = mid(s.c1, s.c2);
	const p23 = mid(s.c2, s.to);
	const a = mid(p01, p12);
	const b = mid(p12, p23);
	flattenCubic({ ...s, c1: p01, c2: a, to: m }, tol, out, depth + 1);
	flattenCubic({ ...s, from: m, c1: b, c2: p23 }, tol, out, depth + 1);
}

/** The cutting line as a polygon, curves within `tol` cm (0.05: half a millimetre). */
export function cutPolygon(segs: Segment[], tol = 0.05): Point[] {
	const out: Point[] = [];
	for (const s of segs) {
		if (s.kind === 'line') out.push(s.from);
		else flattenCubic(s, tol, out);
	}
	// Drop points repeated or lying on a straight run.
	const clean: Point[] = [];
	for (let i = 0; i < out.length; i++) {
		const p = out[i];
		const q = clean[clean.length - 1];
		if (q && Math.abs(p.x - q.x) < 1e-9 && Math.abs(p.y - q.y) < 1e-9) continue;
		clean.push(p);
	}
	return clean;
}

/** The whole piece opened out from its fold: the outline from the fold round to the fold again, then its
 * mirror image in the fold line (x = 0). */
export function unfolded(poly: Point[]): Point[] {
	const n = poly.length;
	const on = (q: Point) => Math.abs(q.x) <= 1e-6;
	const s = poly.findIndex((q, i) => on(q) && !on(poly[(i + 1) % n]));
	if (s < 0) return poly;
	const half: Point[] = [];
	for (let k = 0; k < n; k++) {
		const q = poly[(s + k) % n];
		half.push(q);
		if (k > 0 && on(q)) break;
	}
	return [
		...half,
		...half
			.slice(1, -1)
			.reverse()
			.map((q) => ({ x: -q.x, y: q.y }))
	];
}

const flipX = (o: Orientation) => o === 'mirrored' || o === 'turned';
const flipY = (o: Orientation) => o === 'turned' || o === 'turned-mirrored';

/** The outline as it lies, in piece coordinates. */
export const oriented = (points: Point[], o: Orientation): Point[] =>
	points.map((p) => ({ x: flipX(o) ? -p.x : p.x, y: flipY(o) ? -p.y : p.y }));

/** Piece coordinates to the nester's (x along, y across), and back. */
export const toStrip = (points: Point[]): Point[] => points.map((p) => ({ x: p.y, y: p.x }));
export const fromStrip = toStrip;

// The same outline turned the same way is the same array every time, so its bands are made once.
const lyingCache = new WeakMap<Point[], Map<Orientation, Point[]>>();
function lying(outline: Point[], o: Orientation): Point[] {
	let m = lyingCache.get(outline);
	if (!m) lyingCache.set(outline, (m = new Map()));
	let pts = m.get(o);
	if (!pts) m.set(o, (pts = toStrip(oriented(outline, o))));
	return pts;
}

/** The ways of lying allowed: without nap, each may also be turned end for end. */
function withTurns(o: Orientation[], nap: boolean): Orientation[] {
	if (nap) return o;
	return [...o, ...o.map((x): Orientation => (x === 'as-cut' ? 'turned' : x === 'mirrored' ? 'turned-mirrored' : x))];
}

/** A polygon as it goes to the nester, kept per piece so every lay of a draft reuses it. */
export interface Outlines {
	cut: Point[];
	whole: Point[];
	halves: Point[];
}

/** Outlines of a piece: as cut, opened out from the fold, and as half with a centre seam allowance. */
export function outlinesOf(p: Piece, seam: number): Outlines {
	const cut = cutPolygon(p.cutting.segments);
	return {
		cut,
		whole: p.cut.onFold ? unfolded(cut) : cut,
		halves: cut.map((q) => (Math.abs(q.x) < 1e-6 ? { x: -seam, y: q.y } : q))
	};
}

/** A piece and the outlines it is laid with (a waistband may be given as parts). */
export interface LayPiece {
	piece: Piece;
	outlines: Outlines;
	/** The waistband cut in parts: each part's outline (piece coordinates), laid on its own. */
	parts?: Point[][];
}

/** The nesting items of a set of pieces for one kind of lay. */
export function itemsFor(
	pieces: LayPiece[],
	kind: LayKind,
	nap: boolean,
	group = 0
): { items: NestItem[]; info: ItemInfo[] } {
	const items: NestItem[] = [];
	const info: ItemInfo[] = [];
	const add = (
		lp: LayPiece,
		key: string,
		outline: Point[],
		atFold: boolean,
		orientations: Orientation[],
		layers: 1 | 2
	) => {
		items.push({
			key: `${group}:${lp.piece.id}:${key}`,
			atFold,
			variants: orientations.map((o) => ({ name: o, points: lying(outline, o) }))
		});
		info.push({ pieceId: lp.piece.id, name: lp.piece.name, layers, orientations, group });
	};
	for (const lp of pieces) {
		const p = lp.piece;
		if (lp.parts) {
			lp.parts.forEach((part, k) => add(lp, `part${k}`, part, false, withTurns(['as-cut'], nap), 1));
			continue;
		}
		if (kind === 'folded') {
			if (p.cut.onFold) add(lp, 'fold', lp.outlines.cut, true, nap ? ['as-cut'] : ['as-cut', 'turned-mirrored'], 2);
			else
				for (let k = 0; k < Math.ceil(p.cut.count / 2); k++) {
					const single = p.cut.count % 2 === 1 && k === Math.ceil(p.cut.count / 2) - 1;
					add(
						lp,
						`${k}`,
						lp.outlines.cut,
						false,
						withTurns(single ? ['as-cut'] : ['as-cut', 'mirrored'], nap),
						single ? 1 : 2
					);
				}
			continue;
		}
		if (p.cut.onFold && kind === 'open') {
			add(lp, 'whole', lp.outlines.whole, false, withTurns(['as-cut'], nap), 1);
			continue;
		}
		// Cut as separate left and right pieces (a fold piece as two halves with a centre seam added).
		const outline = p.cut.onFold ? lp.outlines.halves : lp.outlines.cut;
		const count = p.cut.onFold ? 2 : p.cut.count;
		for (let k = 0; k < count; k++)
			add(lp, `${k}`, outline, false, withTurns([k % 2 === 1 && count > 1 ? 'mirrored' : 'as-cut'], nap), 1);
	}
	return { items, info };
}
