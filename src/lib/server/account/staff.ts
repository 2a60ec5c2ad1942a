// The people who sign in, as the back office manages them: the staff list, a search over every account,
// one account, its role, and switching it off or on.
import { asc, count, desc, eq, like, or, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { sessions, users, verificationTokens, type Role } from '../db/schema';
import { endSessions } from '../auth/sessions';

const account = {
	id: users.id,
	name: users.name,
	email: users.email,
	role: users.role,
	disabledAt: users.disabledAt,
	createdAt: users.createdAt
};

// LIKE treats % and _ as wildcards: a search for "a_b" means those three characters.
const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Everyone who is not a shopper, owners first. */
export function staffList(db: Db) {
	return db
		.select(account)
		.from(users)
		.where(sql`${users.role} <> 'shopper'`)
		.orderBy(desc(users.role), asc(users.name), asc(users.email));
}

/** Accounts whose address or name holds the text: at most `limit`. */
export function searchAccounts(db: Db, q: string, limit: number) {
	return (
		db
			.select(account)
			.from(users)
			// Addresses are stored lower-cased and compared byte for byte (binary collation).
			.where(or(like(users.email, `%${escapeLike(q.toLowerCase())}%`), like(users.name, `%${escapeLike(q)}%`)))
			.orderBy(asc(users.email))
			.limit(limit)
	);
}

/** How many cutters and owners there are. */
export function staffCounts(db: Db) {
	return db.select({ role: users.role, n: count() }).from(users).where(sql`${users.role} <> 'shopper'`).groupBy(users.role);
}

export async function accountById(db: Db, id: string) {
	const [row] = id.length <= 255 ? await db.select().from(users).where(eq(users.id, id)).limit(1) : [];
	return row ?? null;
}

export async function setRole(db: Db, id: string, role: Role) {
	await db.update(users).set({ role }).where(eq(users.id, id));
}

/**
 * Switches an account off. Their session is checked against the database on every request, so they are
 * out now; raising the session version keeps their old cookies out even once the account is switched
 * back on. Any sign-in link still in their inbox goes too.
 */
export async function switchOff(db: Db, u: { id: string; email: string | null }) {
	await db.update(users).set({ disabledAt: new Date() }).where(eq(users.id, u.id));
	await endSessions(db, u.id);
	await db.delete(sessions).where(eq(sessions.userId, u.id));
	if (u.email) await db.delete(verificationTokens).where(eq(verificationTokens.identifier, u.email));
}

export async function switchOn(db: Db, id: string) {
	await db.update(users).set({ disabledAt: null }).where(eq(users.id, id));
}
