// Where the words go on a drawn piece so that nothing lies on top of anything else: the label stack is
// slid off the grain line, the hip line's figure slides along the hip line clear of the labels, and
// the fold bracket takes a stretch of the fold the labels leave free. Page points throughout.
import type { Point } from '../../drafting';
import type { Piece } from '../../drafting';
import { widthOf } from './text';

export interface Rect {
	x0: number;
	y0: number;
	x1: number;
	y1: number;
}

export const overlaps = (a: Rect, b: Rect, pad = 0) =>
	a.x0 < b.x1 + pad && b.x0 < a.x1 + pad && a.y0 < b.y1 + pad && b.y0 < a.y1 + pad;

/** A fast inside test for many queries: the polygon's crossings on scan lines 1 pt apart. */
function scanInside(poly: Point[]): (p: Point) => boolean {
	const ys = poly.map((q) => q.y);
	const y0 = Math.min(...ys);
	const rows = Math.ceil(Math.max(...ys) - y0) + 1;
	const crossings: number[][] = [];
	for (let r = 0; r < rows; r++) {
		const y = y0 + r + 0.5;
		const xs: number[] = [];
		for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
			const a = poly[i];
			const b = poly[j];
			if (a.y > y !== b.y > y) xs.push(((b.x - a.x) * (y - a.y)) / (b.y - a.y) + a.x);
		}
		crossings.push(xs.sort((p, q) => p - q));
	}
	return (p) => {
		const row = crossings[Math.floor(p.y - y0)];
		if (!row) return false;
		let n = 0;
		while (n < row.length && row[n] < p.x) n++;
		return n % 2 === 1;
	};
}

const rectInside = (isInside: (p: Point) => boolean, r: Rect) =>
	[
		{ x: r.x0, y: r.y0 },
		{ x: r.x1, y: r.y0 },
		{ x: r.x0, y: r.y1 },
		{ x: r.x1, y: r.y1 },
		{ x: (r.x0 + r.x1) / 2, y: r.y0 },
		{ x: (r.x0 + r.x1) / 2, y: r.y1 }
	].every(isInside);

/** A segment's bounding rectangle, widened by `pad`. */
export const segRect = (a: Point, b: Point, pad: number): Rect => ({
	x0: Math.min(a.x, b.x) - pad,
	y0: Math.min(a.y, b.y) - pad,
	x1: Math.max(a.x, b.x) + pad,
	y1: Math.max(a.y, b.y) + pad
});

/** One line of a label stack as it will be drawn. */
export interface StackLine {
	text: string;
	size: number;
	weight: 400 | 600;
	kind: string;
}

/** The label stack laid out: its lines (those that fit), its angle and its rectangle about `centre`. */
export interface Stack {
	lines: StackLine[];
	/** Degrees anticlockwise on the page: 0 or ±90. */
	angle: number;
	centre: Point;
	rect: Rect;
}

const MIN_PT: Record<string, number> = { name: 6, cut: 5.8, figure: 6.5, note: 5.5, allowances: 5.5 };
const MAX_PT: Record<string, number> = { name: 11, cut: 8.5, figure: 7.5, note: 7, allowances: 7 };

function stackRect(doc: PDFKit.PDFDocument, lines: StackLine[], centre: Point, angle: number): Rect {
	const thick = lines.reduce((a, l) => a + l.size * 1.3, 0);
	const long = Math.max(0, ...lines.map((l) => widthOf(doc, l.text, l.size, l.weight)));
	const [w, h] = angle % 180 === 0 ? [long, thick] : [thick, long];
	return { x0: centre.x - w / 2, y0: centre.y - h / 2, x1: centre.x + w / 2, y1: centre.y + h / 2 };
}

/** Sizes the engine's labels for reading at this scale and keeps them inside the piece: lines that
 * cannot be read there are left out (the piece list carries the same words), and a name too long to
 * run across a narrow piece turns to run along it. */
export function layoutStack(
	doc: PDFKit.PDFDocument,
	p: Piece,
	poly: Point[],
	centre: Point,
	angle: number,
	k: number,
	number: number,
	extra: string[] = []
): Stack {
	const lines: StackLine[] = [
		...p.labels.slice(0, 2),
		...extra.map((text) => ({ text, at: centre, size: 0, angle: 0, kind: 'figure' as const })),
		...p.labels.slice(2)
	].map((l) => ({
		text: l.kind === 'name' ? `${number} · ${l.text}` : l.text,
		size: Math.min(MAX_PT[l.kind] ?? 7, Math.max(MIN_PT[l.kind] ?? 5.5, l.size * k)),
		weight: l.kind === 'name' ? 600 : 400,
		kind: l.kind
	}));
	const xs = poly.map((q) => q.x);
	const ys = poly.map((q) => q.y);
	const spanW = Math.max(...xs) - Math.min(...xs);
	const spanH = Math.max(...ys) - Math.min(...ys);
	const room = (a: number) => (a % 180 === 0 ? spanW : spanH) * 0.86;
	const nameW = widthOf(doc, lines[0]?.text ?? '', lines[0]?.size ?? 6, 600);
	if (lines.length && nameW > room(angle) && room(angle + 90) > room(angle)) angle = angle === 0 ? -90 : 0;
	const fits = (l: StackLine) => widthOf(doc, l.text, l.size, l.weight) <= room(angle);
	// A long cut line ("Cut 1 on the fold · lining fabric") breaks at its separator rather than shrinking.
	for (let i = lines.length - 1; i >= 0; i--) {
		const l = lines[i];
		if (fits(l) || !l.text.includes(' · ') || l.kind !== 'cut') continue;
		const cut = l.text.lastIndexOf(' · ');
		lines.splice(i, 1, { ...l, text: l.text.slice(0, cut) }, { ...l, text: l.text.slice(cut + 3) });
	}
	for (const l of lines) {
		if (fits(l) || l.kind === 'note' || l.kind === 'allowances') continue;
		l.size = Math.max(MIN_PT[l.kind] ?? 5.5, (l.size * room(angle)) / widthOf(doc, l.text, l.size, l.weight));
	}
	const kept = lines.filter((l) => fits(l) || l.kind === 'name' || l.kind === 'cut' || l.kind === 'figure');
	return { lines: kept, angle, centre, rect: stackRect(doc, kept, centre, angle) };
}

const moved = (r: Rect, dx: number, dy: number): Rect => ({
	x0: r.x0 + dx,
	y0: r.y0 + dy,
	x1: r.x1 + dx,
	y1: r.y1 + dy
});

/** The nearest place to the stack's own centre where it lies inside the piece clear of the obstacles,
 * trying each set of obstacles in turn (strictest first); lines the piece list also carries are given
 * up, and at last name and cut share one line, before the stack is left where the engine put it. */
export function placeStack(
	doc: PDFKit.PDFDocument,
	stack: Stack,
	poly: Point[],
	tiers: Rect[][]
): { stack: Stack; clear: boolean } {
	const xs = poly.map((q) => q.x);
	const ys = poly.map((q) => q.y);
	const box = { x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) };
	const optional = (l: StackLine) => l.kind === 'note' || l.kind === 'allowances';
	const isInside = scanInside(poly);
	let lines = stack.lines;
	for (;;) {
		const rect = stackRect(doc, lines, stack.centre, stack.angle);
		const offsets: [number, number][] = [[0, 0]];
		const step = 5;
		for (let dx = box.x0 - rect.x0; dx <= box.x1 - rect.x1; dx += step)
			for (let dy = box.y0 - rect.y0; dy <= box.y1 - rect.y1; dy += step) offsets.push([dx, dy]);
		offsets.sort((a, b) => Math.hypot(a[0], a[1] * 0.6) - Math.hypot(b[0], b[1] * 0.6));
		// Inside-the-piece is the costly test: made once per offset, and only for offsets clear of the marks.
		const insideAt = new Map<number, boolean>();
		const fitsAt = (i: number) => {
			let v = insideAt.get(i);
			if (v === undefined) {
				const r = moved(rect, offsets[i][0], offsets[i][1]);
				insideAt.set(i, (v = rectInside(isInside, { x0: r.x0 - 3, y0: r.y0 - 2, x1: r.x1 + 3, y1: r.y1 + 2 })));
			}
			return v;
		};
		for (const avoid of tiers) {
			for (let i = 0; i < offsets.length; i++) {
				const [dx, dy] = offsets[i];
				const r = moved(rect, dx, dy);
				if (avoid.some((o) => overlaps(r, o, 1.5)) || !fitsAt(i)) continue;
				return {
					stack: { ...stack, lines, centre: { x: stack.centre.x + dx, y: stack.centre.y + dy }, rect: r },
					clear: true
				};
			}
		}
		const last = lines.map(optional).lastIndexOf(true);
		if (last >= 0) lines = lines.filter((_, i) => i !== last);
		else if (lines.length >= 2) {
			// A narrow strip: name and cut on one line.
			const [name, cut] = lines;
			lines = [
				{ text: `${name.text} · ${cut.text}`, size: Math.min(name.size, cut.size + 0.5), weight: 600, kind: 'name' }
			];
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
	tries = [0.5, 0.32, 0.68, 0.2, 0.8]
): number | null {
	for (const t of tries) {
		const c = { x: a.x + (b.x - a.x) * t + offset.x, y: a.y + (b.y - a.y) * t + offset.y };
		const horizontal = Math.abs(b.x - a.x) >= Math.abs(b.y - a.y);
		const [rw, rh] = horizontal ? [w, h] : [h, w];
		const r = { x0: c.x - rw / 2, y0: c.y - rh / 2, x1: c.x + rw / 2, y1: c.y + rh / 2 };
		if (!avoid.some((o) => overlaps(r, o, 1.5))) return t;
	}
	return null;
}

/** Name and cut written under a piece whose labels do not fit inside it, wrapped to its box. */
export function captionLines(
	doc: PDFKit.PDFDocument,
	p: Piece,
	number: number,
	width: number
): { text: string; weight: 400 | 600 }[] {
	const wrap = (text: string, weight: 400 | 600) => {
		const out: string[] = [];
		for (const word of text.split(' ')) {
			const last = out[out.length - 1];
			if (last !== undefined && widthOf(doc, `${last} ${word}`, 7, weight) <= width)
				out[out.length - 1] = `${last} ${word}`;
			else out.push(word);
		}
		return out.map((t) => ({ text: t, weight }));
	};
	return [...wrap(`${number} · ${p.name}`, 600), ...wrap(p.cutText, 400)];
}

/** Height a caption of so many lines takes. */
export const captionHeight = (lines: number) => 9 * lines + 2;
/** A caption may reach this far into the gap beside its box. */
export const CAPTION_SPILL = 3;
