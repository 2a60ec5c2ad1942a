// Drawing primitives for pattern pieces on the page: piece centimetres mapped to page points, paths of
// lines and cubic curves, arrowheads, dimension lines.
import type { MarkLine, Notch, Piece, Point, Segment } from '../../drafting';
import { formatCm } from '../../drafting';
import { INK, PENCIL, line, widthOf } from './text';

type Doc = PDFKit.PDFDocument;

/** Piece centimetres to page points: scaled, and for a long strip turned a quarter turn anticlockwise. */
export interface PieceMap {
	k: number;
	turned: boolean;
	ox: number;
	oy: number;
}

export const toPage = (m: PieceMap, p: Point): Point =>
	m.turned ? { x: m.ox + p.y * m.k, y: m.oy - p.x * m.k } : { x: m.ox + p.x * m.k, y: m.oy + p.y * m.k };
/** A direction (no translation) on the page. */
export const dirOnPage = (m: PieceMap, d: Point): Point => (m.turned ? { x: d.y, y: -d.x } : d);

export const unit = (d: Point): Point => {
	const l = Math.hypot(d.x, d.y) || 1;
	return { x: d.x / l, y: d.y / l };
};

/** Room kept left of and below each piece for its dimension lines, in points. */
export const DIM_ROOM = 13;

export function tracePath(doc: Doc, segs: Segment[], m: PieceMap) {
	if (!segs.length) return;
	const s0 = toPage(m, segs[0].from);
	doc.moveTo(s0.x, s0.y);
	for (const s of segs) {
		const t = toPage(m, s.to);
		if (s.kind === 'line') doc.lineTo(t.x, t.y);
		else {
			const a = toPage(m, s.c1);
			const b = toPage(m, s.c2);
			doc.bezierCurveTo(a.x, a.y, b.x, b.y, t.x, t.y);
		}
	}
	doc.closePath();
}

export function arrowhead(doc: Doc, tip: Point, dir: Point, size: number, color = INK) {
	const d = unit(dir);
	const bx = tip.x - d.x * size;
	const by = tip.y - d.y * size;
	const sx = -d.y * size * 0.36;
	const sy = d.x * size * 0.36;
	doc
		.save()
		.moveTo(tip.x, tip.y)
		.lineTo(bx + sx, by + sy)
		.lineTo(bx - sx, by - sy)
		.closePath()
		.fill(color)
		.restore();
}

export function seg(doc: Doc, a: Point, b: Point, width: number, color: string) {
	doc.save().moveTo(a.x, a.y).lineTo(b.x, b.y).lineWidth(width).strokeColor(color).stroke().restore();
}

/** Page extent of a piece's seam line (for its dimensions). */
export function pageExtent(segs: Segment[], m: PieceMap) {
	let minX = Infinity;
	let minY = Infinity;
	let maxX = -Infinity;
	let maxY = -Infinity;
	for (const s of segs) {
		const pts = s.kind === 'line' ? [s.from, s.to] : Array.from({ length: 13 }, (_, i) => bez(s, i / 12));
		for (const p of pts) {
			const q = toPage(m, p);
			minX = Math.min(minX, q.x);
			minY = Math.min(minY, q.y);
			maxX = Math.max(maxX, q.x);
			maxY = Math.max(maxY, q.y);
		}
	}
	return { minX, minY, maxX, maxY };
}

function bez(s: Extract<Segment, { kind: 'cubic' }>, t: number): Point {
	const u = 1 - t;
	const a = u * u * u;
	const b = 3 * u * u * t;
	const c = 3 * u * t * t;
	const d = t * t * t;
	return {
		x: a * s.from.x + b * s.c1.x + c * s.c2.x + d * s.to.x,
		y: a * s.from.y + b * s.c1.y + c * s.c2.y + d * s.to.y
	};
}

/** A dimension line between two page points with slash ticks and its value written in a gap. */
export function dimension(doc: Doc, a: Point, b: Point, cm: number) {
	const d = unit({ x: b.x - a.x, y: b.y - a.y });
	const len = Math.hypot(b.x - a.x, b.y - a.y);
	const label = formatCm(cm);
	const size = 6.5;
	const tw = widthOf(doc, label, size) + 4;
	const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
	const gapA = { x: mid.x - (d.x * tw) / 2, y: mid.y - (d.y * tw) / 2 };
	const gapB = { x: mid.x + (d.x * tw) / 2, y: mid.y + (d.y * tw) / 2 };
	if (len > tw + 4) {
		seg(doc, a, gapA, 0.35, PENCIL);
		seg(doc, gapB, b, 0.35, PENCIL);
	}
	for (const p of [a, b])
		seg(
			doc,
			{ x: p.x - (d.x + d.y) * 2, y: p.y - (d.y - d.x) * 2 },
			{ x: p.x + (d.x + d.y) * 2, y: p.y + (d.y - d.x) * 2 },
			0.5,
			PENCIL
		);
	const angle = (-Math.atan2(d.y, d.x) * 180) / Math.PI;
	line(doc, label, mid.x, mid.y, { size, align: 'center', middle: true, angle: upright(angle), color: INK });
}

/** Page polygon of a path (curves sampled), for the placement of words inside the piece. */
export function pagePolygon(segs: Segment[], m: PieceMap): Point[] {
	const out: Point[] = [];
	for (const s of segs) {
		if (s.kind === 'line') out.push(toPage(m, s.from));
		else for (let i = 0; i < 12; i++) out.push(toPage(m, bez(s, i / 12)));
	}
	return out;
}

/** An angle turned so text never reads upside down; upright text reads from the top down, as the
 * engine letters long pieces. */
export function upright(deg: number): number {
	let d = (((deg % 360) + 540) % 360) - 180;
	if (d >= 90 - 1e-6) d -= 180;
	else if (d < -90 - 1e-6) d += 180;
	return d;
}

/** Construction lines inside a piece (hip line, fold lines, vent line): pencil grey, dashed. */
export function drawMarkLines(doc: Doc, lines: MarkLine[], m: PieceMap) {
	for (const l of lines) {
		if (l.points.length < 2) continue;
		doc.save().lineWidth(0.4).strokeColor(PENCIL).dash(2.4, { space: 1.6 });
		const a = toPage(m, l.points[0]);
		doc.moveTo(a.x, a.y);
		for (const q of l.points.slice(1)) {
			const b = toPage(m, q);
			doc.lineTo(b.x, b.y);
		}
		doc.stroke().undash().restore();
	}
}

/** Notches: short ticks cut in from the cutting line, two side by side for the back; at least 4 pt
 * long so they show at any scale. */
export function drawNotches(doc: Doc, notches: Notch[], m: PieceMap) {
	for (const k of notches) {
		const at = toPage(m, k.at);
		const inward = unit(dirOnPage(m, k.inward));
		const len = Math.max(k.depth * m.k, 4);
		const across = { x: -inward.y, y: inward.x };
		for (const o of k.double ? [-1.3, 1.3] : [0]) {
			const a = { x: at.x + across.x * o, y: at.y + across.y * o };
			seg(doc, a, { x: a.x + inward.x * len, y: a.y + inward.y * len }, 0.8, INK);
		}
	}
}

/** A piece's overall size on its seam line: the height left of it, the width below it. */
export function drawOverallSize(doc: Doc, p: Piece, m: PieceMap) {
	const ext = pageExtent(p.seam.segments, m);
	const cut = pageExtent(p.cutting.segments, m);
	const dx = cut.minX - DIM_ROOM * 0.55;
	dimension(doc, { x: dx, y: ext.maxY }, { x: dx, y: ext.minY }, (ext.maxY - ext.minY) / m.k);
	const dy = cut.maxY + DIM_ROOM * 0.55;
	dimension(doc, { x: ext.minX, y: dy }, { x: ext.maxX, y: dy }, (ext.maxX - ext.minX) / m.k);
	for (const x of [ext.minX, ext.maxX]) seg(doc, { x, y: cut.maxY + 1.5 }, { x, y: dy + 2.5 }, 0.3, PENCIL);
	for (const y of [ext.minY, ext.maxY]) seg(doc, { x: cut.minX - 1.5, y }, { x: dx - 2.5, y }, 0.3, PENCIL);
}
