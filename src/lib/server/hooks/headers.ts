import type { Handle } from '@sveltejs/kit';
import { isPersonal } from '../access';
import { servedOverHttps } from '../origin';

// The content-security policy comes from kit.csp in svelte.config.js; these are the rest.
export const securityHeaders: Handle = async ({ event, resolve }) => {
	let response = await resolve(event);
	const extra: [string, string][] = [
		['X-Content-Type-Options', 'nosniff'],
		['Referrer-Policy', 'same-origin'],
		['Permissions-Policy', 'camera=(), microphone=(), geolocation=()']
	];
	// Orders, measurements and addresses must not sit in a shared cache or the back-forward store.
	if (isPersonal(event.route.id)) extra.push(['Cache-Control', 'private, no-store']);
	if (servedOverHttps()) extra.push(['Strict-Transport-Security', 'max-age=31536000']);
	// Responses made by Response.redirect() (Auth.js's redirects) have immutable headers: copy those first.
	try {
		for (const [k, v] of extra) response.headers.set(k, v);
	} catch {
		response = new Response(response.body, { status: response.status, statusText: response.statusText, headers: new Headers(response.headers) });
		for (const [k, v] of extra) response.headers.set(k, v);
	}
	return response;
};
