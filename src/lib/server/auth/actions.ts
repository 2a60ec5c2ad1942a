import { isRedirect, type RequestEvent } from '@sveltejs/kit';
import { AuthError, CredentialsSignin } from '@auth/sveltekit';
import { signIn } from './index';

export type SignInOutcome = { ok: true; location: string } | { ok: false; code: string };

/**
 * Runs an Auth.js sign-in from inside our own form action, so the form can answer with a clear
 * message (and 429 when throttled) instead of Auth.js's generic error page.
 */
export async function signInWith(event: RequestEvent, providerId: 'credentials' | 'nodemailer', fields: Record<string, string>, redirectTo: string): Promise<SignInOutcome> {
	const body = new FormData();
	body.set('providerId', providerId);
	body.set('redirectTo', redirectTo);
	for (const [k, v] of Object.entries(fields)) body.set(k, v);
	const headers = new Headers(event.request.headers);
	headers.delete('content-type');
	headers.delete('content-length');
	const request = new Request(event.url, { method: 'POST', headers, body });
	try {
		await signIn({ ...event, request });
	} catch (e) {
		if (isRedirect(e)) {
			const url = new URL(e.location, event.url);
			const error = url.searchParams.get('error');
			if (error) return { ok: false, code: url.searchParams.get('code') ?? error };
			return { ok: true, location: e.location };
		}
		// Called in-process, Auth.js throws its sign-in errors instead of redirecting to its error page.
		if (e instanceof CredentialsSignin) return { ok: false, code: e.code };
		if (e instanceof AuthError) return { ok: false, code: e.type };
		throw e;
	}
	return { ok: false, code: 'unknown' };
}
