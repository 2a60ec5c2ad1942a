import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { linkSignInSchema, passwordSignInSchema } from '$lib/forms/auth';
import { signInWith } from '$lib/server/auth/actions';
import { signInContext } from '$lib/server/auth/context';
import { messageForError, SIGN_IN_MESSAGES } from '$lib/server/auth/messages';
import { db } from '$lib/server/db';
import { roleOf } from '$lib/server/auth/accounts';
import { safeNext } from '$lib/server/origin';
import type { Actions, PageServerLoad } from './$types';

const landing = (role: string) => (role === 'owner' ? '/admin' : role === 'cutter' ? '/workroom' : '/account');

export const load: PageServerLoad = async ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next'), landing(locals.user.role)));
	return {
		form: await superValidate(zod4(passwordSignInSchema)),
		linkForm: await superValidate(zod4(linkSignInSchema)),
		// Auth.js sends people back here with ?error= (a used or expired link, a wrong password at its
		// own endpoint, …): say what happened in plain words.
		problem: messageForError(url.searchParams.get('error'), url.searchParams.get('code'))
	};
};

export const actions: Actions = {
	password: async (event) => {
		const form = await superValidate(event.request, zod4(passwordSignInSchema));
		if (!form.valid) return fail(400, { form });
		const next = safeNext(event.url.searchParams.get('next'), '');
		const outcome = await signInWith(
			event,
			'credentials',
			{ email: form.data.email, password: form.data.password },
			next || '/'
		);
		if (!outcome.ok) {
			form.data.password = '';
			if (outcome.code === 'throttled' || outcome.code === 'client-throttled') {
				event.setHeaders({ 'retry-after': String(signInContext()?.retryAfter ?? 60) });
				return message(form, SIGN_IN_MESSAGES[outcome.code], { status: 429 });
			}
			if (outcome.code === 'disabled') return message(form, SIGN_IN_MESSAGES.disabled, { status: 403 });
			return message(form, SIGN_IN_MESSAGES.credentials, { status: 400 });
		}
		// Send each role to its own start page unless a page asked for the sign-in.
		if (next) redirect(303, next);
		redirect(303, landing((await roleOf(db, form.data.email)) ?? 'shopper'));
	},
	link: async (event) => {
		const linkForm = await superValidate(event.request, zod4(linkSignInSchema));
		if (!linkForm.valid) return fail(400, { linkForm });
		const next = safeNext(event.url.searchParams.get('next'), '/account');
		const outcome = await signInWith(event, 'nodemailer', { email: linkForm.data.email }, next);
		if (!outcome.ok) {
			if (outcome.code === 'Address') return message(linkForm, SIGN_IN_MESSAGES.address, { status: 400 });
			return message(linkForm, 'We could not send the link just now. Please try again in a minute.', { status: 503 });
		}
		redirect(303, `/signin/check-mail?email=${encodeURIComponent(linkForm.data.email)}`);
	}
};
