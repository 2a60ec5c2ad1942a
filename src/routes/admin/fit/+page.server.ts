import { fail } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { styleKinds } from '$lib/server/catalogue/listing';
import { OWNER, requireRole } from '$lib/server/access';
import { fitInsights } from '$lib/server/fit/insights';
import { currentRules, saveRulesVersion } from '$lib/server/house/rules';
import { sampleDrawing } from '$lib/server/quote/sample';
import { DraftInputError, draftSkirt, resolveRules, toSvg, type StyleId } from '$lib/drafting';
import { SAMPLE_FIGURE } from '$lib/server/quote/sample';
import type { HouseRules } from '$lib/drafting/rules';
import { SUGGEST_MIN_REPORTS, SUGGEST_SHARE, type RuleSuggestion } from '$lib/fit/report';
import type { Actions, PageServerLoad } from './$types';

// Ease is at most 5 cm a quarter at the waist and 10 at the hip (the engine's rule ranges).
const CAP = { 'ease.waist': 5, 'ease.hip': 10 } as const;

/** The house rules with one suggestion applied: ease added on each quarter (front and back at the waist). */
function applied(rules: HouseRules, s: RuleSuggestion): HouseRules {
	const next = structuredClone(rules);
	if (s.rule === 'ease.waist') {
		next.ease.waist.front = Math.min(CAP['ease.waist'], next.ease.waist.front + s.perQuarterCm);
		next.ease.waist.back = Math.min(CAP['ease.waist'], next.ease.waist.back + s.perQuarterCm);
	} else next.ease.hip = Math.min(CAP['ease.hip'], next.ease.hip + s.perQuarterCm);
	return resolveRules(next);
}

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const [insights, { id, rules }, kinds] = await Promise.all([fitInsights(db), currentRules(db), styleKinds(db)]);
	const kindOf = new Map(kinds.map((k) => [k.name, k.kind]));
	const suggestions = insights.suggestions.map((s) => {
		const kind = kindOf.get(s.style) ?? 'straight';
		let preview: string | null = null;
		try {
			preview = toSvg(draftSkirt(SAMPLE_FIGURE, { style: kind as StyleId }, applied(rules, s)), { view: 'block', units: 'cm' });
		} catch (err) {
			if (!(err instanceof DraftInputError)) throw err;
		}
		return { ...s, key: `${s.style}|${s.area}`, now: s.rule === 'ease.waist' ? rules.ease.waist.front : rules.ease.hip, current: sampleDrawing(kind, rules, id, 'block'), preview };
	});
	return { ...insights, suggestions, threshold: { min: SUGGEST_MIN_REPORTS, share: SUGGEST_SHARE }, rulesVersion: id };
};

export const actions: Actions = {
	adopt: async (event) => {
		const user = requireRole(event, OWNER);
		const key = String((await event.request.formData()).get('key') ?? '');
		// Worked out again from the reports: the page's word is only which suggestion she chose.
		const s = (await fitInsights(db)).suggestions.find((x) => `${x.style}|${x.area}` === key);
		if (!s) return fail(404, { message: 'That suggestion no longer stands (the reports changed). Nothing was saved.' });
		const { rules } = await currentRules(db);
		const note = `From the fit page: ${s.words}`.slice(0, 255);
		const id = await saveRulesVersion(db, applied(rules, s), note, user.id);
		return { message: `Saved as house rules version ${id}. New orders are drafted with it; placed orders keep theirs.` };
	}
};
