import { z } from 'zod';
import { checkEmail } from '$lib/email';

// Every form that takes an address (sign-in, register, checkout, the order API, staff invites) uses
// this one field, so every address is stored in the one normalised form of $lib/email.
export const email = z
	.string()
	.max(320, 'Enter an e-mail address such as name@example.com.')
	.overwrite((v) => {
		const r = checkEmail(v);
		return r.ok ? r.email : v.trim();
	})
	.superRefine((v, ctx) => {
		const r = checkEmail(v);
		if (!r.ok) ctx.addIssue({ code: 'custom', message: r.message });
	});

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
