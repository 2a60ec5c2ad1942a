// One pattern piece as marks, in the house conventions: cutting line, construction lines, darts, grain,
// fold bracket, seam line, notches, words. The words are placed first (place.ts), then everything is
// listed in drawing order: lines under paper patches under the words, so no line runs through a word.
import { add, mul, pointAt, sub, unit, type Point, type Segment } from '../geometry';
import { boundsOf, flatten } from '../outline';
import { allowanceText, type Piece } from '../pieces';
import { formatCm, formatLength, type Units } from '../units';
import { overlaps, segRect, upright, type Curve, type Mark, type Rect, type Tone } from './model';
import { freeAlong, layoutStack, placeStack, stackRect, type Fit, type StackLine } from './place';
import { dartMarks, dimension, foldBracket, grainArrow, notchTicks } from './symbols';

/** Piece cm to drawing cm: a move, and for a long strip laid along the page a quarter turn. */
export type PlaceMap = (p: Point) => Point;

export interface PieceStyle extends Fit {
	units: Units;
	/** Its number in the piece list, written before its name. */
	number?: number;
	/** The hip line's length and the overall size on the seam line (for a cutter's reduced print). */
	figures?: boolean;
	/** A circle skirt's waist radius, drawn from the centre and written with the labels. */
	radius?: number;
	/** Notch labels (CB, side...) beside the notches. */
	notchLabels?: boolean;
	/** Where name and cut are written when the labels find no place inside the piece (else they stay
	 * where the engine put them): the piece's box in drawing cm. */
	caption?: { x: number; y: number; w: number; h: number };
	/** Bands (drawing cm) the label stack keeps out of when it can, after the marks themselves: the
	 * edges of a tiled print's pages, so no word is cut by a trim line or lies under a page's own notes;
	 * with `wrap`, the stack's long lines are broken to that length (drawing cm) when that lets it. */
	keepOff?: { edges: Rect[]; wrap: number };
}

/** A stack's lines broken between words so none is longer than `width` (a single longer word stays whole). */
function wrapLines(lines: StackLine[], width: number, measure: Fit['measure']): StackLine[] {
	return lines.flatMap((l) => {
		if (measure(l.text, l.size, l.weight) <= width) return [l];
		const out: string[] = [];
		for (const word of l.text.split(' ')) {
			const last = out[out.length - 1];
			if (last !== undefined && measure(`${last} ${word}`, l.size, l.weight) <= width) out[out.length - 1] = `${last} ${word}`;
			else out.push(word);
		}
		return out.map((text) => ({ ...l, text }));
	});
}

/** Room kept left of and below each piece for its dimension lines, in points of paper. */
export const DIM_ROOM = 13;
/** A caption may reach this far (points) into the gap beside its box. */
const CAPTION_SPILL = 3;
/** Height (points) a caption of so many lines takes. */
const captionHeight = (lines: number) => 9 * lines + 2;

const path = (segs: Curve[], role: 'seam' | 'cutting', fill?: Tone): Mark => ({
	kind: 'path',
	role,
	parts: segs,
	closed: true,
	...(fill ? { fill, fillOpacity: 0.55 } : {})
});
const text = (at: Point, s: string, size: number, angle = 0, weight: 400 | 600 = 400, tone: Tone = 'ink'): Mark => ({
	kind: 'text',
	role: 'label',
	at,
	text: s,
	size,
	angle,
	weight,
	tone
});
const wordRect = (at: Point, w: number, h: number, angle: number): Rect =>
	angle % 180 === 0
		? segRect(add(at, { x: -w / 2, y: -h / 2 }), add(at, { x: w / 2, y: h / 2 }), 0)
		: segRect(add(at, { x: -h / 2, y: -w / 2 }), add(at, { x: h / 2, y: w / 2 }), 0);
const angleOf = (a: Point, b: Point) => upright((Math.atan2(b.y - a.y, b.x - a.x) * 180) / Math.PI);
const mapSeg = (s: Segment, f: PlaceMap): Curve =>
	s.kind === 'line' ? { from: f(s.from), to: f(s.to) } : { from: f(s.from), c1: f(s.c1), c2: f(s.c2), to: f(s.to) };

/** The stack's lines: name (numbered), cut, any figure, notes, allowances in the drawing's units. */
function stackLines(p: Piece, s: PieceStyle): StackLine[] {
	const extra = s.radius === undefined ? [] : [{ text: `waist radius r = ${formatCm(s.radius)}`, size: 0, kind: 'figure' as const }];
	const labels = [...p.labels.slice(0, 2), ...extra, ...p.labels.slice(2)];
	return labels.map((l) => ({
		text: l.kind === 'name' && s.number !== undefined ? `${s.number} · ${l.text}` : l.kind === 'allowances' ? allowanceText(p.allowances, s.units) : l.text,
		size: l.size,
		weight: l.kind === 'name' ? 600 : 400,
		kind: l.kind
	}));
}

/** Name and cut written under a piece whose labels do not fit inside it, wrapped to `width` (points). */
function captionLines(p: Piece, number: number | undefined, width: number, fit: Fit): { text: string; weight: 400 | 600 }[] {
	const wrap = (words: string, weight: 400 | 600) => {
		const out: string[] = [];
		for (const word of words.split(' ')) {
			const last = out[out.length - 1];
			if (last !== undefined && fit.measure(`${last} ${word}`, 7 * fit.u, weight) <= width * fit.u) out[out.length - 1] = `${last} ${word}`;
			else out.push(word);
		}
		return out.map((t) => ({ text: t, weight }));
	};
	return [...wrap(number === undefined ? p.name : `${number} · ${p.name}`, 600), ...wrap(p.cutText, 400)];
}

/** Room (points) a piece needs under its box of `width` points for a caption: none when its labels find a
 * clear place inside it at this style. */
export function captionRoom(p: Piece, f: PlaceMap, s: PieceStyle, width: number): number {
	if (pieceMarks(p, f, { ...s, caption: undefined }).clear) return 0;
	return captionHeight(captionLines(p, s.number, width + 2 * CAPTION_SPILL, s).length);
}

/** The marks of one piece through a place map; `clear` is false when its labels found no place inside it. */
export function pieceMarks(p: Piece, f: PlaceMap, s: PieceStyle): { marks: Mark[]; clear: boolean } {
	const { u, measure } = s;
	const word = 6.5 * u;
	const seam = p.seam.segments.map((g) => mapSeg(g, f));
	const poly = flatten(p.seam.segments, 0.5).map(f);
	const [g1, g2] = [f(p.grain.from), f(p.grain.to)];
	const darts = p.darts.map((d) => [f(d.top1), f(d.point), f(d.top2)] as const);
	// avoid[0] is the grain line: the one mark words may give way on last.
	const avoid: Rect[] = [
		segRect(g1, g2, 1.5 * u),
		...darts.map(([a, b, c]) => ({
			x0: Math.min(a.x, b.x, c.x) - u,
			y0: Math.min(a.y, b.y, c.y) - u,
			x1: Math.max(a.x, b.x, c.x) + u,
			y1: Math.max(a.y, b.y, c.y) + u
		}))
	];
	const soft = p.lines.filter((l) => l.points.length >= 2).map((l) => segRect(f(l.points[0]), f(l.points[l.points.length - 1]), u));
	const words: Mark[] = [];
	const knock: Rect[] = [];
	// The hip line's length above it, in the longest wording that fits between the seams.
	const hip = s.figures ? p.lines.find((l) => l.kind === 'hip-line' && l.points.length >= 2) : undefined;
	if (hip) {
		const [a, b] = [f(hip.points[0]), f(hip.points[hip.points.length - 1])];
		const len = Math.hypot(b.x - a.x, b.y - a.y);
		const cm = formatLength(len, s.units);
		const t = [`hip line ${cm}`, `hip ${cm}`, cm].find((t) => measure(t, word) + 2 * u <= len - 8 * u);
		if (t) {
			const d = unit(sub(b, a));
			let off = mul({ x: d.y, y: -d.x }, 3.8 * u);
			if (off.y > 0 || (Math.abs(off.y) < 1e-9 && off.x > 0)) off = mul(off, -1);
			const w = measure(t, word) + 2 * u;
			const lo = (w / 2 + 4 * u) / len;
			const k = Math.min(1 - lo, Math.max(lo, freeAlong(a, b, w, 7 * u, off, avoid, 1.5 * u) ?? 0.5));
			const at = add(add(a, mul(sub(b, a), k)), off);
			words.push(text(at, t, word, angleOf(a, b)));
			knock.push(wordRect(at, w, 8 * u, angleOf(a, b)));
			avoid.push(knock[knock.length - 1]);
		}
	}
	// The fold bracket on a stretch of the fold clear of the other marks (the grain line last of all).
	const fold: Mark[] = [];
	if (p.fold) {
		const [a, b] = [f(p.fold.from), f(p.fold.to)];
		const along = sub(b, a);
		const c = f({ x: (p.bounds.minX + p.bounds.maxX) / 2, y: (p.bounds.minY + p.bounds.maxY) / 2 });
		let n = unit({ x: -along.y, y: along.x });
		if ((c.x - a.x) * n.x + (c.y - a.y) * n.y < 0) n = mul(n, -1);
		const off = 5.5 * u;
		const spans: [number, number][] = [
			[0.22, 0.78],
			[0.08, 0.42],
			[0.58, 0.92]
		];
		const at = (t: number, o: number) => add(add(a, mul(along, t)), mul(n, o));
		const box = ([t0, t1]: [number, number]) => segRect(at(t0, 0), at(t1, off + 8 * u), 0);
		const free = (obstacles: Rect[]) => spans.find((sp) => !obstacles.some((o) => overlaps(box(sp), o, u)));
		const span = free(avoid) ?? free(avoid.slice(1)) ?? spans[0];
		const bracket = foldBracket(a, b, n, span, { off, head: 3 * u, word });
		fold.push(...bracket.marks);
		words.push(bracket.word);
		if (bracket.word.kind === 'text') knock.push(wordRect(bracket.word.at, measure('fold', word) + 2 * u, 8 * u, bracket.word.angle ?? 0));
		avoid.push(box(span));
	}
	// The label stack: clear of everything if it can be; else across construction lines; else along the
	// grain line, as pattern pieces are often lettered (the paper under the words interrupts it).
	let clear = true;
	if (p.labels.length) {
		const [first, last] = [p.labels[0], p.labels[p.labels.length - 1]];
		const centre = f(mul(add(first.at, last.at), 0.5));
		const o = sub(f({ x: 1, y: 0 }), f({ x: 0, y: 0 }));
		const turn = (Math.atan2(o.y, o.x) * 180) / Math.PI;
		const laid = layoutStack(s, stackLines(p, s), poly, centre, upright(first.angle + turn));
		let placed: ReturnType<typeof placeStack> | null = null;
		if (s.keepOff) {
			// Off the page edges first, every line kept (broken if need be, narrower and narrower for a piece
			// that has only a strip of one page to itself); else placed as anywhere else.
			const { edges, wrap } = s.keepOff;
			const off = [[...avoid, ...soft, ...edges], [...avoid, ...edges], [...avoid.slice(1), ...edges]];
			// Half as fine a search (some 1 cm steps on a skirt piece): it may run several times, each over
			// every place when the page edges leave none.
			const strict = { ...s, readable: false, across: 60 };
			placed = placeStack(strict, laid, poly, off);
			for (const k of [1, 0.6, 0.4]) {
				if (placed.clear) break;
				const lines = wrapLines(laid.lines, wrap * k, measure);
				if (lines.length > laid.lines.length) placed = placeStack(strict, { ...laid, lines, rect: stackRect(s, lines, laid.centre, laid.angle) }, poly, off);
			}
			if (!placed.clear) placed = null;
		}
		placed ??= placeStack(s, laid, poly, [[...avoid, ...soft], avoid, avoid.slice(1)]);
		clear = placed.clear;
		const st = placed.stack;
		if (clear || !s.caption) {
			const rad = (st.angle * Math.PI) / 180;
			const down = { x: -Math.sin(rad), y: Math.cos(rad) };
			let run = -st.lines.reduce((a, l) => a + l.size * 1.3, 0) / 2;
			for (const l of st.lines) {
				const mid = run + (l.size * 1.3) / 2;
				run += l.size * 1.3;
				words.push(text(add(st.centre, mul(down, mid)), l.text, l.size, st.angle, l.weight, l.kind === 'note' || l.kind === 'allowances' ? 'pencil' : 'ink'));
			}
			if (clear) knock.push({ x0: st.rect.x0 - 1.5 * u, y0: st.rect.y0 - 0.5 * u, x1: st.rect.x1 + 1.5 * u, y1: st.rect.y1 + 0.5 * u });
		} else {
			const box = s.caption;
			const lines = captionLines(p, s.number, box.w / u + 2 * CAPTION_SPILL, s);
			let y = box.y + box.h - (captionHeight(lines.length) - 8) * u;
			for (const l of lines) {
				words.push(text({ x: box.x + box.w / 2, y }, l.text, (l.weight === 600 ? 7 : 6.5) * u, 0, l.weight));
				y += 9 * u;
			}
		}
	}
	const marks: Mark[] = [
		path(
			p.cutting.segments.map((g) => mapSeg(g, f)),
			'cutting',
			'white'
		)
	];
	for (const l of p.lines)
		if (l.points.length >= 2) marks.push({ kind: 'path', role: 'construction', parts: l.points.slice(1).map((q, i) => ({ from: f(l.points[i]), to: f(q) })) });
	for (const [a, b, c] of darts) marks.push(...dartMarks(a, b, c, 0.8 * u));
	marks.push(...grainArrow(g1, g2, 4.5 * u), ...fold);
	if (s.radius !== undefined) marks.push(...radiusMarks(p, f, u));
	if (knock.length) marks.push({ kind: 'patch', rects: knock, clip: seam });
	marks.push(path(seam, 'seam'));
	for (const k of p.notches) {
		const at = f(k.at);
		const inward = sub(f(add(k.at, k.inward)), at);
		marks.push(...notchTicks(at, inward, Math.max(k.depth, 4 * u), k.double, 1.3 * u));
		if (s.notchLabels && k.label) words.push(text(add(at, mul(unit(inward), k.depth + 1.1)), k.label, 0.65, 0, 400, 'pencil'));
	}
	marks.push(...words);
	if (s.figures) marks.push(...overallSize(p, f, s));
	return { marks: [{ kind: 'group', name: p.name, marks }], clear };
}

/** The waist radius from the circle's centre to the middle of the waist, when the centre lies within the
 * piece's box (in the waist opening); its length is written with the labels. */
function radiusMarks(p: Piece, f: PlaceMap, u: number): Mark[] {
	const b = p.bounds;
	const waist = p.seam.segments.filter((sg) => sg.edge === 'waist');
	const mid = waist[Math.floor(waist.length / 2)];
	if (!mid || b.minX > 1e-6 || b.minY > 1e-6) return [];
	const c = f({ x: 0, y: 0 });
	const e = f(waist.length % 2 ? pointAt(mid, 0.5) : mid.from);
	const r = 2.5 * u;
	return [
		{ kind: 'path', role: 'construction', parts: [{ from: c, to: e }] },
		{
			kind: 'path',
			role: 'dimension',
			parts: [
				{ from: add(c, { x: -r, y: 0 }), to: add(c, { x: r, y: 0 }) },
				{ from: add(c, { x: 0, y: -r }), to: add(c, { x: 0, y: r }) }
			]
		}
	];
}

/** A piece's overall size on its seam line: the height left of it, the width below it. */
function overallSize(p: Piece, f: PlaceMap, s: PieceStyle): Mark[] {
	const [ext, cut] = [p.seam, p.cutting].map((path) => boundsOf(flatten(path.segments, 2).map(f)));
	const { u, measure } = s;
	const dx = cut.minX - DIM_ROOM * 0.55 * u;
	const dy = cut.maxY + DIM_ROOM * 0.55 * u;
	const size = 6.5 * u;
	const extension: Curve[] = [
		...[ext.minX, ext.maxX].map((x) => ({ from: { x, y: cut.maxY + 1.5 * u }, to: { x, y: dy + 2.5 * u } })),
		...[ext.minY, ext.maxY].map((y) => ({ from: { x: cut.minX - 1.5 * u, y }, to: { x: dx - 2.5 * u, y } }))
	];
	return [
		...dimension({ x: dx, y: ext.maxY }, { x: dx, y: ext.minY }, formatLength(ext.maxY - ext.minY, s.units), size, measure),
		...dimension({ x: ext.minX, y: dy }, { x: ext.maxX, y: dy }, formatLength(ext.maxX - ext.minX, s.units), size, measure),
		{ kind: 'path', role: 'dimension', parts: extension }
	];
}
