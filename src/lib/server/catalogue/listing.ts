import { asc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, styles } from '../db/schema';

export function listStyles(db: Db) {
	return db.select().from(styles).where(isNull(styles.retiredAt)).orderBy(asc(styles.sortOrder), asc(styles.name));
}

export async function styleBySlug(db: Db, slug: string) {
	const [row] = await db.select().from(styles).where(eq(styles.slug, slug)).limit(1);
	return row ?? null;
}

export function listFabrics(db: Db) {
	return db.select().from(fabrics).where(isNull(fabrics.retiredAt)).orderBy(asc(fabrics.name));
}

/** Every style's name and kind, retired ones too (reports and orders may name a retired style). */
export const styleKinds = (db: Db) => db.select({ name: styles.name, kind: styles.kind }).from(styles);
