import { fail } from '@sveltejs/kit';
import { desc, eq } from 'drizzle-orm';
import { DraftInputError, resolveRules } from '$lib/drafting';
import { CHOICE_FIELDS, RULE_FIELDS, getPath, rulesFromForm } from '$lib/server/admin/rules-form';
import { db } from '$lib/server/db';
import { houseRules, users } from '$lib/server/db/schema';
import { currentRules } from '$lib/server/shop/rules';
import { sampleDrawing } from '$lib/server/shop/sample';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const { id, rules } = await currentRules(db);
	const versions = await db
		.select({ id: houseRules.id, note: houseRules.note, createdAt: houseRules.createdAt, by: users.name })
		.from(houseRules)
		.leftJoin(users, eq(users.id, houseRules.createdBy))
		.orderBy(desc(houseRules.id))
		.limit(20);
	return {
		version: id,
		fields: RULE_FIELDS.map((f) => ({ ...f, value: getPath(rules, f.path) as number })),
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
			rules = resolveRules(rulesFromForm(form, base));
		} catch (err) {
			if (err instanceof DraftInputError) return fail(400, { message: 'Some rules are out of range.', errors: Object.fromEntries(err.fields.map((f) => [f.field.replace(/^rules\./, ''), f.message])) });
			throw err;
		}
		if (!note) return fail(400, { message: 'Say in a few words what changed and why: the note stays with every order drafted with these rules.', errors: {} });
		// A new version: orders already placed keep the rules they were drafted with.
		const [{ id }] = await db.insert(houseRules).values({ rules: rules as unknown as Record<string, unknown>, note, createdBy: user.id }).$returningId();
		return { message: `Saved as version ${id}. New orders are drafted with it; placed orders keep theirs.` };
	}
};
