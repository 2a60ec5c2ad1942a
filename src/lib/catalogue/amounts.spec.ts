import { describe, expect, it } from 'vitest';
import { amountProblem, centsToText, numberToText, parseScaled, slugify } from './amounts';

describe('figures typed into the catalogue', () => {
	it('reads euros into cents exactly, with a point or a comma', () => {
		expect(parseScaled('89', 2)).toBe(8900);
		expect(parseScaled('89.5', 2)).toBe(8950);
		expect(parseScaled('0,07', 2)).toBe(7);
		// 19.99 × 100 is 1998.9999999999998 in floating point: reading the digits avoids it.
		expect(parseScaled('19.99', 2)).toBe(1999);
	});

	it('refuses what it would have to guess at', () => {
		for (const t of ['', '1,200.50', '12.345', '-3', '12 €', 'abc', '1e3']) expect(parseScaled(t, 2)).toBeNull();
	});

	it('turns metres into tenths of a centimetre', () => {
		expect(parseScaled('12.345', 3)).toBe(12345); // 12.345 m = 1234.5 cm
	});

	it('says what is wrong in words', () => {
		const rule = { label: 'width', decimals: 1, min: 50, max: 330, unit: 'cm', example: '150' };
		expect(amountProblem('', rule)).toBe('Enter the width.');
		expect(amountProblem('150.25', rule)).toBe('Write the width as a number with at most 1 decimal, such as 150.');
		expect(amountProblem('20', rule)).toBe('The width must be from 50 to 330 cm.');
		expect(amountProblem('140,5', rule)).toBeNull();
	});

	it('shows stored figures back without trailing zeros', () => {
		expect(centsToText(8950)).toBe('89.50');
		expect(centsToText(8900)).toBe('89');
		expect(numberToText(150, 1)).toBe('150');
		expect(numberToText(12.35, 3)).toBe('12.35');
	});

	it('makes web addresses from names', () => {
		expect(slugify('Rue straight skirt')).toBe('rue-straight-skirt');
		expect(slugify('  Crêpe de Chine, “Ink” ')).toBe('crepe-de-chine-ink');
	});
});
