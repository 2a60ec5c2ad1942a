import ClipperLib from 'clipper-lib';
import { describe, expect, it } from 'vitest';
import { inside } from './checks';
import { dist, P, pointAt, sub, tangentAt, unit, type Point, type Segment } from './geometry';
import { flatten } from './outline';
import { draftSkirt, type Piece } from './index';
import { cuttingLine } from './offset';

const size12 = { waist: 68, hip: 94, length: 58.5, waistToHip: 20.6 };

/** Distance from p to a polygon's boundary. */
function toBoundary(p: Point, poly: Point[]): number {
	let best = Infinity;
	for (let i = 0; i < poly.length; i++) {
		const a = poly[i];
		const b = poly[(i + 1) % poly.length];
		const d = sub(b, a);
		const t = Math.max(0, Math.min(1, ((p.x - a.x) * d.x + (p.y - a.y) * d.y) / (d.x * d.x + d.y * d.y || 1)));
		best = Math.min(best, dist(p, P(a.x + d.x * t, a.y + d.y * t)));
	}
	return best;
}

/** Samples away from the ends of every seam segment: the cutting line lies at exactly its allowance. */
function checkTrueOffset(p: Piece) {
	const cut = flatten(p.cutting.segments, 8);
	for (const s of p.seam.segments) {
		const a = p.allowances[s.edge]!;
		if (a === 0) continue;
		for (const t of [0.3, 0.5, 0.7]) {
			const q = pointAt(s, t);
			// Near a corner the mitre or a trim sits closer to other edges: skip points within 2a of one.
			if (Math.min(dist(q, s.from), dist(q, s.to)) < 2 * a) continue;
			expect(Math.abs(toBoundary(q, cut) - a), `${p.id} ${s.edge} at t=${t}`).toBeLessThan(0.012);
		}
	}
}

const SCALE = 1000;
const toClipper = (pts: Point[]) => pts.map((q) => ({ X: Math.round(q.x * SCALE), Y: Math.round(q.y * SCALE) }));

describe('cutting line', () => {
	it('is a true offset of the seam line on lines and curves, every style and finish', () => {
		for (const style of ['straight', 'pencil', 'a-line', 'half-circle', 'full-circle', 'gored'] as const) {
			for (const choice of [{}, { waistband: 'facing' as const, lining: true, pockets: true }]) {
				for (const p of draftSkirt({ ...size12, length: 66 }, { style, ...choice }).pieces) checkTrueOffset(p);
			}
		}
	});

	it('mitres square corners: the allowance lines are extended until they meet', () => {
		const front = draftSkirt(size12).pieces[0];
		// Straight skirt: the side seam meets the hem square at (25.5, 58.5); allowances 1.5 and 4.
		const corner = flatten(front.cutting.segments).find((q) => Math.abs(q.x - 27) < 1e-6 && Math.abs(q.y - 62.5) < 1e-6);
		expect(corner).toBeDefined();
		// The fold has no allowance: the cutting line runs down the fold to the hem allowance.
		expect(flatten(front.cutting.segments).some((q) => Math.abs(q.x) < 1e-9 && Math.abs(q.y - 62.5) < 1e-6)).toBe(true);
	});

	it('squares every hem to its seams, so the allowance below the hem carries the seam straight on', () => {
		for (const style of ['pencil', 'a-line', 'gored'] as const) {
			for (const p of draftSkirt(size12, { style }).pieces.filter((x) => x.role === 'panel')) {
				const segs = p.seam.segments;
				segs.forEach((s, i) => {
					const next = segs[(i + 1) % segs.length];
					if (s.edge === 'hem' && ['side', 'gore'].includes(next.edge)) {
						const along = tangentAt(s, 1);
						const seam = tangentAt(next, 0);
						expect(Math.abs(along.x * seam.x + along.y * seam.y), `${style} ${p.id}`).toBeLessThan(1e-6);
					}
				});
			}
		}
	});

	it('mirrors a flared seam in a straight hem line below the hem, so the hem folds up flat', () => {
		// A flared panel with a level hem (not squared): side seam from (20, 0) out to (26, 40).
		const pts = [P(0, 0), P(20, 0), P(26, 40), P(0, 40)];
		const edges = ['waist', 'side', 'hem', 'fold'] as const;
		const segs: Segment[] = pts.map((p, i) => ({ kind: 'line', from: p, to: pts[(i + 1) % 4], edge: edges[i] }));
		const cut = cuttingLine(segs, (s) => ({ waist: 1.5, side: 1.5, hem: 4, fold: 0 })[s.edge as 'waist']);
		const d = unit(P(6, 40));
		const down = cut.filter((s) => s.kind === 'line' && s.edge === 'side').map((s) => unit(sub(s.to, s.from)));
		// Above the hem the allowance runs with the seam; below it, the seam's mirror in the hem line (6, −40 → −6, 40).
		expect(down.some((u) => Math.abs(u.x - d.x) < 1e-9 && Math.abs(u.y - d.y) < 1e-9)).toBe(true);
		expect(down.some((u) => Math.abs(u.x + d.x) < 1e-9 && Math.abs(u.y - d.y) < 1e-9)).toBe(true);
		// It meets the hem allowance line 4 cm below the hem, inside the straight-on continuation.
		const low = flatten(cut).filter((q) => Math.abs(q.y - 44) < 1e-9);
		const sideOffset = 1.5 / Math.cos(Math.atan2(6, 40));
		expect(Math.max(...low.map((q) => q.x))).toBeCloseTo(26 + sideOffset - 0.6, 6);
	});

	it('contains the seam line, and adds about its allowance along every edge (checked with Clipper)', () => {
		const d = draftSkirt({ ...size12, length: 70 }, { style: 'straight', waistband: 'facing' });
		for (const p of d.pieces) {
			const seam = flatten(p.seam.segments, 4);
			const cut = flatten(p.cutting.segments, 4);
			for (const q of seam) expect(inside(q, cut) || toBoundary(q, cut) < 1e-6).toBe(true);
			const c = new ClipperLib.Clipper();
			c.AddPath(toClipper(seam), ClipperLib.PolyType.ptSubject, true);
			c.AddPath(toClipper(cut), ClipperLib.PolyType.ptClip, true);
			const outside: ClipperLib.Paths = [];
			c.Execute(ClipperLib.ClipType.ctDifference, outside, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
			const area = outside.reduce((s, path) => s + Math.abs(ClipperLib.Clipper.Area(path)), 0) / SCALE / SCALE;
			expect(area, p.id).toBeLessThan(0.05);
			const band = Math.abs(ClipperLib.Clipper.Area(toClipper(cut))) / SCALE / SCALE - Math.abs(ClipperLib.Clipper.Area(toClipper(seam))) / SCALE / SCALE;
			const expected = p.seam.segments.reduce((s, x) => s + (p.allowances[x.edge] ?? 0) * dist(x.from, x.to), 0);
			expect(band / expected, p.id).toBeGreaterThan(0.9);
			expect(band / expected, p.id).toBeLessThan(1.2);
		}
	});

	it('joins different allowances at a corner and trims where a corner turns in', () => {
		// A notched square: one inward corner; edges 1 and 2 cm.
		const pts = [P(0, 0), P(10, 0), P(10, 10), P(5, 10), P(5, 5), P(0, 5)];
		const segs: Segment[] = pts.map((p, i) => ({ kind: 'line', from: p, to: pts[(i + 1) % pts.length], edge: i === 1 ? 'centre' : 'side' }));
		const cut = flatten(cuttingLine(segs, (s) => (s.edge === 'centre' ? 2 : 1)));
		// Outer corner of the 1 cm and 2 cm edges: (12, −1); the inward corner at (5, 5) becomes (4, 6).
		expect(cut.some((q) => dist(q, P(12, -1)) < 1e-9)).toBe(true);
		expect(cut.some((q) => dist(q, P(4, 6)) < 1e-9)).toBe(true);
		expect(cut).toHaveLength(6);
	});
});
