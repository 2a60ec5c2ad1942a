import { json } from '@sveltejs/kit';
import { DraftInputError, draftSkirt, resolveRules, toSvg } from '$lib/drafting';
import { fieldErrors } from '$lib/forms/errors';
import type { FailureAnswer, RulesPreviewAnswer } from '$lib/api/answers';
import { ruleFormProblems, rulesFromForm } from '$lib/server/house/rules-form';
import { rulesPreviewSchema } from '$lib/server/house/rules-preview';
import { db } from '$lib/server/db';
import { currentRules } from '$lib/server/house/rules';
import { SAMPLE_FIGURE } from '$lib/server/quote/sample';
import type { RequestHandler } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

// The house-rules page's live sample drawing: draws the sample figure with the rules being edited.
export const POST: RequestHandler = async (event) => {
	requireRole(event, OWNER);
	const body = await event.request.json().catch(() => null);
	if (!body || typeof body !== 'object') return json({ message: 'Send the rules as JSON.' } satisfies FailureAnswer, { status: 400 });
	const parsed = rulesPreviewSchema.safeParse(body);
	if (!parsed.success) return json({ message: 'Some values need a second look.', fields: fieldErrors(parsed.error) } satisfies FailureAnswer, { status: 400 });
	try {
		const posted = rulesFromForm(parsed.data, (await currentRules(db)).rules);
		const whole = ruleFormProblems(posted);
		if (Object.keys(whole).length) return json({ message: Object.values(whole).join(' '), fields: Object.fromEntries(Object.entries(whole).map(([k, v]) => [k, [v]])) } satisfies FailureAnswer, { status: 400 });
		const rules = resolveRules(posted);
		const draft = draftSkirt(SAMPLE_FIGURE, { style: 'straight' }, rules);
		return json({ svg: toSvg(draft, { view: 'block', units: 'cm' }), figures: draft.figures, warnings: draft.warnings } satisfies RulesPreviewAnswer);
	} catch (err) {
		if (err instanceof DraftInputError) return json({ message: err.message, fields: Object.fromEntries(err.fields.map((f) => [f.field.replace(/^rules\./, ''), [f.message]])) } satisfies FailureAnswer, { status: 400 });
		throw err;
	}
};
