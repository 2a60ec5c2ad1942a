// Units and text drawing for the cutting ticket. Every single line of text goes through
// `line`, which sets it on its baseline in Lora, run by run (see fonts.ts), shrunk or cut to fit.
import { PALETTE } from '$lib/drafting/drawing/model';
import { runsOf, useFont, type Weight } from '../fonts/lora';

/** The one palette (the drawing model's), by the names page layout uses. */
export const { ink: INK, chalk: CHALK, thread: THREAD, pencil: PENCIL, paper: PAPER } = PALETTE;

/** PDF points in a millimetre: 72 points to the inch, 25.4 mm to the inch. */
export const MM = 72 / 25.4;

export { ptPerCm } from '$lib/drafting/drawing/model';

type Doc = PDFKit.PDFDocument;

export interface LineStyle {
	size: number;
	weight?: Weight;
	color?: string;
	align?: 'left' | 'center' | 'right';
	/** Shrink (to 80 %), then cut with an ellipsis, to stay within this width. */
	maxWidth?: number;
	/** Degrees counter-clockwise as seen on the page (90 reads from the bottom up). */
	angle?: number;
	/** y is the middle of the letters rather than the baseline. */
	middle?: boolean;
}

// Measuring text shapes it with fontkit every time; a ticket measures the same labels many times
// while it tries page layouts, and every document sets the same words, so widths are remembered for the
// process, per face, at 1 pt (a width grows with the letter size in proportion). Started afresh past a size.
const widths = new Map<string, number>();
const MAX_WIDTHS = 20_000;

/** Width at 1 pt of a run of text in one face. */
function runWidth(doc: Doc, font: string, text: string): number {
	const key = `${font}|${text}`;
	const hit = widths.get(key);
	if (hit !== undefined) return hit;
	const w = doc.font(font).fontSize(1).widthOfString(text);
	if (widths.size >= MAX_WIDTHS) widths.clear();
	widths.set(key, w);
	return w;
}

/** Width of a line of text at a size. */
export function widthOf(doc: Doc, text: string, size: number, weight: Weight = 400): number {
	let w = 0;
	for (const r of runsOf(text, weight)) w += runWidth(doc, r.font, r.text);
	return w * size;
}

function fitted(doc: Doc, text: string, s: LineStyle): { text: string; size: number } {
	const weight = s.weight ?? 400;
	if (!s.maxWidth || widthOf(doc, text, s.size, weight) <= s.maxWidth) return { text, size: s.size };
	const size = Math.max(s.size * 0.8, (s.size * s.maxWidth) / widthOf(doc, text, s.size, weight));
	let t = text;
	while (t.length > 1 && widthOf(doc, t, size, weight) > s.maxWidth) t = `${t.slice(0, -2).trimEnd()}…`;
	return { text: t, size };
}

/** Draws one line of text with its baseline at y; returns its width. */
export function line(doc: Doc, text: string, x: number, y: number, s: LineStyle): number {
	const weight = s.weight ?? 400;
	const f = fitted(doc, text, s);
	const width = widthOf(doc, f.text, f.size, weight);
	const start = s.align === 'center' ? -width / 2 : s.align === 'right' ? -width : 0;
	doc.save();
	if (s.angle) doc.rotate(-s.angle, { origin: [x, y] });
	// Lora's capitals stand about 0.7 em tall: half of that puts the letters' middle on y.
	const base = s.middle ? y + f.size * 0.35 : y;
	y = base;
	doc.fillColor(s.color ?? INK);
	let dx = start;
	for (const r of runsOf(f.text, weight)) {
		const w = runWidth(doc, r.font, r.text) * f.size;
		doc.font(r.font).fontSize(f.size);
		doc.text(r.text, x + dx, y, { lineBreak: false, baseline: 'alphabetic' });
		dx += w;
	}
	doc.restore();
	return width;
}

/** A wrapped paragraph (text in the latin subset: our own words and the engine's) from its top; returns its height. */
export function para(
	doc: Doc,
	text: string,
	x: number,
	top: number,
	width: number,
	s: { size: number; weight?: Weight; color?: string; gap?: number }
): number {
	useFont(doc, s.weight ?? 400, s.size);
	const options = { width, lineGap: s.gap ?? 1 };
	const h = doc.heightOfString(text, options);
	doc.fillColor(s.color ?? INK).text(text, x, top, options);
	return h;
}

/** A straight rule from (x0, y0) to (x1, y1). */
export const rule = (doc: Doc, x0: number, y0: number, x1: number, y1: number, width: number, color: string) =>
	doc.save().moveTo(x0, y0).lineTo(x1, y1).lineWidth(width).strokeColor(color).stroke().restore();

/** A section heading with a hairline under it; returns the y below it. */
export function heading(doc: Doc, text: string, x: number, top: number, width: number): number {
	line(doc, text, x, top + 9, { size: 9.5, weight: 600, color: INK });
	rule(doc, x, top + 12.5, x + width, top + 12.5, 0.4, PENCIL);
	return top + 17;
}

/** Rows of a table from `top`: each a label in pencil (within `label` points), then its values set
 * right at the columns' right edges; a head row names the columns. Returns the y below. */
export function table(
	doc: Doc,
	x: number,
	top: number,
	cols: number[],
	rows: string[][],
	o: { label?: number; value?: number; step: number; head?: string[] }
): number {
	let y = top;
	if (o.head) {
		o.head.forEach((h, i) => line(doc, h, cols[i], y + 7, { size: 7, align: 'right', color: PENCIL }));
		y += o.step - 1;
	}
	for (const [label, ...values] of rows) {
		line(doc, label, x, y + 8, { size: 8, color: PENCIL, maxWidth: o.label });
		values.forEach((v, i) => line(doc, v, cols[i], y + 8, { size: 8, align: 'right', maxWidth: o.value }));
		y += o.step;
	}
	return y;
}
