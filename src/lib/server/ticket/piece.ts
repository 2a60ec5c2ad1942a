// One pattern piece drawn to scale as vectors from the engine's geometry, in the house conventions:
// seam line solid ink, cutting line thread red, construction lines pencil grey dashed, darts chalk blue,
// grain line a long double-headed arrow, the fold edge a bracket with "fold", notches short ticks,
// labels in Lora, key dimensions on the seam line. Words are placed first (marks.ts), then drawn in
// layers: marks, white under the words (never outside the seam line), seam and cutting lines, words.
import type { Piece, Point, Segment } from '../../drafting';
import { formatCm } from '../../drafting';
import {
	arrowhead,
	drawMarkLines,
	drawNotches,
	drawOverallSize,
	pagePolygon,
	seg,
	toPage,
	tracePath,
	unit,
	upright,
	type PieceMap
} from './draw';
import {
	CAPTION_SPILL,
	captionHeight,
	captionLines,
	freeAlong,
	layoutStack,
	overlaps,
	placeStack,
	segRect,
	type Rect
} from './marks';
import { CHALK, INK, PENCIL, THREAD, line, widthOf } from './text';

type Doc = PDFKit.PDFDocument;

interface Word {
	text: string;
	at: Point;
	size: number;
	weight: 400 | 600;
	color: string;
	angle: number;
}

/** The middle of a segment (on a cubic, at t = ½). */
const midPoint = (sg: Segment): Point =>
	sg.kind === 'line'
		? { x: (sg.from.x + sg.to.x) / 2, y: (sg.from.y + sg.to.y) / 2 }
		: {
				x: (sg.from.x + 3 * sg.c1.x + 3 * sg.c2.x + sg.to.x) / 8,
				y: (sg.from.y + 3 * sg.c1.y + 3 * sg.c2.y + sg.to.y) / 8
			};

const angleOf = (a: Point, b: Point) => upright((-Math.atan2(b.y - a.y, b.x - a.x) * 180) / Math.PI);
const wordRect = (at: Point, w: number, h: number, angle: number): Rect =>
	angle % 180 === 0
		? { x0: at.x - w / 2, y0: at.y - h / 2, x1: at.x + w / 2, y1: at.y + h / 2 }
		: { x0: at.x - h / 2, y0: at.y - w / 2, x1: at.x + h / 2, y1: at.y + w / 2 };

/** The fold bracket: parallel to the fold inside the piece, its ends turned to the fold with
 * arrowheads, on a stretch of the fold clear of the other marks (the grain line last of all). */
function planFold(doc: Doc, p: Piece, m: PieceMap, avoid: Rect[]) {
	if (!p.fold) return null;
	const a = toPage(m, p.fold.from);
	const b = toPage(m, p.fold.to);
	const along = { x: b.x - a.x, y: b.y - a.y };
	const c = toPage(m, { x: (p.bounds.minX + p.bounds.maxX) / 2, y: (p.bounds.minY + p.bounds.maxY) / 2 });
	let n = unit({ x: -along.y, y: along.x });
	if ((c.x - a.x) * n.x + (c.y - a.y) * n.y < 0) n = { x: -n.x, y: -n.y };
	const off = 5.5;
	const spans: [number, number][] = [
		[0.22, 0.78],
		[0.08, 0.42],
		[0.58, 0.92]
	];
	const at = (t: number, o: number) => ({ x: a.x + along.x * t + n.x * o, y: a.y + along.y * t + n.y * o });
	const box = ([t0, t1]: [number, number]) => segRect(at(t0, 0), at(t1, off + 8), 0);
	const free = (obstacles: Rect[]) => spans.find((s) => !obstacles.some((o) => overlaps(box(s), o, 1)));
	const span = free(avoid) ?? free(avoid.slice(1)) ?? spans[0];
	const word: Word = {
		text: 'fold',
		at: at((span[0] + span[1]) / 2, off + 4),
		size: 6.5,
		weight: 400,
		color: INK,
		angle: angleOf(a, b)
	};
	const draw = () => {
		const [p1, p2, q1, q2] = [at(span[0], 0), at(span[1], 0), at(span[0], off), at(span[1], off)];
		doc
			.save()
			.moveTo(p1.x + n.x * 2.2, p1.y + n.y * 2.2)
			.lineTo(q1.x, q1.y)
			.lineTo(q2.x, q2.y)
			.lineTo(p2.x + n.x * 2.2, p2.y + n.y * 2.2)
			.lineWidth(0.5)
			.strokeColor(INK)
			.stroke()
			.restore();
		arrowhead(doc, p1, { x: -n.x, y: -n.y }, 3);
		arrowhead(doc, p2, { x: -n.x, y: -n.y }, 3);
	};
	return { word, rect: box(span), draw };
}

/** The hip line's length written above it, in the longest wording that fits between the seams. */
function planHip(doc: Doc, p: Piece, m: PieceMap, avoid: Rect[]) {
	const hip = p.lines.find((l) => l.kind === 'hip-line');
	if (!hip || hip.points.length < 2) return null;
	const a = toPage(m, hip.points[0]);
	const b = toPage(m, hip.points[hip.points.length - 1]);
	const len = Math.hypot(b.x - a.x, b.y - a.y);
	const cm = formatCm(len / m.k);
	const text = [`hip line ${cm}`, `hip ${cm}`, cm].find((t) => widthOf(doc, t, 6.5) + 2 <= len - 8);
	if (!text) return null;
	const d = unit({ x: b.x - a.x, y: b.y - a.y });
	let off = { x: d.y * 3.8, y: -d.x * 3.8 };
	if (off.y > 0 || (Math.abs(off.y) < 1e-6 && off.x > 0)) off = { x: -off.x, y: -off.y };
	const w = widthOf(doc, text, 6.5) + 2;
	const lo = (w / 2 + 4) / len;
	const t = Math.min(1 - lo, Math.max(lo, freeAlong(a, b, w, 7, off, avoid) ?? 0.5));
	const at = { x: a.x + (b.x - a.x) * t + off.x, y: a.y + (b.y - a.y) * t + off.y };
	const word: Word = { text, at, size: 6.5, weight: 400, color: INK, angle: angleOf(a, b) };
	return { word, rect: wordRect(at, w, 8, word.angle), line: segRect(a, b, 1) };
}

/** The label stack: clear of everything if it can be; else across construction lines; else along the
 * grain line, as pattern pieces are often lettered (the white under the words interrupts it). */
function planLabels(
	doc: Doc,
	p: Piece,
	m: PieceMap,
	number: number,
	poly: Point[],
	avoid: Rect[],
	soft: Rect[],
	extra: string[]
) {
	if (!p.labels.length) return null;
	const first = p.labels[0];
	const last = p.labels[p.labels.length - 1];
	const centre = toPage(m, { x: (first.at.x + last.at.x) / 2, y: (first.at.y + last.at.y) / 2 });
	// Engine angles turn clockwise (SVG), ours anticlockwise; a turned piece adds a quarter turn.
	const laid = layoutStack(doc, p, poly, centre, upright(-first.angle + (m.turned ? 90 : 0)), m.k, number, extra);
	const placed = placeStack(doc, laid, poly, [[...avoid, ...soft], avoid, avoid.slice(1)]);
	const s = placed.stack;
	const rad = (s.angle * Math.PI) / 180;
	const down = { x: Math.sin(rad), y: Math.cos(rad) };
	let run = -s.lines.reduce((a, l) => a + l.size * 1.3, 0) / 2;
	const words: Word[] = s.lines.map((l) => {
		const mid = run + (l.size * 1.3) / 2;
		run += l.size * 1.3;
		return {
			text: l.text,
			at: { x: s.centre.x + down.x * mid, y: s.centre.y + down.y * mid },
			size: l.size,
			weight: l.weight,
			color: l.kind === 'note' || l.kind === 'allowances' ? PENCIL : INK,
			angle: s.angle
		};
	});
	return { words, rect: s.rect, clear: placed.clear };
}

/** Where a piece's words go, before anything is drawn; `clear` is false when its labels found no
 * place inside it (then they are written under it, see captionLines). */
export function planPiece(doc: Doc, p: Piece, m: PieceMap, number: number, radius?: number) {
	const poly = pagePolygon(p.seam.segments, m);
	const g1 = toPage(m, p.grain.from);
	const g2 = toPage(m, p.grain.to);
	// avoid[0] is the grain line: the one mark words may give way on last.
	const avoid: Rect[] = [segRect(g1, g2, 1.5)];
	const darts = p.darts.map((d) => [toPage(m, d.top1), toPage(m, d.point), toPage(m, d.top2)] as const);
	for (const [a, b, c] of darts)
		avoid.push({
			x0: Math.min(a.x, b.x, c.x) - 1,
			y0: Math.min(a.y, b.y, c.y) - 1,
			x1: Math.max(a.x, b.x, c.x) + 1,
			y1: Math.max(a.y, b.y, c.y) + 1
		});
	const words: Word[] = [];
	const knock: Rect[] = [];
	const soft: Rect[] = [];
	const hip = planHip(doc, p, m, avoid);
	if (hip) {
		words.push(hip.word);
		knock.push(hip.rect);
		avoid.push(hip.rect);
	}
	for (const l of p.lines)
		if (l.points.length >= 2) soft.push(segRect(toPage(m, l.points[0]), toPage(m, l.points[l.points.length - 1]), 1));
	const fold = planFold(doc, p, m, avoid);
	if (fold) {
		words.push(fold.word);
		knock.push(wordRect(fold.word.at, widthOf(doc, 'fold', 6.5) + 2, 8, fold.word.angle));
		avoid.push(fold.rect);
	}
	const labels = planLabels(
		doc,
		p,
		m,
		number,
		poly,
		avoid,
		soft,
		radius === undefined ? [] : [`waist radius r = ${formatCm(radius)}`]
	);
	const clear = !labels || labels.clear;
	if (labels && clear) {
		words.push(...labels.words);
		knock.push({
			x0: labels.rect.x0 - 1.5,
			y0: labels.rect.y0 - 0.5,
			x1: labels.rect.x1 + 1.5,
			y1: labels.rect.y1 + 0.5
		});
	}
	return { g1, g2, darts, words, knock, fold, clear };
}

/** Draws a piece through its map; `number` is its place in the piece list; `radius` marks a circle's
 * waist radius; `box` is the piece's place on the page (its caption goes at the bottom of it). */
export function drawPiece(
	doc: Doc,
	p: Piece,
	m: PieceMap,
	number: number,
	box: { x: number; y: number; w: number; h: number },
	radius?: number
) {
	const { g1, g2, darts, words, knock, fold, clear } = planPiece(doc, p, m, number, radius);
	if (!clear) {
		const lines = captionLines(doc, p, number, box.w + 2 * CAPTION_SPILL);
		let y = box.y + box.h - captionHeight(lines.length) + 8;
		for (const l of lines) {
			words.push({
				text: l.text,
				at: { x: box.x + box.w / 2, y },
				size: l.weight === 600 ? 7 : 6.5,
				weight: l.weight,
				color: INK,
				angle: 0
			});
			y += 9;
		}
	}
	// Marks inside the piece.
	drawMarkLines(doc, p.lines, m);
	for (const [a, b, c] of darts)
		doc
			.save()
			.moveTo(a.x, a.y)
			.lineTo(b.x, b.y)
			.lineTo(c.x, c.y)
			.lineWidth(0.7)
			.strokeColor(CHALK)
			.stroke()
			.circle(b.x, b.y, 1)
			.fill(CHALK)
			.restore();
	seg(doc, g1, g2, 0.6, INK);
	arrowhead(doc, g2, { x: g2.x - g1.x, y: g2.y - g1.y }, 4.5);
	arrowhead(doc, g1, { x: g1.x - g2.x, y: g1.y - g2.y }, 4.5);
	fold?.draw();
	const b = p.bounds;
	if (radius !== undefined && b.minX <= 1e-6 && b.minY <= 1e-6) {
		// The waist radius from the circle's centre to the middle of the waist, when the centre lies
		// within the piece's box (in the waist opening); its length is written with the labels.
		const waist = p.seam.segments.filter((sg) => sg.edge === 'waist');
		const mid = waist[Math.floor(waist.length / 2)];
		const c = toPage(m, { x: 0, y: 0 });
		const e = mid ? toPage(m, waist.length % 2 ? midPoint(mid) : mid.from) : null;
		if (e) {
			doc.save().lineWidth(0.4).strokeColor(PENCIL).dash(2.4, { space: 1.6 }).moveTo(c.x, c.y).lineTo(e.x, e.y);
			doc.stroke().undash().restore();
			seg(doc, { x: c.x - 2.5, y: c.y }, { x: c.x + 2.5, y: c.y }, 0.5, PENCIL);
			seg(doc, { x: c.x, y: c.y - 2.5 }, { x: c.x, y: c.y + 2.5 }, 0.5, PENCIL);
		}
	}
	// White under the words, kept inside the seam line so no seam or cutting line is ever hidden.
	doc.save();
	tracePath(doc, p.seam.segments, m);
	doc.clip();
	for (const r of knock) doc.rect(r.x0, r.y0, r.x1 - r.x0, r.y1 - r.y0).fill('#FFFFFF');
	doc.restore();
	doc.save();
	tracePath(doc, p.cutting.segments, m);
	doc.lineWidth(0.9).lineJoin('miter').strokeColor(THREAD).stroke();
	tracePath(doc, p.seam.segments, m);
	doc.lineWidth(0.6).strokeColor(INK).stroke();
	doc.restore();
	drawNotches(doc, p.notches, m);
	for (const w of words)
		line(doc, w.text, w.at.x, w.at.y, {
			size: w.size,
			weight: w.weight,
			align: 'center',
			middle: true,
			angle: w.angle,
			color: w.color
		});
	drawOverallSize(doc, p, m);
}
