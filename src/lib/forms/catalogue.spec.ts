import { describe, expect, it } from 'vitest';
import { fabricSchema } from './catalogue';

const base = {
	name: 'Oat linen canvas',
	colour: 'Oat',
	swatchHex: '#d8cbb0',
	fibreContent: '100 % linen',
	careText: 'Machine wash at 40 °C, line dry.',
	widthCm: '140',
	pricePerMetre: '24.00',
	stockMetres: '8',
	shrinkagePct: '6'
};

describe('the fabric form: shrinkage across', () => {
	it('may be left empty (the lengthwise figure then applies to both) or given on its own', () => {
		expect(fabricSchema.safeParse({ ...base, shrinkageAcrossPct: '' }).success).toBe(true);
		expect(fabricSchema.safeParse({ ...base, shrinkageAcrossPct: '2.5' }).success).toBe(true);
	});

	it('refuses a figure out of range with a message naming the field', () => {
		const r = fabricSchema.safeParse({ ...base, shrinkageAcrossPct: '35' });
		expect(r.success).toBe(false);
		expect(r.error?.issues[0].path).toEqual(['shrinkageAcrossPct']);
		expect(r.error?.issues[0].message).toMatch(/shrinkage across/);
	});
});
