import { describe, expect, it } from 'vitest';
import { DraftInputError, resolveRules } from '$lib/drafting';
import { rulesFromForm } from './rules-form';

describe('house rules form: the lay fields', () => {
	it('takes the gap between pieces and where a long waistband is joined', () => {
		const rules = resolveRules(rulesFromForm({ 'fabric.gap': '1', 'fabric.bandJoin': 'none' }));
		expect(rules.fabric.gap).toBe(1);
		expect(rules.fabric.bandJoin).toBe('none');
	});

	it('refuses a gap out of range and a join it does not know, naming the field', () => {
		for (const form of [{ 'fabric.gap': '5' }, { 'fabric.bandJoin': 'glued' }]) {
			let fields: string[] = [];
			try {
				resolveRules(rulesFromForm(form));
			} catch (e) {
				if (e instanceof DraftInputError) fields = e.fields.map((f) => f.field);
			}
			expect(fields).toEqual([`rules.${Object.keys(form)[0]}`]);
		}
	});
});
