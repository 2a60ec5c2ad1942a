// Orders made for the output tests and removed after them: one with no skirt, one of a retired style,
// one whose stored figures no longer draft. Cancelled, so no queue or lay shows them meanwhile.
import { eq, inArray } from 'drizzle-orm';
import { orderLines, orders, styles } from '../../src/lib/server/db/schema';
import type { testDb } from '../support/db';

type Db = ReturnType<typeof testDb>;

export async function makeBadOrders(db: Db, tag: string) {
	const [base] = await db.select().from(orders).where(eq(orders.number, 'QL-1006'));
	const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, base.id));
	const [style] = await db.select().from(styles).where(eq(styles.id, line.styleId));
	const [{ id: retiredStyle }] = await db
		.insert(styles)
		.values({ ...style, id: undefined, slug: `retired-${tag}`, name: `Retired Test Skirt ${tag}`, retiredAt: new Date(), createdAt: undefined, updatedAt: undefined })
		.$returningId();
	const make = async (n: number) => {
		const [{ id }] = await db
			.insert(orders)
			.values({ ...base, id: undefined, number: `QL-9${tag}${n}`, status: 'cancelled', checkoutKey: null, createdAt: undefined, updatedAt: undefined, paidAt: null })
			.$returningId();
		return id;
	};
	const noDraft = await make(1);
	const retired = await make(2);
	const undraftable = await make(3);
	const lineOf = (orderId: number, over: Partial<typeof orderLines.$inferInsert>) => ({ ...line, id: undefined, createdAt: undefined, orderId, ...over });
	await db.insert(orderLines).values([lineOf(retired, { styleId: retiredStyle }), lineOf(undraftable, { measurements: { waist: 5, hip: 98, length: 60, waistToHip: 20 } })]);
	const ids = { noDraft, retired, undraftable };
	return {
		ids,
		numbers: { noDraft: `QL-9${tag}1`, retired: `QL-9${tag}2`, undraftable: `QL-9${tag}3` },
		async remove() {
			await db.delete(orders).where(inArray(orders.id, Object.values(ids)));
			await db.delete(styles).where(eq(styles.id, retiredStyle));
		}
	};
}
