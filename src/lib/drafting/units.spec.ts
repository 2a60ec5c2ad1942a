import { describe, expect, it } from 'vitest';
import { draftSkirt, validateMeasurements } from './index';
import { cmToIn, formatCm, formatInches, formatLength, inToCm } from './units';

describe('units', () => {
	it('converts at exactly 2.54 cm to the inch (international yard, 1959)', () => {
		expect(inToCm(1)).toBe(2.54);
		expect(cmToIn(25.4)).toBeCloseTo(10, 12);
		expect(cmToIn(inToCm(7.375))).toBeCloseTo(7.375, 12);
	});

	it('shows inches to the nearest eighth, as a tape reads', () => {
		expect(formatInches(inToCm(10.375))).toBe('10⅜″');
		expect(formatInches(inToCm(10.43))).toBe('10⅜″'); // 10.43 is nearer ⅜ (10.375) than ½
		expect(formatInches(inToCm(0.625))).toBe('⅝″'); // a US seam allowance
		expect(formatInches(inToCm(11.99))).toBe('12″');
		expect(formatInches(0)).toBe('0″');
		expect(formatInches(-inToCm(0.5))).toBe('−½″');
	});

	it('shows centimetres to the millimetre without a trailing zero', () => {
		expect(formatCm(25.5)).toBe('25.5 cm');
		expect(formatCm(32)).toBe('32 cm');
		expect(formatCm(32.04)).toBe('32 cm');
		expect(formatCm(0.06)).toBe('0.1 cm');
		expect(formatLength(1.5875, 'in')).toBe('⅝″');
		expect(formatLength(1.5, 'cm')).toBe('1.5 cm');
	});

	// ASTM D5585-11e1 (adult female misses, sizes 00–20), waist girth in inches, curvy and straight
	// figure types (from TRADE.md): each size reads back to the same eighth after a trip through cm,
	// lies inside the range the engine drafts, and drafts.
	const curvy = ['23⅞', '24⅝', '25⅜', '26⅛', '27', '28', '29', '30¾', '32½', '34½', '36¾', '39'];
	const straight = ['25⅜', '26⅛', '26⅞', '27⅝', '28½', '29½', '30½', '32¼', '34', '36', '38¼', '40½'];
	const parse = (s: string) => {
		const frac: Record<string, number> = { '⅛': 1, '¼': 2, '⅜': 3, '½': 4, '⅝': 5, '¾': 6, '⅞': 7 };
		const last = s.at(-1)!;
		return frac[last] ? Number(s.slice(0, -1)) + frac[last] / 8 : Number(s);
	};
	it('reads every ASTM D5585 waist size back exactly through centimetres', () => {
		for (const s of [...curvy, ...straight]) {
			const cm = inToCm(parse(s));
			expect(formatInches(cm)).toBe(`${s}″`);
			expect(validateMeasurements({ waist: cm, hip: cm + 25, length: 60 })).toEqual([]);
			const d = draftSkirt({ waist: cm, hip: cm + 25, length: 60, waistToHip: 20 });
			expect(d.exactFigures.check.waistSeam.front * 4).toBeCloseTo(cm + 2, 9);
		}
	});
});
