import { describe, expect, it } from 'vitest';
import { DraftInputError, draftSkirt, MEASUREMENT_LIMITS, validateMeasurements } from './index';

const good = { waist: 72, hip: 98, length: 60, waistToHip: 20.5 };

function problemsOf(input: unknown): DraftInputError {
	try {
		draftSkirt(input as never);
	} catch (e) {
		expect(e).toBeInstanceOf(DraftInputError);
		return e as DraftInputError;
	}
	throw new Error('expected a DraftInputError');
}

describe('measurements', () => {
	it('accepts a usual figure', () => {
		expect(validateMeasurements(good)).toEqual([]);
		expect(() => draftSkirt(good)).not.toThrow();
	});

	// Ranges from TRADE.md ("waist 50–200 cm, hip 70–200 cm" [from memory]).
	it('names each bad field with its allowed range, all at once', () => {
		const e = problemsOf({ waist: 30, hip: 250, length: 60 });
		expect(e.fields.map((f) => f.field).sort()).toEqual(['hip', 'waist']);
		expect(e.fields.find((f) => f.field === 'waist')).toMatchObject({ min: 50, max: 200 });
		expect(e.fields.find((f) => f.field === 'hip')).toMatchObject({ min: 70, max: 200 });
		expect(e.message).toContain('waist');
	});

	it('refuses missing, negative and non-numeric values', () => {
		expect(problemsOf({ hip: 98, length: 60 }).fields[0]).toMatchObject({ field: 'waist', message: 'Enter your waist in centimetres, as a number.' });
		expect(problemsOf({ ...good, hip: -98 }).fields[0].field).toBe('hip');
		expect(problemsOf({ ...good, length: '60' }).fields[0].field).toBe('length');
		expect(problemsOf({ ...good, waist: NaN }).fields[0].field).toBe('waist');
		expect(problemsOf({ ...good, waist: Infinity }).fields[0].field).toBe('waist');
		expect(problemsOf(null).fields.map((f) => f.field).sort()).toEqual(['hip', 'length', 'waist']);
	});

	it('refuses a skirt that does not reach past the hip line, and one longer than the limit', () => {
		const short = problemsOf({ ...good, length: 24 });
		expect(short.fields).toEqual([expect.objectContaining({ field: 'length', min: 26, max: MEASUREMENT_LIMITS.length.max })]);
		expect(short.fields[0].message).toContain('below your hip line');
		// With the hip depth unknown the house default (22 cm) sets the shortest length.
		expect(problemsOf({ waist: 72, hip: 98, length: 26 }).fields[0].min).toBe(27);
		expect(problemsOf({ ...good, length: 131 }).fields[0]).toMatchObject({ field: 'length', max: 130 });
		expect(problemsOf({ ...good, waistToHip: 40 }).fields[0]).toMatchObject({ field: 'waistToHip', min: 10, max: 35 });
	});

	it('refuses a hip larger than the waist by more than the hip depth can carry', () => {
		// 4.8 cm of hip over waist per cm of depth (1.2 cm of shaping a quarter per cm): W 50 over 10 cm → hip ≤ 98.
		expect(validateMeasurements({ waist: 50, hip: 98, length: 40, waistToHip: 10 })).toEqual([]);
		const e = problemsOf({ waist: 50, hip: 99, length: 40, waistToHip: 10 });
		expect(e.fields).toEqual([expect.objectContaining({ field: 'hip', max: 98 })]);
		expect(e.fields[0].message).toMatch(/^Please check your hip and your waist-to-hip depth/);
		// A waist larger than the hip is never refused outright: past 20 cm over the hip (rare, from memory)
		// it is asked to be confirmed, with the numbers, and drafted once it is.
		expect(validateMeasurements({ waist: 200, hip: 70, length: 40, waistToHip: 10, confirmed: true })).toEqual([]);
		expect(validateMeasurements({ waist: 200, hip: 70, length: 40, waistToHip: 10 })).toEqual([expect.objectContaining({ field: 'waist', value: 200, limit: 90, confirmable: true })]);
		expect(validateMeasurements({ waist: 90, hip: 70, length: 40, waistToHip: 10 })).toEqual([]);
	});

	it('says when it assumed the hip depth, and when a value is near the edge of the range', () => {
		const d = draftSkirt({ waist: 72, hip: 98, length: 60 });
		expect(d.figures.hipDepth).toBe(22);
		expect(d.figures.hipDepthAssumed).toBe(true);
		expect(d.warnings[0]).toMatch(/^You did not give your waist-to-hip depth, so we used 22 cm/);
		const edge = draftSkirt({ waist: 52, hip: 76, length: 50, waistToHip: 18 });
		expect(edge.warnings.some((w) => w.startsWith('Please check your waist: 52 cm is close to the smallest we draft'))).toBe(true);
	});

	it('refuses bad options and house rules with the field named', () => {
		expect(() => draftSkirt(good, { style: 'tulip' as never })).toThrow(DraftInputError);
		try {
			draftSkirt(good, { hemDepth: 0.2 }, { allowances: { seam: -1 } as never });
		} catch (e) {
			expect((e as DraftInputError).fields).toEqual([expect.objectContaining({ field: 'rules.allowances.seam', min: 0.3, max: 10 })]);
		}
		try {
			draftSkirt(good, { hemDepth: 0.2 });
		} catch (e) {
			expect((e as DraftInputError).fields).toEqual([expect.objectContaining({ field: 'choice.hemDepth', min: 1, max: 10 })]);
		}
		expect.assertions(3);
	});
});
