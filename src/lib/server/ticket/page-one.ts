// The top of the ticket's first page: order number and QR code, promised date, first name, stage, then
// the measurements as given, the working values (quarters with ease) and the style with its options.
import { formatCm } from '$lib/drafting';
import { formatDate } from '$lib/format';
import { STAGE_LABELS } from '$lib/orders/stages';
import { drawQr } from './qr';
import { INK, PENCIL, THREAD, heading, line, rule, table } from './text';
import type { Ticket } from '../outputs/ticket';
import { adjustmentWords, halvesWords, kneeWords, optionRows, styleKindName } from './words';

type Doc = PDFKit.PDFDocument;

/** The printable box of a page, points. */
export interface Frame {
	left: number;
	right: number;
	top: number;
	bottom: number;
}

/** A length without its unit, for tables headed "cm". */
export const num = (cm: number) => formatCm(cm).replace(' cm', '');

const ROW = 11;

const SOURCE_SHORT: Record<Ticket['figuresSource'], string> = { measured: 'her tape', size_chart: 'a size chart', flat_garment: 'a skirt laid flat' };
const SOURCE_LINES: Record<Ticket['figuresSource'], string[]> = {
	measured: [],
	size_chart: ['Her usual size on the ASTM D5585 chart:', 'a chart body, not hers. No tape used.'],
	flat_garment: ['A skirt that fits her, laid flat: widths', 'doubled, house ease taken off. No tape.']
};

/** Label on the left, value on the right of a column. */
const pairs = (doc: Doc, rows: string[][], x: number, w: number, y: number) =>
	table(doc, x, y, [x + w], rows, { label: w * 0.5, value: w * 0.55, step: ROW });

export function workroomUrl(origin: string, t: Ticket) {
	return `${origin.replace(/\/+$/, '')}/workroom/orders/${t.orderId}`;
}

/** The header; returns the y below it. */
export function header(doc: Doc, t: Ticket, f: Frame, origin: string): number {
	const top = f.top;
	const qr = 66;
	drawQr(doc, workroomUrl(origin, t), f.right - qr + 4, top - 4, qr);
	// The order page offers the full-size pattern files (tiled, roll, projector) and the lay.
	line(doc, 'Scan: order and files', f.right - qr / 2 + 4, top + qr + 3, { size: 6, align: 'center', color: PENCIL });
	line(doc, 'Cutting ticket', f.left, top + 8, { size: 9, weight: 600, color: PENCIL });
	line(doc, t.number, f.left, top + 33, { size: 24, weight: 600 });
	const skirt = t.line.count > 1 ? ` · skirt ${t.line.index} of ${t.line.count}` : '';
	line(doc, `${t.styleName}${skirt}`, f.left, top + 50, { size: 10.5, weight: 600, maxWidth: 215 });
	line(doc, styleKindName(t.draft.style), f.left, top + 62, { size: 8, color: PENCIL });
	const cells: [string, string][] = [
		['Promised', formatDate(t.promisedDate)],
		['For', t.firstName],
		['Stage', STAGE_LABELS[t.status]],
		['House rules', `version ${t.houseRulesId}`]
	];
	const x0 = f.left + 230;
	cells.forEach(([label, value], i) => {
		const x = x0 + (i % 2) * 115;
		const y = top + 14 + Math.floor(i / 2) * 32;
		line(doc, label, x, y, { size: 7, color: PENCIL });
		line(doc, value, x, y + 14, { size: i === 0 ? 13 : 11, weight: 600, maxWidth: 108 });
	});
	const y = top + 76;
	rule(doc, f.left, y, f.right, y, 0.6, INK);
	return y + 8;
}

/** Warnings that stop or slow the cutter; returns the y below them. */
export function banners(doc: Doc, t: Ticket, f: Frame, top: number): number {
	const out: string[] = [];
	if (t.status === 'awaiting_payment' || t.status === 'cancelled' || t.status === 'refunded')
		out.push(`Do not cut: this order is ${STAGE_LABELS[t.status].toLowerCase()}.`);
	else if (t.status !== 'paid' && t.status !== 'cutting')
		out.push(`Reprint: this order is already past cutting (${STAGE_LABELS[t.status].toLowerCase()}).`);
	if (t.figuresAgree === false)
		out.push('The figures drafted now differ from those stored with the order: ask the owner before you cut.');
	let y = top;
	for (const text of out) {
		doc
			.save()
			.rect(f.left, y, f.right - f.left, 15)
			.fill('#F7E6E8')
			.restore();
		line(doc, text, f.left + 6, y + 10.5, { size: 8.5, weight: 600, color: THREAD, maxWidth: f.right - f.left - 12 });
		y += 19;
	}
	return y;
}

function measurements(doc: Doc, t: Ticket, x: number, w: number, top: number): number {
	let y = heading(doc, 'Measurements, as given', x, top, w);
	const g = t.given;
	const rows: [string, string][] = [
		['Waist', formatCm(g.waist)],
		['Hip', formatCm(g.hip)],
		[
			'Waist to hip',
			g.waistToHip === null ? `not given: ${formatCm(t.draft.measurements.hipDepth)} used` : formatCm(g.waistToHip)
		],
		['Waist to knee', g.waistToKnee === null || g.waistToKnee === undefined ? kneeWords(t.draft) : formatCm(g.waistToKnee)],
		['Skirt length', formatCm(g.length)],
		['Figures from', SOURCE_SHORT[t.figuresSource]]
	];
	y = pairs(doc, rows, x, w, y);
	if (g.confirmed) {
		line(doc, 'Figures confirmed by the shopper: fit in calico first.', x, y + 8, { size: 6.5, color: THREAD, maxWidth: w });
		y += ROW;
	}
	line(doc, 'Length at the side, waist to hem.', x, y + 8, { size: 6.5, color: PENCIL, maxWidth: w });
	// Figures found without a tape on her body: the cutter is told how, in two short lines.
	const note = SOURCE_LINES[t.figuresSource];
	note.forEach((text, i) => line(doc, text, x, y + 8 + (i + 1) * 8, { size: 6.5, color: THREAD, maxWidth: w }));
	return y + ROW + note.length * 8;
}

function workingValues(doc: Doc, t: Ticket, x: number, w: number, top: number): number {
	let y = heading(doc, 'Working values, a quarter with ease (cm)', x, top, w);
	const { measurements: m, rules: r, figures } = t.draft;
	const q = (v: number, e: number) => `${num(v)} + ${num(e)} = ${num(v + e)}`;
	const hipQ = m.hip / 4 + r.ease.hip;
	const rows = [
		['Waist ÷ 4 + ease', q(m.waist / 4, r.ease.waist.back), q(m.waist / 4, r.ease.waist.front)],
		['Hip ÷ 4 + ease', q(m.hip / 4, r.ease.hip), q(m.hip / 4, r.ease.hip)],
		[
			'Balance at the side',
			`${num(hipQ)} − ${num(r.balance)} = ${num(figures.back.hipWidth)}`,
			`${num(hipQ)} + ${num(r.balance)} = ${num(figures.front.hipWidth)}`
		]
	];
	y = table(doc, x, y, [x + w * 0.68, x + w], rows, { step: ROW, head: ['Back', 'Front'] });
	const exact = t.draft.exactFigures;
	if (Math.abs(exact.back.hipWidth + exact.front.hipWidth - 2 * hipQ) > 0.01) {
		line(doc, 'Hip line widened to clear the waist.', x, y + 8, { size: 6.5, color: PENCIL });
		y += ROW;
	}
	const more = [['Hip depth', `${formatCm(m.hipDepth)}${m.hipDepthAssumed ? ' (assumed)' : ''}`]];
	if (figures.waistRadius !== undefined) {
		const seam = 2 * (figures.check.waistSeam.back + figures.check.waistSeam.front);
		const theta = t.draft.style === 'full-circle' ? '2π' : 'π';
		more.push(
			['Waist seam all round', formatCm(seam)],
			[`Waist radius, seam ÷ ${theta}`, formatCm(figures.waistRadius)]
		);
	}
	return pairs(doc, more, x, w, y);
}

function options(doc: Doc, t: Ticket, x: number, w: number, top: number): number {
	const y = heading(doc, 'Style and options', x, top, w);
	const rows: [string, string][] = [
		['Style', styleKindName(t.draft.style)],
		...optionRows(t.draft.choice, t.draft.rules.waistband.width, t.draft.rules.facingDepth)
	];
	return table(doc, x, y, [x + w], rows, { label: w * 0.36, value: w * 0.66, step: ROW });
}

/** Measurements, working values and options side by side; returns the y below the tallest. */
export function facts(doc: Doc, t: Ticket, f: Frame, top: number): number {
	const W = f.right - f.left;
	const gap = 14;
	const w1 = W * 0.27;
	const w2 = W * 0.38;
	const w3 = W - w1 - w2 - 2 * gap;
	const a = measurements(doc, t, f.left, w1, top);
	const b = workingValues(doc, t, f.left + w1 + gap, w2, top);
	const c = options(doc, t, f.left + w1 + w2 + 2 * gap, w3, top);
	return Math.max(a, b, c) + 6;
}

/** The fit adjustments drafted into the line, and each half's figures for a figure drafted in two;
 * nothing when there are none. Returns the y below. */
export function fitAdjustments(doc: Doc, t: Ticket, f: Frame, top: number): number {
	const words = adjustmentWords(t.draft);
	if (!words.length) return top;
	const W = f.right - f.left;
	let y = heading(doc, 'Fit adjustments, drafted in', f.left, top, W);
	for (const w of [...words, ...halvesWords(t.draft)]) {
		line(doc, w, f.left, y + 8, { size: 7.5, maxWidth: W });
		y += ROW;
	}
	return y + 6;
}
