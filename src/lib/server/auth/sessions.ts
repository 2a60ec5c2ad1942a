import { eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { users } from '../db/schema';

/**
 * Ends every session of this person at once, on every app server: the version in their session
 * cookies no longer matches (hooks/user.ts). For sign-out, switching an account off, a new password.
 */
export async function endSessions(db: Pick<Db, 'update'>, userId: string) {
	await db
		.update(users)
		.set({ sessionVersion: sql`${users.sessionVersion} + 1` })
		.where(eq(users.id, userId));
}
