// How much fabric to buy: the cutting pieces laid on the width left after shrinking, grain along the
// selvedge, folded where pieces are cut on the fold, never turned end for end on a napped fabric; the lay
// grown by the lengthwise shrinkage as L ÷ (1 − s) and rounded up to the shop's sale step. The lay is the
// shorter of the nested one (nest/, pieces fitted into each other) and the row and column lays, each of
// which only gets shorter as the cloth gets wider.
import type { Draft } from './draft';
import { DraftInputError } from './errors';
import { type Point } from './geometry';
import { flatten, polygonArea } from './outline';
import { packColumns } from './columns';
import { packRows, type LayItem, type LayPlacement, type Orientation } from './pack';
import type { Piece } from './pieces';
import { unfolded } from './nest/pieces';
import { ladderLay, layPiecesOf } from './nest/quote';
import type { PieceLay } from './nest/lay';
import type { HouseRules } from './rules';
import { CM_PER_INCH } from './units';

/** The fabric a skirt is cut from. */
export interface FabricOptions {
	/** Usable width between the selvedges, cm. */
	width: number;
	/** Directional fabric (pile, sheen, one-way print): every piece lies top the same way. */
	nap: boolean;
	/** Expected shrinkage in washing, % along the length (and across too, unless `shrinkageAcross` says). */
	shrinkage: number;
	/** Shrinkage across the width, %, when it differs from the lengthwise one. */
	shrinkageAcross?: number;
	/** Which fabric: the skirt's own (default) or the lining. */
	fabric?: 'shell' | 'lining';
}

/** One piece as laid (lay coordinates: x across from the fold or a selvedge, y along the length, cm). */
export interface LayoutPiece {
	pieceId: string;
	/** On a combined lay: which of the orders (index into the orders given) the piece belongs to. */
	group?: number;
	name: string;
	x: number;
	y: number;
	orientation: Orientation;
	/** 2: cut through both layers of the folded fabric; 1: one layer only. */
	layers: 1 | 2;
	outline: Point[];
}

/** Where every piece lies, for the marker drawing. */
export interface Layout {
	width: number;
	/** The width left after shrinking across, which the pieces were laid on. */
	usableWidth: number;
	/** Folded lengthwise, selvedges together: pieces lie on a double layer `laneWidth` wide. */
	folded: boolean;
	laneWidth: number;
	/** Length the pieces take, before the end allowance and shrinkage. */
	layLength: number;
	pieces: LayoutPiece[];
	notes: string[];
}

/** The estimate: fabric to buy (cm, rounded up to the sale step) and the lay it comes from. */
export interface FabricEstimate {
	length: number;
	/** The length to cut before rounding (lay + end allowance, grown by the shrinkage), cm. */
	need: number;
	layout: Layout;
}

/** Rounds a need (cm) up to what the shop sells: whole sale steps by the metre, ⅛ yards by the yard
 * (then up to the next millimetre, so the figure stored and shown is never below the need). */
export function saleLength(need: number, rules: Pick<HouseRules['fabric'], 'saleStep' | 'sellBy'>): number {
	if (need <= 0) return 0;
	if (rules.sellBy === 'yard') {
		const eighth = (36 * CM_PER_INCH) / 8;
		return Math.ceil(Math.ceil(need / eighth - 1e-9) * eighth * 10 - 1e-6) / 10;
	}
	return Math.ceil(need / rules.saleStep - 1e-9) * rules.saleStep;
}

type Variant = 'folded' | 'open' | 'seamed';

/** Band height across the quote's lays, cm: fine enough for a price, coarse enough to answer as she types. */
const QUOTE_BAND = 2;

// Outlines are made once per piece and reused by every lay tried (the packer caches by outline).
const outlines = new WeakMap<Piece, { cut?: Point[]; whole?: Point[]; halves?: Point[] }>();
function outlineOf(p: Piece, kind: 'cut' | 'whole' | 'halves', seam: number): Point[] {
	let o = outlines.get(p);
	if (!o) outlines.set(p, (o = {}));
	if (!o.cut) o.cut = flatten(p.cutting.segments, 0.5);
	if (kind === 'whole') return (o.whole ??= unfolded(o.cut));
	if (kind === 'halves') return (o.halves ??= o.cut.map((q) => (Math.abs(q.x) < 1e-6 ? { x: -seam, y: q.y } : q)));
	return o.cut;
}


/** The ways of lying allowed: without nap, each may also be turned end for end. */
function withTurns(o: Orientation[], nap: boolean): Orientation[] {
	if (nap) return o;
	return [...o, ...o.map((x): Orientation => (x === 'as-cut' ? 'turned' : x === 'mirrored' ? 'turned-mirrored' : x))];
}

function itemsFor(pieces: Piece[], variant: Variant, nap: boolean, seam: number): LayItem[] {
	const items: LayItem[] = [];
	for (const p of pieces) {
		const poly = outlineOf(p, 'cut', seam);
		const item = (key: string, polygon: Point[], atFold: boolean, orientations: Orientation[], layers: 1 | 2): LayItem => ({ key: `${p.id}:${key}`, pieceId: p.id, polygon, atFold, orientations, layers });
		if (variant === 'folded') {
			if (p.cut.onFold) items.push(item('fold', poly, true, nap ? ['as-cut'] : ['as-cut', 'turned-mirrored'], 2));
			else for (let k = 0; k < Math.ceil(p.cut.count / 2); k++) items.push(item(`${k}`, poly, false, withTurns(p.cut.count === 1 ? ['as-cut'] : ['as-cut', 'mirrored'], nap), p.cut.count === 1 ? 1 : 2));
			continue;
		}
		if (p.cut.onFold && variant === 'open') {
			items.push(item('whole', outlineOf(p, 'whole', seam), false, withTurns(['as-cut'], nap), 1));
			continue;
		}
		// Cut as separate left and right pieces (for a fold piece, two halves with a centre seam added).
		const half = p.cut.onFold ? outlineOf(p, 'halves', seam) : poly;
		const count = p.cut.onFold ? 2 : p.cut.count;
		for (let k = 0; k < count; k++) items.push(item(`${k}`, half, false, withTurns([k % 2 === 0 || count === 1 ? 'as-cut' : 'mirrored'], nap), 1));
	}
	return items;
}

/** The shortest lay of one kind, or null when a piece does not fit. Skipped (null) when even its lower
 * bound (the tallest piece, or the pieces' area over the width) cannot beat `beat`: the best of all
 * lays is the same either way, only found sooner. */
function lay(pieces: Piece[], variant: Variant, width: number, nap: boolean, seam: number, beat = Infinity) {
	const lane = variant === 'folded' ? width / 2 : width;
	const items = itemsFor(pieces, variant, nap, seam);
	const bound = Math.max(...items.map((i) => Math.max(...i.polygon.map((q) => q.y)) - Math.min(...i.polygon.map((q) => q.y))), items.reduce((a, i) => a + Math.abs(polygonArea(i.polygon)), 0) / lane);
	if (bound >= beat - 1e-9) return null;
	const packs = [() => packRows(items, lane), () => packColumns(items, lane)];
	// Turning pieces end for end may help or, greedily, hurt: keep the better, so nap never needs less.
	if (!nap) packs.push(() => packRows(itemsFor(pieces, variant, true, seam), lane));
	let best: ReturnType<typeof packRows> = null;
	for (const pack of packs) {
		const t = pack();
		if (t && (!best || t.length < best.length - 1e-9)) best = t;
		if (best && best.length <= bound + 1e-9) break;
	}
	return best ? { variant, lane, ...best } : null;
}

function check(o: FabricOptions) {
	const problems = [];
	if (typeof o?.width !== 'number' || !Number.isFinite(o.width) || o.width < 40 || o.width > 400) problems.push({ field: 'width', message: 'The fabric width must be from 40 to 400 cm.', min: 40, max: 400 });
	if (typeof o?.nap !== 'boolean') problems.push({ field: 'nap', message: 'Say whether the fabric has a nap (yes or no).' });
	if (typeof o?.shrinkage !== 'number' || !Number.isFinite(o.shrinkage) || o.shrinkage < 0 || o.shrinkage > 30) problems.push({ field: 'shrinkage', message: 'The shrinkage must be from 0 to 30 %.', min: 0, max: 30 });
	if (o?.shrinkageAcross !== undefined && (typeof o.shrinkageAcross !== 'number' || !Number.isFinite(o.shrinkageAcross) || o.shrinkageAcross < 0 || o.shrinkageAcross > 30))
		problems.push({
			field: 'shrinkageAcross',
			message: 'The shrinkage across must be from 0 to 30 %.',
			min: 0,
			max: 30
		});
	if (problems.length) throw new DraftInputError(problems);
}

interface Candidate {
	kind: Variant;
	lane: number;
	length: number;
	pieces: Omit<LayoutPiece, 'name'>[];
}

const fromRows = (l: NonNullable<ReturnType<typeof lay>>): Candidate => ({
	kind: l.variant,
	lane: l.lane,
	length: l.length,
	pieces: l.placements.map((p: LayPlacement) => ({
		pieceId: p.item.pieceId,
		x: p.x,
		y: p.y,
		orientation: p.orientation,
		layers: p.item.layers,
		outline: p.outline
	}))
});
const fromNest = (l: PieceLay): Candidate => ({
	kind: l.kind,
	lane: l.lane,
	length: l.length,
	pieces: l.pieces.map(({ pieceId, x, y, orientation, layers, outline }) => ({
		pieceId,
		x,
		y,
		orientation,
		layers,
		outline
	}))
});
const shorter = (a: Candidate | null, b: Candidate | null) => (!a ? b : !b ? a : b.length < a.length - 1e-9 ? b : a);

/** The shortest lay of one kind on a usable width: nested (on the ladder of lane widths) or in rows and
 * columns, whichever is shorter; both only shorten as the width grows, and so does their minimum. */
function bestOfKind(pieces: Piece[], kind: Variant, width: number, nap: boolean, shrinkage: number, rules: HouseRules, enough = -Infinity): Candidate | null {
	const seam = rules.allowances.seam;
	const rows = lay(pieces, kind, width, nap, seam);
	const { endAllowance } = rules.fabric;
	const sold = (l: number) => saleLength((l + endAllowance) / (1 - shrinkage / 100), rules.fabric);
	if (rows && sold(rows.length) <= enough) return fromRows(rows);
	const { whole, pieced } = layPiecesOf(pieces, seam, rules.fabric.bandJoin);
	const lane = kind === 'folded' ? width / 2 : width;
	const nested = ladderLay(pieced ? [whole, pieced] : [whole], kind, lane, nap, { band: QUOTE_BAND, gap: rules.fabric.gap }, sold, enough);
	return shorter(rows ? fromRows(rows) : null, nested ? fromNest(nested) : null);
}

/** Checks fabric options; throws DraftInputError naming each bad field. */
export const checkFabric = (o: FabricOptions) => check(o);

// The quote's lays, most recently used kept: the same pieces on the same cloth under the same rules always
// give the same lay (the search is deterministic), so a repeated quote (a page reloaded, the bag priced
// again, the order placed after its quote, many shoppers with one size) is answered without nesting. Keyed
// by the pieces' cutting lines to 0.01 mm, the cloth and the rules the lay reads. A Map keeps insertion
// order, which is all an LRU needs; a package for 20 lines was not worth the dependency.
const LAY_CACHE_SIZE = 256;
const layCache = new Map<string, FabricEstimate>();
/** Empties the quote's lay cache (the bench times a cold lay with it). */
export function clearLayCache() {
	layCache.clear();
}

function cacheKey(pieces: Piece[], options: FabricOptions, rules: HouseRules): string {
	const r = (v: number) => Math.round(v * 1e4);
	const parts: (string | number)[] = [options.width, options.nap ? 1 : 0, options.shrinkage, options.shrinkageAcross ?? -1, JSON.stringify(rules.fabric), rules.allowances.seam];
	for (const p of pieces) {
		parts.push('|', p.id, p.name, p.role, p.cut.onFold ? 1 : 0, p.cut.count);
		for (const s of p.cutting.segments) {
			parts.push(r(s.from.x), r(s.from.y));
			if (s.kind === 'cubic') parts.push(r(s.c1.x), r(s.c1.y), r(s.c2.x), r(s.c2.y));
		}
		for (const n of p.notches) parts.push(n.label ?? '', r(n.at.x), r(n.at.y));
	}
	return parts.join(',');
}

/** The fabric to buy for a draft at a given width. Throws DraftInputError when a piece is wider than the fabric. */
export function estimateFabric(draft: Draft, options: FabricOptions): FabricEstimate {
	check(options);
	const pieces = draft.pieces.filter((p) => p.fabric === (options.fabric ?? 'shell'));
	const key = cacheKey(pieces, options, draft.rules);
	const hit = layCache.get(key);
	if (hit) {
		layCache.delete(key);
		layCache.set(key, hit);
		return hit;
	}
	const est = estimateUncached(draft, options);
	layCache.set(key, est);
	if (layCache.size > LAY_CACHE_SIZE) layCache.delete(layCache.keys().next().value!);
	return est;
}

function estimateUncached(draft: Draft, options: FabricOptions): FabricEstimate {
	const { width, nap, shrinkage } = options;
	const across = options.shrinkageAcross ?? shrinkage;
	// Cloth shrinks across as well as along: the pieces must fit the width it will have.
	const usable = width * (1 - across / 100);
	const which = options.fabric ?? 'shell';
	const pieces = draft.pieces.filter((p) => p.fabric === which);
	const empty: Layout = {
		width,
		usableWidth: usable,
		folded: false,
		laneWidth: usable,
		layLength: 0,
		pieces: [],
		notes: []
	};
	if (!pieces.length) return { length: 0, need: 0, layout: empty };
	const rules = draft.rules;
	const seam = rules.allowances.seam;
	let best = shorter(bestOfKind(pieces, 'folded', usable, nap, shrinkage, rules), bestOfKind(pieces, 'open', usable, nap, shrinkage, rules));
	const notes: string[] = [];
	// Narrowest fabric each way of cutting can use (its widest piece, or twice that on a folded lay).
	const widest = (variant: Variant) => Math.max(...itemsFor(pieces, variant, true, seam).map((i) => Math.max(...i.polygon.map((q) => q.x)) - Math.min(i.atFold ? 0 : Infinity, ...i.polygon.map((q) => q.x))));
	let floor = 0;
	if (!best) {
		best = bestOfKind(pieces, 'seamed', usable, nap, shrinkage, rules);
		if (best) {
			const names = pieces.filter((p) => p.cut.onFold).map((p) => p.name.toLowerCase());
			notes.push(`This width is too narrow to cut the ${names.join(' and ')} on the fold: cut each as two halves with a ${seam} cm seam allowance added at the centre.`);
			// Never less than the narrowest fabric that can be cut without the extra seam would need, so a
			// narrower fabric can never come out cheaper than a wider one.
			const threshold = Math.min(2 * widest('folded'), widest('open'));
			// Only whether it sells for more than the seamed lay matters: each search stops at one that does not.
			const { endAllowance } = rules.fabric;
			const enough = saleLength((best.length + endAllowance) / (1 - shrinkage / 100), rules.fabric);
			const folded = bestOfKind(pieces, 'folded', threshold, nap, shrinkage, rules, enough);
			const ref = folded && saleLength((folded.length + endAllowance) / (1 - shrinkage / 100), rules.fabric) <= enough ? folded : shorter(folded, bestOfKind(pieces, 'open', threshold, nap, shrinkage, rules, enough));
			floor = ref ? ref.length : 0;
		}
	}
	if (!best) {
		const need = Math.ceil(widest('seamed') / (1 - across / 100));
		throw new DraftInputError([
			{
				field: 'width',
				message: `This fabric is too narrow for the pattern: it needs at least ${need} cm of width.`,
				min: need
			}
		]);
	}
	const { endAllowance } = rules.fabric;
	const need = (Math.max(best.length, floor) + endAllowance) / (1 - shrinkage / 100);
	const length = saleLength(need, rules.fabric);
	if (best.kind === 'folded' && best.pieces.some((p) => p.layers === 1)) notes.push('Pieces marked “one layer” need only the top layer: keep the second as a spare.');
	if (best.pieces.filter((p) => p.pieceId === 'waistband').length > 1) notes.push('Waistband cut in two, joined at a side seam: a seam allowance is added each side of the join.');
	if (nap) notes.push('Napped fabric: every piece lies with its waist toward the same end.');
	if (across > 0) notes.push(`Laid on the width after shrinking: ${Math.round(usable * 10) / 10} cm.`);
	const byId = new Map(pieces.map((p) => [p.id, p]));
	const layout: Layout = {
		width,
		usableWidth: usable,
		folded: best.kind === 'folded',
		laneWidth: best.kind === 'folded' ? usable / 2 : usable,
		layLength: best.length,
		pieces: best.pieces.map((p) => ({ ...p, name: byId.get(p.pieceId)!.name })),
		notes
	};
	return { length, need, layout };
}
