import { fail, message, setError, superValidate } from 'sveltekit-superforms';
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
		const posted = await event.request.formData();
		const form = await superValidate(posted, zod4(fitSettingsSchema));
		// Superforms reads a whole-number field with parseInt ("12.5" becomes 12): the typed text is checked
		// as typed too, so a fraction is refused rather than cut. Bad input changes nothing.
		const typed = fitSettingsSchema.safeParse(Object.fromEntries(posted));
		if (!typed.success) for (const issue of typed.error.issues) setError(form, issue.path.join('.') as keyof typeof form.data, issue.message);
		if (!form.valid || !typed.success) return fail(400, { form });
		await saveShopSettings(db, form.data);
		return message(form, 'Saved. The shop’s pages, mails and the fit report window use the new settings now.');
	}
};
