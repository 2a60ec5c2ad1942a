import { fail } from '@sveltejs/kit';
import { DraftInputError, resolveRules } from '$lib/drafting';
import { CHOICE_FIELDS, RULE_FIELDS, getPath, ruleFormProblems, rulesFromForm } from '$lib/server/house/rules-form';
import { db } from '$lib/server/db';
import { currentRules, rulesVersions, saveRulesVersion } from '$lib/server/house/rules';
import { sampleDrawing } from '$lib/server/quote/sample';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const { id, rules } = await currentRules(db);
	const versions = await rulesVersions(db);
	return {
		version: id,
		fields: RULE_FIELDS.map((f) => ({ path: f.path, label: f.label, help: f.help, unit: 'unit' in f ? f.unit : 'cm', step: 'step' in f ? f.step : 0.1, value: getPath(rules, f.path) as number })),
		choices: CHOICE_FIELDS.map((f) => ({ ...f, value: getPath(rules, f.path) as string })),
		drawing: sampleDrawing('straight', rules, id, 'block'),
		versions
	};
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireRole(event, OWNER);
		const form = Object.fromEntries(await event.request.formData());
		const note = String(form.note ?? '').trim().slice(0, 255);
		const { rules: base } = await currentRules(db);
		let rules;
		try {
			const posted = rulesFromForm(form, base);
			const whole = ruleFormProblems(posted);
			if (Object.keys(whole).length) return fail(400, { message: 'Some rules are out of range.', errors: whole });
			rules = resolveRules(posted);
		} catch (err) {
			if (err instanceof DraftInputError) return fail(400, { message: 'Some rules are out of range.', errors: Object.fromEntries(err.fields.map((f) => [f.field.replace(/^rules\./, ''), f.message])) });
			throw err;
		}
		if (!note) return fail(400, { message: 'Say in a few words what changed and why: the note stays with every order drafted with these rules.', errors: {} });
		// A new version: orders already placed keep the rules they were drafted with.
		const id = await saveRulesVersion(db, rules, note, user.id);
		return { message: `Saved as version ${id}. New orders are drafted with it; placed orders keep theirs.` };
	}
};
