import { hash, verify } from '@node-rs/argon2';
import { eq } from 'drizzle-orm';
import { normaliseEmail } from '$lib/email';
import type { Db } from '../db/client';
import { signInAttempts, users } from '../db/schema';
import { forgive, hit } from '../limits';

// argon2id with the OWASP-recommended minimum (19 MiB, 2 passes, 1 lane); @node-rs/argon2
// defaults to the argon2id variant.
const ARGON2 = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

// Five wrong passwords per e-mail, and twenty per client address (someone trying many e-mails), in ten
// minutes (common practice: a handful of tries per account, more per network for shared addresses).
export const THROTTLE = { failures: 5, windowMinutes: 10 } as const;
export const CLIENT_THROTTLE = { failures: 20, windowMinutes: 10 } as const;

export function hashPassword(password: string) {
	return hash(password, ARGON2);
}

export type PasswordCheck =
	| { ok: true; user: typeof users.$inferSelect }
	| { ok: false; reason: 'throttled' | 'client-throttled'; retryAfter: number }
	| { ok: false; reason: 'wrong' | 'disabled' };

const limit = (t: { failures: number; windowMinutes: number }) => ({
	limit: t.failures,
	windowSeconds: t.windowMinutes * 60
});

/**
 * Checks an e-mail and password. Each try takes a place in the per-e-mail and per-client counts
 * *before* the password is checked (one atomic upsert each, see limits.ts), so thirty tries at once
 * still get exactly five checks; a right password gives its places back.
 */
export async function checkPassword(
	db: Db,
	rawEmail: string,
	password: string,
	client: string | null
): Promise<PasswordCheck> {
	const email = normaliseEmail(rawEmail);
	const emailKey = `signin:email:${email ?? rawEmail.trim().toLowerCase()}`;
	const clientKey = client ? `signin:client:${client}` : null;
	const byEmail = await hit(db, emailKey, limit(THROTTLE));
	if (!byEmail.allowed) return { ok: false, reason: 'throttled', retryAfter: byEmail.retryAfter };
	if (clientKey) {
		const byClient = await hit(db, clientKey, limit(CLIENT_THROTTLE));
		if (!byClient.allowed) {
			// Refused for the client, not for this e-mail: that e-mail's place was not used.
			await forgive(db, emailKey);
			return { ok: false, reason: 'client-throttled', retryAfter: byClient.retryAfter };
		}
	}
	const [user] = email ? await db.select().from(users).where(eq(users.email, email)).limit(1) : [];
	// Verify against a real hash even for unknown e-mails, so timing does not tell which exist.
	const ok = user?.passwordHash
		? await verify(user.passwordHash, password).catch(() => false)
		: (await hashPassword(password), false);
	await db.insert(signInAttempts).values({ email: email ?? rawEmail.trim().slice(0, 255), succeeded: ok });
	if (!ok || !user) return { ok: false, reason: 'wrong' };
	await forgive(db, emailKey);
	if (clientKey) await forgive(db, clientKey);
	if (user.disabledAt) return { ok: false, reason: 'disabled' };
	return { ok: true, user };
}
