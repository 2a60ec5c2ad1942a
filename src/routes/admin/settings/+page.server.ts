import { fail, message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { saveShopSettings, shopSettingsOf } from '$lib/server/house/rules';
import { fitSettingsSchema } from '$lib/forms/fit-settings';
import { OWNER, requireRole } from '$lib/server/access';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const s = await shopSettingsOf(db, true);
	const current = { remakeWindowDays: s.remakeWindowDays, photoRetentionDays: s.photoRetentionDays, freeRemakesPerOrder: s.freeRemakesPerOrder };
	return { form: await superValidate(current, zod4(fitSettingsSchema), { errors: false }) };
};

export const actions: Actions = {
	default: async (event) => {
		// Asked here too, from the route SvelteKit matched: a posted form reaches the action without the load.
		requireRole(event, OWNER);
		const form = await superValidate(event.request, zod4(fitSettingsSchema));
		// Bad input changes nothing: every value is checked before any is written.
		if (!form.valid) return fail(400, { form });
		await saveShopSettings(db, form.data);
		return message(form, 'Saved. The shop’s pages, mails and the fit report window use the new settings now.');
	}
};
