import { describe, expect, it } from 'vitest';
import { pointAt, type CubicSegment, type Segment } from './geometry';
import { draftSkirt, type Panel } from './index';

// The curves a cutter draws with a hip curve and checks by eye: the side seam is fullest high on the hip
// (the body's fullest curve, as a hip curve is), the waist runs on from dart to side seam without sagging
// (common practice; the tolerance of 1 mm is the house's).

/** Where along its height the side curve stands out furthest from the straight line waist → hip (0–1). */
function fullestAt(c: CubicSegment): number {
	const S = c.from;
	const H = c.to;
	let best = { d: -Infinity, at: 0 };
	for (let i = 0; i <= 400; i++) {
		const q = pointAt(c, i / 400);
		const d = ((q.x - S.x) * (H.y - S.y) - (q.y - S.y) * (H.x - S.x)) / Math.hypot(H.x - S.x, H.y - S.y);
		if (d > best.d) best = { d, at: (q.y - S.y) / (H.y - S.y) };
	}
	return best.at;
}

/** The most any waist part after the first dart dips below the lower of its two ends (cm). */
function sag(p: Panel): number {
	let worst = 0;
	for (const s of p.waistParts.slice(1).flat() as Segment[]) {
		const lower = Math.max(s.from.y, s.to.y);
		for (let i = 0; i <= 100; i++) worst = Math.max(worst, pointAt(s, i / 100).y - lower);
	}
	return worst;
}

describe('defect 9: curves', () => {
	it('the side seam is fullest in the upper part of the hip, not three quarters down (W 100, H 128)', () => {
		const { block } = draftSkirt({ waist: 100, hip: 128, length: 60, waistToHip: 22 });
		for (const p of [block.front, block.back]) {
			expect(fullestAt(p.hipCurve)).toBeLessThanOrEqual(0.55);
			// It never stands out past the hip line.
			for (let i = 0; i <= 50; i++) expect(pointAt(p.hipCurve, i / 50).x).toBeLessThanOrEqual(p.hipPoint.x + 1e-9);
		}
	});

	it('the waist does not sag between dart and side seam (W 150, H 175, depth 15)', () => {
		const { block } = draftSkirt({ waist: 150, hip: 175, length: 60, waistToHip: 15, confirmed: true });
		expect(sag(block.back)).toBeLessThanOrEqual(0.1);
		expect(sag(block.front)).toBeLessThanOrEqual(0.1);
	});
});
