// The nesting engine: pieces (polygons in lay coordinates, x along the strip, y across it from the fold or
// first selvedge at y = 0) laid on a strip of a given width, as short as the search can make it.
//
// The search: a few orders by size are decoded bottom-left, then a late-acceptance hill climb changes the
// order (swap two pieces, move one) and the ways pieces lie (force one, or free it again), keeping any lay
// no longer than the one from some steps back. It was chosen over a genetic search because one decoded lay
// is the costly step and a climb spends every decode next to a good lay; over simulated annealing because
// it has one setting (the history length) and no temperature to tune per instance. A move re-decodes only
// from the first piece it changes, starting from a saved copy of the strip (checkpoints along the order).
// Then, when asked (`compaction`), the best lay is compacted (compact.ts): the strip shortened a little
// and the pieces, overlapping now, moved one by one until none overlap, again and again. The order search
// alone stalls 6–8 points of density short of the published records on the benchmark instances, because
// a bottom-left lay keeps every gap its greed left; compaction moves any piece anywhere.
// Deterministic: the same problem, seed and number of evaluations (and compaction moves) give the same
// lay; a time limit only stops it sooner.
import type { Point } from '../geometry';
import { compact } from './compact';
import { decode, type Prepared, type Spot } from './decode';
import { seeded } from './random';
import { shapeOf } from './shape';
import { Sheet } from './sheet';

/** One way a piece may lie: its outline as it lies (turned, mirrored) and a name for it. */
export interface NestVariant {
	name: string;
	points: Point[];
}

/** One piece to place (one copy: a piece cut four times is four items). */
export interface NestItem {
	key: string;
	variants: NestVariant[];
	/** Its lowest edge (least y) must lie on the fold at y = 0. */
	atFold?: boolean;
}

export interface NestProblem {
	/** Width of the strip across (the cloth's usable width, or half of it when folded). */
	width: number;
	items: NestItem[];
	/** Least distance between pieces (0 for none). */
	gap?: number;
	/** Height of a band across the width (the finest step across); default: width / 400 rounded to a
	 * 1, 2, 5 step. */
	band?: number;
}

export interface NestOptions {
	seed?: number;
	/** How many lays to decode at most (the deterministic bound). */
	evaluations?: number;
	/** Wall-clock bound in seconds (stops sooner; then the result depends on the machine's speed). */
	seconds?: number;
	/** Lays to start from, besides the engine's own: an order (a permutation of item indices) and, if
	 * given, the way each item must lie (−1: free). */
	starts?: { order: number[]; choice?: number[] }[];
	/** Search first with bands this high (coarser: many more lays tried), for `coarseShare` of the budget,
	 * then go on from its best order at the problem's own band height. */
	coarseBand?: number;
	coarseShare?: number;
	/** Share of the time (0–1) given to compaction after the order search (compact.ts): shrink the strip,
	 * separate the overlapping pieces, repeat. Runs only with `seconds` or `compactionMoves` set. */
	compaction?: number;
	/** Most piece moves in compaction (the deterministic bound for it). */
	compactionMoves?: number;
	/** The clock the time limit is read from, in ms (default: wall clock). A CPU-time clock makes runs on a
	 * loaded machine comparable. */
	clock?: () => number;
}

/** One placed piece: its outline is `variants[variant].points` moved by (dx, dy). */
export interface NestPlacement {
	index: number;
	key: string;
	variant: number;
	dx: number;
	dy: number;
	points: Point[];
}

export interface NestResult {
	width: number;
	/** Length of strip used (rightmost edge of any piece; the strip starts at x = 0). */
	length: number;
	placements: NestPlacement[];
	/** Area of the pieces ÷ (width × length). */
	utilisation: number;
	evaluations: number;
	/** Piece moves made by compaction (0 when it did not run). */
	moves: number;
	/** The order and forced ways of lying that gave this lay (to start a later, longer search from). */
	order: number[];
	choice: number[];
}

/** A round band height near width / count: 1, 2 or 5 times a power of ten. */
export function bandFor(width: number, count = 400): number {
	const raw = width / count;
	const p = Math.pow(10, Math.floor(Math.log10(raw)));
	for (const m of [1, 2, 5, 10]) if (m * p >= raw - 1e-12) return m * p;
	return 10 * p;
}

const now = () => (typeof performance !== 'undefined' ? performance.now() : Date.now());

export class NestInputError extends Error {}

interface Lay {
	order: number[];
	choice: Int8Array;
	spots: Spot[];
	length: number;
	/** What the climb minimises: the length, then (a hundredth as much) the area-weighted mean right edge
	 * of the pieces, so that among lays of one length the one packed further left is preferred; that is
	 * the one from which a later move can pull in the end. */
	score: number;
}

/** Nests the items; throws NestInputError when a piece is wider than the strip in every way it may lie. */
export function nest(problem: NestProblem, options: NestOptions = {}): NestResult {
	const { coarseBand, coarseShare = 0.6, compaction = 0, compactionMoves, ...given } = options;
	const clock = given.clock ?? now;
	const started = clock();
	// Compaction gets the last share of the time (or its own move budget); the order search the rest.
	const compacting = compaction > 0 && (given.seconds !== undefined || (compactionMoves ?? 0) > 0);
	const rest: NestOptions = {
		...given,
		clock,
		seconds: given.seconds !== undefined && compacting ? given.seconds * (1 - compaction) : given.seconds
	};
	const finish: Finish | undefined = compacting
		? {
				deadline: given.seconds !== undefined ? started + given.seconds * 1000 : Infinity,
				moves: compactionMoves
			}
		: undefined;
	const fine = problem.band ?? bandFor(problem.width);
	if (!coarseBand || coarseBand <= fine) return nestAt(problem, rest, finish);
	const first = nestAt(
		{ ...problem, band: coarseBand },
		{
			...rest,
			seconds: rest.seconds !== undefined ? rest.seconds * coarseShare : undefined,
			evaluations: rest.evaluations !== undefined ? Math.ceil(rest.evaluations * coarseShare) : undefined
		}
	);
	const second = nestAt(
		{ ...problem, band: fine },
		{
			...rest,
			seconds: rest.seconds !== undefined ? Math.max(0.001, rest.seconds - (clock() - started) / 1000) : undefined,
			evaluations: rest.evaluations !== undefined ? Math.max(1, rest.evaluations - first.evaluations) : undefined,
			starts: [{ order: first.order, choice: first.choice }, ...(rest.starts ?? [])]
		},
		finish
	);
	return { ...second, evaluations: first.evaluations + second.evaluations };
}

/** When and how long compaction runs after the order search. */
interface Finish {
	deadline: number;
	moves?: number;
}

function nestAt(problem: NestProblem, options: NestOptions, finish?: Finish): NestResult {
	const clock = options.clock ?? now;
	const { width, items } = problem;
	const gap = problem.gap ?? 0;
	if (!(width > 0) || !Number.isFinite(width)) throw new NestInputError('The strip width must be a positive number.');
	const band = problem.band ?? bandFor(width);
	const count = Math.ceil(width / band - 1e-9);
	const prepared: Prepared[] = items.map((it) => ({
		shapes: it.variants.map((v) => shapeOf(v.points, band, gap / 2)),
		atFold: !!it.atFold
	}));
	prepared.forEach((p, i) => {
		if (!p.shapes.some((s) => s.breadth <= width + 1e-9))
			throw new NestInputError(`The piece ${items[i].key} is wider than the strip (${width}) every way it may lie.`);
	});
	const n = items.length;
	const totalArea = prepared.reduce((a, p) => a + p.shapes[0].area, 0);
	if (n === 0)
		return { width, length: 0, placements: [], utilisation: 0, evaluations: 0, moves: 0, order: [], choice: [] };

	const deadline = options.seconds !== undefined ? clock() + options.seconds * 1000 : Infinity;
	const budget = options.evaluations ?? (options.seconds !== undefined ? Infinity : 200);
	const random = seeded(options.seed ?? 1);
	let evaluations = 0;

	// Checkpoints: a copy of the strip every `every` pieces of the current lay, to re-decode from.
	const every = Math.max(1, Math.ceil(n / 8));
	const run = (
		order: number[],
		choice: Int8Array,
		from: number,
		base: Lay | null,
		marks: Sheet[] | null
	): { lay: Lay | null; marks: Sheet[] } => {
		evaluations++;
		const start = base && marks ? Math.floor(from / every) : 0;
		const sheet = start > 0 && marks ? marks[start].clone() : new Sheet(count, band);
		const newMarks: Sheet[] = marks ? marks.slice(0, start + 1) : [];
		if (start === 0) newMarks[0] = new Sheet(count, band);
		const spots = start > 0 && base ? base.spots.slice(0, start * every) : [];
		const done = decode(sheet, prepared, order, choice, width, start * every, spots, (i) => {
			if ((i + 1) % every === 0) newMarks[(i + 1) / every] = sheet.clone();
		});
		if (!done) return { lay: null, marks: newMarks };
		let edge = 0;
		for (const sp of done) {
			const sh = prepared[sp.item].shapes[sp.variant];
			edge += (sp.x + sh.length) * sh.area;
		}
		const score = sheet.length + (0.01 * edge) / totalArea;
		return { lay: { order, choice, spots: done, length: sheet.length, score }, marks: newMarks };
	};

	// Starting orders: the caller's, then largest area first, longest first, widest first.
	const byKey = (f: (p: Prepared) => number) =>
		Array.from({ length: n }, (_, i) => i).sort(
			(a, b) => Number(prepared[b].atFold) - Number(prepared[a].atFold) || f(prepared[b]) - f(prepared[a]) || a - b
		);
	const free = () => new Int8Array(n).fill(-1);
	const starts = [
		...(options.starts ?? [])
			.filter((s) => s.order.length === n && new Set(s.order).size === n && s.order.every((i) => i >= 0 && i < n))
			.map((s) => ({ order: s.order, choice: s.choice && s.choice.length === n ? Int8Array.from(s.choice) : free() })),
		...[
			(p: Prepared) => p.shapes[0].area,
			(p: Prepared) => Math.min(...p.shapes.map((s) => s.length)),
			(p: Prepared) => Math.min(...p.shapes.map((s) => s.breadth))
		].map((f) => ({
			order: byKey(f),
			choice: free()
		}))
	];
	let best: Lay | null = null;
	let current: Lay | null = null;
	let currentMarks: Sheet[] = [];
	for (const { order, choice } of starts) {
		if (best && (evaluations >= budget || clock() > deadline)) break;
		const { lay, marks } = run(order, choice, 0, null, null);
		if (
			lay &&
			(!best || lay.length < best.length - 1e-9 || (lay.length <= best.length + 1e-9 && lay.score < best.score))
		) {
			best = lay;
			current = lay;
			currentMarks = marks;
		}
	}
	if (!best || !current) throw new NestInputError('Some piece fits nowhere on the strip.');

	// Late-acceptance hill climbing over order and ways of lying; when the best has not improved for a long
	// while, start again from it with a few pieces swapped.
	const history = new Float64Array(Math.max(5, Math.min(200, 10 * n))).fill(current.score);
	const patience = Math.max(300, 30 * n);
	let sinceBest = 0;
	let step = 0;
	while (evaluations < budget && clock() < deadline && n > 1) {
		if (sinceBest > patience) {
			sinceBest = 0;
			const order = best.order.slice();
			for (let k = 0; k < 3; k++) {
				const a = Math.floor(random() * n);
				const b = Math.floor(random() * n);
				[order[a], order[b]] = [order[b], order[a]];
			}
			const { lay, marks } = run(order, best.choice.slice(), 0, null, null);
			if (lay) {
				current = lay;
				currentMarks = marks;
				history.fill(current.score);
			}
			continue;
		}
		const order = current.order.slice();
		const choice = current.choice.slice();
		const r = random();
		let from: number;
		if (r < 0.45) {
			const a = Math.floor(random() * n);
			const b = Math.floor(random() * n);
			[order[a], order[b]] = [order[b], order[a]];
			from = Math.min(a, b);
		} else if (r < 0.75) {
			const a = Math.floor(random() * n);
			const b = Math.floor(random() * n);
			const [x] = order.splice(a, 1);
			order.splice(b, 0, x);
			from = Math.min(a, b);
		} else {
			const a = Math.floor(random() * n);
			const item = order[a];
			const ways = prepared[item].shapes.length;
			if (ways < 2) continue;
			const pick = Math.floor(random() * (ways + 1)) - 1;
			if (pick === choice[item]) continue;
			choice[item] = pick;
			from = a;
		}
		const { lay, marks } = run(order, choice, from, current, currentMarks);
		const h = step % history.length;
		step++;
		sinceBest++;
		if (!lay) continue;
		if (lay.score <= current.score + 1e-12 || lay.score <= history[h] + 1e-12) {
			current = lay;
			currentMarks = marks;
		}
		history[h] = current.score;
		if (
			current.length < best.length - 1e-9 ||
			(current.length <= best.length + 1e-9 && current.score < best.score - 1e-12)
		) {
			if (current.length < best.length - 1e-9) sinceBest = 0;
			best = current;
		}
	}

	let moves = 0;
	if (finish) {
		const done = compact(prepared, width, band, count, best.spots, {
			random,
			clock,
			deadline: finish.deadline,
			moves: finish.moves
		});
		moves = done.moves;
		if (done.length < best.length - 1e-9) {
			const choice = new Int8Array(n);
			for (const s of done.spots) choice[s.item] = s.variant;
			best = { order: done.spots.map((s) => s.item), choice, spots: done.spots, length: done.length, score: done.length };
		}
	}
	const found = best;
	const placements = placementsOf(found.spots, prepared, items, band);
	return {
		width,
		length: found.length,
		placements,
		utilisation: found.length > 0 ? totalArea / (width * found.length) : 0,
		evaluations,
		moves,
		order: found.order,
		choice: Array.from(found.choice)
	};
}

/** Goes on compacting a lay `nest` gave for this problem (at the same band height), for a slice of time or
 * a number of moves: what a search that must pause between slices calls after its order search. Returns
 * the lay itself when nothing shorter was found. */
export function compactLay(
	problem: NestProblem,
	from: NestResult,
	options: { seconds?: number; moves?: number; seed?: number; clock?: () => number }
): NestResult {
	const clock = options.clock ?? now;
	const { width, items } = problem;
	const n = items.length;
	if (n < 2 || from.placements.length !== n) return from;
	const gap = problem.gap ?? 0;
	const band = problem.band ?? bandFor(width);
	const count = Math.ceil(width / band - 1e-9);
	const prepared: Prepared[] = items.map((it) => ({
		shapes: it.variants.map((v) => shapeOf(v.points, band, gap / 2)),
		atFold: !!it.atFold
	}));
	const spots: Spot[] = from.placements.map((p) => {
		const shape = prepared[p.index].shapes[p.variant];
		return { item: p.index, variant: p.variant, x: p.dx + shape.minX, offset: Math.round((p.dy + shape.minY) / band) };
	});
	const done = compact(prepared, width, band, count, spots, {
		random: seeded(options.seed ?? 1),
		clock,
		deadline: options.seconds !== undefined ? clock() + options.seconds * 1000 : Infinity,
		moves: options.moves ?? (options.seconds === undefined ? 0 : undefined)
	});
	if (!(done.length < from.length - 1e-9)) return { ...from, moves: from.moves + done.moves };
	const totalArea = prepared.reduce((a, p) => a + p.shapes[0].area, 0);
	const choice = new Array<number>(n).fill(-1);
	for (const s of done.spots) choice[s.item] = s.variant;
	return {
		width,
		length: done.length,
		placements: placementsOf(done.spots, prepared, items, band),
		utilisation: totalArea / (width * done.length),
		evaluations: from.evaluations,
		moves: from.moves + done.moves,
		order: done.spots.map((s) => s.item),
		choice
	};
}

function placementsOf(spots: Spot[], prepared: Prepared[], items: NestItem[], band: number): NestPlacement[] {
	return spots.map((s) => {
		const shape = prepared[s.item].shapes[s.variant];
		const dx = s.x - shape.minX;
		const dy = s.offset * band - shape.minY;
		return {
			index: s.item,
			key: items[s.item].key,
			variant: s.variant,
			dx,
			dy,
			points: shape.points.map((p) => ({ x: p.x + dx, y: p.y + dy }))
		};
	});
}
