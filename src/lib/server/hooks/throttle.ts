import { json, type Handle } from '@sveltejs/kit';
import { withSignInContext, type SignInContext } from '../auth/context';
import { SIGN_IN_MESSAGES } from '../auth/messages';

/**
 * Gives the sign-in throttle the client address (adapter-node's getClientAddress: the socket's
 * address, or ADDRESS_HEADER/XFF_DEPTH when a proxy is declared in front). Auth.js's own credentials
 * endpoint answers a throttled try with a redirect to its error page; it gets a plain 429 instead, the
 * same as our form, with the wait in Retry-After.
 */
export const throttleCredentials: Handle = async ({ event, resolve }) => {
	let client: string | null = null;
	try {
		client = event.getClientAddress();
	} catch {
		// A proxy is declared but did not send the header: count the try per e-mail only.
	}
	const context: SignInContext = { client };
	const response = await withSignInContext(context, () => resolve(event));
	if (context.refused && response.status >= 300 && response.status < 400) {
		return json(
			{ message: SIGN_IN_MESSAGES[context.refused] },
			{ status: 429, headers: { 'retry-after': String(context.retryAfter ?? 60) } }
		);
	}
	return response;
};
