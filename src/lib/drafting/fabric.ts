// How much fabric to buy: the cutting pieces laid on the given width, grain along the selvedge, folded
// where pieces are cut on the fold, never turned end for end on a napped fabric; the lay grown by the
// shrinkage and rounded up to the shop's sale step.
import type { Draft } from './draft';
import { DraftInputError } from './errors';
import { type Point } from './geometry';
import { flatten, polygonArea } from './outline';
import { packColumns } from './columns';
import { packRows, type LayItem, type LayPlacement, type Orientation } from './pack';
import type { Piece } from './pieces';

/** The fabric a skirt is cut from. */
export interface FabricOptions {
	/** Usable width between the selvedges, cm. */
	width: number;
	/** Directional fabric (pile, sheen, one-way print): every piece lies top the same way. */
	nap: boolean;
	/** Expected shrinkage in washing, % (applied to the length). */
	shrinkage: number;
	/** Which fabric: the skirt's own (default) or the lining. */
	fabric?: 'shell' | 'lining';
}

/** One piece as laid (lay coordinates: x across from the fold or a selvedge, y along the length, cm). */
export interface LayoutPiece {
	pieceId: string;
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
	layout: Layout;
}

type Variant = 'folded' | 'open' | 'seamed';

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

/** The whole piece opened out from its fold: the outline from the fold round to the fold again, then its
 * mirror image in the fold line (x = 0). */
function unfolded(poly: Point[]): Point[] {
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
	return [...half, ...half.slice(1, -1).reverse().map((q) => ({ x: -q.x, y: q.y }))];
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
	const bound = Math.max(
		...items.map((i) => Math.max(...i.polygon.map((q) => q.y)) - Math.min(...i.polygon.map((q) => q.y))),
		items.reduce((a, i) => a + Math.abs(polygonArea(i.polygon)), 0) / lane
	);
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
	if (problems.length) throw new DraftInputError(problems);
}

/** The fabric to buy for a draft at a given width. Throws DraftInputError when a piece is wider than the fabric. */
export function estimateFabric(draft: Draft, options: FabricOptions): FabricEstimate {
	check(options);
	const { width, nap, shrinkage } = options;
	const which = options.fabric ?? 'shell';
	const pieces = draft.pieces.filter((p) => p.fabric === which);
	const empty: Layout = { width, folded: false, laneWidth: width, layLength: 0, pieces: [], notes: [] };
	if (!pieces.length) return { length: 0, layout: empty };
	const seam = draft.rules.allowances.seam;
	const folded = lay(pieces, 'folded', width, nap, seam);
	const lays = [folded, lay(pieces, 'open', width, nap, seam, folded?.length)].filter((l) => l !== null);
	const notes: string[] = [];
	// Narrowest fabric each way of cutting can use (its widest piece, or twice that on a folded lay).
	const widest = (variant: Variant) =>
		Math.max(...itemsFor(pieces, variant, true, seam).map((i) => Math.max(...i.polygon.map((q) => q.x)) - Math.min(i.atFold ? 0 : Infinity, ...i.polygon.map((q) => q.x))));
	let floor = 0;
	if (!lays.length) {
		const seamed = lay(pieces, 'seamed', width, nap, seam);
		if (seamed) {
			lays.push(seamed);
			const names = pieces.filter((p) => p.cut.onFold).map((p) => p.name.toLowerCase());
			notes.push(`This width is too narrow to cut the ${names.join(' and ')} on the fold: cut each as two halves with a ${seam} cm seam allowance added at the centre.`);
			// Never less than the narrowest fabric that can be cut without the extra seam would need, so a
			// narrower fabric can never come out cheaper than a wider one.
			const threshold = Math.min(2 * widest('folded'), widest('open'));
			const ref = [lay(pieces, 'folded', threshold, nap, seam), lay(pieces, 'open', threshold, nap, seam)].filter((l) => l !== null);
			floor = Math.min(...ref.map((l) => l.length));
		}
	}
	if (!lays.length) {
		const need = Math.ceil(widest('seamed'));
		throw new DraftInputError([{ field: 'width', message: `This fabric is too narrow for the pattern: it needs at least ${need} cm of width.`, min: need }]);
	}
	const best = lays.reduce((a, b) => (b.length < a.length - 1e-9 ? b : a));
	const { saleStep, endAllowance } = draft.rules.fabric;
	const grown = (Math.max(best.length, floor) + endAllowance) * (1 + shrinkage / 100);
	const length = Math.ceil(grown / saleStep - 1e-9) * saleStep;
	if (best.placements.some((p: LayPlacement) => p.item.layers === 1 && best.variant === 'folded')) notes.push('Pieces marked “one layer” need only the top layer: keep the second as a spare.');
	if (nap) notes.push('Napped fabric: every piece lies with its waist toward the same end.');
	const byId = new Map(pieces.map((p) => [p.id, p]));
	const layout: Layout = {
		width,
		folded: best.variant === 'folded',
		laneWidth: best.lane,
		layLength: best.length,
		pieces: best.placements.map((p: LayPlacement) => ({ pieceId: p.item.pieceId, name: byId.get(p.item.pieceId)!.name, x: p.x, y: p.y, orientation: p.orientation, layers: p.item.layers, outline: p.outline })),
		notes
	};
	return { length, layout };
}
