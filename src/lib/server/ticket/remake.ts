// The remake's block on the ticket's first page: what changed against the first cut, each figure's old
// and new value in one piece (so the cutter reads it, and pdftotext returns it, whole), then the fit
// report the changes came from and why. Nothing is drawn for an order that is not a remake.
// The pages and mails write "72 cm → 74 cm"; Lora has no arrow glyph in any of its subsets, so the
// ticket says it in words: "first cut 72 cm, now 74 cm".
import { formatCm } from '$lib/drafting';
import { formatDate } from '$lib/format';
import { FIELD_LABEL } from '$lib/fit/report';
import type { FitCorrection } from '../db/schema';
import type { RemakeChanges } from '../fit/remake-changes';
import type { Frame } from './page-one';
import { THREAD, PENCIL, heading, line, widthOf } from './text';
import { styleKindName } from './words';
import type { Ticket } from '../outputs/ticket';

type Doc = PDFKit.PDFDocument;
const ROW = 11;
const SIZE = 8;

const cm = (v: number | null) => (v === null ? 'none' : formatCm(v));

/** "Waist: first cut 72 cm, now 74 cm" */
export const changeOnPaper = (c: FitCorrection) => `${FIELD_LABEL[c.field] ?? c.field}: first cut ${cm(c.from)}, now ${cm(c.to)}`;

/** The report a change came from, as the workroom names it: "fit report 12 of 3 Jun 2026". */
export const reportWords = (r: Pick<RemakeChanges, 'reportId' | 'decidedAt'>) => `fit report ${r.reportId}${r.decidedAt ? ` of ${formatDate(r.decidedAt)}` : ''}`;

/** The block's height (points), for placing it before it is drawn. */
export const remakeHeight = (r: RemakeChanges | null | undefined) => (r ? 17 + Math.ceil(Math.max(1, r.corrections.length) / 2) * ROW + ROW + 4 : 0);

/**
 * Draws the block when the ticket is a remake's; returns the y below it. The first page is full on a
 * lined six-gore skirt, so the block is compact: the changes two to a row (each names its field, the
 * first cut's figure and the new one), then one line naming the report they came from and why.
 */
export function remakeChanges(doc: Doc, r: RemakeChanges | null | undefined, f: Pick<Frame, 'left' | 'right'>, top: number): number {
	if (!r) return top;
	const W = f.right - f.left;
	const half = (W - 14) / 2;
	let y = heading(doc, `Remake of order ${r.firstNumber} — changes against the first cut`, f.left, top, W);
	const rows = r.corrections.length ? r.corrections.map(changeOnPaper) : ['No figure changed: cut as before.'];
	rows.forEach((text, i) => {
		line(doc, text, f.left + (i % 2) * (half + 14), y + 8, { size: SIZE, weight: 600, color: THREAD, maxWidth: half });
		if (i % 2 === 1 || i === rows.length - 1) y += ROW;
	});
	const why = r.reason ? ` Why: ${r.reason}` : '';
	line(doc, `From ${reportWords(r)}.${why}`, f.left, y + 8, { size: 7.5, color: PENCIL, maxWidth: W });
	return y + ROW + 4;
}

/** Beside the style's kind in the header: "· remake of QL-2040" (and where its changes are when they
 * are not on this page), in thread red so a cutter sees it before anything else. */
export function remakeMark(doc: Doc, t: Pick<Ticket, 'draft' | 'remake'>, f: Pick<Frame, 'left' | 'top'>, page: number | null) {
	if (!t.remake) return;
	const x = f.left + widthOf(doc, styleKindName(t.draft.style), 8) + 3;
	line(doc, `· remake of ${t.remake.firstNumber}${page ? `, its changes on page ${page}` : ''}`, x, f.top + 62, { size: 8, weight: 600, color: THREAD });
}
