// Pieces on sheets of paper: where each piece goes and at which scale, in points of paper. For a reduced
// print the scales are the reduction series of technical drawing, 1:5, 1:10, 1:20 (ISO 5455 [from
// memory]), so a cutter can read them with a scale rule; a full-size print passes [1]. The largest scale
// at which every piece fits on one sheet wins; portrait before landscape, and the waistband (a long
// strip) may lie along the sheet. Each piece keeps room left of and below it for its dimension lines.
import type { Piece } from '../pieces';
import { ptPerCm } from './model';
import { DIM_ROOM, type PlaceMap } from './piece';

export interface Area {
	x: number;
	y: number;
	w: number;
	h: number;
}

/** Piece centimetres to page points: scaled, and for a long strip turned a quarter turn anticlockwise. */
export interface PieceMap {
	k: number;
	turned: boolean;
	ox: number;
	oy: number;
}

/** The same place in cm of a drawing that the page shows at k points a cm from its corner. */
export const placeOf =
	(m: PieceMap): PlaceMap =>
	(p) =>
		m.turned ? { x: m.ox / m.k + p.y, y: m.oy / m.k - p.x } : { x: m.ox / m.k + p.x, y: m.oy / m.k + p.y };

/** A piece with its place on a page. */
export interface Placed {
	piece: Piece;
	/** Its number in the piece list (1-based). */
	number: number;
	map: PieceMap;
	box: Area;
}

export interface PiecesPlan {
	/** The scale is 1:scale. */
	scale: number;
	landscape: boolean;
	pages: Placed[][];
}

/** Space between two pieces' boxes, points. */
export const GAP = 10;

/** Extra height a piece needs under it (for a caption when its labels do not fit inside it). */
export type ExtraRoom = (piece: Piece, map: PieceMap, number: number) => number;

function boxSize(p: Piece, k: number, turned: boolean, extra: number) {
	const b = p.bounds;
	const w = (turned ? b.maxY - b.minY : b.maxX - b.minX) * k + DIM_ROOM;
	const h = (turned ? b.maxX - b.minX : b.maxY - b.minY) * k + DIM_ROOM + extra;
	return { w, h };
}

function mapFor(p: Piece, k: number, turned: boolean, x: number, y: number): PieceMap {
	const b = p.bounds;
	return turned ? { k, turned, ox: x + DIM_ROOM - b.minY * k, oy: y + b.maxX * k } : { k, turned, ox: x + DIM_ROOM - b.minX * k, oy: y - b.minY * k };
}

interface Shelf {
	y: number;
	h: number;
	x: number;
}

/** Shelves, tallest pieces first; each piece goes on the first shelf of the page with room. Null when a
 * piece is larger than the area. */
function pack(pieces: Piece[], k: number, area: Area, turn: boolean, extra: ExtraRoom): Placed[][] | null {
	const items = pieces.map((piece, i) => {
		const turned = turn && piece.role === 'waistband';
		return { piece, number: i + 1, turned, ...boxSize(piece, k, turned, extra(piece, mapFor(piece, k, turned, 0, 0), i + 1)) };
	});
	if (items.some((it) => it.w > area.w || it.h > area.h)) return null;
	items.sort((a, b) => b.h - a.h || a.number - b.number);
	const pages: Placed[][] = [];
	let shelves: Shelf[] = [];
	let page: Placed[] = [];
	for (const it of items) {
		let shelf = shelves.find((s) => s.x + it.w <= area.w + 1e-6 && it.h <= s.h + 1e-6);
		if (!shelf) {
			const last = shelves[shelves.length - 1];
			const y = last ? last.y + last.h + GAP : 0;
			if (y + it.h > area.h + 1e-6) {
				pages.push(page);
				page = [];
				shelves = [];
				shelf = { y: 0, h: it.h, x: 0 };
			} else shelf = { y, h: it.h, x: 0 };
			shelves.push(shelf);
		}
		const x = area.x + shelf.x;
		const y = area.y + shelf.y;
		page.push({ piece: it.piece, number: it.number, map: mapFor(it.piece, k, it.turned, x, y), box: { x, y, w: it.w, h: it.h } });
		shelf.x += it.w + GAP;
	}
	pages.push(page);
	return pages;
}

/** The plan for a set of pieces: `areaFor` gives the drawing area of a portrait or landscape page. */
export function planPieces(pieces: Piece[], areaFor: (landscape: boolean) => Area, ladder: readonly number[], extra: ExtraRoom = () => 0): PiecesPlan {
	let fallback: PiecesPlan | null = null;
	for (const scale of ladder) {
		const k = ptPerCm(scale);
		for (const landscape of [false, true]) {
			for (const turn of [false, true]) {
				const pages = pack(pieces, k, areaFor(landscape), turn, extra);
				if (!pages) continue;
				if (pages.length === 1) return { scale, landscape, pages };
				if (!fallback || pages.length < fallback.pages.length) fallback = { scale, landscape, pages };
			}
		}
	}
	// Nothing fits one page even at the smallest scale: the fewest pages, at the largest scale giving them.
	if (fallback) return fallback;
	const scale = ladder[ladder.length - 1];
	return { scale, landscape: false, pages: pack(pieces, ptPerCm(scale), areaFor(false), true, extra) ?? [] };
}
