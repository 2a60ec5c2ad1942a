import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { linkSignInSchema, passwordSignInSchema, safeNext } from '$lib/forms/auth';
import { signInWith } from '$lib/server/auth/actions';
import { THROTTLED_MESSAGE } from '$lib/server/hooks/throttle';
import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { users } from '$lib/server/db/schema';
import type { Actions, PageServerLoad } from './$types';

const landing = (role: string) => (role === 'owner' ? '/admin' : role === 'cutter' ? '/workroom' : '/account');

export const load: PageServerLoad = async ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next'), landing(locals.user.role)));
	return {
		form: await superValidate(zod4(passwordSignInSchema)),
		linkForm: await superValidate(zod4(linkSignInSchema)),
		// Auth.js sends people back here with ?error= when a link has expired or was used already.
		linkProblem: url.searchParams.get('error') === 'Verification'
	};
};

export const actions: Actions = {
	password: async (event) => {
		const form = await superValidate(event.request, zod4(passwordSignInSchema));
		if (!form.valid) return fail(400, { form });
		const next = safeNext(event.url.searchParams.get('next'), '');
		const outcome = await signInWith(event, 'credentials', { email: form.data.email, password: form.data.password }, next || '/');
		if (!outcome.ok) {
			form.data.password = '';
			if (outcome.code === 'throttled') return message(form, THROTTLED_MESSAGE, { status: 429 });
			if (outcome.code === 'disabled') return message(form, 'This account has been switched off. Ask the atelier if you think that is a mistake.', { status: 403 });
			return message(form, 'That e-mail and password do not match an account. Check both, or e-mail yourself a sign-in link.', { status: 400 });
		}
		// Send each role to its own start page unless a page asked for the sign-in.
		if (next) redirect(303, next);
		const [u] = await db.select({ role: users.role }).from(users).where(eq(users.email, form.data.email)).limit(1);
		redirect(303, landing(u?.role ?? 'shopper'));
	},
	link: async (event) => {
		const linkForm = await superValidate(event.request, zod4(linkSignInSchema));
		if (!linkForm.valid) return fail(400, { linkForm });
		const next = safeNext(event.url.searchParams.get('next'), '/account');
		const outcome = await signInWith(event, 'nodemailer', { email: linkForm.data.email }, next);
		if (!outcome.ok) return message(linkForm, 'We could not send the link just now. Please try again in a minute.', { status: 503 });
		redirect(303, `/signin/check-mail?email=${encodeURIComponent(linkForm.data.email)}`);
	}
};
