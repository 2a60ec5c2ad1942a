// The pieces page: every piece drawn to one stated scale, a scale bar whose true length a cutter can
// check with a rule (print scaling is the usual way a drawing stops being to scale), and a legend.
import type { Piece } from '$lib/drafting';
import { ruledBar } from '$lib/drafting/drawing/marker';
import { pieceMarks, type PieceStyle } from '$lib/drafting/drawing/piece';
import { legendMarks } from '$lib/drafting/drawing/symbols';
import { drawMarks, pdfMeasure } from './draw-pdf';
import { placeOf, type Area, type PieceMap, type Placed } from '$lib/drafting/drawing/sheets';
import type { Frame } from './page-one';
import { MM, PENCIL, line, ptPerCm } from './text';
import type { Ticket } from '../outputs/ticket';

type Doc = PDFKit.PDFDocument;

/** A circle skirt's waist radius, for its skirt and lining pieces (they are cut from it). */
export const radiusOf = (t: Ticket, p: Piece) =>
	t.draft.figures.waistRadius !== undefined && (p.role === 'panel' || p.role === 'lining')
		? t.draft.figures.waistRadius
		: undefined;

/** How the ticket draws a piece at a map's scale: readable letters, its figures, numbered as listed. */
export const ticketStyle = (doc: Doc, t: Ticket, p: Piece, m: PieceMap, number: number): PieceStyle => ({
	u: 1 / m.k,
	measure: pdfMeasure(doc),
	readable: true,
	units: 'cm',
	number,
	figures: true,
	radius: radiusOf(t, p)
});

/** Height of the pieces page's header, points. */
export const PIECES_HEADER = 74;

/** The drawing area of a pieces page inside its frame. */
export const piecesArea = (f: Frame): Area => ({
	x: f.left,
	y: f.top + PIECES_HEADER,
	w: f.right - f.left,
	h: f.bottom - 14 - (f.top + PIECES_HEADER)
});

/** What the page says about its scale (the tests read it back): the ratio, then how to check the print. */
export function scaleWords(scale: number): [string, string] {
	const bar = ruledBar({ x: 0, y: 0 }, 1 / ptPerCm(scale)).length;
	const mm = (bar * 10) / scale;
	return [
		`Scale 1:${scale}: 1 cm on the page is ${scale} cm of cloth.`,
		`Print at actual size (100 %), not fitted to the page. Check: the ${bar} cm bar measures ${Number(mm.toFixed(1))} mm.`
	];
}

/** Draws one pieces page. */
export function piecesPage(
	doc: Doc,
	t: Ticket,
	f: Frame,
	placed: Placed[],
	scale: number,
	part: { index: number; of: number }
) {
	const more = part.of > 1 ? ` (${part.index} of ${part.of})` : '';
	const tw = line(doc, `${t.number} · Pieces${more}`, f.left, f.top + 14, { size: 14, weight: 600 });
	line(doc, `${t.styleName} for ${t.firstName}`, f.left + tw + 10, f.top + 14, {
		size: 9,
		color: PENCIL,
		maxWidth: f.right - f.left - tw - 10
	});
	// The bar's true length is stated beside it, so the printed bar can be measured against a rule.
	const [ratio, check] = scaleWords(scale);
	line(doc, ratio, f.left, f.top + 29, { size: 9, weight: 600, maxWidth: f.right - f.left - 150 });
	line(doc, check, f.left, f.top + 40, { size: 7.5, maxWidth: f.right - f.left - 150 });
	const k = ptPerCm(scale);
	const bar = ruledBar({ x: (f.right - 120) / k, y: (f.top + 22) / k }, 1 / k);
	const barW = bar.length * k;
	drawMarks(doc, [bar.mark], { k, ox: 0, oy: 0 });
	line(doc, `${Number((barW / MM).toFixed(1))} mm on the page`, f.right - 120 + barW + 6, f.top + 26, {
		size: 6.5,
		color: PENCIL
	});
	drawMarks(doc, legendMarks(f.left, f.top + 53, 1, pdfMeasure(doc)).marks, { k: 1, ox: 0, oy: 0 });
	line(doc, 'Dimensions on the seam line (cm). Allowances lie outside it: see the piece list.', f.left, f.top + 66, {
		size: 7,
		color: PENCIL
	});
	for (const p of placed) {
		const caption = { x: p.box.x / p.map.k, y: p.box.y / p.map.k, w: p.box.w / p.map.k, h: p.box.h / p.map.k };
		const style = { ...ticketStyle(doc, t, p.piece, p.map, p.number), caption };
		drawMarks(doc, pieceMarks(p.piece, placeOf(p.map), style).marks, { k: p.map.k, ox: 0, oy: 0 });
	}
}
