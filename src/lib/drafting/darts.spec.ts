import { describe, expect, it } from 'vitest';
import { DraftInputError, draftSkirt, type DartFigure, type Draft } from './index';

// Dart rules a cutter signs. Check values: TRADE.md "Darts" (a 3 × 11 cm dart is about 16°; past about
// 25° the cloth puckers, common practice; larger intake → longer dart, never past the hip line less about
// 2–3 cm [from memory]; a prominent seat takes more at the back) and "The straight skirt block" (the
// percentage rule and what a pattern maker checks). House values (largest angle 25°, three darts at most,
// 1.5 cm longer a cm of intake over 3 cm, 60 % of the extra intake to the back) are common practice.

const angle = (d: DartFigure) => (2 * Math.atan(d.intake / 2 / d.length) * 180) / Math.PI;
const allDarts = (d: Draft) => [...d.exactFigures.front.darts, ...d.exactFigures.back.darts];
const refusal = (f: () => unknown) => {
	try {
		f();
	} catch (e) {
		expect(e).toBeInstanceOf(DraftInputError);
		return (e as DraftInputError).fields;
	}
	throw new Error('expected a DraftInputError');
};

describe('defect 3: darts a cutter would sew', () => {
	it('a 3 × 11 cm dart is about 16° (TRADE.md), the house worked example keeps its darts', () => {
		expect(angle({ intake: 3, length: 11, fromCentre: 0 })).toBeCloseTo(15.5, 0);
		const f = draftSkirt({ waist: 100, hip: 128, length: 60, waistToHip: 22 }).figures;
		expect(f.front.darts).toEqual([{ fromCentre: 12, intake: 3, length: 11 }]);
		expect(f.back.darts).toEqual([{ fromCentre: 12, intake: 3, length: 14 }]);
	});

	it('waist 65, hip 150 (a slip for 105?) is refused until confirmed, with the numbers', () => {
		const fields = refusal(() => draftSkirt({ waist: 65, hip: 150, length: 60 }));
		expect(fields).toEqual([expect.objectContaining({ field: 'hip', value: 150, confirmable: true })]);
		// The limit is the largest hip the block takes for this waist: well under 150, well over 105.
		expect(fields[0].limit).toBeGreaterThan(105);
		expect(fields[0].limit).toBeLessThan(150);
		// Confirmed, it is drafted: no dart past 25°, at most three a panel, every point 2.5 cm clear of the
		// hip line (22 cm down, the front 1 cm lower at the centre).
		const d = draftSkirt({ waist: 65, hip: 150, length: 60, confirmed: true });
		for (const x of allDarts(d)) expect(angle(x)).toBeLessThanOrEqual(25 + 1e-9);
		for (const x of d.exactFigures.front.darts) expect(x.length).toBeLessThanOrEqual(22 - 2.5 - 1 + 1e-9);
		for (const x of d.exactFigures.back.darts) expect(x.length).toBeLessThanOrEqual(22 - 2.5 + 1e-9);
		expect(d.exactFigures.front.darts.length).toBeLessThanOrEqual(3);
		expect(d.warnings.join(' ')).toContain('more than darts can take: the side seams take the rest');
	});

	it('waist 170, hip 96 is asked to be confirmed, not called common', () => {
		expect(refusal(() => draftSkirt({ waist: 170, hip: 96, length: 60 }))).toEqual([expect.objectContaining({ field: 'waist', value: 170, limit: 116, confirmable: true })]);
		expect(() => draftSkirt({ waist: 170, hip: 96, length: 60, confirmed: true })).not.toThrow();
	});

	it('dart length grows with intake, never past the hip line less 2.5 cm', () => {
		const small = draftSkirt({ waist: 70, hip: 96, length: 60, waistToHip: 21 }).exactFigures.back.darts[0];
		const large = draftSkirt({ waist: 70, hip: 118, length: 60, waistToHip: 21 }).exactFigures.back.darts[0];
		expect(large.intake).toBeGreaterThan(small.intake);
		expect(large.length).toBeGreaterThan(small.length);
		expect(large.length).toBeLessThanOrEqual(21 - 2.5);
	});

	it('a very large intake gets a third dart', () => {
		const d = draftSkirt({ waist: 60, hip: 118, length: 60, waistToHip: 22 });
		expect(d.exactFigures.back.darts).toHaveLength(3);
		for (const x of allDarts(d)) expect(angle(x)).toBeLessThanOrEqual(25 + 1e-9);
	});

	it('a pear figure (W 70, H 110) has at least as much back dart as front', () => {
		const f = draftSkirt({ waist: 70, hip: 110, length: 62, waistToHip: 21 }).exactFigures;
		const sum = (ds: DartFigure[]) => ds.reduce((a, x) => a + x.intake, 0);
		expect(sum(f.back.darts)).toBeGreaterThan(sum(f.front.darts));
		// The hip line as a whole is unchanged: H/2 + 2 × 1 cm ease (house).
		expect(f.back.hipWidth + f.front.hipWidth).toBeCloseTo(110 / 2 + 2, 9);
	});
});

describe('defect 6: the percentage rule trues the waist', () => {
	it('W 73.5, H 94, depth 20, shares 13/8/16/0 with house ease: both waist seams are W/4 + 0.5 = 18.875', () => {
		const rules = { suppression: { method: 'shares', side: 13, frontDart: 8, backDart: 16, centreBack: 0 } } as const;
		const f = draftSkirt({ waist: 73.5, hip: 94, length: 60, waistToHip: 20 }, { style: 'straight' }, rules).exactFigures;
		expect(f.check.waistSeam.front).toBeCloseTo(18.875, 6);
		expect(f.check.waistSeam.back).toBeCloseTo(18.875, 6);
		// Suppression with ease: (94 + 4) − (73.5 + 2) = 22.5; side 13 % = 2.925 each, back dart 3.6, front 1.8.
		expect(f.front.sideShaping).toBeCloseTo(2.925, 6);
		expect(f.back.sideShaping).toBeCloseTo(2.925, 6);
		// 3.6 cm is past the house's largest dart of 3.5: two of 1.8.
		expect(f.back.darts.map((x) => x.intake)).toEqual([expect.closeTo(1.8, 9), expect.closeTo(1.8, 9)]);
		expect(f.front.darts.map((x) => x.intake)).toEqual([expect.closeTo(1.8, 9)]);
		expect(f.back.hipWidth + f.front.hipWidth).toBeCloseTo(94 / 2 + 2, 9);
	});
});

describe('defect 7: no centre front drop where the waist is the hip or more', () => {
	it('W 120, H 118: the front centre stays on the waist line; a usual figure keeps the 1 cm drop', () => {
		expect(draftSkirt({ waist: 120, hip: 118, length: 60, waistToHip: 20 }).figures.front.centreDrop).toBe(0);
		expect(draftSkirt({ waist: 68, hip: 94, length: 60, waistToHip: 20.6 }).figures.front.centreDrop).toBe(1);
	});
});

describe('defect 8: no sliver darts on an A-line', () => {
	it('W 80, H 130, length 90: every dart left on the pieces is at least the house minimum of 1 cm', () => {
		const d = draftSkirt({ waist: 80, hip: 130, length: 90, confirmed: true }, { style: 'a-line' });
		const left = d.pieces.flatMap((p) => p.darts.map((x) => x.intake));
		expect(left.length).toBeGreaterThan(0);
		for (const i of left) expect(i).toBeGreaterThanOrEqual(1 - 1e-9);
	});
});
