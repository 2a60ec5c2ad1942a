// The pieces of the full-scale files: one pdfkit document with Lora embedded, the pieces as the drawing
// model's marks in centimetres of the strip, and the test square every full-scale page is checked by.
import PDFDocument from 'pdfkit';
import type { Piece } from '$lib/drafting';
import { PALETTE, ptPerCm, type Mark, type Rect, type Tone } from '$lib/drafting/drawing/model';
import { pieceMarks } from '$lib/drafting/drawing/piece';
import { spotMap, type StripPlan } from '$lib/drafting/drawing/tiles';
import { pdfMeasure } from '../ticket/draw-pdf';
import { registerLora } from '../fonts/lora';
import { line } from '../ticket/text';
import type { SourcePiece } from './source';

export type Doc = PDFKit.PDFDocument;

/** Points a centimetre at full size. */
export const K = ptPerCm(1);

/** A new document with Lora registered, and the bytes when it ends. */
export function newDoc(title: string, subject: string, keywords: string): { doc: Doc; done: Promise<Uint8Array> } {
	const doc = new PDFDocument({
		autoFirstPage: false,
		margin: 0,
		font: null as unknown as string,
		displayTitle: true,
		lang: 'en',
		info: { Title: title, Subject: subject, Keywords: keywords, Author: 'Quarterline workroom', Creator: 'Quarterline', Producer: 'Quarterline', CreationDate: new Date() }
	});
	const chunks: Buffer[] = [];
	const done = new Promise<Uint8Array>((resolve, reject) => {
		doc.on('data', (c: Buffer) => chunks.push(c));
		doc.on('end', () => resolve(new Uint8Array(Buffer.concat(chunks))));
		doc.on('error', reject);
	});
	registerLora(doc);
	return { doc, done };
}

/** The piece with the order number (and the skirt, when the order has several) written under its cut,
 * so a piece cut out of its pages still says whose it is. */
function labelled(sp: SourcePiece, number: string): Piece {
	const p = sp.piece;
	const cut = p.labels.findIndex((l) => l.kind === 'cut');
	if (cut < 0) return p;
	const whose = sp.lines > 1 ? `Order ${number} · skirt ${sp.line} of ${sp.lines}` : `Order ${number}`;
	const labels = [...p.labels];
	labels.splice(cut + 1, 0, { ...labels[cut], text: whose, kind: 'cut' });
	return { ...p, labels };
}

/** Words and symbols on a full-size piece at 2½ times the ticket's points: a name some 1 cm tall, read
 * on a table at arm's length like the lettering of a printed pattern (common practice). */
export const FULL_SIZE_WORDS = 2.5;

/**
 * Every piece in its spot on the strip as marks in strip cm. `scale` enlarges the words and symbols
 * (a projected pattern is read from a metre or more away).
 */
export function stripMarks(doc: Doc, pieces: SourcePiece[], plan: StripPlan, number: string, scale = FULL_SIZE_WORDS, keepOff?: { edges: Rect[]; wrap: number }): Mark[][] {
	const measure = pdfMeasure(doc);
	return pieces.map((sp, i) => {
		const map = spotMap(sp.piece, plan.spots[i]);
		return pieceMarks(labelled(sp, number), map, { u: scale / K, measure, readable: true, units: 'cm', notchLabels: true, keepOff }).marks;
	});
}

/**
 * The test square: `side` cm (10 cm, or 4 in as 10.16 cm) with a bar beside it, and the words a printer
 * needs. Drawn at full size from (x, y) points; returns the height used.
 */
export function testSquare(doc: Doc, x: number, y: number, inches: boolean, look: { ink: string; paper: string } = { ink: PALETTE.ink, paper: PALETTE.white }): number {
	const side = (inches ? 4 * 2.54 : 10) * K;
	const bar = (inches ? 2 * 2.54 : 5) * K;
	doc.save();
	doc.rect(x, y, side, side).lineWidth(0.5).strokeColor(look.ink).stroke();
	// A square whose edges are its outer edges: the test reads them as black against paper.
	doc.rect(x, y, side, side).fillColor(look.ink).fillOpacity(0.08).fill();
	doc.restore();
	const name = inches ? '4 in' : '10 cm';
	line(doc, name, x + side / 2, y + side / 2 - 8, { size: 16, weight: 600, align: 'center', color: look.ink });
	line(doc, 'print at 100 %, no scaling; measure this', x + side / 2, y + side / 2 + 10, { size: 8, align: 'center', color: look.ink });
	line(doc, inches ? 'each side 4 inches' : 'each side 10 cm (100 mm)', x + side / 2, y + side / 2 + 22, { size: 7, align: 'center', color: look.ink });
	// The bar, in half-blocks, under the square.
	const by = y + side + 14;
	const steps = inches ? 4 : 5;
	for (let i = 0; i < steps; i++) {
		doc.rect(x + (i * bar) / steps, by, bar / steps, 6)
			.fillColor(i % 2 ? look.paper : look.ink)
			.fill();
	}
	doc.rect(x, by, bar, 6).lineWidth(0.4).strokeColor(look.ink).stroke();
	line(doc, '0', x, by + 16, { size: 7, align: 'center', color: look.ink });
	line(doc, inches ? '2 in' : '5 cm', x + bar, by + 16, { size: 7, align: 'center', color: look.ink });
	return side + 30;
}

/** Tone overrides for a dark ground (the projector file): light lines, the ground where paper was. */
export const DARK: Record<Tone, string> = {
	ink: '#F6F1E7',
	thread: '#FF9C8F',
	pencil: '#B9BDC8',
	chalk: '#9CC3F5',
	paper: '#10131C',
	white: '#10131C'
};

/** A mark with the box (cm) it may ink: a page draws only the marks whose box it shows. */
export interface BoxedMark {
	mark: Mark;
	box: Rect;
}

/** Marks, groups opened, each with a generous box (text by its length at its size, any angle). */
export function boxed(marks: Mark[]): BoxedMark[] {
	const out: BoxedMark[] = [];
	const of = (pts: { x: number; y: number }[], pad: number): Rect => ({
		x0: Math.min(...pts.map((q) => q.x)) - pad,
		y0: Math.min(...pts.map((q) => q.y)) - pad,
		x1: Math.max(...pts.map((q) => q.x)) + pad,
		y1: Math.max(...pts.map((q) => q.y)) + pad
	});
	for (const mk of marks) {
		if (mk.kind === 'group') out.push(...boxed(mk.marks));
		else if (mk.kind === 'path') out.push({ mark: mk, box: of(mk.parts.flatMap((c) => [c.from, c.to, ...(c.c1 && c.c2 ? [c.c1, c.c2] : [])]), 0.5) });
		else if (mk.kind === 'dot') out.push({ mark: mk, box: of([mk.at], mk.r + 0.5) });
		else if (mk.kind === 'text') out.push({ mark: mk, box: of([mk.at], mk.size * (0.7 * [...mk.text].length + 1)) });
		else out.push({ mark: mk, box: of(mk.rects.flatMap((r) => [{ x: r.x0, y: r.y0 }, { x: r.x1, y: r.y1 }]), 0.5) });
	}
	return out;
}
