// Tidying a cutting line after the offset: straight runs joined into one line, and the small loops an
// offset makes inside a bend tighter than its allowance cut out.
import { add, controlBox, cross, derivativeAt, dist, dot, line, split, sub, unit, type ControlBox, type Segment } from './geometry';
import { segmentSegment } from './intersect';

/** Smallest radius of curvature of a cubic, sampled at nine points (Infinity for a straight one). */
export function minRadius(s: Segment): number {
	if (s.kind === 'line') return Infinity;
	let best = Infinity;
	for (let i = 0; i <= 8; i++) {
		const t = i / 8;
		const u = 1 - t;
		const d = derivativeAt(s, t);
		const ddx = 6 * (u * (s.c2.x - 2 * s.c1.x + s.from.x) + t * (s.to.x - 2 * s.c2.x + s.c1.x));
		const ddy = 6 * (u * (s.c2.y - 2 * s.c1.y + s.from.y) + t * (s.to.y - 2 * s.c2.y + s.c1.y));
		const k = Math.abs(d.x * ddy - d.y * ddx);
		const v = Math.sqrt(d.x * d.x + d.y * d.y);
		if (k > 1e-12) best = Math.min(best, (v * v * v) / k);
		else if (v < 1e-9) best = 0;
	}
	return best;
}

/** Joins runs of straight pieces that carry on in the same direction on the same edge (mitres and
 * continuations leave them), so each straight edge of the cutting line is one line. */
/** Two straight pieces of the same edge running on in the same direction. */
function same(a: Segment, b: Segment): boolean {
	if (a.kind !== 'line' || b.kind !== 'line' || a.edge !== b.edge) return false;
	const u = sub(a.to, a.from);
	const v = sub(b.to, b.from);
	return Math.abs(cross(unit(u), unit(v))) < 1e-9 && dot(u, v) > 0;
}

export function mergeLines(segs: Segment[]): Segment[] {
	const out: Segment[] = [];
	for (const s of segs) {
		const last = out[out.length - 1];
		if (last && same(last, s)) out[out.length - 1] = line(last.from, s.to, s.edge);
		else out.push(s);
	}
	while (out.length > 2 && same(out[out.length - 1], out[0])) {
		const last = out.pop()!;
		out[0] = line(last.from, out[0].to, out[0].edge);
	}
	return out;
}

/** Length of a segment's control polygon (at least its length: enough to tell a loop from the piece). */
const chordLength = (s: Segment) => (s.kind === 'line' ? dist(s.from, s.to) : dist(s.from, s.c1) + dist(s.c1, s.c2) + dist(s.c2, s.to));

const apart = (a: ControlBox, b: ControlBox) => b.x0 > a.x1 + 1e-9 || b.x1 < a.x0 - 1e-9 || b.y0 > a.y1 + 1e-9 || b.y1 < a.y0 - 1e-9;

/** Cuts out the small loops an offset makes where a curve bends tighter than its allowance (the
 * "swallowtail" inside a sharp inward bend): where the line crosses itself within a few segments, the
 * part between the crossings goes and the two ends meet at the crossing. */
export function removeLoops(input: Segment[]): Segment[] {
	const segs = [...input];
	let boxes = segs.map(controlBox);
	// An offset round a bend tighter than its allowance comes in up to 32 pieces a segment: a loop spanning a
	// dart cap and such a run (a waist rising steeply after the last dart) ran past a window of 12.
	// A loop is the smaller part: on a small piece 40 segments can run round most of the outline, and what
	// lies between two crossings that far apart is the piece itself, never a loop to cut out.
	const WINDOW = 40;
	let lengths = segs.map(chordLength);
	for (let i = 0; i < segs.length; i++) {
		const half = lengths.reduce((a, b) => a + b, 0) / 2;
		let run = lengths[i];
		for (let k = 1; k <= WINDOW && k < segs.length - 1; k++) {
			const j = (i + k) % segs.length;
			if (run > half) break;
			run += lengths[j];
			// Two straight neighbours meet only at their shared end.
			if (k === 1 && segs[i].kind === 'line' && segs[j].kind === 'line') continue;
			if (apart(boxes[i], boxes[j])) continue;
			const hits = segmentSegment(segs[i], segs[j]).filter((h) => !(k === 1 && h.a > 1 - 1e-6 && h.b < 1e-6) && h.a < 1 - 1e-9 && h.b > 1e-9);
			if (!hits.length) continue;
			const h = hits.reduce((best, x) => (x.a < best.a ? x : best));
			const head = h.a > 1e-9 ? split(segs[i], h.a)[0] : segs[i];
			const tail = split(segs[j], h.b)[1];
			const keepHead = { ...head, to: h.at } as Segment;
			const keepTail = { ...tail, from: h.at } as Segment;
			if (j > i) segs.splice(i, j - i + 1, keepHead, keepTail);
			else {
				segs.splice(i, segs.length - i, keepHead);
				segs.splice(0, j + 1, keepTail);
			}
			boxes = segs.map(controlBox);
			lengths = segs.map(chordLength);
			i = Math.max(-1, i - 2);
			break;
		}
	}
	return snipCusps(segs);
}

/** A loop smaller than the offset's fitting tolerance (0.1 mm) leaves no crossing between the fitted pieces,
 * only a sliver running back on itself at the cusp: such a sliver goes, and the piece before it ends where
 * the piece after it starts (seen on a facing's waist allowance where the waist bends at 2–4 mm radius). */
function snipCusps(segs: Segment[]): Segment[] {
	const out = [...segs];
	for (let i = 0; i < out.length && out.length > 3; i++) {
		const s = out[i];
		const n = out.length;
		const prev = out[(i - 1 + n) % n];
		const next = out[(i + 1) % n];
		if (dist(s.from, s.to) > 0.02 || dist(s.from, s.to) < 1e-12) continue;
		const back = dot(sub(s.to, s.from), derivativeAt(prev, 1)) < 0 || dot(sub(s.to, s.from), derivativeAt(next, 0)) < 0;
		if (!back) continue;
		const to = next.from;
		out[(i - 1 + n) % n] = prev.kind === 'line' ? line(prev.from, to, prev.edge) : { ...prev, to, c2: add(prev.c2, sub(to, prev.to)) };
		out.splice(i, 1);
		i = Math.max(-1, i - 2);
	}
	return out;
}
