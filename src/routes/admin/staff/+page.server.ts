import { fail, message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { searchAccounts, staffList } from '$lib/server/account/staff';
import { inviteSchema } from '$lib/forms/staff';
import { inviteCutter } from '$lib/server/account/invite';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, OWNER);
	const { url } = event;
	const q = (url.searchParams.get('q') ?? '').trim().slice(0, 100);
	const [staff, found] = await Promise.all([
		staffList(db),
		q ? searchAccounts(db, q, 26) : Promise.resolve(null)
	]);
	return {
		form: await superValidate(zod4(inviteSchema)),
		staff,
		q,
		me: me.id,
		found: found?.slice(0, 25) ?? null,
		more: (found?.length ?? 0) > 25
	};
};

export const actions: Actions = {
	invite: async (event) => {
		requireRole(event, OWNER);
		const form = await superValidate(event.request, zod4(inviteSchema));
		if (!form.valid) return fail(400, { form });
		const outcome = await inviteCutter(event, form.data.email, form.data.name);
		if (!outcome.ok) return message(form, outcome.message, { status: outcome.status as 409 | 503 });
		form.data = { email: '', name: '' };
		return message(form, outcome.message);
	}
};
