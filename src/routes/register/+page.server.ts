import { fail, redirect } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { registerSchema, safeNext } from '$lib/forms/auth';
import { db } from '$lib/server/db';
import { users } from '$lib/server/db/schema';
import { hashPassword } from '$lib/server/auth/password';
import { signInWith } from '$lib/server/auth/actions';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	if (locals.user) redirect(303, '/account');
	return { form: await superValidate(zod4(registerSchema)) };
};

export const actions: Actions = {
	default: async (event) => {
		const form = await superValidate(event.request, zod4(registerSchema));
		if (!form.valid) return fail(400, { form });
		const { name, email, password } = form.data;
		const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
		if (existing) {
			form.data.password = '';
			return setError(form, 'email', 'An account with this e-mail exists already: sign in, or e-mail yourself a sign-in link.');
		}
		// Every account made here is a shopper; staff accounts are made by the owner.
		await db.insert(users).values({ name, email, passwordHash: await hashPassword(password), role: 'shopper' });
		const next = safeNext(event.url.searchParams.get('next'), '/account');
		const outcome = await signInWith(event, 'credentials', { email, password }, next);
		if (!outcome.ok) return message(form, 'Your account is made, but signing in failed: please sign in.', { status: 500 });
		redirect(303, next);
	}
};
