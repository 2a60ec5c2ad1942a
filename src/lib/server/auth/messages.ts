import { THROTTLE, CLIENT_THROTTLE } from './password';

// What a person reads when signing in did not work, by Auth.js error type or our own sign-in code.
export const SIGN_IN_MESSAGES = {
	credentials: 'That e-mail and password do not match an account. Check both, or e-mail yourself a sign-in link.',
	throttled: `Too many attempts for this e-mail. Wait ${THROTTLE.windowMinutes} minutes, or use "E-mail me a sign-in link".`,
	'client-throttled': `Too many sign-in attempts from your network. Wait ${CLIENT_THROTTLE.windowMinutes} minutes, or use "E-mail me a sign-in link".`,
	disabled: 'This account has been switched off. Ask the atelier if you think that is a mistake.',
	link: 'That sign-in link has expired or was used already. Ask for a new one below.',
	address: 'We cannot send a link to that address. Check it, or use another one.',
	other: 'Signing in did not work just now. Please try again, or e-mail yourself a sign-in link.'
} as const;

/** The message for Auth.js's `?error=…&code=…` on the sign-in page, or null when there is none. */
export function messageForError(error: string | null, code: string | null): string | null {
	if (!error) return null;
	if (error === 'Verification') return SIGN_IN_MESSAGES.link;
	if (error === 'CredentialsSignin') {
		if (code === 'throttled' || code === 'client-throttled' || code === 'disabled') return SIGN_IN_MESSAGES[code];
		return SIGN_IN_MESSAGES.credentials;
	}
	if (error === 'AccessDenied') return SIGN_IN_MESSAGES.disabled;
	if (error === 'EmailSignin' || error === 'Configuration') return SIGN_IN_MESSAGES.other;
	return SIGN_IN_MESSAGES.other;
}
