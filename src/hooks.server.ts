import { sequence } from '@sveltejs/kit/hooks';
import type { HandleServerError } from '@sveltejs/kit';
import { building } from '$app/environment';
import { authHandle } from '$lib/server/auth';
import { guard } from '$lib/server/hooks/guard';
import { securityHeaders } from '$lib/server/hooks/headers';
import { throttleCredentials } from '$lib/server/hooks/throttle';
import { handleUnavailableError, unavailable } from '$lib/server/hooks/unavailable';
import { currentUser } from '$lib/server/hooks/user';
import { startOutboxWorker, stopOutboxWorker } from '$lib/server/mail';
import { pool } from '$lib/server/db';

if (!building) {
	startOutboxWorker();
	// adapter-node emits this once the HTTP server has closed: the open database connections would
	// otherwise keep the process alive after SIGTERM.
	process.once('sveltekit:shutdown', () => {
		stopOutboxWorker();
		void pool.end().catch(() => {});
	});
}

export const handle = sequence(unavailable, securityHeaders, throttleCredentials, authHandle, currentUser, guard);

export const handleError: HandleServerError = (input) => {
	const dbDown = handleUnavailableError(input);
	if (dbDown) return dbDown;
	if (input.status >= 500) console.error(input.error);
	return { message: input.status >= 500 ? 'Something went wrong on our side. Please try again in a moment.' : input.message };
};
