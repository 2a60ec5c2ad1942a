// The lays behind a fabric estimate. Nesting is a search, and a search is not monotone: a wider cloth can
// send an early piece somewhere that costs length later. An estimate must be (a wider cloth never needs
// more, a napped one never less), so the quote's nest is taken as the best over a fixed ladder of lane
// widths (every RUNG cm) at or below the cloth's: the set only grows with the width. Rungs are visited
// from the top down and stop where the area or the longest piece alone already needs more length than
// the best found. Without nap the nap lay is tried as well, so a napped cloth can never need less.
import type { Piece } from '../pieces';
import { outlinesOf, type LayKind, type LayPiece, type Outlines } from './pieces';
import { placedPieces, type PieceLay } from './lay';
import { Ladder } from './ladder';
import { itemsFor } from './pieces';

/** Lane width step of the quote's ladder, cm (a folded lay's lane is half the cloth). */
export const RUNG = 5;

/** Where a pieced waistband is joined. */
export type BandJoin = 'none' | 'side-seam';

/** The pieces of one fabric made ready to lay, with the waistband also as two parts when the house rule
 * allows a join and the band is longer than any other piece (only then can piecing shorten a lay). */
const outlineCache = new WeakMap<Piece, Map<number, Outlines>>();
function cachedOutlines(piece: Piece, seam: number): Outlines {
	let m = outlineCache.get(piece);
	if (!m) outlineCache.set(piece, (m = new Map()));
	let o = m.get(seam);
	if (!o) m.set(seam, (o = outlinesOf(piece, seam)));
	return o;
}

export function layPiecesOf(
	pieces: Piece[],
	seam: number,
	join: BandJoin
): { whole: LayPiece[]; pieced: LayPiece[] | null } {
	const whole = pieces.map((piece) => ({ piece, outlines: cachedOutlines(piece, seam) }));
	const band = whole.find((lp) => lp.piece.role === 'waistband');
	if (!band || join === 'none') return { whole, pieced: null };
	const len = (lp: LayPiece) => lp.piece.bounds.maxY - lp.piece.bounds.minY;
	if (whole.some((lp) => lp !== band && len(lp) >= len(band))) return { whole, pieced: null };
	const side = band.piece.notches.find((n) => n.label === 'side');
	if (!side) return { whole, pieced: null };
	const { minX, maxX, minY, maxY } = band.piece.bounds;
	const at = side.at.y;
	const rect = (y0: number, y1: number) => [
		{ x: minX, y: y0 },
		{ x: maxX, y: y0 },
		{ x: maxX, y: y1 },
		{ x: minX, y: y1 }
	];
	const parts = [rect(minY, at + seam), rect(at - seam, maxY)];
	return { whole, pieced: whole.map((lp) => (lp === band ? { ...lp, parts } : lp)) };
}

/** The least length any lay of these pieces can have on a lane: their area over the lane, and the longest
 * piece along the grain. */
export function lowerBound(pieces: LayPiece[], kind: LayKind, lane: number): number {
	let area = 0;
	let longest = 0;
	for (const lp of pieces) {
		const polys = lp.parts ?? [lp.outlines.cut];
		for (const poly of polys) {
			let a = 0;
			let y0 = Infinity;
			let y1 = -Infinity;
			for (let i = 0; i < poly.length; i++) {
				const p = poly[i];
				const q = poly[(i + 1) % poly.length];
				a += p.x * q.y - q.x * p.y;
				y0 = Math.min(y0, p.y);
				y1 = Math.max(y1, p.y);
			}
			const copies = lp.parts
				? 1
				: lp.piece.cut.onFold
					? kind === 'folded'
						? 1
						: 2
					: kind === 'folded'
						? Math.ceil(lp.piece.cut.count / 2)
						: lp.piece.cut.count;
			area += (Math.abs(a) / 2) * copies;
			longest = Math.max(longest, y1 - y0);
		}
	}
	return Math.max(longest, area / lane);
}

/** The lane widths of the ladder at or below `lane`, widest first: every RUNG cm, and the narrowest lane
 * each set of pieces fits (a property of the pieces, not of the cloth: so the ladder stays fixed). */
function rungs(sets: LayPiece[][], kind: LayKind, lane: number): number[] {
	const out = new Set<number>();
	for (let r = Math.floor(lane / RUNG + 1e-9); r >= 1; r--) out.add(r * RUNG);
	for (const s of sets) {
		const need = Math.max(...s.map((lp) => breadthOf(lp, kind)));
		if (need <= lane) out.add(need);
	}
	return [...out].sort((a, b) => b - a);
}

/** The best nested lay of one kind at lane widths on the ladder up to `lane`, or null if none fits.
 * `slack(length)` maps a lay length to what is sold (the estimate): a rung is skipped once even its lower
 * bound sells for no less than the best lay found, since it could not change the estimate; and the search
 * stops once a lay sells for `enough` or less (the caller only needs to know that one exists). */
export function ladderLay(
	sets: LayPiece[][],
	kind: LayKind,
	lane: number,
	nap: boolean,
	effort: { band: number; gap: number; starts?: number },
	sold: (length: number) => number = (l) => l,
	enough = -Infinity
): PieceLay | null {
	let best: PieceLay | null = null;
	const ladders = sets.flatMap((pieces) =>
		(nap ? [true] : [false, true]).map((napped) => {
			const { items, info } = itemsFor(pieces, kind, napped);
			// Without nap the napped ladder runs too, exactly as it would for a napped cloth, so that nap can
			// never need less.
			return { ladder: new Ladder(items, lane, effort.gap, effort.band, effort.starts ?? 2), info, pieces };
		})
	);
	for (const d of rungs(sets, kind, lane)) {
		const need = Math.min(...sets.map((s) => lowerBound(s, kind, d)));
		if (best && (sold(need) >= sold(best.length) - 1e-9 || sold(best.length) <= enough)) break;
		let fitted = false;
		for (const { ladder, info } of ladders) {
			const lay = ladder.at(d);
			if (!lay) continue;
			fitted = true;
			if (!best || lay.length < best.length - 1e-9)
				best = {
					kind,
					lane: d,
					length: lay.length,
					pieces: placedPieces(lay.placements, info),
					utilisation: 0,
					evaluations: 0,
					order: lay.order,
					choice: []
				};
		}
		// Narrower rungs cannot fit a piece that this one cannot.
		if (!fitted && sets.every((s) => s.some((lp) => tooWide(lp, kind, d)))) break;
	}
	return best;
}

/** The breadth a piece takes across the lane (the same every way it may lie); a fold piece on a folded
 * lay from the fold. */
function breadthOf(lp: LayPiece, kind: LayKind): number {
	const polys = lp.parts ?? [
		kind === 'open' && lp.piece.cut.onFold
			? lp.outlines.whole
			: kind === 'seamed' && lp.piece.cut.onFold
				? lp.outlines.halves
				: lp.outlines.cut
	];
	const fold = kind === 'folded' && lp.piece.cut.onFold && !lp.parts;
	return Math.max(
		...polys.map((poly) => Math.max(...poly.map((q) => q.x)) - (fold ? 0 : Math.min(...poly.map((q) => q.x))))
	);
}

/** A piece wider than the lane every way it may lie. */
const tooWide = (lp: LayPiece, kind: LayKind, lane: number) => breadthOf(lp, kind) > lane + 1e-9;
