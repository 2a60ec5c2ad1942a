import { describe, expect, it } from 'vitest';
import { DraftInputError, draftSkirt, resolveRules } from '$lib/drafting';
import { DEFAULT_RULES } from '$lib/drafting/rules';
import { RULE_FIELDS, ruleFormProblems, rulesFromForm } from './rules-form';

describe('house rules form: the knee and the dart rules', () => {
	it('lists every rule the engine reads for the knee and the darts', () => {
		const paths = RULE_FIELDS.map((f) => f.path as string);
		for (const p of ['kneeDepth', 'darts.maxAngle', 'darts.maxCount', 'darts.lengthGrowth.from', 'darts.lengthGrowth.perCm', 'darts.backShare', 'vent.reachAboveKnee', 'lining.slitAbove'])
			expect(paths).toContain(p);
	});

	it('drafts with the posted knee: a 53 cm house knee puts the pencil vent top 2 cm above it', () => {
		const rules = resolveRules(rulesFromForm({ kneeDepth: '53' }, DEFAULT_RULES));
		expect(rules.kneeDepth).toBe(53);
		const d = draftSkirt({ waist: 68, hip: 94, length: 80, waistToHip: 20 }, { style: 'pencil' }, rules);
		expect(d.measurements.kneeDepth).toBe(53);
		// Past the knee the vent reaches 2 cm above it (rules.ts vent.reachAboveKnee): its top 51 cm down.
		expect(d.figures.length - d.choice.ventLength).toBeCloseTo(51, 5);
	});

	it('refuses a dart angle out of range, and a count that is not a whole number', () => {
		expect(() => resolveRules(rulesFromForm({ 'darts.maxAngle': '60' }, DEFAULT_RULES))).toThrow(DraftInputError);
		expect(ruleFormProblems(rulesFromForm({ 'darts.maxCount': '2.5' }, DEFAULT_RULES))).toEqual({ 'darts.maxCount': expect.stringContaining('whole number') });
		expect(ruleFormProblems(rulesFromForm({ 'darts.maxCount': '2' }, DEFAULT_RULES))).toEqual({});
	});
});
