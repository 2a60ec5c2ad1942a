import { env } from '$env/dynamic/private';

// The shop's own address comes from the ORIGIN setting. Request headers (Host, X-Forwarded-Host,
// Forwarded) are chosen by whoever sends the request, so nothing that leaves the shop (links in mail,
// redirects) is built from them. Outside local use the app does not start without ORIGIN
// (config-check.ts); in local use without it (vite dev), a loopback address of the request is kept.
const LOCAL_DEFAULT = 'http://127.0.0.1:3000';
const LOOPBACK = /^(localhost|127(\.\d{1,3}){3}|\[::1\])$/;

export function siteOrigin(requestOrigin?: string): string {
	if (env.ORIGIN) return new URL(env.ORIGIN).origin;
	if (requestOrigin && LOOPBACK.test(new URL(requestOrigin).hostname)) return new URL(requestOrigin).origin;
	return LOCAL_DEFAULT;
}

/** True when the configured public address is https: the setting, not a header a client could send. */
export function servedOverHttps() {
	return siteOrigin().startsWith('https://');
}

/** An absolute link on the shop, for mail: only the path and query of `pathOrUrl` are kept. */
export function siteUrl(pathOrUrl: string | URL): string {
	const u = new URL(pathOrUrl, siteOrigin());
	return new URL(u.pathname + u.search + u.hash, siteOrigin(u.origin)).toString();
}

/**
 * Where to send the browser after sign-in: a path on this shop, or `fallback`. The URL standard
 * decides, as the browser will (it drops tabs and newlines, reads "\" as "/", "//host" as another
 * site), so what we check is what the browser follows; the answer is the parsed, re-serialised path.
 */
export function safeNext(next: string | null | undefined, fallback = '/'): string {
	if (!next) return fallback;
	const origin = siteOrigin();
	let u: URL;
	try {
		u = new URL(next, origin);
	} catch {
		return fallback;
	}
	if (u.origin !== origin) return fallback;
	const path = u.pathname + u.search + u.hash;
	// "/.//evil.example" parses to the path "//evil.example", which a browser would read as a host.
	return path.startsWith('/') && !path.startsWith('//') ? path : fallback;
}

/** The sign-in page, asked to come back to where the visitor was (the page she asked for, with its query). */
export const signInReturningTo = (url: URL): string => `/signin?next=${encodeURIComponent(`${url.pathname}${url.search}`)}`;
