import { describe, expect, it } from 'vitest';
import { checkCardFit, readCardFit } from './card';

const card = { waist: 70, hip: 98, length: 62, waistToHip: 20, units: 'cm' as const };
const post = (o: Record<string, string>) => {
	const d = new FormData();
	for (const [k, v] of Object.entries(o)) d.set(k, v);
	return d;
};

describe('the measure card’s knee and fit adjustments', () => {
	it('stores the knee and the adjustments in cm, leaving out the empty ones', () => {
		const { values, errors } = readCardFit(post({ waistToKnee: '53', hollowBack: '1.5', roundedAbdomen: '', oneHipSide: 'left', oneHipHigher: '1', easeHip: '-2' }));
		expect(checkCardFit(card, values, errors)).toEqual({ ok: true, waistToKnee: 53, adjustments: { hollowBack: 1.5, oneHip: { side: 'left', higher: 1 }, ease: { hip: -2 } } });
	});

	it('names each bad value with its range (FIT_LIMITS), in inches on an inch card', () => {
		const { values, errors } = readCardFit(post({ hollowBack: '5', prominentSeat: 'abc', oneHipHigher: '1', waistToKnee: '30' }));
		const r = checkCardFit(card, values, errors);
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.errors.hollowBack?.[0]).toBe('The hollow back must be from 0 to 3 cm.');
		expect(r.errors.prominentSeat?.[0]).toBe('Enter a number, or leave it empty.');
		expect(r.errors.oneHipSide?.[0]).toContain('left or right');
		expect(r.errors.waistToKnee?.[0]).toContain('from 35 to 80 cm');
		const inch = checkCardFit({ ...card, units: 'in' }, readCardFit(post({ hollowBack: '2' })).values);
		expect(inch.ok || inch.errors.hollowBack?.[0]).toBe('The hollow back must be from 0 to 1.2 in.');
	});

	it('refuses a knee less than 20 cm under the hip line, with the numbers', () => {
		const r = checkCardFit(card, readCardFit(post({ waistToKnee: '38' })).values);
		expect(!r.ok && r.errors.waistToKnee?.[0]).toMatch(/38 cm puts your knee less than 20 cm below your hip line \(20 cm down\)/);
	});
});
