// One lay of skirt pieces (of one order or several) on one kind of lay, through the nester, and the
// result in the drawing's coordinates (x across from the fold or a selvedge, y along the length).
import type { Point } from '../geometry';
import { compactLay, nest, NestInputError, type NestOptions, type NestPlacement, type NestResult } from './engine';
import { fromStrip, itemsFor, type ItemInfo, type LayKind, type LayPiece, type Orientation } from './pieces';

/** One piece as laid. */
export interface PlacedPiece {
	pieceId: string;
	name: string;
	/** Which order of a combined lay (0 for one order). */
	group: number;
	layers: 1 | 2;
	orientation: Orientation;
	/** Lowest corner of the piece's box, and its outline as laid (x across, y along, cm). */
	x: number;
	y: number;
	outline: Point[];
}

export interface PieceLay {
	kind: LayKind;
	/** Width the pieces were laid across: the cloth's usable width, or half of it when folded. */
	lane: number;
	length: number;
	pieces: PlacedPiece[];
	/** Area of the pieces over lane × length (a folded lay counts both layers). */
	utilisation: number;
	evaluations: number;
	order: number[];
	choice: number[];
	/** The engine's own result, to go on compacting from (absent for the quote's ladder lays). */
	result?: NestResult;
}

export interface LayEffort extends NestOptions {
	/** Band height across the lane, cm. */
	band: number;
	gap: number;
}

/** Lays the groups of pieces on one kind of lay across `lane`; null when a piece is too wide for it. */
export function layPieces(
	groups: LayPiece[][],
	kind: LayKind,
	lane: number,
	nap: boolean,
	effort: LayEffort
): PieceLay | null {
	const all = groups.map((g, i) => itemsFor(g, kind, nap, i));
	const items = all.flatMap((a) => a.items);
	const info: ItemInfo[] = all.flatMap((a) => a.info);
	const { band, gap, ...options } = effort;
	let result: NestResult;
	try {
		result = nest({ width: lane, items, gap, band }, options);
	} catch (e) {
		if (e instanceof NestInputError) return null;
		throw e;
	}
	return {
		kind,
		lane,
		length: result.length,
		pieces: placedPieces(result.placements, info),
		utilisation: result.utilisation,
		evaluations: result.evaluations,
		order: result.order,
		choice: result.choice,
		result
	};
}

/** Goes on compacting a lay made by `layPieces` with the same groups, kind, lane, nap and effort. */
export function compactPieces(
	groups: LayPiece[][],
	kind: LayKind,
	nap: boolean,
	effort: LayEffort,
	from: PieceLay
): PieceLay {
	if (!from.result) return from;
	const all = groups.map((g, i) => itemsFor(g, kind, nap, i));
	const items = all.flatMap((a) => a.items);
	const info: ItemInfo[] = all.flatMap((a) => a.info);
	const { band, gap, seconds, seed, clock, compactionMoves } = effort;
	const result = compactLay({ width: from.lane, items, gap, band }, from.result, {
		seconds,
		seed,
		clock,
		moves: compactionMoves
	});
	if (result === from.result || result.length >= from.length - 1e-9) return from;
	return {
		...from,
		length: result.length,
		pieces: placedPieces(result.placements, info),
		utilisation: result.utilisation,
		order: result.order,
		choice: result.choice,
		result
	};
}

/** Placements back in the drawing's coordinates, with what each piece is. */
export function placedPieces(placements: NestPlacement[], info: ItemInfo[]): PlacedPiece[] {
	return placements.map((pl): PlacedPiece => {
		const outline = fromStrip(pl.points);
		let x = Infinity;
		let y = Infinity;
		for (const q of outline) ((x = Math.min(x, q.x)), (y = Math.min(y, q.y)));
		const it = info[pl.index];
		return {
			pieceId: it.pieceId,
			name: it.name,
			group: it.group,
			layers: it.layers,
			orientation: it.orientations[pl.variant],
			x,
			y,
			outline
		};
	});
}
