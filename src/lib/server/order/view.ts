import { asc, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderEvents, orderLines, orders, styles } from '../db/schema';
import { checkOrderToken } from './link';

export type Viewer = App.Locals['user'];

/**
 * An order as its shopper sees it, or null when this viewer may not see it: the signed-in owner of
 * the order, anyone holding the signed link from the e-mail, or the owner. A wrong id or token looks
 * exactly like a missing order, so order numbers cannot be probed.
 */
export async function orderForShopper(db: Db, number: string, viewer: Viewer, token: string | null) {
	const [order] = await db.select().from(orders).where(eq(orders.number, number)).limit(1);
	if (!order) return null;
	const mine = viewer && order.userId === viewer.id;
	// The owner answers questions about any order; the workroom sees orders through its own pages, with a
	// first name and no contact details.
	const staff = viewer?.role === 'owner';
	if (!mine && !staff && !checkOrderToken(order.number, token)) return null;
	const [lines, events] = await Promise.all([
		db
			.select({
				id: orderLines.id,
				style: styles.name,
				styleKind: styles.kind,
				fabric: fabrics.name,
				colour: fabrics.colour,
				fabricCm: orderLines.fabricCm,
				options: orderLines.options,
				lineTotal: orderLines.lineTotal,
				pricing: orderLines.pricing,
				figuresSource: orderLines.figuresSource
			})
			.from(orderLines)
			.innerJoin(styles, eq(styles.id, orderLines.styleId))
			.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
			.where(eq(orderLines.orderId, order.id))
			.orderBy(asc(orderLines.id)),
		db
			.select({ at: orderEvents.createdAt, from: orderEvents.fromStatus, to: orderEvents.toStatus, kind: orderEvents.kind, note: orderEvents.note })
			.from(orderEvents)
			.where(eq(orderEvents.orderId, order.id))
			.orderBy(asc(orderEvents.createdAt), asc(orderEvents.id))
	]);
	return {
		number: order.number,
		status: order.status,
		shopperName: order.shopperName,
		currency: order.currency,
		subtotal: order.subtotal,
		shipping: order.shipping,
		total: order.total,
		refundedTotal: order.refundedTotal,
		promisedDate: order.promisedDate,
		createdAt: order.createdAt.toISOString(),
		carrier: order.carrier,
		trackingNumber: order.trackingNumber,
		shippingAddress: order.shippingAddress,
		lines,
		// Shoppers see stage moves and refunds, not the workroom's internal notes.
		timeline: events
			.filter((e) => e.kind === 'stage' || e.kind === 'refund')
			.map((e) => ({ at: e.at.toISOString(), to: e.to, kind: e.kind, note: e.kind === 'refund' ? e.note : null }))
	};
}

export type ShopperOrder = NonNullable<Awaited<ReturnType<typeof orderForShopper>>>;

/** Her own orders, newest first (at most `limit`), as her account lists them. */
export function ordersOfShopper(db: Db, userId: string, limit?: number) {
	const q = db
		.select({ number: orders.number, status: orders.status, total: orders.total, currency: orders.currency, createdAt: orders.createdAt, promisedDate: orders.promisedDate })
		.from(orders)
		.where(eq(orders.userId, userId))
		.orderBy(desc(orders.createdAt));
	return limit ? q.limit(limit) : q;
}

/** An order's id by its number, once a view has said the viewer may see it. */
export async function orderIdOf(db: Db, number: string): Promise<number> {
	const [row] = await db.select({ id: orders.id }).from(orders).where(eq(orders.number, number));
	return row.id;
}
