import type { Handle } from '@sveltejs/kit';

// The content-security policy comes from kit.csp in svelte.config.js; these are the rest.
export const securityHeaders: Handle = async ({ event, resolve }) => {
	let response = await resolve(event);
	try {
		addHeaders(response.headers, event.url);
	} catch {
		// Response.redirect() (Auth.js's error redirects) has immutable headers: copy it, then add them.
		response = new Response(response.body, {
			status: response.status,
			statusText: response.statusText,
			headers: new Headers(response.headers)
		});
		addHeaders(response.headers, event.url);
	}
	return response;
};

function addHeaders(headers: Headers, url: URL) {
	headers.set('X-Content-Type-Options', 'nosniff');
	headers.set('Referrer-Policy', 'same-origin');
	headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
	if (url.protocol === 'https:') headers.set('Strict-Transport-Security', 'max-age=31536000');
}
