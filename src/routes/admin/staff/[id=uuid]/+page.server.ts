import { error, fail as kitFail } from '@sveltejs/kit';
import { fail, message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { accountById, setRole, switchOff, switchOn } from '$lib/server/account/staff';
import { roleSchema, ROLE_CHOICES } from '$lib/forms/staff';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

async function accountFor(id: string) {
	const row = await accountById(db, id);
	if (!row) error(404, 'There is no such account.');
	return row;
}

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, OWNER);
	const u = await accountFor(event.params.id);
	return {
		account: {
			id: u.id,
			name: u.name,
			email: u.email,
			role: u.role,
			disabledAt: u.disabledAt,
			createdAt: u.createdAt,
			hasPassword: Boolean(u.passwordHash)
		},
		self: u.id === me.id,
		form: await superValidate({ role: u.role, confirm: false }, zod4(roleSchema), { errors: false })
	};
};

// The owner cannot take her own rights away: the back office always keeps at least the owner
// who is using it, and nobody locks themselves out by a slip.
const SELF = 'This is your own account: another owner can change its role or switch it off.';

export const actions: Actions = {
	role: async (event) => {
		const me = requireRole(event, OWNER);
		const u = await accountFor(event.params.id);
		const form = await superValidate(event.request, zod4(roleSchema));
		if (u.id === me.id) return message(form, SELF, { status: 403 });
		if (!form.valid) return fail(400, { form });
		if (form.data.role === u.role) return setError(form, 'role', `${u.name ?? u.email} is a ${u.role} already.`);
		await setRole(db, u.id, form.data.role);
		form.data.confirm = false;
		const label = ROLE_CHOICES.find((c) => c.id === form.data.role)!.label.toLowerCase();
		return message(form, `${u.name ?? u.email} is a ${label} now. It counts from their next click.`);
	},
	disable: async (event) => {
		const me = requireRole(event, OWNER);
		const u = await accountFor(event.params.id);
		if (u.id === me.id) return kitFail(403, { message: SELF });
		const confirmed = (await event.request.formData()).get('confirm') === 'on';
		if (!confirmed)
			return kitFail(400, { message: 'Tick the box to confirm: switching an account off signs them out at once.' });
		if (u.disabledAt) return kitFail(409, { message: 'This account is switched off already.' });
		await switchOff(db, u);
		return {
			notice: `Switched off. ${u.name ?? u.email} is signed out and cannot sign in until you switch the account back on.`
		};
	},
	enable: async (event) => {
		const me = requireRole(event, OWNER);
		const u = await accountFor(event.params.id);
		if (u.id === me.id) return kitFail(403, { message: SELF });
		if (!u.disabledAt) return kitFail(409, { message: 'This account is switched on already.' });
		await switchOn(db, u.id);
		return { notice: `Switched back on. ${u.name ?? u.email} can sign in again.` };
	}
};
