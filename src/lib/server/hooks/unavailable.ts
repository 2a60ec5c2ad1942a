import { isApi } from '../access';
import type { Handle, HandleServerError } from '@sveltejs/kit';

const unavailablePage = () =>
	`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>One moment · Atelier Ondine</title></head><body style="background:#F6F1E7;color:#1E2230;font-family:Georgia,serif;max-width:36rem;margin:4rem auto;padding:0 1rem"><h1>One moment, please</h1><p>${UNAVAILABLE_MESSAGE}</p></body></html>`;

// Errors that mean "the database is away for a moment" (restart, failover, network), not a bug.
const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'PROTOCOL_CONNECTION_LOST', 'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR', 'ER_LOCK_WAIT_TIMEOUT', 'ER_QUERY_INTERRUPTED', 'ER_CONNECTION_KILLED']);

export const UNAVAILABLE_MESSAGE = 'The shop’s database is not answering for a moment. Nothing was saved half-way: please try again in a few seconds.';

export function isDatabaseDown(error: unknown): boolean {
	for (let e = error as { code?: string; errno?: number; cause?: unknown } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
		if (e.code && DB_DOWN_CODES.has(e.code)) return true;
		// 2013: lost connection during query; 1927: connection killed; 4031: client idle disconnect.
		if (e.errno === 2013 || e.errno === 1927 || e.errno === 4031) return true;
	}
	return false;
}

const downRequests = new WeakSet<Request>();

/** Marks the request when the error behind a 500 was the database being away. */
export function noteUnavailable(event: { request: Request }, error: unknown) {
	if (isDatabaseDown(error)) downRequests.add(event.request);
}

// SvelteKit answers an unexpected error with 500; when the cause was the database being away, say
// 503 with Retry-After instead, so clients and load balancers know to try again.
export const unavailable: Handle = async ({ event, resolve }) => {
	let response: Response;
	try {
		response = await resolve(event);
	} catch (err) {
		// The user lookup in the hooks runs before any page: the database being away shows up here.
		if (isDatabaseDown(err)) {
			const api = isApi(event.route.id);
			return new Response(api ? JSON.stringify({ message: UNAVAILABLE_MESSAGE }) : unavailablePage(), {
				status: 503,
				headers: { 'content-type': api ? 'application/json' : 'text/html; charset=utf-8', 'retry-after': '5' }
			});
		}
		throw err;
	}
	if (response.status === 500 && downRequests.has(event.request)) {
		const headers = new Headers(response.headers);
		headers.set('retry-after', '5');
		return new Response(response.body, { status: 503, statusText: 'Service Unavailable', headers });
	}
	return response;
};

/** For handleError: the message to show when the database was the cause, otherwise null. */
export function handleUnavailableError({ error, event }: Parameters<HandleServerError>[0]): App.Error | null {
	noteUnavailable(event, error);
	return isDatabaseDown(error) ? { message: UNAVAILABLE_MESSAGE } : null;
}
