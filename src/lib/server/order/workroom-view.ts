import { firstName } from '$lib/orders/names';
import { asc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderEvents, orderLines, orders, payments, styles } from '../db/schema';

// Each audience's view of one order carries only what its page shows: the workroom cuts and sews from
// a first name, the figures and the cloth, and never needs the shopper's contact details or payments.

function linesOf(db: Db, id: number) {
	return db
		.select({ id: orderLines.id, style: styles.name, fabric: fabrics.name, colour: fabrics.colour, widthCm: fabrics.widthCm, stockCm: fabrics.stockCm, nap: fabrics.nap, measurements: orderLines.measurements, adjustments: orderLines.adjustments, figures: orderLines.figures, fabricCm: orderLines.fabricCm, lineTotal: orderLines.lineTotal })
		.from(orderLines)
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orderLines.orderId, id))
		.orderBy(asc(orderLines.id));
}

function eventsOf(db: Db, id: number) {
	return db
		.select({ id: orderEvents.id, createdAt: orderEvents.createdAt, actorLabel: orderEvents.actorLabel, kind: orderEvents.kind, toStatus: orderEvents.toStatus, note: orderEvents.note })
		.from(orderEvents)
		.where(eq(orderEvents.orderId, id))
		.orderBy(asc(orderEvents.createdAt), asc(orderEvents.id));
}

/** The order as the workroom's order page shows it. */
export async function orderForWorkroom(db: Db, id: number) {
	const [order] = await db
		.select({ id: orders.id, number: orders.number, status: orders.status, shopperName: orders.shopperName, promisedDate: orders.promisedDate, carrier: orders.carrier, trackingNumber: orders.trackingNumber })
		.from(orders)
		.where(eq(orders.id, id));
	if (!order) return null;
	const [lines, events] = await Promise.all([linesOf(db, id), eventsOf(db, id)]);
	const { shopperName, ...rest } = order;
	const first = firstName(shopperName);
	return {
		order: { ...rest, firstName: first },
		lines: lines.map(({ lineTotal: _price, ...l }) => l),
		// The shopper's own steps (placing the order) name her as the workroom knows her.
		events: events.map((e) => (e.actorLabel === shopperName ? { ...e, actorLabel: first } : e))
	};
}

/** The order as the owner's order page shows it: contact, money and payments too. */
export async function orderForOwner(db: Db, id: number) {
	const [order] = await db
		.select({ id: orders.id, number: orders.number, status: orders.status, shopperName: orders.shopperName, email: orders.email, currency: orders.currency, total: orders.total, refundedTotal: orders.refundedTotal, promisedDate: orders.promisedDate, carrier: orders.carrier, trackingNumber: orders.trackingNumber, createdAt: orders.createdAt })
		.from(orders)
		.where(eq(orders.id, id));
	if (!order) return null;
	const [lines, events, pays] = await Promise.all([
		linesOf(db, id),
		eventsOf(db, id),
		db
			.select({ id: payments.id, checkoutSessionId: payments.checkoutSessionId, amount: payments.amount, refundedAmount: payments.refundedAmount, currency: payments.currency, state: payments.state })
			.from(payments)
			.where(eq(payments.orderId, id))
			.orderBy(asc(payments.id))
	]);
	return { order, lines, events, payments: pays };
}
