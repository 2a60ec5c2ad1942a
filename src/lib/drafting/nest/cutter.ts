// The workroom's lays: the cutter's lay of one order (a longer search than the quote's, on the exact
// width), and a combined lay of several orders cut from one cloth, with what it saves against cutting each
// order on its own. Both are plain data (the Layout the drawings and the ticket already take), so they can
// be stored with the order and drawn again without searching.
import type { Draft } from '../draft';
import { DraftInputError } from '../errors';
import {
	checkFabric,
	estimateFabric,
	saleLength,
	type FabricEstimate,
	type FabricOptions,
	type Layout
} from '../fabric';
import type { Piece } from '../pieces';
import { compactPieces, layPieces, type PieceLay } from './lay';
import { layPiecesOf } from './quote';
import type { LayKind, LayPiece } from './pieces';

export interface SearchOptions {
	/** Wall-clock bound (default 3 s for one order, 8 s for a combined lay). */
	seconds?: number;
	/** Bound on lays tried; with it and a seed the result is the same on every machine. */
	evaluations?: number;
	seed?: number;
	/** Seconds of search between pauses, for the `…InSlices` forms (default 0.1). */
	slice?: number;
}

/** Something a sliced search awaits between slices (a server lets other requests in). */
export type Pause = () => Promise<void>;

// A search that must not hold a server's one thread for seconds (the cutter's lay after payment, a
// combined lay made from the lays view) runs as a generator: it yields after every slice of `slice`
// seconds, and each slice goes on from the best order and ways of lying found so far. One form runs it in
// one go (tests, the bench), the other awaits a pause between slices. A worker thread would be the other
// way, but adapter-node's build gives no separate entry to start one from.
type Steps<T> = Generator<void, T, void>;

function runSteps<T>(steps: Steps<T>): T {
	for (;;) {
		const r = steps.next();
		if (r.done) return r.value;
	}
}

async function runStepsPaused<T>(steps: Steps<T>, pause: Pause): Promise<T> {
	for (;;) {
		const r = steps.next();
		if (r.done) return r.value;
		await pause();
	}
}

/** The cutter's lay and what it takes: the estimate (same shape as the quote's) and the search's figures. */
export interface CutterLay extends FabricEstimate {
	/** Area of the pieces ÷ (lane × lay length), 0–1. */
	utilisation: number;
	evaluations: number;
}

const CUTTER_BAND = 0.5;

function shellPieces(draft: Draft, fabric: FabricOptions): Piece[] {
	return draft.pieces.filter((p) => p.fabric === (fabric.fabric ?? 'shell'));
}

/** Kinds of lay to try: folded and open where every piece fits, else open with fold pieces halved. */
function kindsFor(groups: LayPiece[][], usable: number): LayKind[] {
	const widest = (kind: LayKind) =>
		Math.max(
			...groups.flat().map((lp) => {
				const poly =
					kind === 'open' && lp.piece.cut.onFold
						? lp.outlines.whole
						: kind === 'seamed' && lp.piece.cut.onFold
							? lp.outlines.halves
							: lp.outlines.cut;
				const xs = poly.map((q) => q.x);
				return Math.max(...xs) - (kind === 'folded' && lp.piece.cut.onFold ? 0 : Math.min(...xs));
			})
		);
	const kinds: LayKind[] = [];
	if (widest('folded') <= usable / 2) kinds.push('folded');
	if (widest('open') <= usable) kinds.push('open');
	return kinds.length ? kinds : widest('seamed') <= usable ? ['seamed'] : [];
}

/** Share of each kind's time given to compaction after the order search (engine.ts, compact.ts): the
 * order search finds a good bottom-left lay quickly for a skirt's few pieces; moving the pieces into each
 * other's room is what shortens it further. */
const COMPACTION = 0.5;
/** Piece moves of compaction per lay tried, when the search is bounded by lays tried (deterministic). */
const MOVES_PER_EVALUATION = 20;

/** Searches every kind of lay for its share of the time; the shortest wins. Sliced when `opts.slice` is
 * given (yielding between slices), else each kind in one call. */
function* search(
	groups: LayPiece[][],
	usable: number,
	nap: boolean,
	gap: number,
	opts: SearchOptions,
	seconds: number,
	sliced = false
): Steps<PieceLay | null> {
	const kinds = kindsFor(groups, usable);
	let best: PieceLay | null = null;
	for (const kind of kinds) {
		const lane = kind === 'folded' ? usable / 2 : usable;
		const total = (opts.seconds ?? seconds) / kinds.length;
		const effort = {
			band: CUTTER_BAND,
			gap,
			seed: opts.seed ?? 1,
			evaluations: opts.evaluations !== undefined ? Math.ceil(opts.evaluations / kinds.length) : undefined,
			coarseBand: 2,
			coarseShare: 0.5
		};
		const ordering = total * (1 - COMPACTION);
		const compaction = {
			...effort,
			compactionMoves: effort.evaluations !== undefined ? effort.evaluations * MOVES_PER_EVALUATION : undefined
		};
		let lay: PieceLay | null;
		if (!sliced) {
			lay = layPieces(groups, kind, lane, nap, { ...effort, seconds: ordering });
			if (lay) lay = compactPieces(groups, kind, nap, { ...compaction, seconds: total * COMPACTION }, lay);
		} else {
			const slice = Math.max(0.02, opts.slice ?? 0.1);
			const started = Date.now();
			const left = () => total - (Date.now() - started) / 1000;
			lay = layPieces(groups, kind, lane, nap, { ...effort, seconds: Math.min(slice, ordering), evaluations: undefined });
			let k = 1;
			while (lay && left() > total * COMPACTION + 1e-3) {
				yield;
				const next = layPieces(groups, kind, lane, nap, {
					band: CUTTER_BAND,
					gap,
					seed: (opts.seed ?? 1) + k++,
					seconds: Math.min(slice, left() - total * COMPACTION),
					starts: [{ order: lay.order, choice: lay.choice }]
				});
				if (next && next.length <= lay.length + 1e-9) lay = { ...next, evaluations: lay.evaluations + next.evaluations };
				else lay = { ...lay, evaluations: lay.evaluations + (next?.evaluations ?? 0) };
			}
			// Compaction in slices, each going on from the shortest lay so far.
			while (lay && left() > 1e-3) {
				yield;
				lay = compactPieces(
					groups,
					kind,
					nap,
					{ ...compaction, evaluations: undefined, compactionMoves: undefined, seed: (opts.seed ?? 1) + k++, seconds: Math.min(slice, left()) },
					lay
				);
			}
			yield;
		}
		if (lay && (!best || lay.length < best.length - 1e-9)) best = lay;
	}
	return best;
}

function layoutOf(lay: PieceLay, width: number, usable: number, notes: string[]): Layout {
	return {
		width,
		usableWidth: usable,
		folded: lay.kind === 'folded',
		laneWidth: lay.kind === 'folded' ? usable / 2 : usable,
		layLength: lay.length,
		pieces: lay.pieces.map((p) => ({
			pieceId: p.pieceId,
			group: p.group,
			name: p.name,
			x: p.x,
			y: p.y,
			orientation: p.orientation,
			layers: p.layers,
			outline: p.outline
		})),
		notes
	};
}

/** The cutter's lay for one order: a search of a few seconds on the exact width left after shrinking;
 * never longer than the quote's lay (which is kept when the search finds nothing shorter). */
export function cutterLay(draft: Draft, fabric: FabricOptions, opts: SearchOptions = {}): CutterLay {
	return runSteps(cutterSteps(draft, fabric, opts, false));
}

/** The same search in slices, awaiting `pause` between them (for a server's background work). */
export function cutterLayInSlices(draft: Draft, fabric: FabricOptions, opts: SearchOptions, pause: Pause): Promise<CutterLay> {
	return runStepsPaused(cutterSteps(draft, fabric, opts, true), pause);
}

function* cutterSteps(draft: Draft, fabric: FabricOptions, opts: SearchOptions, sliced: boolean): Steps<CutterLay> {
	const quote = estimateFabric(draft, fabric);
	const pieces = shellPieces(draft, fabric);
	const across = fabric.shrinkageAcross ?? fabric.shrinkage;
	const usable = fabric.width * (1 - across / 100);
	const rules = draft.rules;
	const { whole, pieced } = layPiecesOf(pieces, rules.allowances.seam, rules.fabric.bandJoin);
	// With a waistband that may be pieced, each way of cutting it gets half the time.
	const share = pieced
		? {
				...opts,
				seconds: (opts.seconds ?? 3) / 2,
				evaluations: opts.evaluations !== undefined ? Math.ceil(opts.evaluations / 2) : undefined
			}
		: opts;
	let best = yield* search([whole], usable, fabric.nap, rules.fabric.gap, share, 3, sliced);
	if (pieced) {
		const other = yield* search([pieced], usable, fabric.nap, rules.fabric.gap, share, 3, sliced);
		if (other && (!best || other.length < best.length - 1e-9)) best = other;
	}
	const area = quote.layout.pieces.reduce((a, p) => a + polygonArea(p.outline), 0);
	if (!best || best.length >= quote.layout.layLength - 1e-9) {
		const lane = quote.layout.laneWidth;
		return {
			...quote,
			utilisation: quote.layout.layLength > 0 ? area / (lane * quote.layout.layLength) : 0,
			evaluations: best?.evaluations ?? 0
		};
	}
	const need = (best.length + rules.fabric.endAllowance) / (1 - fabric.shrinkage / 100);
	const notes = quote.layout.notes.filter((n) => !n.startsWith('Waistband cut in two'));
	if (best.pieces.filter((p) => p.pieceId === 'waistband').length > 1)
		notes.push('Waistband cut in two, joined at a side seam: a seam allowance is added each side of the join.');
	return {
		length: saleLength(need, rules.fabric),
		need,
		layout: layoutOf(best, fabric.width, usable, notes),
		utilisation: best.utilisation,
		evaluations: best.evaluations
	};
}

/** One order on a combined lay. */
export interface LayOrder {
	/** The caller's id for the order (echoed back). */
	id: string | number;
	draft: Draft;
	/** Fabric to buy for this order alone, cm, if already known (say the stored cutter's lay); else the
	 * quote's estimate is used. */
	aloneLength?: number;
}

export interface CombinedLay {
	/** Fabric to buy for the whole lay (cm, rounded up to the sale step). */
	length: number;
	need: number;
	layout: Layout;
	/** Area of all the pieces ÷ (lane × lay length), 0–1. */
	utilisation: number;
	/** Each order on its own: fabric to buy, cm. */
	alone: { id: string | number; length: number }[];
	/** Sum of the orders' own lengths less the combined length, cm (negative when laying them together
	 * would take more: then cut them one by one). */
	saved: number;
	evaluations: number;
}

/** Lays several orders' pieces (one cloth) together. Each piece keeps its order's index in `group`. */
export function combinedLay(orders: LayOrder[], fabric: FabricOptions, opts: SearchOptions = {}): CombinedLay {
	return runSteps(combinedSteps(orders, fabric, opts, false));
}

/** The same lay in slices, awaiting `pause` between them (made from a request without holding the server). */
export function combinedLayInSlices(orders: LayOrder[], fabric: FabricOptions, opts: SearchOptions, pause: Pause): Promise<CombinedLay> {
	return runStepsPaused(combinedSteps(orders, fabric, opts, true), pause);
}

function* combinedSteps(orders: LayOrder[], fabric: FabricOptions, opts: SearchOptions, sliced: boolean): Steps<CombinedLay> {
	checkFabric(fabric);
	if (!orders.length) throw new DraftInputError([{ field: 'orders', message: 'Choose at least one order to lay.' }]);
	const across = fabric.shrinkageAcross ?? fabric.shrinkage;
	const usable = fabric.width * (1 - across / 100);
	const alone = orders.map((o) => ({ id: o.id, length: o.aloneLength ?? estimateFabric(o.draft, fabric).length }));
	const groups = orders.map(
		(o) => layPiecesOf(shellPieces(o.draft, fabric), o.draft.rules.allowances.seam, 'none').whole
	);
	const rules = orders[0].draft.rules;
	const best = yield* search(groups, usable, fabric.nap, rules.fabric.gap, opts, 8, sliced);
	if (!best)
		throw new DraftInputError([{ field: 'width', message: 'Some piece of these orders is wider than the fabric.' }]);
	const need = (best.length + rules.fabric.endAllowance) / (1 - fabric.shrinkage / 100);
	const length = saleLength(need, rules.fabric);
	const sum = alone.reduce((a, o) => a + o.length, 0);
	const notes = [`${orders.length} orders laid together.`];
	if (fabric.nap) notes.push('Napped fabric: every piece lies with its waist toward the same end.');
	if (across > 0) notes.push(`Laid on the width after shrinking: ${Math.round(usable * 10) / 10} cm.`);
	return {
		length,
		need,
		layout: layoutOf(best, fabric.width, usable, notes),
		utilisation: best.utilisation,
		alone,
		saved: sum - length,
		evaluations: best.evaluations
	};
}

function polygonArea(pts: { x: number; y: number }[]): number {
	let a = 0;
	for (let i = 0; i < pts.length; i++) {
		const p = pts[i];
		const q = pts[(i + 1) % pts.length];
		a += p.x * q.y - q.x * p.y;
	}
	return Math.abs(a) / 2;
}
