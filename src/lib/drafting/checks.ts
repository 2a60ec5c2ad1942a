// Checks a cutter (and the test suite) can run on any outline: closed, finite, never crossing itself.
import { dist, type Point, type Segment } from './geometry';
import { flatten } from './outline';
import { selfIntersects } from './intersect';

/** What is wrong with a closed outline, in words (an empty list when nothing is). */
export function pathProblems(segs: Segment[]): string[] {
	const out: string[] = [];
	if (!segs.length) return ['The outline is empty.'];
	const points = segs.flatMap((s) => (s.kind === 'line' ? [s.from, s.to] : [s.from, s.c1, s.c2, s.to]));
	if (points.some((p) => !Number.isFinite(p.x) || !Number.isFinite(p.y))) out.push('The outline has a point that is not a number.');
	for (let i = 0; i < segs.length; i++) {
		const next = segs[(i + 1) % segs.length];
		if (dist(segs[i].to, next.from) > 1e-9) out.push(`The outline breaks after segment ${i + 1}.`);
	}
	if (!out.length && selfIntersects(flatten(segs, 2))) out.push('The outline crosses itself.');
	return out;
}

/** Whether a point lies inside a polygon (even–odd rule). */
export function inside(p: Point, poly: Point[]): boolean {
	let c = false;
	for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
		const a = poly[i];
		const b = poly[j];
		if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) c = !c;
	}
	return c;
}

/** Distance from a point to a polygon's outline. */
export function toOutline(p: Point, poly: Point[]): number {
	let best = Infinity;
	for (let i = 0; i < poly.length; i++) {
		const a = poly[i];
		const b = poly[(i + 1) % poly.length];
		const dx = b.x - a.x;
		const dy = b.y - a.y;
		const t = Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / (dx * dx + dy * dy || 1)));
		best = Math.min(best, Math.hypot(p.x - a.x - dx * t, p.y - a.y - dy * t));
	}
	return best;
}
