// Pieces at full size on paper, in centimetres: packed onto a strip of a given width (a plotter roll, an
// A0 sheet, a projector's mat), and the strip cut into a grid of page-sized cells for a home printer, with
// only the cells something lies on kept. Shelf packing is our own (a few dozen lines): pattern pieces are
// few and nearly rectangular, and the nesting engine's irregular search is for cloth, not paper, where a
// few more pages matter less than pieces whole and upright to read.
import type { Point } from '../geometry';
import { flatten } from '../outline';
import type { Piece } from '../pieces';

/** A box to pack: a piece's cutting-line extent with room round it for its marks. */
export interface StripItem {
	key: string;
	w: number;
	h: number;
}

/** Where an item went: its box's top-left corner, and whether it lies a quarter turn round. */
export interface StripSpot {
	key: string;
	x: number;
	y: number;
	w: number;
	h: number;
	turned: boolean;
}

export interface StripPlan {
	width: number;
	length: number;
	spots: StripSpot[];
}

/** Room (cm) kept round every piece: the notches and fold arrows reach past the cutting line by a few mm,
 * and scissors need somewhere to go between two pieces. */
export const PIECE_PAD = 1.5;

export const itemOf = (key: string, p: Pick<Piece, 'bounds'>): StripItem => ({
	key,
	w: p.bounds.maxX - p.bounds.minX + 2 * PIECE_PAD,
	h: p.bounds.maxY - p.bounds.minY + 2 * PIECE_PAD
});

/** The narrowest strip every item fits on, one at a time, each turned the way that needs less width. */
export const narrowestStrip = (items: StripItem[]) => Math.max(0, ...items.map((it) => Math.min(it.w, it.h)));

/** The skyline: the top of what is packed so far, as steps across the strip. */
type Step = { x: number; w: number; y: number };

/** The lowest place for a box `w` wide on the skyline: its left edge at a step's start. */
function lowest(sky: Step[], w: number, width: number): { x: number; y: number } | null {
	let best: { x: number; y: number } | null = null;
	for (const st of sky) {
		if (st.x + w > width + 1e-9) break;
		let y = 0;
		for (const o of sky) if (o.x < st.x + w - 1e-9 && o.x + o.w > st.x + 1e-9) y = Math.max(y, o.y);
		if (!best || y < best.y - 1e-9) best = { x: st.x, y };
	}
	return best;
}

function raise(sky: Step[], x: number, w: number, top: number): Step[] {
	const out: Step[] = [];
	for (const st of sky) {
		if (st.x + st.w <= x + 1e-9 || st.x >= x + w - 1e-9) {
			out.push(st);
			continue;
		}
		if (st.x < x) out.push({ x: st.x, w: x - st.x, y: st.y });
		if (st.x + st.w > x + w) out.push({ x: x + w, w: st.x + st.w - x - w, y: st.y });
	}
	out.push({ x, w, y: top });
	out.sort((a, b) => a.x - b.x);
	// Neighbouring steps at one height become one.
	return out.reduce<Step[]>((acc, st) => {
		const last = acc[acc.length - 1];
		if (last && Math.abs(last.y - st.y) < 1e-9) last.w += st.w;
		else acc.push({ ...st });
		return acc;
	}, []);
}

/**
 * Items on a strip `width` wide, each put where its box sits lowest on what is already packed (a
 * skyline, bottom-left packing), upright or a quarter turn round, whichever leaves its top lower;
 * tallest first. With `height`, an item that would reach past it is left for the next sheet. Null when
 * some item fits on no sheet. Our own few lines rather than the nesting engine: pattern paper wants
 * whole upright boxes with room for the words, not the tightest lay.
 */
export function packSheets(items: StripItem[], width: number, height = Infinity): StripPlan[] | null {
	const fits = (w: number, h: number) => w <= width + 1e-9 && h <= height + 1e-9;
	if (items.some((it) => !fits(it.w, it.h) && !fits(it.h, it.w))) return null;
	let left = items.map((it, i) => ({ it, i })).sort((a, b) => Math.max(b.it.h, b.it.w) - Math.max(a.it.h, a.it.w) || a.i - b.i);
	const sheets: StripPlan[] = [];
	while (left.length) {
		let sky: Step[] = [{ x: 0, w: width, y: 0 }];
		const spots: StripSpot[] = [];
		const later: typeof left = [];
		for (const { it, i } of left) {
			let best: { x: number; y: number; w: number; h: number; turned: boolean } | null = null;
			for (const turned of [false, true]) {
				const [w, h] = turned ? [it.h, it.w] : [it.w, it.h];
				if (w > width + 1e-9) continue;
				const at = lowest(sky, w + PIECE_GAP, width + PIECE_GAP);
				if (!at || at.y + h > height + 1e-9) continue;
				if (!best || at.y + h < best.y + best.h - 1e-9) best = { ...at, w, h, turned };
			}
			if (!best) {
				later.push({ it, i });
				continue;
			}
			sky = raise(sky, best.x, best.w + PIECE_GAP, best.y + best.h + PIECE_GAP);
			spots[i] = { key: it.key, x: best.x, y: best.y, w: best.w, h: best.h, turned: best.turned };
		}
		const length = Math.max(0, ...spots.filter(Boolean).map((s) => s.y + s.h));
		sheets.push({ width, length, spots });
		if (later.length === left.length) return null;
		left = later;
	}
	// Each sheet's spots indexed by the item's place in `items` (holes for items on other sheets).
	return sheets;
}

/** All items on one strip with no end (a roll). */
export function packStrip(items: StripItem[], width: number): StripPlan | null {
	return packSheets(items, width)?.[0] ?? null;
}

/** Space (cm) between pieces on the strip. */
export const PIECE_GAP = 1;

/** Piece cm to strip cm for a piece in its spot: a move, or a quarter turn anticlockwise and a move. */
export function spotMap(p: Pick<Piece, 'bounds'>, s: StripSpot): (q: Point) => Point {
	const b = p.bounds;
	return s.turned
		? (q) => ({ x: s.x + PIECE_PAD + (q.y - b.minY), y: s.y + PIECE_PAD + (b.maxX - q.x) })
		: (q) => ({ x: s.x + PIECE_PAD + (q.x - b.minX), y: s.y + PIECE_PAD + (q.y - b.minY) });
}

/** A page-sized window on the strip: row and column of the grid, the cell's corner in strip cm. */
export interface Cell {
	row: number;
	col: number;
	x: number;
	y: number;
}

export interface TilePlan {
	strip: StripPlan;
	cellW: number;
	cellH: number;
	rows: number;
	cols: number;
	/** The cells printed, row by row; the page number of a cell is its index + 1 (after any cover). */
	cells: Cell[];
}

/** Row letters A–Z, then AA, AB… (a sheet so tall is unlikely, but the letters never run out). */
export function rowLetter(row: number): string {
	let s = '';
	let n = row + 1;
	while (n > 0) {
		const r = (n - 1) % 26;
		s = String.fromCharCode(65 + r) + s;
		n = Math.floor((n - 1) / 26);
	}
	return s;
}

export const cellName = (c: Pick<Cell, 'row' | 'col'>) => `${rowLetter(c.row)}${c.col + 1}`;

function segmentMeetsRect(a: Point, b: Point, x0: number, y0: number, x1: number, y1: number): boolean {
	// Liang–Barsky clipping: whether any part of the segment lies inside the rectangle.
	let [t0, t1] = [0, 1];
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	for (const [p, q] of [
		[-dx, a.x - x0],
		[dx, x1 - a.x],
		[-dy, a.y - y0],
		[dy, y1 - a.y]
	]) {
		if (Math.abs(p) < 1e-12) {
			if (q < 0) return false;
		} else {
			const t = q / p;
			if (p < 0) t0 = Math.max(t0, t);
			else t1 = Math.min(t1, t);
			if (t0 > t1) return false;
		}
	}
	return true;
}

function inside(poly: Point[], q: Point): boolean {
	let c = false;
	for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
		const [a, b] = [poly[i], poly[j]];
		if (a.y > q.y !== b.y > q.y && q.x < ((b.x - a.x) * (q.y - a.y)) / (b.y - a.y) + a.x) c = !c;
	}
	return c;
}

/** Whether an outline (strip cm) has anything inside a rectangle: an edge through it, or the rectangle
 * wholly inside the outline (a page in the middle of a big piece is printed: it carries its marks). */
export function outlineMeets(poly: Point[], x0: number, y0: number, x1: number, y1: number): boolean {
	let [bx0, by0, bx1, by1] = [Infinity, Infinity, -Infinity, -Infinity];
	for (const q of poly) [bx0, by0, bx1, by1] = [Math.min(bx0, q.x), Math.min(by0, q.y), Math.max(bx1, q.x), Math.max(by1, q.y)];
	if (bx0 > x1 || bx1 < x0 || by0 > y1 || by1 < y0) return false;
	for (let i = 0; i < poly.length; i++) if (segmentMeetsRect(poly[i], poly[(i + 1) % poly.length], x0, y0, x1, y1)) return true;
	return inside(poly, { x: (x0 + x1) / 2, y: (y0 + y1) / 2 });
}

/** The cutting lines of pieces in their spots, in strip cm (for page choice and maps); `flat`, the
 * pieces' cutting lines already flattened in piece cm, saves flattening them again for every plan tried. */
export function stripOutlines(pieces: Pick<Piece, 'bounds' | 'cutting'>[], plan: StripPlan, flat = pieces.map((p) => flatten(p.cutting.segments, 0.3))): Point[][] {
	return pieces.map((p, i) => flat[i].map(spotMap(p, plan.spots[i])));
}

/**
 * The fewest pages for pieces at 1:1 on cells `cellW` × `cellH` cm: the strip is tried one to eight
 * cells wide, and a cell nothing lies on is left out. Fewer columns win a tie (a taller, narrower
 * sheet is easier to tape together on a table).
 */
export function planTiles(pieces: Pick<Piece, 'bounds' | 'cutting'>[], cellW: number, cellH: number): TilePlan | null {
	const items = pieces.map((p, i) => itemOf(String(i), p));
	const flat = pieces.map((p) => flatten(p.cutting.segments, 0.3));
	let best: TilePlan | null = null;
	for (let cols = 1; cols <= 8; cols++) {
		const strip = packStrip(items, cols * cellW);
		if (!strip) continue;
		const rows = Math.max(1, Math.ceil(strip.length / cellH - 1e-9));
		const outlines = stripOutlines(pieces, strip, flat);
		const cells: Cell[] = [];
		for (let row = 0; row < rows; row++)
			for (let col = 0; col < cols; col++) {
				const [x, y] = [col * cellW, row * cellH];
				if (outlines.some((o) => outlineMeets(o, x, y, x + cellW, y + cellH))) cells.push({ row, col, x, y });
			}
		// A column nobody uses is a narrower strip, found at a smaller `cols`.
		if (!best || cells.length < best.cells.length) best = { strip, cellW, cellH, rows, cols, cells };
	}
	return best;
}
