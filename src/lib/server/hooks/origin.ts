import type { Handle } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';

// Auth.js builds the links it mails and its redirects from the request's X-Forwarded-Host (or Host)
// and X-Forwarded-Proto headers, which any client can set. The shop's address is the ORIGIN setting
// (adapter-node builds event.url from it), so before Auth.js sees a request its host headers are made
// to say the same. A proxy in front changes nothing here: ORIGIN is the public address either way, and
// the client address comes from adapter-node's ADDRESS_HEADER setting, not from these headers.
// (Mail links are also rebuilt on ORIGIN where they are sent: auth/index.ts.)
export const canonicalHost: Handle = ({ event, resolve }) => {
	try {
		const headers = event.request.headers;
		headers.delete('x-forwarded-host');
		headers.delete('x-forwarded-proto');
		headers.delete('forwarded');
		if (env.ORIGIN) headers.set('host', new URL(env.ORIGIN).host);
	} catch {
		// Headers of a request made inside the app can be read-only; those carry no client's headers.
	}
	return resolve(event);
};
