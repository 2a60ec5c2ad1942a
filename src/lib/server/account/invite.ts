// Inviting a cutter: the account is made (or made a cutter) here, and the sign-in link goes out
// through the Auth.js e-mail provider, so the invitee signs in exactly like everyone else.
import type { RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { signInWith } from '$lib/server/auth/actions';
import { db } from '$lib/server/db';
import { users } from '$lib/server/db/schema';

export type InviteOutcome = { ok: true; message: string } | { ok: false; status: number; message: string };

/**
 * The sign-in request runs as if from a browser with no cookies, and whatever cookies Auth.js
 * would set are dropped: the owner who sends the invite keeps her own session untouched.
 */
function withoutCookies(event: RequestEvent): RequestEvent {
	const headers = new Headers(event.request.headers);
	headers.delete('cookie');
	const request = new Request(event.url, { method: 'POST', headers });
	const cookies: RequestEvent['cookies'] = {
		get: () => undefined,
		getAll: () => [],
		set: () => {},
		delete: () => {},
		serialize: (name, value, opts) => event.cookies.serialize(name, value, opts)
	};
	return { ...event, request, cookies };
}

export async function inviteCutter(event: RequestEvent, email: string, name: string): Promise<InviteOutcome> {
	const [existing] = await db.select().from(users).where(eq(users.email, email)).limit(1);
	let note = '';
	if (!existing) {
		await db.insert(users).values({ email, name: name || null, role: 'cutter' });
	} else if (existing.disabledAt) {
		return {
			ok: false,
			status: 409,
			message: `The account for ${email} is switched off. Open it below and switch it back on first.`
		};
	} else if (existing.role === 'owner') {
		return { ok: false, status: 409, message: `${email} is an owner already: there is nothing to invite.` };
	} else if (existing.role === 'shopper') {
		await db
			.update(users)
			.set({ role: 'cutter', ...(name && !existing.name ? { name } : {}) })
			.where(eq(users.id, existing.id));
		note = ' Their shopper account is a cutter account now; their orders and measure cards stay as they were.';
	} else {
		note = ' They had a cutter account already: this is a fresh link.';
	}
	const sent = await signInWith(withoutCookies(event), 'nodemailer', { email }, '/workroom');
	if (!sent.ok)
		return {
			ok: false,
			status: 503,
			message: `The account is ready, but the e-mail could not go out just now. Send the invitation again in a minute.`
		};
	return {
		ok: true,
		message: `Invitation on its way to ${email}. The link in it signs them in to the workroom once, within the hour.${note}`
	};
}
