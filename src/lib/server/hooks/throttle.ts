import { json, type Handle } from '@sveltejs/kit';
import { db } from '../db';
import { isThrottled, THROTTLE } from '../auth/password';

export const THROTTLED_MESSAGE = `Too many attempts for this e-mail. Wait ${THROTTLE.windowMinutes} minutes, or use "E-mail me a sign-in link".`;

// Auth.js's own credentials endpoint can be posted to directly; it gets the same throttle as our form.
export const throttleCredentials: Handle = async ({ event, resolve }) => {
	if (event.request.method === 'POST' && event.url.pathname === '/auth/callback/credentials') {
		const form = await event.request.clone().formData().catch(() => null);
		const email = form?.get('email');
		if (typeof email === 'string' && (await isThrottled(db, email))) {
			return json({ message: THROTTLED_MESSAGE }, { status: 429 });
		}
	}
	return resolve(event);
};
