// The drawing model's back end for pdfkit: marks in cm of the drawing onto the page at k points a cm,
// with the print pens (widths in points whatever the scale). Nothing is decided here but strokes.
import { PALETTE, PENS, type Curve, type Mark, type Measure, type Role, type Tone } from '$lib/drafting/drawing/model';
import { line, widthOf } from './text';

type Doc = PDFKit.PDFDocument;

/** Drawing cm to page points: k points a cm, the drawing's origin at (ox, oy). */
export interface PageMap {
	k: number;
	ox: number;
	oy: number;
}

/** Text widths for the model, measured in the embedded Lora: once a text at 1 pt, as a width grows with
 * the letter size in proportion (the model tries many sizes while it places words). Any unit in, same out. */
export const pdfMeasure =
	(doc: Doc): Measure =>
	(text, size, weight = 400) =>
		widthOf(doc, text, 1, weight) * size;

function trace(doc: Doc, parts: Curve[], m: PageMap, closed?: boolean) {
	const at = (p: { x: number; y: number }) => [m.ox + p.x * m.k, m.oy + p.y * m.k] as const;
	let last: Curve['to'] | null = null;
	for (const s of parts) {
		if (!last || Math.abs(last.x - s.from.x) > 1e-9 || Math.abs(last.y - s.from.y) > 1e-9) doc.moveTo(...at(s.from));
		if (s.c1 && s.c2) doc.bezierCurveTo(...at(s.c1), ...at(s.c2), ...at(s.to));
		else doc.lineTo(...at(s.to));
		last = s.to;
	}
	if (closed) doc.closePath();
}

/** Another look for the same marks (the projector's light lines on a dark ground): colours by tone,
 * and pens made wider by role. */
export interface Look {
	palette?: Record<Tone, string>;
	widen?: Partial<Record<Role, number>>;
}

/** Draws marks in order. */
export function drawMarks(doc: Doc, marks: Mark[], m: PageMap, look: Look = {}) {
	const colours = look.palette ?? PALETTE;
	for (const mk of marks) {
		if (mk.kind === 'group') {
			drawMarks(doc, mk.marks, m, look);
			continue;
		}
		doc.save();
		if (mk.kind === 'patch') {
			// Paper under the words, kept inside the seam line so no seam or cutting line is ever hidden.
			trace(doc, mk.clip, m, true);
			doc.clip();
			for (const r of mk.rects)
				doc.rect(m.ox + r.x0 * m.k, m.oy + r.y0 * m.k, (r.x1 - r.x0) * m.k, (r.y1 - r.y0) * m.k);
			doc.fill(colours.white);
		} else if (mk.kind === 'text') {
			line(doc, mk.text, m.ox + mk.at.x * m.k, m.oy + mk.at.y * m.k, {
				size: mk.size * m.k,
				weight: mk.weight,
				color: colours[mk.tone ?? 'ink'],
				align: mk.anchor === 'start' ? 'left' : mk.anchor === 'end' ? 'right' : 'center',
				middle: mk.baseline !== 'alphabetic',
				angle: -(mk.angle ?? 0)
			});
		} else {
			const pen = PENS[mk.role];
			if (mk.kind === 'dot') doc.circle(m.ox + mk.at.x * m.k, m.oy + mk.at.y * m.k, mk.r * m.k).fill(colours[pen.tone]);
			else {
				trace(doc, mk.parts, m, mk.closed);
				const fill = mk.fill ? colours[mk.fill] : null;
				if (fill && mk.fillOpacity !== undefined) doc.fillOpacity(mk.fillOpacity);
				if (mk.noStroke) doc.fill(fill ?? colours[pen.tone]);
				else {
					doc.lineWidth(pen.width.print * (look.widen?.[mk.role] ?? 1)).strokeColor(colours[pen.tone]);
					if (mk.dashed ?? pen.dashed) doc.dash(pen.dash.print[0], { space: pen.dash.print[1] });
					if (fill) doc.fillAndStroke(fill, colours[pen.tone]);
					else doc.stroke();
				}
			}
		}
		doc.restore();
	}
}
