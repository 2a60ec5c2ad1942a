// The shop's drawings of a draft as drawing models, 1:1 in centimetres: the block, the pieces, the lay.
// Each is framed with a title and a scale bar (DESIGN.md: a scale bar on every drawing that is to scale).
import type { Draft } from '../draft';
import type { FabricEstimate } from '../fabric';
import { P, type Point } from '../geometry';
import { boundsOf } from '../outline';
import { waistWithCaps, type Panel } from '../panel';
import { grainClearOfDarts } from '../styles/common';
import { formatBuy, formatLength, type Units } from '../units';
import { segRect, through, type Curve, type Drawing, type Mark, type Measure, type Tone } from './model';
import { pieceMarks } from './piece';
import { freeAlong } from './place';
import { dartMarks, foldBracket, grainArrow, scaleBar } from './symbols';

const MARGIN = 4;
/** Screen drawings size their symbols as a print at about 1:7.5 would (cm of the drawing a point). */
export const SCREEN_U = 0.27;

type TextOpts = { angle?: number; anchor?: 'start' | 'middle' | 'end'; tone?: Tone; weight?: 400 | 600; italic?: boolean };
const text = (at: Point, s: string, size: number, o: TextOpts = {}): Mark => ({ kind: 'text', role: 'label', at, text: s, size, ...o });

/** A title above, a scale bar below: 10 cm in 1 cm blocks, or 4 inches in half-inch blocks. */
function frame(marks: Mark[], minX: number, minY: number, maxX: number, maxY: number, title: string, units: Units): Drawing {
	const x0 = minX - MARGIN;
	const y0 = minY - MARGIN - 3;
	const bar = P(x0 + MARGIN, maxY + MARGIN);
	const length = units === 'in' ? 8 * 1.27 : 10;
	return {
		title,
		box: { x: x0, y: y0, w: maxX - minX + 2 * MARGIN, h: maxY - minY + 2 * MARGIN + 6 },
		marks: [
			text(P(x0 + MARGIN, y0 + 1.8), title, 1.3, { anchor: 'start', weight: 600 }),
			...marks,
			scaleBar(bar, length, units === 'in' ? 8 : 10, 0.5, 'paper', { left: '0', right: formatLength(length, units), size: 0.8, below: 1.48 }),
			text(P(bar.x + length + 1.2, bar.y + 0.25), 'scale: 1:1 printed at 100 %', 0.7, { anchor: 'start', tone: 'pencil' })
		]
	};
}

/** One block panel as seam line (the back as drafted, the front mirrored to the right of it). */
function panelMarks(p: Panel, length: number, f: (q: Point) => Point): Mark[] {
	const H = p.hipPoint;
	const corners = [H, P(H.x, length), P(0, length), p.centreHip, p.centreTop];
	const segs: Curve[] = [...waistWithCaps(p), p.hipCurve, ...through(corners)];
	const seam: Mark = {
		kind: 'path',
		role: 'seam',
		closed: true,
		parts: segs.map((s) => ({ from: f(s.from), to: f(s.to), ...(s.c1 && s.c2 ? { c1: f(s.c1), c2: f(s.c2) } : {}) }))
	};
	return [seam, ...p.darts.flatMap((d) => dartMarks(f(d.top1), f(d.point), f(d.top2), 0.18))];
}

export function blockView(draft: Draft, units: Units, measure: Measure): Drawing {
	const { back, front } = draft.block;
	const [L, d] = [draft.block.length, draft.block.hipDepth];
	const [bh, fh] = [back.spec.hip, front.spec.hip];
	const W = bh + fh;
	const mirror = (q: Point) => P(W - q.x, q.y);
	const construction = (pts: Point[]): Mark => ({ kind: 'path', role: 'construction', parts: through(pts) });
	const marks: Mark[] = [
		construction([P(0, 0), P(W, 0)]),
		construction([P(0, d), P(W, d)]),
		construction([P(0, 0), P(0, L), P(W, L), P(W, 0)]),
		construction([P(bh, d), P(bh, L)])
	];
	marks.push(...panelMarks(back, L, (q) => q), ...panelMarks(front, L, mirror));
	const fig = draft.figures;
	const small = 0.9;
	const pencil = { tone: 'pencil' as const };
	const fl = (cm: number) => formatLength(cm, units);
	// The hip line's words slide along it clear of the side seam and the darts (they were struck through
	// by the side seam when always centred).
	const hipWords = `Hip line, half the body: ${fl(fig.back.hipWidth + fig.front.hipWidth)}`;
	const sides = [segRect(back.hipCurve.from, back.hipCurve.to, 0.3), segRect(mirror(front.hipCurve.from), mirror(front.hipCurve.to), 0.3)];
	const darts = [...back.darts, ...front.darts.map((g) => ({ ...g, top1: mirror(g.top1), point: mirror(g.point), top2: mirror(g.top2) }))].map((g) =>
		segRect(g.top1, g.point, 0.3)
	);
	const t = freeAlong(P(0, d), P(W, d), measure(hipWords, small), small * 1.2, P(0, -0.8), [...sides, ...darts], 0.3, [0.5, 0.68, 0.32, 0.75, 0.25]) ?? 0.75;
	marks.push(text(P(W * t, d - 0.8), hipWords, small, pencil));
	const mids = [bh / 2, bh + fh / 2];
	const seams = [fig.check.waistSeam.back, fig.check.waistSeam.front];
	['Back', 'Front'].forEach((name, i) => {
		marks.push(text(P(mids[i], d + 1.4), `${name} ${fl(i ? fig.front.hipWidth : fig.back.hipWidth)}`, small));
		marks.push(text(P(mids[i], (d + L) / 2), name.toUpperCase(), 2, { weight: 600 }));
		marks.push(text(P(mids[i], (d + L) / 2 + 2.2), `waist seam ${fl(seams[i])}, darts closed`, small, pencil));
	});
	// The grain line of each panel, parallel to its centre line below the hip line, clear of the words.
	const widest = measure(`waist seam ${fl(Math.max(...seams))}, darts closed`, small);
	[bh, fh].forEach((hip, i) => {
		const x = Math.max(1.5, Math.min(grainClearOfDarts(hip, [], 0.2), hip / 2 - widest / 2 - 1.2));
		const gx = i ? W - x : x;
		marks.push(...grainArrow(P(gx, d + 3), P(gx, L - 3), 1.2));
	});
	marks.push(text(P(W / 2, -2.6), `Waist line · back mark ${fl(fig.back.waistWidth)} · front mark ${fl(fig.front.waistWidth)}`, small, pencil));
	marks.push(text(P(-1.3, L / 2), 'Centre back', small, { angle: -90 }), text(P(W + 1.3, L / 2), 'Centre front', small, { angle: 90 }));
	marks.push(text(P(W / 2, L + 1.5), `Length ${fl(L)} · waist to hip ${fl(d)}${fig.hipDepthAssumed ? ' (assumed)' : ''}`, small, pencil));
	return frame(marks, -3, -4, W + 3, L + 2.5, 'Skirt block (no allowances)', units);
}

export function piecesView(draft: Draft, units: Units, measure: Measure): Drawing {
	const gap = 6;
	const maxRow = Math.max(160, ...draft.pieces.map((p) => p.bounds.maxX - p.bounds.minX));
	let [x, y, rowH, right] = [0, 0, 0, 0];
	const marks: Mark[] = [];
	for (const p of draft.pieces) {
		const w = p.bounds.maxX - p.bounds.minX;
		if (x > 0 && x + w > maxRow) [x, y, rowH] = [0, y + rowH + gap + 2, 0];
		const [dx, dy] = [x - p.bounds.minX, y - p.bounds.minY];
		marks.push(...pieceMarks(p, (q) => P(q.x + dx, q.y + dy), { u: SCREEN_U, measure, readable: false, units, notchLabels: true }).marks);
		x += w + gap;
		right = Math.max(right, x - gap);
		rowH = Math.max(rowH, p.bounds.maxY - p.bounds.minY);
	}
	const names = [...new Set(draft.pieces.map((p) => (p.fabric === 'lining' ? 'lining' : 'skirt fabric')))].join(' and ');
	return frame(marks, 0, 0, right, y + rowH, `Pattern pieces · cut from ${names} · seam line black, cutting line red`, units);
}

export function layView(draft: Draft, units: Units, est: FabricEstimate): Drawing {
	const lay = est.layout;
	const lane = lay.laneWidth;
	const len = Math.max(lay.layLength, 1);
	// Lay coordinates (x across, y along) turned a quarter: the length runs left to right, the fold below.
	const f = (q: Point) => P(q.y, lane - q.x);
	const marks: Mark[] = [{ kind: 'path', role: 'cloth', parts: through([P(0, 0), P(len, 0), P(len, lane), P(0, lane)]), closed: true, fill: 'white' }];
	for (const pl of lay.pieces) {
		const piece = draft.pieces.find((p) => p.id === pl.pieceId);
		marks.push({ kind: 'path', role: 'cutting', parts: through(pl.outline.map(f)), closed: true, fill: 'white' });
		const b = boundsOf(pl.outline.map(f));
		const c = P((b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2);
		const size = Math.max(0.9, Math.min(2.2, (b.maxY - b.minY) / 7));
		const gy = c.y + size * 1.6;
		marks.push(...grainArrow(P(c.x - (b.maxX - b.minX) * 0.3, gy), P(c.x + (b.maxX - b.minX) * 0.3, gy), 1), text(c, pl.name, size, { weight: 600 }));
		const note = pl.layers === 1 && lay.folded ? 'one layer' : piece?.cut.onFold && lay.folded ? 'on the fold' : '';
		if (note) marks.push(text(P(c.x, c.y - size * 1.2), note, size * 0.6, { tone: 'pencil', italic: true }));
	}
	// The fold bracket sits just outside the fold edge, its arrows on the fold.
	if (lay.folded) {
		const bracket = foldBracket(P(0, lane), P(len, lane), P(0, 1), [0.2, 0.8], { off: 2, head: 0.8, word: 1 });
		marks.push(...bracket.marks, bracket.word);
	}
	const edge = { tone: 'pencil' as const, italic: true };
	marks.push(text(P(len / 2, -1), lay.folded ? 'selvedges' : 'selvedge', 0.9, edge));
	if (!lay.folded) marks.push(text(P(len / 2, lane + 1.2), 'selvedge', 0.9, edge));
	const buy = `Buy ${formatBuy(est.length, units)} of ${formatLength(lay.width, units)} wide fabric · lay ${formatLength(lay.layLength, units)}`;
	marks.push(text(P(len / 2, lane + (lay.folded ? 5.6 : 3)), buy, 1.1, { weight: 600 }));
	lay.notes.forEach((t, i) => marks.push(text(P(0, lane + 7.4 + i * 1.4), t, 0.85, { anchor: 'start', tone: 'pencil' })));
	return frame(
		marks,
		0,
		-2,
		len,
		lane + 7.4 + lay.notes.length * 1.4,
		`Lay on ${formatLength(lay.width, units)} fabric${lay.folded ? ', folded lengthwise' : ', opened out'}`,
		units
	);
}
