// Requests first. The cutter's lays are searched in the background in the same event loop that answers
// requests (seconds of CPU each, in slices), so between slices the search waits while any request is
// being answered; it still takes a slice at least once a second, so a busy shop's lays get done too.
// Without this, every database round trip of a request waited behind a slice: under 50 shoppers
// checking out at once (npm run bench) requests took seconds and timed out while paid orders queued.
import type { Handle } from '@sveltejs/kit';

let inFlight = 0;

export const countRequests: Handle = async ({ event, resolve }) => {
	inFlight++;
	try {
		return await resolve(event);
	} finally {
		inFlight--;
	}
};

export const requestsInFlight = () => inFlight;

/** For background work between its slices: lets I/O in, then waits while requests are answered (at most `maxWaitMs`). */
export async function yieldToRequests(maxWaitMs = 1000) {
	await new Promise<void>((resolve) => setImmediate(resolve));
	const until = Date.now() + maxWaitMs;
	while (inFlight > 0 && Date.now() < until) await new Promise<void>((resolve) => setTimeout(resolve, 10));
}
