import { hash, verify } from '@node-rs/argon2';
import { and, count, eq, gt, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { signInAttempts, users } from '../db/schema';

// argon2id with the OWASP-recommended minimum (19 MiB, 2 passes, 1 lane); @node-rs/argon2
// defaults to the argon2id variant.
const ARGON2 = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const THROTTLE = { failures: 5, windowMinutes: 10 } as const;

export function hashPassword(password: string) {
	return hash(password, ARGON2);
}

export type PasswordCheck =
	| { ok: true; user: typeof users.$inferSelect }
	| { ok: false; reason: 'throttled' | 'wrong' | 'disabled' };

export function normaliseEmail(email: string) {
	return email.trim().toLowerCase();
}

export async function isThrottled(db: Db, email: string) {
	const [row] = await db
		.select({ n: count() })
		.from(signInAttempts)
		.where(
			and(
				eq(signInAttempts.email, normaliseEmail(email)),
				eq(signInAttempts.succeeded, false),
				gt(signInAttempts.createdAt, sql`DATE_SUB(CURRENT_TIMESTAMP(3), INTERVAL ${THROTTLE.windowMinutes} MINUTE)`)
			)
		);
	return row.n >= THROTTLE.failures;
}

/** Checks an e-mail and password, counting failures per e-mail so guessing is throttled. */
export async function checkPassword(db: Db, rawEmail: string, password: string): Promise<PasswordCheck> {
	const email = normaliseEmail(rawEmail);
	if (await isThrottled(db, email)) return { ok: false, reason: 'throttled' };
	const [user] = await db.select().from(users).where(eq(users.email, email)).limit(1);
	// Verify against a real hash even for unknown e-mails, so timing does not tell which exist.
	const ok = user?.passwordHash ? await verify(user.passwordHash, password).catch(() => false) : (await hashPassword(password), false);
	await db.insert(signInAttempts).values({ email, succeeded: ok });
	if (!ok || !user) return { ok: false, reason: 'wrong' };
	if (user.disabledAt) return { ok: false, reason: 'disabled' };
	return { ok: true, user };
}
