// One hip higher or fuller: the left and right halves are drafted from their own figures, so the pattern
// can no longer be cut on the fold or in mirrored pairs. Each piece cut on the fold becomes one full piece
// (its two halves joined along the old fold line); each pair becomes a left and a right piece. Pieces are
// drawn as laid on the right side of the cloth: on a front the wearer's left is on the drawing's right,
// on a back on its left (TRADE.md: draft left and right separately and cut full pieces, not on the fold).
import { P, line, mapSegments, reversePath, type Point, type Segment } from './geometry';
import type { BodySide } from './fit';
import type { DartGeom } from './panel';
import type { NotchSpec, Outline } from './styles/common';

const flip = (q: Point): Point => P(-q.x, q.y);
const flipDart = (d: DartGeom): DartGeom => ({ ...d, top1: flip(d.top1), top2: flip(d.top2), point: flip(d.point), cap: flip(d.cap) });

/** Which side of the wearer a piece's half drawn on +x belongs to. */
const plusSide = (o: Outline): BodySide => (o.id.includes('front') ? 'left' : 'right');

/** Notches that belong to one side only are kept on that side. */
function notchesFor(notches: NotchSpec[], side: BodySide): NotchSpec[] {
	return notches.filter((n) => !(side === 'right' && n.label?.includes('(left side)')) && !(side === 'left' && n.label?.includes('(right side)')));
}

function mirrored(o: Outline): Outline {
	return {
		...o,
		segments: reversePath(mapSegments(o.segments, flip)),
		darts: o.darts.map(flipDart),
		waistParts: o.waistParts.map((p) => mapSegments(p, flip)),
		side: mapSegments(o.side, flip),
		notches: o.notches.map((n) => ({ ...n, at: flip(n.at) })),
		lines: o.lines.map((l) => ({ ...l, points: l.points.map(flip) })),
		grainX: -o.grainX
	};
}

/** The segments run so the fold line comes last. */
function foldLast(segs: Segment[]): Segment[] {
	const k = segs.findIndex((s) => s.edge === 'fold');
	return [...segs.slice(k + 1), ...segs.slice(0, k + 1)];
}

/** The two halves may end a hair apart on the old fold (a facing's lower edge is trimmed where each half's
 * own offset meets the centre line: 0.02 mm apart on W 50, H 115.4, one hip 8 cm fuller): join them with a
 * line across rather than leave the outline open. */
function bridged(segs: Segment[]): Segment[] {
	const out: Segment[] = [];
	segs.forEach((s, i) => {
		out.push(s);
		const next = segs[(i + 1) % segs.length];
		if (Math.hypot(next.from.x - s.to.x, next.from.y - s.to.y) > 1e-9) out.push(line(s.to, next.from, s.edge));
	});
	return out;
}

/** One full piece from two halves drafted on +x, joined along the fold (which becomes no edge at all). */
function joined(plus: Outline, minus: Outline, plusIs: BodySide): Outline {
	const a = foldLast(plus.segments).slice(0, -1);
	const b = foldLast(minus.segments).slice(0, -1);
	const m = mirrored({ ...minus, segments: b });
	return {
		...plus,
		name: `${plus.name} (full)`,
		cut: { count: 1, onFold: false },
		// `a` runs from the top of the old fold round to its hem end; the mirrored half, run backwards by the
		// mirroring, continues from there back to the top.
		segments: bridged([...a, ...m.segments]),
		darts: [...plus.darts, ...m.darts],
		notches: [...notchesFor(plus.notches, plusIs), ...notchesFor(m.notches, plusIs === 'left' ? 'right' : 'left')],
		lines: [...plus.lines, ...m.lines],
		notes: [...plus.notes, `Cut open, right side up: the wearer's left on the ${plusIs === 'left' ? 'right' : 'left'} of the piece`]
	};
}

/** A left or right piece of what was a pair, drawn as laid right side up. */
function single(o: Outline, side: BodySide, flipIt: boolean): Outline {
	const base = flipIt ? mirrored(o) : o;
	const word = side === 'left' ? 'left' : 'right';
	return { ...base, id: `${o.id}-${word}`, name: `${o.name}, ${word}`, cut: { count: 1, onFold: false }, notches: notchesFor(base.notches, side), notes: [...base.notes, `Wearer's ${word} side only: cut 1, right side up`] };
}

/** Joins the right and left drafts of the same pieces (matched by id, in the right draft's order). */
export function joinSides(right: Outline[], left: Outline[]): Outline[] {
	const out: Outline[] = [];
	for (const r of right) {
		const l = left.find((x) => x.id === r.id);
		if (!l || r.role === 'pocket' || r.role === 'waistband') {
			out.push(r);
			continue;
		}
		const plusIs = plusSide(r);
		const [plus, minus] = plusIs === 'left' ? [l, r] : [r, l];
		if (r.cut.onFold && r.segments.some((s) => s.edge === 'fold')) out.push(joined(plus, minus, plusIs));
		else out.push(single(plus, plusIs, false), single(minus, plusIs === 'left' ? 'right' : 'left', true));
	}
	return out;
}
