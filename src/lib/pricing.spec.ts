import { describe, expect, it } from 'vitest';
import { fabricCost, priceLine, promisedShipDate, shippingCost } from './pricing';

describe('pricing', () => {
	it('charges fabric by length at the price per metre', () => {
		// 1.30 m at €24.00 a metre is €31.20, worked by hand.
		expect(fabricCost(130, 2400)).toBe(3120);
	});

	it('adds making and chosen options only', () => {
		const p = priceLine({ fabricCm: 100, pricePerMetre: 1800, makingPrice: 9500, options: { lining: true, pockets: false, waistband: 'band' }, optionPrices: { lining: 1500, pockets: 1200, band: 0 } });
		expect(p).toEqual({ fabric: 1800, making: 9500, options: 1500, total: 12_800 });
	});

	it('ships free from the threshold', () => {
		expect(shippingCost(29_999)).toBe(950);
		expect(shippingCost(30_000)).toBe(0);
	});

	it('counts working days and adds a day per four waiting orders', () => {
		// Tuesday 1 Dec 2026 + 5 working days = Tuesday 8 Dec; 8 waiting orders add 2 more = Thursday 10 Dec.
		const tue = new Date('2026-12-01T10:00:00Z');
		expect(promisedShipDate(tue, 5, 0)).toBe('2026-12-08');
		expect(promisedShipDate(tue, 5, 8)).toBe('2026-12-10');
		// From a Friday, one working day is the Monday.
		expect(promisedShipDate(new Date('2026-12-04T10:00:00Z'), 1, 0)).toBe('2026-12-07');
	});
});
