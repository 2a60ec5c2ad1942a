import { describe, expect, it } from 'vitest';
import { flatToBody, houseEase, validateFlat } from './flat-garment';
import { DEFAULT_RULES } from './rules';
import { validateMeasurements } from './measurements';

describe('a skirt that fits, laid flat, into body figures', () => {
	it('doubles each width and takes off the house ease (worked example)', () => {
		// House ease (rules.ts, common practice): waist 0.5 cm front + 0.5 cm back a quarter → 4 quarters =
		// 2 × (0.5 + 0.5) = 2 cm on the whole waist; hip 1 cm a quarter → 4 × 1 = 4 cm on the whole hip.
		expect(houseEase(DEFAULT_RULES)).toEqual({ waist: 2, hip: 4 });
		// Waist across 35.5 cm → 2 × 35.5 = 71 cm of garment − 2 cm ease = 69 cm of body.
		// Hip across 48.3 cm at 20 cm down → 2 × 48.3 = 96.6 cm of garment − 4 cm ease = 92.6 cm of body.
		// Depth 20 cm and length 62 cm are taken as measured.
		const body = flatToBody({ waistAcross: 35.5, hipAcross: 48.3, hipDepth: 20, length: 62 });
		expect(body).toMatchObject({ waist: 69, hip: 92.6, waistToHip: 20, length: 62 });
		expect(validateMeasurements(body)).toEqual([]);
	});

	it('takes off the ease the house rules say, when the owner changes it', () => {
		// 1 cm a quarter at the waist front and back → 2 × (1 + 1) = 4; hip 2 a quarter → 8.
		const rules = { ...DEFAULT_RULES, ease: { waist: { front: 1, back: 1 }, hip: 2 } };
		expect(flatToBody({ waistAcross: 35, hipAcross: 48, hipDepth: 20, length: 60 }, rules)).toMatchObject({ waist: 66, hip: 88 });
	});

	it('refuses widths no skirt laid flat has, and a hip line below the hem, naming the field', () => {
		expect(validateFlat({ waistAcross: 35, hipAcross: 48, hipDepth: 20, length: 60 })).toEqual([]);
		// A whole girth typed by mistake (70 cm "across" would be a 140 cm waist) passes; 300 does not.
		expect(validateFlat({ waistAcross: 300, hipAcross: 48, hipDepth: 20, length: 60 }).map((p) => p.field)).toEqual(['waistAcross']);
		expect(validateFlat({ waistAcross: 35, hipAcross: Number.NaN, hipDepth: 20, length: 60 }).map((p) => p.field)).toEqual(['hipAcross']);
		expect(validateFlat({ waistAcross: 35, hipAcross: 48, hipDepth: 30, length: 28 }).map((p) => p.field)).toEqual(['hipDepth']);
	});
});
