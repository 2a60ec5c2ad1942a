// Pieces that come with the options: the waistband or the facings, the pocket bags.
import {
	P,
	add,
	angleBetween,
	mul,
	normalOf,
	pointAt,
	tangentAt,
	cubic,
	line,
	rotateAbout,
	mapSegments,
	lengthTo,
	reversePath,
	segmentLength,
	split,
	subPath,
	sub,
	withEdge,
	type Point,
	type Segment
} from './geometry';
import { inside } from './checks';
import { lineSegment } from './intersect';
import { flatten } from './outline';
import { minRadius, removeLoops } from './loops';
import { offsetSegment } from './offset';
import type { DartGeom } from './panel';
import type { Outline, StyleContext } from './styles/common';

/** The waist parts with every dart folded shut (the part after each dart turned about its point). */
export function closeDarts(parts: Segment[][], darts: DartGeom[]): Segment[] {
	let rest = parts.map((p) => [...p]);
	let pending = darts.map((d) => ({ ...d }));
	const out: Segment[] = [...rest[0]];
	for (let k = 0; k < pending.length; k++) {
		const d = pending[k];
		const turn = angleBetween(sub(d.top2, d.point), sub(d.top1, d.point));
		const rot = (p: Point) => rotateAbout(p, d.point, turn);
		rest = rest.map((p, j) => (j > k ? mapSegments(p, rot) : p));
		pending = pending.map((x, j) => (j > k ? { ...x, top1: rot(x.top1), top2: rot(x.top2), point: rot(x.point), cap: rot(x.cap) } : x));
		out.push(...rest[k + 1]);
	}
	return out;
}

/** A facing the shape of the waist with the darts closed, `depth` deep, cut like the panel it faces. */
export function facing(kind: 'front' | 'back', parts: Segment[][], darts: DartGeom[], cut: Outline['cut'], ctx: StyleContext): Outline {
	const top = withEdge(closeDarts(parts, darts), 'waist');
	const depth = ctx.rules.facingDepth;
	const start = top[0].from;
	const end = top[top.length - 1].to;
	const bottom = reversePath(withEdge(trimEnds(top.flatMap((s) => offsetSegment(s, -depth)), start, end), 'facing-edge'));
	const name = kind === 'front' ? 'Front facing' : 'Back facing';
	return {
		id: `${kind}-facing`,
		name,
		fabric: 'shell',
		role: 'facing',
		cut,
		// A waist bending tighter than the facing is deep makes a loop in its lower edge: cut it out.
		segments: (top.some((s) => minRadius(s) < 2 * depth) ? removeLoops : (x: Segment[]) => x)([...top, line(end, bottom[0].from, 'side'), ...bottom, line(bottom[bottom.length - 1].to, start, cut.onFold ? 'fold' : 'centre')]),
		darts: [],
		waistParts: [top],
		side: [],
		notches: [],
		lines: [],
		notes: [],
		grainX: start.x + (end.x - start.x) * 0.3
	};
}

/** Crossings of a chain with the line through two points, with the distance along the chain to each. */
function crossings(chain: Segment[], from: Point, through: Point) {
	let run = 0;
	return chain.flatMap((s, j) => {
		const before = run;
		run += segmentLength(s);
		return lineSegment(from, sub(through, from), s)
			.filter((h) => h.b >= 0 && h.b <= 1)
			.map((h) => ({ j, t: h.b, at: h.at, d: before + lengthTo(s, h.b) }));
	});
}

/** Where a waist bends tighter than the facing is deep near an end, its offset runs past the end line and
 * doubles back: cut the offset where it last crosses the centre line and first crosses the side line. */
function trimEnds(chain: Segment[], centre: Point, side: Point): Segment[] {
	const total = chain.reduce((a, s) => a + segmentLength(s), 0);
	let out = chain;
	const first = crossings(out, centre, out[0].from).filter((h) => h.d > 1e-6 && h.d < total / 2);
	if (first.length) {
		const h = first.reduce((a, b) => (b.d > a.d ? b : a));
		out = [{ ...split(out[h.j], h.t)[1], from: h.at } as Segment, ...out.slice(h.j + 1)];
	}
	const rest = out.reduce((a, s) => a + segmentLength(s), 0);
	const ends = crossings(out, side, out[out.length - 1].to).filter((h) => h.d > rest / 2 && h.d < rest - 1e-6);
	if (ends.length) {
		const h = ends.reduce((a, b) => (b.d < a.d ? b : a));
		out = [...out.slice(0, h.j), { ...split(out[h.j], h.t)[0], to: h.at } as Segment];
	}
	return out;
}

/** The straight waistband: the whole waist seam plus the underlap, folded in half along its length; it
 * lies along the grain. Notches mark the centre back, side seams and centre front. */
export function waistband(ctx: StyleContext): Outline {
	const { front, back } = ctx.block;
	const f = front.waistSeam;
	const b = back.waistSeam;
	const w = ctx.rules.waistband.width;
	const total = 2 * (f + b);
	const len = total + ctx.rules.waistband.underlap;
	const marks = ctx.choice.closure.position === 'centre-back' ? [[b, 'side'], [b + f, 'CF'], [b + 2 * f, 'side'], [total, 'CB']] : [[f, 'CF'], [2 * f, 'side'], [2 * f + b, 'CB'], [total, 'side']];
	return {
		id: 'waistband',
		name: 'Waistband',
		fabric: 'shell',
		role: 'waistband',
		cut: { count: 1, onFold: false },
		segments: [line(P(0, 0), P(2 * w, 0), 'band-end'), line(P(2 * w, 0), P(2 * w, len), 'band-edge'), line(P(2 * w, len), P(0, len), 'band-end'), line(P(0, len), P(0, 0), 'band-edge')],
		darts: [],
		waistParts: [],
		side: [],
		notches: marks.map(([y, label]) => ({ at: P(0, y as number), label: label as string })),
		lines: [{ kind: 'band-fold', points: [P(w, 0), P(w, len)] }],
		notes: ['Underlap at the lower end'],
		grainX: w * 0.5
	};
}

/** An in-seam pocket bag, its seam edge the front side seam round the opening, built along that seam
 * whichever way the style's side seam runs (plumb on a straight skirt, aslant on a half circle, level on a
 * full circle): the edge is turned so the opening runs down the bag's grain, which keeps it from
 * stretching. Four bags (two pairs), or one pair when the zip takes the left side seam. */
export function pocketBag(frontSide: Segment[], ctx: StyleContext): Outline {
	const p = ctx.rules.pocket;
	const a0 = Math.max(0, p.fromWaist - 2);
	const a1 = p.fromWaist + p.opening + 2;
	const raw = withEdge(subPath(frontSide, a0, a1), 'bag-seam');
	const first = raw[0].from;
	const chord = sub(raw[raw.length - 1].to, first);
	// Turn the edge about its start so the chord points straight down (a rotation: the piece's inside stays
	// on the same hand of the seam, toward the centre).
	const turn = angleBetween(chord, P(0, 1));
	const edge = mapSegments(raw, (q) => rotateAbout(q, first, turn));
	const t0 = edge[0].from;
	const t1 = edge[edge.length - 1].to;
	const w = p.width;
	const h = t1.y - t0.y;
	const inner = P(t0.x - 0.8 * w, t0.y);
	const round = cubic(t1, P(t1.x - 0.2 * w, t1.y + 0.35 * h), P(inner.x, inner.y + 0.75 * h), inner, 'bag');
	const oneSide = ctx.choice.closure.position === 'side';
	return {
		id: 'pocket-bag',
		name: 'Pocket bag',
		fabric: 'shell',
		role: 'pocket',
		cut: { count: oneSide ? 2 : 4, onFold: false },
		segments: [...edge, round, line(inner, t0, 'bag')],
		darts: [],
		waistParts: [],
		side: [],
		notches: [{ at: edge.length ? pointOnEdge(edge, p.fromWaist - a0) : t0, label: 'pocket' }, { at: pointOnEdge(edge, p.fromWaist - a0 + p.opening), label: 'pocket' }],
		lines: [],
		notes: [oneSide ? 'Right side seam only: the zip is in the left' : 'Skirt fabric, or lining for a lighter pocket'],
		grainX: t0.x - 0.45 * w
	};
}

/** With the zip in the left side seam, a piece cut on the fold or in pairs has both its side seams cut
 * with the zip's wider allowance; this line marks the usual allowance, so the cutter trims the right side
 * seam back to it (the left keeps the zip's). Returns the outline with the line and a note added. */
export function withZipTrim(o: Outline, seamAllowance: number, zipAllowance: number): Outline {
	const sides = o.segments.filter((x) => x.edge === 'side');
	if (!sides.length || zipAllowance <= seamAllowance) return o;
	const poly = flatten(o.segments, 2);
	const lines = sides.map((x) => {
		const pts: Point[] = [];
		for (let i = 0; i <= 12; i++) {
			const q = pointAt(x, i / 12);
			const n = normalOf(tangentAt(x, i / 12));
			const a = add(q, mul(n, seamAllowance));
			pts.push(inside(a, poly) ? add(q, mul(n, -seamAllowance)) : a);
		}
		return { kind: 'trim-line' as const, points: pts };
	});
	return { ...o, lines: [...o.lines, ...lines], notes: [...o.notes, 'Right side seam: trim to the dashed line beside it; the zip side keeps its allowance'] };
}

const pointOnEdge = (edge: Segment[], d: number) => subPath(edge, 0, d).at(-1)?.to ?? edge[0].from;
