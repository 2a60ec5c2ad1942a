import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { registerSchema } from '$lib/forms/auth';
import { db } from '$lib/server/db';
import { accountExists, createShopper } from '$lib/server/auth/accounts';
import { signInWith } from '$lib/server/auth/actions';
import { hit } from '$lib/server/limits';
import { sendMail } from '$lib/server/mail';
import { registerAttemptMail } from '$lib/server/mail/templates';
import { safeNext, siteUrl } from '$lib/server/origin';
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
		if (await accountExists(db, email)) {
			// The screen must not tell a stranger that this address has an account: its owner gets a mail
			// instead (at most three an hour, so the form cannot be used to flood someone's inbox).
			form.data.password = '';
			const allowed = await hit(db, `register-mail:${email}`, { limit: 3, windowSeconds: 3600 });
			if (allowed.allowed) await sendMail({ to: email, ...registerAttemptMail(siteUrl('/signin')) });
			return message(form, `We sent a message to ${email}. Open it to carry on.`);
		}
		await createShopper(db, { name, email, password });
		const next = safeNext(event.url.searchParams.get('next'), '/account');
		const outcome = await signInWith(event, 'credentials', { email, password }, next);
		if (!outcome.ok)
			return message(form, 'Your account is made, but signing in failed: please sign in.', { status: 500 });
		redirect(303, next);
	}
};
