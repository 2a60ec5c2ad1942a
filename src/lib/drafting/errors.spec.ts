import { describe, expect, it } from 'vitest';
import { problemIn } from './errors';
import { validateMeasurements } from './measurements';
import { resolveFit } from './fit';
import { validateFlat } from './flat-garment';

// Messages in inches come from the problems' own numbers. An inch is exactly 2.54 cm (international
// yard and pound agreement, 1959); limits she types are decimal inches, lengths read as a tape, to the ⅛″.
describe('problems said in the shopper’s units', () => {
	it('gives a range as decimal inches she can type', () => {
		const [p] = validateMeasurements({ waist: 30, hip: 98, length: 60, waistToHip: 20 });
		expect(p.message).toBe('Your waist must be from 50 to 200 cm: please measure again.');
		// 50 / 2.54 = 19.685 → 19.7; 200 / 2.54 = 78.74 → 78.7
		expect(problemIn(p, 'in')).toBe('Your waist must be from 19.7 to 78.7 in: please measure again.');
	});

	it('says a short skirt’s least length and the hip-line margin in inches', () => {
		const [p] = validateMeasurements({ waist: 70, hip: 96, length: 20, waistToHip: 20 });
		expect(p.message).toBe('Your skirt length must reach at least 5 cm below your hip line: 25 cm or more.');
		// 5 cm = 1.97″ → 2″ on a tape; 25 cm = 9.84 → 9.8 in typed
		expect(problemIn(p, 'in')).toBe('Your skirt length must reach at least 2″ below your hip line: 9.8 in or more.');
	});

	it('names the unit she types in', () => {
		const [p] = validateMeasurements({ waist: 'x', hip: 98, length: 60 });
		expect(problemIn(p, 'in')).toBe('Enter your waist in inches, as a number.');
		expect(problemIn(p, 'cm')).toBe(p.message);
	});

	it('says a fit amount’s range and a flat measure’s range in inches', () => {
		const fit = resolveFit({ hollowBack: 9 }).problems[0];
		expect(problemIn(fit, 'in')).not.toMatch(/\bcm\b/);
		expect(problemIn(fit, 'in')).toMatch(/^The hollow back must be from [\d.]+ to [\d.]+ in\.$/);
		const flat = validateFlat({ waistAcross: 5, hipAcross: 50, hipDepth: 20, length: 60 })[0];
		expect(problemIn(flat, 'in')).toMatch(/^The waist across of a skirt laid flat is from [\d.]+ to [\d.]+ in: please measure again\.$/);
	});

	it('leaves a sentence with no length as it is', () => {
		const p = resolveFit({ oneHip: { side: 'up', higher: 1 } }).problems[0];
		expect(problemIn(p, 'in')).toBe('Say which hip is higher or fuller: left or right.');
	});

	it('says every problem of a wild figure without a centimetre left in inches', () => {
		const problems = validateMeasurements({ waist: 140, hip: 70, length: 200, waistToHip: 40, waistToKnee: 20, adjustments: { hollowBack: 30, ease: { waist: 99 } } });
		expect(problems.length).toBeGreaterThan(3);
		for (const p of problems) expect(problemIn(p, 'in')).not.toMatch(/\bcm\b|centimetres/);
	});
});
