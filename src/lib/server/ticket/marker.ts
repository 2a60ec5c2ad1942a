// The lay drawn as a marker: the fabric as it lies on the table (its length across the page), every
// piece where the estimate put it, numbered as in the piece list, to a stated scale with a scale bar.
import type { Layout } from '../../drafting';
import { formatCm } from '../../drafting';
import { arrowhead } from './draw';
import type { Area } from './layout';
import { INK, PAPER, PENCIL, THREAD, line, ptPerCm } from './text';

type Doc = PDFKit.PDFDocument;

// 1:25 sits between 1:20 and 1:50 on metric scale rules (common practice).
const MARKER_SCALES = [10, 20, 25, 50, 100] as const;
const PAD = { left: 16, top: 6, bottom: 32, right: 38 };
/** A folded lay with pieces needed from one layer only gets a line saying what their dashed outline means. */
const legendRoom = (layout: Layout) => (layout.folded && layout.pieces.some((p) => p.layers === 1) ? 10 : 0);

/** The scale (1:n) at which a lay fits a box, and the points per cm. */
export function markerScale(layout: Layout, box: Area): number {
	const lane = laneOf(layout);
	const room = { w: box.w - PAD.left - PAD.right, h: box.h - PAD.top - PAD.bottom - legendRoom(layout) };
	return (
		MARKER_SCALES.find(
			(n) => layout.layLength * ptPerCm(n) <= room.w && (lane.max - lane.min) * ptPerCm(n) <= room.h
		) ?? MARKER_SCALES[MARKER_SCALES.length - 1]
	);
}

function laneOf(layout: Layout) {
	let min = 0;
	let max = layout.laneWidth;
	for (const p of layout.pieces)
		for (const q of p.outline) {
			min = Math.min(min, q.x);
			max = Math.max(max, q.x);
		}
	return { min, max };
}

/** A scale bar of a round true length between about 15 and 45 mm on the page, labelled with it. */
export function scaleBar(doc: Doc, x: number, y: number, scale: number, label = true): number {
	const k = ptPerCm(scale);
	const cm = [10, 20, 50, 100, 200].find((c) => c * k >= 40) ?? 200;
	const w = cm * k;
	const parts = 5;
	for (let i = 0; i < parts; i++)
		doc
			.save()
			.rect(x + (i * w) / parts, y, w / parts, 3.2)
			.lineWidth(0.4)
			.fillAndStroke(i % 2 ? '#FFFFFF' : INK, INK)
			.restore();
	if (label) {
		line(doc, '0', x, y + 11, { size: 6.5, align: 'center' });
		line(doc, formatCm(cm), x + w, y + 11, { size: 6.5, align: 'center' });
	}
	return w;
}

/** Draws the lay in the box and returns its scale. */
export function drawMarker(doc: Doc, layout: Layout, box: Area, numberOf: (pieceId: string) => number): number {
	const scale = markerScale(layout, box);
	const k = ptPerCm(scale);
	const lane = laneOf(layout);
	const x0 = box.x + PAD.left;
	const y0 = box.y + PAD.top;
	const at = (p: { x: number; y: number }) => ({ x: x0 + p.y * k, y: y0 + (p.x - lane.min) * k });
	const L = layout.layLength * k;
	const H = (lane.max - lane.min) * k;
	doc.save().rect(x0, y0, L, H).fill(PAPER).restore();
	const edgeTop = layout.folded ? 'fold' : 'selvedge';
	const edgeBottom = layout.folded ? 'selvedges' : 'selvedge';
	doc
		.save()
		.moveTo(x0, y0)
		.lineTo(x0 + L, y0)
		.lineWidth(layout.folded ? 0.6 : 0.8)
		.strokeColor(PENCIL);
	if (layout.folded) doc.dash(3, { space: 2 });
	doc.stroke().undash().restore();
	doc
		.save()
		.moveTo(x0, y0 + H)
		.lineTo(x0 + L, y0 + H)
		.lineWidth(0.8)
		.strokeColor(PENCIL)
		.stroke()
		.restore();
	line(doc, edgeTop, x0 + L + 3, y0, { size: 6.5, middle: true, color: PENCIL });
	line(doc, edgeBottom, x0 + L + 3, y0 + H, { size: 6.5, middle: true, color: PENCIL });
	for (const p of layout.pieces) {
		if (!p.outline.length) continue;
		doc.save();
		const s = at(p.outline[0]);
		doc.moveTo(s.x, s.y);
		for (const q of p.outline.slice(1)) {
			const t = at(q);
			doc.lineTo(t.x, t.y);
		}
		doc.closePath().lineWidth(0.6).lineJoin('round');
		if (p.layers === 1 && layout.folded) doc.dash(2, { space: 1.5 });
		doc.fillAndStroke('#FFFFFF', THREAD).undash().restore();
		let cx = 0;
		let cy = 0;
		for (const q of p.outline) {
			cx += q.x;
			cy += q.y;
		}
		const c = at({ x: cx / p.outline.length, y: cy / p.outline.length });
		line(doc, String(numberOf(p.pieceId)), c.x, c.y, { size: 7, weight: 600, align: 'center', middle: true });
	}
	// Grain runs along the selvedge: a double-headed arrow under the lay, then the scale and its bar.
	const gy = y0 + H + 18;
	const g1 = { x: x0, y: gy };
	const g2 = { x: x0 + 50, y: gy };
	doc.save().moveTo(g1.x, gy).lineTo(g2.x, gy).lineWidth(0.6).strokeColor(INK).stroke().restore();
	arrowhead(doc, g2, { x: 1, y: 0 }, 4);
	arrowhead(doc, g1, { x: -1, y: 0 }, 4);
	line(doc, 'grain', g2.x + 4, gy + 2.3, { size: 6.5 });
	line(doc, `lay ${formatCm(layout.layLength)}`, x0 + L / 2, y0 + H + 8, { size: 6.5, align: 'center' });
	line(doc, `${formatCm(lane.max - lane.min)}${layout.folded ? ' folded' : ''}`, x0 - 4, y0 + H / 2, {
		size: 6.5,
		align: 'center',
		middle: true,
		angle: -90
	});
	const sx = x0 + 92;
	const tw = line(doc, `Scale 1:${scale}`, sx, gy + 2.3, { size: 6.5, weight: 600 });
	scaleBar(doc, sx + tw + 8, gy - 1.6, scale);
	if (legendRoom(layout))
		line(doc, 'Dashed outline: a piece needed from one layer only.', x0, gy + 16, { size: 6.5, color: PENCIL });
	return scale;
}
