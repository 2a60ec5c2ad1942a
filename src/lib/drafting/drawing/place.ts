// Where the words go on a drawn piece so that nothing lies on top of anything else: the label stack is
// slid off the grain line and kept inside the seam line, the hip line's figure slides along the hip line
// clear of the labels. Decided once for every back end, with text widths the back end measures. Sizes
// and gaps are in points of paper (`u` cm of the drawing each), so the same rules read at any scale.
import type { Point } from '../geometry';
import type { Label } from '../pieces';
import { overlaps, type Measure, type Rect, type Weight } from './model';

/** A fast inside test for many queries: the polygon's crossings on scan lines `step` apart. */
function scanInside(poly: Point[], step: number): (p: Point) => boolean {
	const ys = poly.map((q) => q.y);
	const y0 = Math.min(...ys);
	const rows = Math.ceil((Math.max(...ys) - y0) / step) + 1;
	const crossings: number[][] = [];
	for (let r = 0; r < rows; r++) {
		const y = y0 + (r + 0.5) * step;
		const xs: number[] = [];
		for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
			const [a, b] = [poly[i], poly[j]];
			if (a.y > y !== b.y > y) xs.push(((b.x - a.x) * (y - a.y)) / (b.y - a.y) + a.x);
		}
		crossings.push(xs.sort((p, q) => p - q));
	}
	return (p) => {
		const row = crossings[Math.floor((p.y - y0) / step)];
		if (!row) return false;
		let n = 0;
		while (n < row.length && row[n] < p.x) n++;
		return n % 2 === 1;
	};
}

/** The scan lines of an outline, made once for every stack placed in it (a piece's words may be placed
 * several times over, each a fresh try, in the same outline). */
const scans = new WeakMap<Point[], Map<number, (p: Point) => boolean>>();
function insideTest(poly: Point[], step: number): (p: Point) => boolean {
	let byStep = scans.get(poly);
	if (!byStep) scans.set(poly, (byStep = new Map()));
	let test = byStep.get(step);
	if (!test) byStep.set(step, (test = scanInside(poly, step)));
	return test;
}

const rectInside = (isInside: (p: Point) => boolean, r: Rect) =>
	[
		[r.x0, r.y0],
		[r.x1, r.y0],
		[r.x0, r.y1],
		[r.x1, r.y1],
		[(r.x0 + r.x1) / 2, r.y0],
		[(r.x0 + r.x1) / 2, r.y1]
	].every(([x, y]) => isInside({ x, y }));

/** One line of a label stack as it will be drawn. */
export interface StackLine {
	text: string;
	size: number;
	weight: Weight;
	kind: Label['kind'] | 'figure';
}

/** A label stack: its lines, its angle (degrees clockwise: 0 or ±90) and its rectangle about `centre`. */
export interface Stack {
	lines: StackLine[];
	angle: number;
	centre: Point;
	rect: Rect;
}

/** How words are fitted: `u` cm of the drawing a point of paper; `readable` keeps letters between the
 * sizes below (a reduced print) and may leave out lines the piece list repeats; else the engine's sizes
 * and every line stay. */
export interface Fit {
	u: number;
	measure: Measure;
	readable: boolean;
	/** Places tried across the piece's longer side at full size (120 unless said). */
	across?: number;
}

// Points on paper: the smallest a cutter reads at arm's length, the largest worth the room.
const MIN_PT: Record<StackLine['kind'], number> = { name: 6, cut: 5.8, figure: 6.5, note: 5.5, allowances: 5.5 };
const MAX_PT: Record<StackLine['kind'], number> = { name: 11, cut: 8.5, figure: 7.5, note: 7, allowances: 7 };
const optional = (l: StackLine) => l.kind === 'note' || l.kind === 'allowances';

export function stackRect(fit: Fit, lines: StackLine[], centre: Point, angle: number): Rect {
	const thick = lines.reduce((a, l) => a + l.size * 1.3, 0);
	const long = Math.max(0, ...lines.map((l) => fit.measure(l.text, l.size, l.weight)));
	const [w, h] = angle % 180 === 0 ? [long, thick] : [thick, long];
	return { x0: centre.x - w / 2, y0: centre.y - h / 2, x1: centre.x + w / 2, y1: centre.y + h / 2 };
}

/** Sizes the stack's lines for reading and keeps them inside the piece's box: on a reduced print, lines
 * that cannot be read there are left out (the piece list carries the same words), and a name too long
 * to run across a narrow piece turns to run along it. */
export function layoutStack(fit: Fit, lines0: StackLine[], poly: Point[], centre: Point, angle: number): Stack {
	const { u, measure, readable } = fit;
	const lines = lines0.map((l) => ({ ...l, size: readable ? Math.min(MAX_PT[l.kind] * u, Math.max(MIN_PT[l.kind] * u, l.size)) : l.size }));
	const min = (l: StackLine) => (readable ? MIN_PT[l.kind] * u : 0);
	const xs = poly.map((q) => q.x);
	const ys = poly.map((q) => q.y);
	const [spanW, spanH] = [Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)];
	const room = (a: number) => (a % 180 === 0 ? spanW : spanH) * 0.86;
	const nameW = lines.length ? measure(lines[0].text, lines[0].size, 600) : 0;
	if (readable && lines.length && nameW > room(angle) && room(angle + 90) > room(angle)) angle = angle === 0 ? 90 : 0;
	const fits = (l: StackLine) => measure(l.text, l.size, l.weight) <= room(angle);
	// A long cut line ("Cut 1 on the fold · lining fabric") breaks at its separator rather than shrinking.
	for (let i = lines.length - 1; i >= 0; i--) {
		const l = lines[i];
		if (fits(l) || !l.text.includes(' · ') || l.kind !== 'cut') continue;
		const cut = l.text.lastIndexOf(' · ');
		lines.splice(i, 1, { ...l, text: l.text.slice(0, cut) }, { ...l, text: l.text.slice(cut + 3) });
	}
	for (const l of lines) {
		if (fits(l) || optional(l)) continue;
		l.size = Math.max(min(l), (l.size * room(angle)) / measure(l.text, l.size, l.weight));
	}
	const kept = readable ? lines.filter((l) => fits(l) || !optional(l)) : lines;
	return { lines: kept, angle, centre, rect: stackRect(fit, kept, centre, angle) };
}

const moved = (r: Rect, dx: number, dy: number): Rect => ({ x0: r.x0 + dx, y0: r.y0 + dy, x1: r.x1 + dx, y1: r.y1 + dy });

/**
 * The offsets' indices nearest first (by the distance with the vertical counted at 0.6, ties in the order
 * given), handed out one by one: `nth(n)` is the n-th nearest, -1 past the end. A stack mostly finds its
 * place among the first few of some 15 000 offsets at full size, so they come off a binary heap (our own
 * few lines) as asked for instead of being sorted all at once; the order is the same a stable sort gives.
 */
function nearestFirst(xs: number[], ys: number[]): (n: number) => number {
	const size0 = xs.length;
	const key = new Float64Array(size0);
	for (let i = 0; i < size0; i++) key[i] = Math.hypot(xs[i], ys[i] * 0.6);
	const heap = new Int32Array(size0);
	for (let i = 0; i < size0; i++) heap[i] = i;
	const before = (a: number, b: number) => key[a] < key[b] || (key[a] === key[b] && a < b);
	let size = size0;
	const down = (at: number) => {
		for (;;) {
			const l = 2 * at + 1;
			const r = l + 1;
			let top = at;
			if (l < size && before(heap[l], heap[top])) top = l;
			if (r < size && before(heap[r], heap[top])) top = r;
			if (top === at) return;
			const t = heap[at];
			heap[at] = heap[top];
			heap[top] = t;
			at = top;
		}
	};
	for (let i = (size >> 1) - 1; i >= 0; i--) down(i);
	const taken: number[] = [];
	return (n) => {
		while (taken.length <= n && size > 0) {
			taken.push(heap[0]);
			heap[0] = heap[--size];
			down(0);
		}
		return n < taken.length ? taken[n] : -1;
	};
}

/** The nearest place to the stack's own centre where it lies inside the piece clear of the obstacles,
 * trying each set of obstacles in turn (strictest first); on a reduced print, lines the piece list also
 * carries are given up, and at last name and cut share one line, before the stack is left where it was. */
export function placeStack(fit: Fit, stack: Stack, poly: Point[], tiers: Rect[][]): { stack: Stack; clear: boolean } {
	const u = fit.u;
	const xs = poly.map((q) => q.x);
	const ys = poly.map((q) => q.y);
	const box = { x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) };
	const isInside = insideTest(poly, u);
	let lines = stack.lines;
	for (;;) {
		const rect = stackRect(fit, lines, stack.centre, stack.angle);
		const xs: number[] = [0];
		const ys: number[] = [0];
		// Five points of paper a step; at full size, no finer than 1/120 of the piece (a 70 cm piece at 1:1
		// would otherwise try some 150 000 places; at a ticket's scales the first rule always wins).
		const step = Math.max(5 * u, Math.max(box.x1 - box.x0, box.y1 - box.y0) / (fit.across ?? 120));
		for (let dx = box.x0 - rect.x0; dx <= box.x1 - rect.x1; dx += step)
			for (let dy = box.y0 - rect.y0; dy <= box.y1 - rect.y1; dy += step) {
				xs.push(dx);
				ys.push(dy);
			}
		const offsets = nearestFirst(xs, ys);
		// Inside-the-piece is the costly test: made once per offset (0 not yet, 1 in, 2 out), and only for
		// offsets clear of the marks.
		const insideAt = new Uint8Array(xs.length);
		const inside = (i: number) => {
			if (!insideAt[i]) {
				const r = moved(rect, xs[i], ys[i]);
				insideAt[i] = rectInside(isInside, { x0: r.x0 - 3 * u, y0: r.y0 - 2 * u, x1: r.x1 + 3 * u, y1: r.y1 + 2 * u }) ? 1 : 2;
			}
			return insideAt[i] === 1;
		};
		const pad = 1.5 * u;
		// Every place tried lies in the piece's box or where the stack was: obstacles beyond cannot matter.
		const reach = { x0: Math.min(box.x0, rect.x0), y0: Math.min(box.y0, rect.y0), x1: Math.max(box.x1, rect.x1), y1: Math.max(box.y1, rect.y1) };
		for (const all of tiers) {
			const avoid = all.filter((o) => overlaps(reach, o, pad));
			for (let n = 0, i = offsets(0); i >= 0; i = offsets(++n)) {
				const dx = xs[i];
				const dy = ys[i];
				// overlaps(moved(rect, dx, dy), o, pad) for each obstacle, written out: this runs for every
				// offset of every tier a stack tries, and a rectangle made for each was most of its time.
				const x0 = rect.x0 + dx;
				const y0 = rect.y0 + dy;
				const x1 = rect.x1 + dx;
				const y1 = rect.y1 + dy;
				let hit = false;
				for (const o of avoid)
					if (x0 < o.x1 + pad && o.x0 < x1 + pad && y0 < o.y1 + pad && o.y0 < y1 + pad) {
						hit = true;
						break;
					}
				if (hit || !inside(i)) continue;
				return { stack: { ...stack, lines, centre: { x: stack.centre.x + dx, y: stack.centre.y + dy }, rect: moved(rect, dx, dy) }, clear: true };
			}
		}
		if (!fit.readable) break;
		const last = lines.map(optional).lastIndexOf(true);
		if (last >= 0) lines = lines.filter((_, i) => i !== last);
		else if (lines.length >= 2) {
			// A narrow strip: name and cut on one line.
			const [name, cut] = lines;
			lines = [{ text: `${name.text} · ${cut.text}`, size: Math.min(name.size, cut.size + 0.5 * u), weight: 600, kind: 'name' }];
		} else break;
	}
	return { stack, clear: false };
}

/** Where along a line (as a fraction) a text of this width and height can sit clear of every rectangle. */
export function freeAlong(
	a: Point,
	b: Point,
	w: number,
	h: number,
	offset: Point,
	avoid: Rect[],
	pad: number,
	tries = [0.5, 0.32, 0.68, 0.2, 0.8]
): number | null {
	for (const t of tries) {
		const c = { x: a.x + (b.x - a.x) * t + offset.x, y: a.y + (b.y - a.y) * t + offset.y };
		const [rw, rh] = Math.abs(b.x - a.x) >= Math.abs(b.y - a.y) ? [w, h] : [h, w];
		const r = { x0: c.x - rw / 2, y0: c.y - rh / 2, x1: c.x + rw / 2, y1: c.y + rh / 2 };
		if (!avoid.some((o) => overlaps(r, o, pad))) return t;
	}
	return null;
}
