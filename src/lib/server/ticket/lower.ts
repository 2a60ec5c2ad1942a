// The bottom of the first page: the fabric with its estimated length and the lay drawing, sign-off boxes
// for cut, sewn and finished, the sharp-tools caution, and the footer every page carries.
import { formatCm } from '$lib/drafting';
import { formatMetres } from '$lib/format';
import { MARKER_PAD, markerMarks, markerScale } from '$lib/drafting/drawing/marker';
import { drawMarks, pdfMeasure } from './draw-pdf';
import type { Area } from '$lib/drafting/drawing/sheets';
import type { Frame } from './page-one';
import { INK, PENCIL, THREAD, heading, line, para, ptPerCm, rule } from './text';
import type { Ticket } from '../outputs/ticket';

type Doc = PDFKit.PDFDocument;

export const SIGN_OFF_HEIGHT = 52;
export const CAUTION =
	'Sharp tools. Shears and rotary cutters cut deep: cut on a mat, away from your other hand, keep fingers out of the blade path, close or guard the blade every time you put it down, and hand shears over handle first. Follow your workroom’s safety rules and local law.';

const TEXT_W = 176;

/** Where the lay drawing goes in the fabric section between `top` and `bottom`. */
export const markerBox = (f: Frame, top: number, bottom: number) => ({
	x: f.left + TEXT_W + 14,
	y: top + 17,
	w: f.right - (f.left + TEXT_W + 14),
	h: bottom - top - 17
});

/** The fabric section between `top` and `bottom`; the lay is drawn here unless `layElsewhere` says
 * where it is instead. */
export function fabric(doc: Doc, t: Ticket, f: Frame, top: number, bottom: number, layElsewhere?: string) {
	const W = f.right - f.left;
	const y0 = heading(doc, 'Fabric and lay', f.left, top, W);
	const wl = TEXT_W;
	const x = f.left;
	const fb = t.fabric;
	let y = y0;
	line(doc, fb.name, x, y + 9, { size: 9.5, weight: 600, maxWidth: wl });
	y += 12;
	line(doc, [fb.colour, fb.fibreContent].filter(Boolean).join(' · '), x, y + 8, {
		size: 7.5,
		color: PENCIL,
		maxWidth: wl
	});
	y += 11;
	line(
		doc,
		`Width ${formatCm(fb.widthCm)} · ${fb.nap ? 'with nap' : 'no nap'} · shrinkage ${formatCm(fb.shrinkagePct).replace(' cm', '')} %`,
		x,
		y + 8,
		{ size: 8, maxWidth: wl }
	);
	y += 14;
	const e = t.estimate;
	if (!e) {
		para(doc, t.estimateProblem ?? 'The lay could not be made.', x, y, wl, { size: 8, weight: 600, color: THREAD });
		return;
	}
	line(doc, `Cut ${formatMetres(e.length)}`, x, y + 12, { size: 14, weight: 600 });
	y += 18;
	const rules = t.draft.rules.fabric;
	const step = rules.sellBy === 'yard' ? '⅛ yard' : formatCm(rules.saleStep);
	const how = `The lay is ${formatCm(e.layout.layLength)}; with ${formatCm(rules.endAllowance)} to square the ends, divided by (1 − ${formatCm(fb.shrinkagePct).replace(' cm', '')} %) for shrinkage, rounded up to the next ${step}.`;
	y += para(doc, how, x, y, wl, { size: 7, color: PENCIL }) + 3;
	const lay = e.layout.folded
		? `Folded lengthwise, selvedges together: ${formatCm(e.layout.laneWidth)} wide, two layers.`
		: `Open, one layer, ${formatCm(e.layout.laneWidth)} wide.`;
	y += para(doc, lay, x, y, wl, { size: 7.5 }) + 3;
	const notes = [...e.layout.notes];
	if (t.cutterLay) notes.unshift("The cutter's lay: a longer search than the shop's quote, made after payment.");
	const folds = t.draft.pieces.filter((p) => p.fabric === 'shell' && p.cut.onFold);
	if (!e.layout.folded && folds.length && !notes.some((n) => n.includes('two halves')))
		notes.push(
			'On this open lay, a piece cut on the fold is laid whole: turn the pattern over along its fold line to mark the second half.'
		);
	if (t.draft.pieces.some((p) => p.fabric === 'lining')) {
		const nums = t.draft.pieces.map((p, i) => (p.fabric === 'lining' ? i + 1 : 0)).filter(Boolean);
		notes.push(`Lining pieces (${nums.join(', ')}) are cut from lining fabric, not from this length.`);
	}
	if (t.orderedCm !== null && Math.abs(t.orderedCm - e.length) > 0.05)
		notes.push(
			t.cutterLay && e.length < t.orderedCm
				? `Priced with the order: ${formatMetres(t.orderedCm)}; the cutter's lay needs less.`
				: `Priced with the order: ${formatMetres(t.orderedCm)} (the bolt or the rules have changed since).`
		);
	// Notes that do not fit under the figures go to the top of the right-hand column, above the lay.
	const box = markerBox(f, top, bottom);
	const over: string[] = [];
	for (const n of notes) {
		if (over.length || y + paraHeight(doc, n, wl, 7) > bottom) over.push(n);
		else y += para(doc, n, x, y, wl, { size: 7, color: PENCIL }) + 2;
	}
	let yr = box.y;
	if (layElsewhere) {
		line(doc, layElsewhere, box.x, yr + 9, { size: 8, color: PENCIL, maxWidth: box.w });
		yr += 16;
	}
	for (const n of over) yr += para(doc, n, box.x, yr, Math.min(box.w, 300), { size: 7, color: PENCIL }) + 2;
	if (!layElsewhere) layDrawing(doc, t, { ...box, y: yr, h: box.y + box.h - yr });
}

const paraHeight = (doc: Doc, text: string, width: number, size: number) => {
	doc.font('lora-latin-400').fontSize(size);
	return doc.heightOfString(text, { width, lineGap: 1 }) + 2;
};

/** The lay drawing of a ticket's estimate in a box, pieces numbered as in the piece list. */
export function layDrawing(doc: Doc, t: Ticket, box: Area) {
	if (!t.estimate) return;
	const number = new Map(t.draft.pieces.map((p, i) => [p.id, i + 1]));
	const layout = t.estimate.layout;
	const scale = markerScale(layout, box.w, box.h);
	const k = ptPerCm(scale);
	const marks = markerMarks(layout, scale, 1 / k, pdfMeasure(doc), (id) => number.get(id) ?? 0);
	drawMarks(doc, marks, { k, ox: box.x + MARKER_PAD.left, oy: box.y + MARKER_PAD.top });
}

/** Sign-off boxes for the three workroom stages, from `top`. */
export function signOff(doc: Doc, f: Frame, top: number) {
	const gap = 10;
	const w = (f.right - f.left - 2 * gap) / 3;
	['Cut', 'Sewn', 'Finished'].forEach((stage, i) => {
		const x = f.left + i * (w + gap);
		doc.save().rect(x, top, w, SIGN_OFF_HEIGHT).lineWidth(0.6).strokeColor(INK).stroke().restore();
		line(doc, stage, x + 6, top + 12, { size: 9.5, weight: 600 });
		for (const [j, label] of ['Who', 'Date'].entries()) {
			const y = top + 28 + j * 16;
			line(doc, label, x + 6, y, { size: 7.5, color: PENCIL });
			rule(doc, x + 32, y + 1.5, x + w - 8, y + 1.5, 0.4, PENCIL);
		}
	});
}

/** The sharp-tools caution, ending at `bottom`; returns its top. */
export function caution(doc: Doc, f: Frame, bottom: number): number {
	const w = f.right - f.left - 12;
	doc.font('lora-latin-400').fontSize(7.5);
	const h = doc.heightOfString(CAUTION, { width: w, lineGap: 1 }) + 8;
	const top = bottom - h;
	doc.save().rect(f.left, top, 2.5, h).fill(THREAD).restore();
	para(doc, CAUTION, f.left + 10, top + 4, w, { size: 7.5 });
	return top;
}

/** The footer of every page. */
export function footer(doc: Doc, t: Ticket, f: Frame, page: number, pages: number) {
	const y = f.bottom;
	rule(doc, f.left, y - 9, f.right, y - 9, 0.3, PENCIL);
	line(doc, `${t.number} · ${t.firstName} · page ${page} of ${pages}`, f.left, y, {
		size: 7,
		color: PENCIL,
		maxWidth: 200
	});
	line(doc, 'Holds body measurements: keep it in the workroom and shred it once the skirt has shipped.', f.right, y, {
		size: 7,
		color: PENCIL,
		align: 'right'
	});
}
