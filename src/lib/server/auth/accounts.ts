// Shopper accounts as the register and sign-in pages need them. Addresses arrive normalised
// (src/lib/email.ts) and are compared byte for byte in the database (binary collation).
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { hashPassword } from './password';

export async function accountExists(db: Db, email: string) {
	const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
	return Boolean(row);
}

/** Every account made by registering is a shopper; staff accounts are made by the owner. */
export async function createShopper(db: Db, input: { name: string; email: string; password: string }) {
	await db.insert(users).values({ name: input.name, email: input.email, passwordHash: await hashPassword(input.password), role: 'shopper' });
}

export async function roleOf(db: Db, email: string) {
	const [row] = await db.select({ role: users.role }).from(users).where(eq(users.email, email)).limit(1);
	return row?.role ?? null;
}
