import { AsyncLocalStorage } from 'node:async_hooks';

// Auth.js calls `authorize` with a Request of its own making, which no longer knows who sent it. The
// throttle handle puts the client address here for the whole request (our form action and Auth.js's
// own endpoint alike), and `authorize` reports back when it refused a try and for how long.
export type SignInContext = { client: string | null; refused?: 'throttled' | 'client-throttled'; retryAfter?: number };

const store = new AsyncLocalStorage<SignInContext>();

export function withSignInContext<T>(context: SignInContext, fn: () => T): T {
	return store.run(context, fn);
}

export function signInContext(): SignInContext | undefined {
	return store.getStore();
}
