import { asc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderEvents, orderLines, orders, payments, styles } from '../db/schema';

/** An order as the workroom and the back office see it: every line, figure and event. */
export async function staffOrder(db: Db, id: number) {
	const [order] = await db.select().from(orders).where(eq(orders.id, id));
	if (!order) return null;
	const [lines, events, pays] = await Promise.all([
		db
			.select({ id: orderLines.id, style: styles.name, kind: styles.kind, fabric: fabrics.name, colour: fabrics.colour, widthCm: fabrics.widthCm, stockCm: fabrics.stockCm, nap: fabrics.nap, options: orderLines.options, measurements: orderLines.measurements, figures: orderLines.figures, fabricCm: orderLines.fabricCm, lineTotal: orderLines.lineTotal, pricing: orderLines.pricing })
			.from(orderLines)
			.innerJoin(styles, eq(styles.id, orderLines.styleId))
			.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
			.where(eq(orderLines.orderId, id))
			.orderBy(asc(orderLines.id)),
		db.select().from(orderEvents).where(eq(orderEvents.orderId, id)).orderBy(asc(orderEvents.createdAt), asc(orderEvents.id)),
		db.select().from(payments).where(eq(payments.orderId, id)).orderBy(asc(payments.id))
	]);
	return { order, lines, events, payments: pays };
}
