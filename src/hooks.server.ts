import { sequence } from '@sveltejs/kit/hooks';
import type { HandleServerError, ServerInit } from '@sveltejs/kit';
import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import { authHandle } from '$lib/server/auth';
import { configMessage, configProblems } from '$lib/server/config-check';
import { canonicalHost } from '$lib/server/hooks/origin';
import { guard } from '$lib/server/hooks/guard';
import { securityHeaders } from '$lib/server/hooks/headers';
import { throttleCredentials } from '$lib/server/hooks/throttle';
import { handleUnavailableError, unavailable } from '$lib/server/hooks/unavailable';
import { currentUser } from '$lib/server/hooks/user';
import { countRequests } from '$lib/server/hooks/busy';
import { startOutboxWorker, stopOutboxWorker } from '$lib/server/mail';
import { startJobWorker, stopJobWorker } from '$lib/server/outputs/worker';
import { pool } from '$lib/server/db';
import { startCutterLayWorker, stopCutterLayWorker } from '$lib/server/order/cutter-lays';

if (!building) {
	startOutboxWorker();
	startJobWorker();
	// The cutter's lays of paid orders, a few seconds of search each, stored with the order.
	startCutterLayWorker(Number(env.CUTTER_LAY_INTERVAL_MS ?? 5_000), Number(env.CUTTER_LAY_SECONDS ?? 3));
	// adapter-node emits this once the HTTP server has closed: the open database connections would
	// otherwise keep the process alive after SIGTERM.
	process.once('sveltekit:shutdown', () => {
		stopOutboxWorker();
		stopJobWorker();
		stopCutterLayWorker();
		void pool.end().catch(() => {});
	});
}

// Outside local use, published example secrets stop the app before it serves anything.
export const init: ServerInit = () => {
	if (building) return;
	const problems = configProblems(env);
	if (problems.length === 0) return;
	console.error(configMessage(env, problems));
	process.exit(1);
};

export const handle = sequence(countRequests, unavailable, securityHeaders, canonicalHost, throttleCredentials, authHandle, currentUser, guard);

export const handleError: HandleServerError = (input) => {
	const dbDown = handleUnavailableError(input);
	if (dbDown) return dbDown;
	if (input.status >= 500) console.error(input.error);
	return { message: input.status >= 500 ? 'Something went wrong on our side. Please try again in a moment.' : input.message };
};
