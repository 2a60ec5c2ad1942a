import { env } from '$env/dynamic/private';

// The shop's public address is a setting (ORIGIN), never read from a request: a Host or
// X-Forwarded-Host header is the client's to choose, so links in mail, PDFs and payment pages that
// were built from one could point anywhere.
export function siteOrigin() {
	return (env.ORIGIN ?? 'http://127.0.0.1:3000').replace(/\/+$/, '');
}

/** True when the configured public address is https: the setting, not a header a client could send. */
export function servedOverHttps() {
	return siteOrigin().startsWith('https://');
}
