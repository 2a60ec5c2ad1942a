// One catalogue entry (a style or a fabric) as the back office edits it: found by id, retired from the
// shop or brought back. Retiring never touches orders already placed: they keep their style and cloth.
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, styles } from '../db/schema';
import { failure, type Failure } from '$lib/failure';

export async function styleById(db: Db, id: number | null) {
	const [row] = id ? await db.select().from(styles).where(eq(styles.id, id)).limit(1) : [];
	return row ?? null;
}

export async function fabricById(db: Db, id: number | null) {
	const [row] = id ? await db.select().from(fabrics).where(eq(fabrics.id, id)).limit(1) : [];
	return row ?? null;
}

type Entry = { kind: 'style'; row: typeof styles.$inferSelect } | { kind: 'fabric'; row: typeof fabrics.$inferSelect };

/** Takes an entry out of the shop (retire) or puts it back; a second click says it is done already. */
export async function setRetired(db: Db, entry: Entry, retire: boolean): Promise<Failure | { ok: true; notice: string }> {
	const { kind, row } = entry;
	const name = kind === 'fabric' ? `${row.name}, ${entry.row.colour}` : row.name;
	if (retire === Boolean(row.retiredAt)) return failure(409, retire ? `This ${kind} is retired already.` : `This ${kind} is in the shop already.`);
	const retiredAt = retire ? new Date() : null;
	if (kind === 'style') await db.update(styles).set({ retiredAt }).where(eq(styles.id, row.id));
	else await db.update(fabrics).set({ retiredAt }).where(eq(fabrics.id, row.id));
	if (!retire) return { ok: true, notice: `Back in the shop: ${name}.` };
	return {
		ok: true,
		notice: kind === 'fabric' ? `Retired. Shoppers no longer see ${name}; orders already placed keep it.` : `Retired. ${name} is no longer in the shop; orders already placed keep it.`
	};
}
