import { z } from 'zod';

export const email = z.string().trim().toLowerCase().max(255).email('Enter an e-mail address such as name@example.com.');

export const passwordSignInSchema = z.object({
	email,
	password: z.string().min(1, 'Enter your password.').max(200)
});

export const linkSignInSchema = z.object({ email });

export const registerSchema = z.object({
	name: z.string().trim().min(1, 'Tell us what to call you.').max(120),
	email,
	password: z.string().min(10, 'Use at least 10 characters.').max(200)
});

/** Only same-site paths are followed after sign-in, so a crafted link cannot send anyone elsewhere. */
export function safeNext(next: string | null | undefined, fallback = '/') {
	return next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\') ? next : fallback;
}
