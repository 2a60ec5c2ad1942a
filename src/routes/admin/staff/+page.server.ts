import { asc, desc, like, or, sql } from 'drizzle-orm';
import { fail, message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { users } from '$lib/server/db/schema';
import { inviteSchema } from '$lib/forms/staff';
import { inviteCutter } from './invite.server';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

const account = {
	id: users.id,
	name: users.name,
	email: users.email,
	role: users.role,
	disabledAt: users.disabledAt,
	createdAt: users.createdAt
};

// LIKE treats % and _ as wildcards: a search for "a_b" means those three characters.
const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, OWNER);
	const { url } = event;
	const q = (url.searchParams.get('q') ?? '').trim().slice(0, 100);
	const [staff, found] = await Promise.all([
		db
			.select(account)
			.from(users)
			.where(sql`${users.role} <> 'shopper'`)
			.orderBy(desc(users.role), asc(users.name), asc(users.email)),
		q
			? db
					.select(account)
					.from(users)
					// Addresses are stored lower-cased and compared byte for byte (binary collation).
					.where(or(like(users.email, `%${escapeLike(q.toLowerCase())}%`), like(users.name, `%${escapeLike(q)}%`)))
					.orderBy(asc(users.email))
					.limit(26)
			: Promise.resolve(null)
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
