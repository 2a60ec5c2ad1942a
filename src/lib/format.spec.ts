import { describe, expect, it } from 'vitest';
import { currencySign, formatMoney, minorDigits, plainAmount, toMinor } from './format';

// Minor units per currency as ISO 4217 lists them (EUR and USD 2 decimals, JPY 0), which is also how
// the payment provider counts amounts; Intl's data follows the same table.
describe('money in the shop’s currency', () => {
	it('writes each currency with its own sign and decimals (ISO 4217)', () => {
		expect(formatMoney(1250, 'EUR')).toBe('€12.50');
		expect(formatMoney(1250, 'GBP')).toBe('£12.50');
		expect(formatMoney(1250, 'JPY')).toBe('JP¥1,250');
		expect(minorDigits('JPY')).toBe(0);
		expect(minorDigits('EUR')).toBe(2);
	});
	it('turns typed amounts into minor units and back without drift', () => {
		expect(toMinor(12.5, 'EUR')).toBe(1250);
		expect(toMinor(0.1 + 0.2, 'EUR')).toBe(30);
		expect(toMinor(1250, 'JPY')).toBe(1250);
		expect(plainAmount(1250, 'EUR')).toBe('12.50');
		expect(plainAmount(1250, 'JPY')).toBe('1250');
	});
	it('gives the sign for a field label', () => {
		expect(currencySign('EUR')).toBe('€');
		expect(currencySign('USD')).toMatch(/\$/);
	});
});
