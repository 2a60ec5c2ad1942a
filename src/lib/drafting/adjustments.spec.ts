import { describe, expect, it } from 'vitest';
import { pointAt, type CubicSegment } from './geometry';
import { DraftInputError, draftSkirt, STYLES, pathProblems, type FitAdjustments } from './index';

// Fit adjustments on one worked figure (W 72, H 100, waist to hip 21, knee 57). Check values: TRADE.md
// "Figure adjustments" (common practice: hollow back lowers the centre back 1–2 cm tapering to nothing at
// the side; rounded abdomen raises the centre front, smaller/shorter front darts; prominent seat deeper,
// longer back darts and more length at centre back; high hip fuller higher up; one hip higher or fuller
// drafted left and right apart and cut full). The amounts per quarter are the house's (fit.ts).

const figure = { waist: 72, hip: 100, length: 64, waistToHip: 21, waistToKnee: 57 };
const draft = (adjustments?: FitAdjustments, style: (typeof STYLES)[number]['id'] = 'straight') => draftSkirt({ ...figure, adjustments }, { style });
const plain = draft().exactFigures;
const xAtY = (c: CubicSegment, y: number) => {
	let [lo, hi] = [0, 1];
	for (let i = 0; i < 40; i++) [lo, hi] = pointAt(c, (lo + hi) / 2).y < y ? [(lo + hi) / 2, hi] : [lo, (lo + hi) / 2];
	return pointAt(c, lo).x;
};

describe('fit adjustments on W 72, H 100', () => {
	it('without any: the house block (front dart 3 × 11, back 3 × 14, centre front dropped 1 cm)', () => {
		expect(plain.front.darts.map((d) => [d.intake, d.length])).toEqual([[3, 11]]);
		expect(plain.back.darts.map((d) => [d.intake, d.length])).toEqual([[3, 14]]);
		expect(plain.front.centreDrop).toBe(1);
		expect(plain.back.centreDrop).toBe(0);
	});

	it('hollow back 1.5: the centre back waist 1.5 cm lower, the waist seam unchanged', () => {
		const f = draft({ hollowBack: 1.5 }).exactFigures;
		expect(f.back.centreDrop).toBe(1.5);
		expect(f.check.waistSeam.back).toBeCloseTo(72 / 4 + 0.5, 6);
		expect(f.back.sideRaise).toBe(plain.back.sideRaise);
	});

	it('rounded abdomen 1.5: centre front raised 1.5 cm from where it was, front darts 0.75 cm smaller and 1.5 cm shorter', () => {
		const f = draft({ roundedAbdomen: 1.5 }).exactFigures;
		expect(f.front.centreDrop).toBeCloseTo(1 - 1.5, 9);
		expect(f.front.darts.map((d) => [d.intake, d.length])).toEqual([[2.25, 9.5]]);
		expect(f.front.sideShaping).toBeCloseTo(plain.front.sideShaping + 0.75, 9);
		expect(f.check.waistSeam.front).toBeCloseTo(18.5, 6);
	});

	it('prominent seat 2: back hip 1 cm wider a quarter, its darts 1 cm more and 2 cm longer, centre back 1 cm higher', () => {
		const f = draft({ prominentSeat: 2 }).exactFigures;
		expect(f.back.hipWidth).toBeCloseTo(plain.back.hipWidth + 1, 9);
		expect(f.back.darts.reduce((a, d) => a + d.intake, 0)).toBeCloseTo(4, 9);
		expect(f.back.darts.every((d) => d.length === 16)).toBe(true);
		expect(f.back.centreDrop).toBe(-1);
		// The hip line round the body grows by the seat: 100/2 + 2 (house ease) + 1.
		expect(f.check.hipLine.front + f.check.hipLine.back).toBeCloseTo(53, 9);
	});

	it('high hip 2: the side seam stands further out 9 cm below the waist (up to 0.5 cm a quarter), never past the hip line', () => {
		const d = draft({ highHip: 2 });
		const before = draft().block;
		for (const k of ['front', 'back'] as const) {
			const more = xAtY(d.block[k].hipCurve, 9) - xAtY(before[k].hipCurve, 9);
			expect(more).toBeGreaterThan(0.25);
			expect(more).toBeLessThanOrEqual(0.5 + 0.05);
			for (let i = 0; i <= 40; i++) expect(pointAt(d.block[k].hipCurve, i / 40).x).toBeLessThanOrEqual(d.block[k].hipPoint.x + 1e-9);
		}
	});

	it('personal ease +2 waist, +4 hip: each waist seam 0.5 cm more, each hip quarter 1 cm more', () => {
		const f = draft({ ease: { waist: 2, hip: 4 } }).exactFigures;
		expect(f.check.waistSeam.front).toBeCloseTo(19, 6);
		expect(f.check.hipLine.front + f.check.hipLine.back).toBeCloseTo(50 + 2 + 2, 9);
	});

	it('left hip 1.5 cm higher and 3 cm fuller: left drafted from H 103, right from H 97; full pieces, cut open', () => {
		const d = draft({ oneHip: { side: 'left', higher: 1.5, fuller: 3 } });
		const left = d.left!.exactFigures;
		const right = d.exactFigures;
		expect(left.front.hipWidth + left.back.hipWidth).toBeCloseTo(103 / 2 + 2, 9);
		expect(right.front.hipWidth + right.back.hipWidth).toBeCloseTo(97 / 2 + 2, 9);
		// The left back side waist point: the house raise of 1 cm (full at 2 cm of side shaping) + 1.5 cm.
		expect(left.back.sideRaise).toBeCloseTo(2.5, 9);
		expect(right.back.sideRaise).toBeLessThanOrEqual(1);
		expect(d.pieces.map((p) => `${p.id}: ${p.cutText}`)).toEqual(['front: Cut 1', 'back-right: Cut 1', 'back-left: Cut 1', 'waistband: Cut 1']);
		const front = d.pieces.find((p) => p.id === 'front')!;
		expect(front.fold).toBeUndefined();
		expect(pathProblems(front.seam.segments)).toEqual([]);
		// The full front spans both halves: the left (H 103) on the right of the drawing.
		expect(front.bounds.maxX).toBeGreaterThan(-front.bounds.minX);
		expect(d.warnings.some((w) => w.includes('cut open'))).toBe(true);
	});

	it('every style takes every adjustment (closed outlines, the waist seam kept)', () => {
		const all: FitAdjustments = { hollowBack: 1.5, roundedAbdomen: 1.5, prominentSeat: 1, highHip: 2, oneHip: { side: 'right', higher: 1, fuller: 2 }, ease: { waist: 1, hip: 2 } };
		for (const s of STYLES) {
			const d = draft(all, s.id);
			for (const p of d.pieces) expect(pathProblems(p.seam.segments), `${s.id} ${p.id}`).toEqual([]);
			expect(d.exactFigures.check.waistSeam.front).toBeCloseTo(18.75, 6);
			expect(d.pieces.some((p) => p.cut.onFold)).toBe(false);
		}
	});

	it('refuses amounts out of range, naming the field, its range and the value', () => {
		try {
			draft({ hollowBack: 5, oneHip: { side: 'middle' as never, higher: 1 } });
			expect.unreachable();
		} catch (e) {
			expect(e).toBeInstanceOf(DraftInputError);
			expect((e as DraftInputError).fields).toEqual([
				expect.objectContaining({ field: 'adjustments.oneHip.side' }),
				expect.objectContaining({ field: 'adjustments.hollowBack', min: 0, max: 3, value: 5, limit: 3 })
			]);
		}
	});

	it('refuses a back waist lowered past two fifths of a short waist-to-hip depth, where the back outline would fold over itself', () => {
		// W 50, H 70, depth 10, hollow back 1.8 and the left hip 4 higher crossed the back's outline (found by the
		// property tests). The share is the house's own; a fitting in calico is the usual answer (common practice).
		const short = { waist: 50, hip: 70, waistToHip: 10, length: 15, confirmed: true };
		try {
			draftSkirt({ ...short, adjustments: { hollowBack: 1.8, oneHip: { side: 'left', higher: 4 } } });
			expect.unreachable();
		} catch (e) {
			expect((e as DraftInputError).fields).toEqual([expect.objectContaining({ field: 'adjustments.hollowBack', value: 5.8, limit: 4 })]);
		}
		const ok = draftSkirt({ ...short, adjustments: { hollowBack: 1, oneHip: { side: 'left', higher: 3 } } });
		for (const p of ok.pieces) expect(pathProblems(p.cutting.segments)).toEqual([]);
	});
});
