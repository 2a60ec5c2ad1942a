import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { measurementProfiles, orderLines, orders, users } from '../db/schema';
import { ERASED } from '../order/lines';

// Orders still in the workroom need the measurements to be cut and sewn; once an order is
// finished with (shipped, delivered, cancelled, refunded) its copy can go.
const DONE = ['shipped', 'delivered', 'cancelled', 'refunded'] as const;

/** Everything the shop keeps about a shopper, for her download. */
export async function exportPersonalData(db: Db, userId: string) {
	const [user] = await db.select({ name: users.name, email: users.email, createdAt: users.createdAt }).from(users).where(eq(users.id, userId));
	const cards = await db.select().from(measurementProfiles).where(eq(measurementProfiles.userId, userId));
	const myOrders = await db.select().from(orders).where(eq(orders.userId, userId));
	const lines = myOrders.length ? await db.select().from(orderLines).where(inArray(orderLines.orderId, myOrders.map((o) => o.id))) : [];
	return {
		exportedAt: new Date().toISOString(),
		account: user,
		measureCards: cards.map((c) => ({ name: c.name, waistCm: c.waist, hipCm: c.hip, lengthCm: c.length, waistToHipCm: c.waistToHip, waistToKneeCm: c.waistToKnee, fitAdjustmentsCm: c.adjustments, units: c.units, consentAt: c.consentAt, updatedAt: c.updatedAt })),
		orders: myOrders.map((o) => ({
			number: o.number,
			stage: o.status,
			placedAt: o.createdAt,
			total: o.total,
			currency: o.currency,
			shippingAddress: o.shippingAddress,
			skirts: lines.filter((l) => l.orderId === o.id).map((l) => ({ options: l.options, measurementsCm: l.measurements, fitAdjustmentsCm: l.adjustments, draftedFigures: l.figures }))
		}))
	};
}

/** Deletes her measure cards and the measurements of her finished orders; says what it kept and why. */
export async function deleteMeasurements(db: Db, userId: string) {
	return db.transaction(async (tx) => {
		const [{ affectedRows: cards }] = await tx.delete(measurementProfiles).where(eq(measurementProfiles.userId, userId));
		const mine = await tx.select({ id: orders.id, status: orders.status }).from(orders).where(eq(orders.userId, userId));
		const done = mine.filter((o) => (DONE as readonly string[]).includes(o.status)).map((o) => o.id);
		if (done.length) await tx.update(orderLines).set({ measurements: ERASED, figures: ERASED, adjustments: null }).where(and(inArray(orderLines.orderId, done)));
		return { cards, cleared: done.length, kept: mine.length - done.length };
	});
}
