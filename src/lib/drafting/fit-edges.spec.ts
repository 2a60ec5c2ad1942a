import { describe, expect, it } from 'vitest';
import { inside, toOutline } from './checks';
import { flatten } from './outline';
import { draftSkirt, pathProblems, type Measurements, type SkirtChoiceInput } from './index';

// Figures at the edges of the fit adjustments, each one a counterexample the property tests
// (fit-properties.spec.ts) once found. The waist seam check is the house rule W/4 + 0.5 + personal ease / 4
// (common practice: the waist seam with the darts closed is a quarter of the waist plus the ease).

const straight = (waistband: 'band' | 'facing'): SkirtChoiceInput => ({ style: 'straight', waistband, closure: { kind: 'zip', position: 'centre-back' }, lining: false, pockets: false, vent: 'auto', stretch: false });
const seams = (m: Measurements) => {
	const d = draftSkirt(m, straight('band'));
	return [d.exactFigures, ...(d.left ? [d.left.exactFigures] : [])].flatMap((f) => [f.check.waistSeam.front, f.check.waistSeam.back]);
};

describe('a small waist with one hip much higher', () => {
	it('W 50, H 98.07, depth 15.88, left hip 4 cm higher, waist ease −0.5: every waist seam is W/4 + 0.5 − 0.49/4', () => {
		const m = { waist: 50, hip: 98.07, waistToHip: 15.88, length: 21, confirmed: true, adjustments: { oneHip: { side: 'left' as const, higher: 3.995, fuller: 0 }, ease: { waist: -0.495, hip: 0 } } };
		// The ease is taken to the tenth of a millimetre: −0.495 → −0.49.
		for (const s of seams(m)) expect(s).toBeCloseTo(50 / 4 + 0.5 - 0.49 / 4, 6);
	});

	it('W 50, H 145.5, left hip 4 cm higher: every waist seam is W/4 + 0.5', () => {
		const m = { waist: 50, hip: 145.47532113603629, length: 27, confirmed: true, adjustments: { oneHip: { side: 'left' as const, higher: 3.995, fuller: 0 } } };
		for (const s of seams(m)) expect(s).toBeCloseTo(50 / 4 + 0.5, 6);
	});

	it('W 50, H 122, depth 15, left hip 4 cm higher, waist ease −2: every waist seam is W/4 + 0.5 − 0.5', () => {
		const m = { waist: 50, hip: 122, waistToHip: 15, length: 25, confirmed: true, adjustments: { oneHip: { side: 'left' as const, higher: 4, fuller: 0 }, ease: { waist: -2, hip: 0 } } };
		for (const s of seams(m)) expect(s).toBeCloseTo(50 / 4, 6);
	});
});

describe('the smallest waist and hip over a short depth', () => {
	it('W 50, H 70, depth 10.93, A-line with a side zip: both waist seams are W/4 + 0.5 = 13', () => {
		const d = draftSkirt({ waist: 50, hip: 70, waistToHip: 10.929049968259498, length: 49.44, confirmed: true }, { style: 'a-line', waistband: 'band', closure: { kind: 'zip', position: 'side' }, vent: 'vent' });
		expect(d.exactFigures.check.waistSeam.front).toBeCloseTo(13, 6);
		expect(d.exactFigures.check.waistSeam.back).toBeCloseTo(13, 6);
	});
});

describe('cutting lines round a waist that rises steeply after the last dart', () => {
	it('W 50.8, H 122, depth 14.83, high hip 8, left hip 4 higher: every cutting line is closed and never crosses itself', () => {
		const m = { waist: 50.77762828912761, hip: 121.95602027951247, waistToHip: 14.828831664663538, waistToKnee: 59.83, length: 122, confirmed: true, adjustments: { highHip: 8, oneHip: { side: 'left' as const, higher: 4, fuller: 0 } } };
		const d = draftSkirt(m, { ...straight('band'), closure: { kind: 'invisible-zip', position: 'centre-back' }, vent: 'kick-pleat' });
		for (const p of d.pieces) expect(pathProblems(p.cutting.segments), p.id).toEqual([]);
	});
});

describe('a small gored skirt', () => {
	it('W 50, H 97.2, depth 10, length 16: every seam line lies inside its cutting line (no part taken for a loop)', () => {
		const d = draftSkirt({ waist: 50, hip: 97.17013121755906, waistToHip: 10, length: 16, confirmed: true }, { style: 'gored', waistband: 'band', closure: { kind: 'zip', position: 'side' } });
		for (const p of d.pieces) {
			const cut = flatten(p.cutting.segments, 2);
			expect(flatten(p.seam.segments, 0.5).filter((q) => !inside(q, cut) && toOutline(q, cut) > 1e-6).length, p.id).toBe(0);
		}
	});
});

describe('darts held short by the hip line', () => {
	it('W 88.9, H 136.9, depth 10, hollow back 3: no dart opens wider than 25° (TRADE.md "Darts", common practice)', () => {
		const m = { waist: 88.93829494245485, hip: 136.9382949424549, waistToHip: 10, waistToKnee: 42.58, length: 47.58, confirmed: true, adjustments: { hollowBack: 3 } };
		const f = draftSkirt(m, { style: 'full-circle', waistband: 'facing', closure: { kind: 'zip', position: 'centre-back' }, stretch: true }).exactFigures;
		for (const d of [...f.front.darts, ...f.back.darts]) expect((2 * Math.atan(d.intake / 2 / d.length) * 180) / Math.PI).toBeLessThanOrEqual(25 + 1e-9);
		// The side seam takes what the shortened dart cannot: the hip line and the waist seam are kept.
		expect(f.check.waistSeam.back).toBeCloseTo(88.93829494245485 / 4 + 0.5, 6);
	});
});

describe('a facing on a waist that bends tightly once the darts are closed', () => {
	const facing = { ...straight('facing'), closure: { kind: 'zip' as const, position: 'side' as const } };
	it('W 103.9, H 157.6, depth 11.18, prominent seat 3: the back facing’s cutting line never crosses itself', () => {
		const m = { waist: 103.93417211482267, hip: 157.60398746637514, waistToHip: 11.181211531573474, waistToKnee: 39.86, length: 61.76, confirmed: true, adjustments: { prominentSeat: 3 } };
		for (const p of draftSkirt(m, { ...facing, pockets: true, vent: 'kick-pleat' }).pieces) expect(pathProblems(p.cutting.segments), p.id).toEqual([]);
	});

	it('W 85.5, H 132.2, depth 11.9, left hip 3.9 fuller: the full back facing’s cutting line never crosses itself', () => {
		const m = { waist: 85.46293776517196, hip: 132.20946551010525, waistToHip: 11.902210075776411, length: 17, confirmed: true, adjustments: { oneHip: { side: 'left' as const, higher: 0, fuller: 3.925 } } };
		for (const p of draftSkirt(m, facing).pieces) expect(pathProblems(p.cutting.segments), p.id).toEqual([]);
	});
});

describe('a full facing joined from two halves drafted apart', () => {
	it('W 50, H 115.4, depth 13.63, rounded abdomen 3, right hip 8 fuller: the full front facing is a closed outline', () => {
		const m = { waist: 50.0000000000001, hip: 115.43045291103999, waistToHip: 13.631344356466656, waistToKnee: 47.01, length: 111.16, confirmed: true, adjustments: { roundedAbdomen: 3, oneHip: { side: 'right' as const, higher: 0, fuller: 8 } } };
		const d = draftSkirt(m, { style: 'pencil', waistband: 'facing', closure: { kind: 'invisible-zip', position: 'centre-back' }, lining: true, pockets: true, stretch: true });
		for (const p of d.pieces) expect([...pathProblems(p.seam.segments), ...pathProblems(p.cutting.segments)], p.id).toEqual([]);
	});
});
