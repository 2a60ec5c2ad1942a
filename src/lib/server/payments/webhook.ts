import { eq, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../db/client';
import { orderEvents, orders, payments, webhookEvents } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { paymentConfirmedMail, refundMail } from '../mail/templates';
import type { Tx } from '../orders/stage';
import { orderSummary } from '../orders/summary';
import { formatMoney } from '../../format';

const PROVIDER = { id: null, label: 'Payment provider' };

/**
 * Applies one verified provider event. Each event id is recorded once, in the same transaction as
 * its effect, so a redelivered event changes nothing; and each effect checks the state it starts
 * from, so events arriving out of order never undo one another. Returns outbox ids to send.
 */
export async function applyEvent(db: Db, event: Stripe.Event): Promise<{ duplicate: boolean; mailIds: number[] }> {
	return db.transaction(async (tx) => {
		const [res] = await tx.execute(sql`INSERT IGNORE INTO ${webhookEvents} (id, type) VALUES (${event.id}, ${event.type})`);
		if ((res as unknown as { affectedRows: number }).affectedRows === 0) return { duplicate: true, mailIds: [] };
		switch (event.type) {
			case 'checkout.session.completed':
				return { duplicate: false, mailIds: await sessionPaid(tx, event.data.object) };
			case 'checkout.session.expired':
				await tx.update(payments).set({ state: 'expired' }).where(sql`${payments.checkoutSessionId} = ${event.data.object.id} AND ${payments.state} = 'open'`);
				return { duplicate: false, mailIds: [] };
			case 'charge.refunded':
				return { duplicate: false, mailIds: await chargeRefunded(tx, event.data.object) };
			default:
				return { duplicate: false, mailIds: [] };
		}
	});
}

async function sessionPaid(tx: Tx, session: Stripe.Checkout.Session) {
	if (session.payment_status !== 'paid') return [];
	const [payment] = await tx.select().from(payments).where(eq(payments.checkoutSessionId, session.id)).for('update');
	if (!payment || payment.state === 'paid' || payment.state === 'refunded' || payment.state === 'partially_refunded') return [];
	const intent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
	await tx.update(payments).set({ state: 'paid', paymentIntentId: intent }).where(eq(payments.id, payment.id));
	const [order] = await tx.select().from(orders).where(eq(orders.id, payment.orderId)).for('update');
	if (!order || order.status !== 'awaiting_payment') return [];
	await tx.update(orders).set({ status: 'paid', paidAt: new Date() }).where(eq(orders.id, order.id));
	await tx.insert(orderEvents).values({ orderId: order.id, actorLabel: PROVIDER.label, kind: 'stage', fromStatus: 'awaiting_payment', toStatus: 'paid', note: `Paid ${formatMoney(payment.amount, payment.currency)}` });
	const summary = await orderSummary(tx, { ...order, status: 'paid' });
	return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...paymentConfirmedMail(summary) })];
}

async function chargeRefunded(tx: Tx, charge: Stripe.Charge) {
	const intent = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
	if (!intent) return [];
	const [payment] = await tx.select().from(payments).where(eq(payments.paymentIntentId, intent)).for('update');
	// Refund events can arrive out of order: only a larger refunded amount than we know counts.
	if (!payment || charge.amount_refunded <= payment.refundedAmount) return [];
	const full = charge.amount_refunded >= payment.amount;
	await tx.update(payments).set({ refundedAmount: charge.amount_refunded, state: full ? 'refunded' : 'partially_refunded' }).where(eq(payments.id, payment.id));
	const [order] = await tx.select().from(orders).where(eq(orders.id, payment.orderId)).for('update');
	if (!order) return [];
	const newly = charge.amount_refunded - payment.refundedAmount;
	await tx.update(orders).set({ refundedTotal: charge.amount_refunded, ...(full ? { status: 'refunded' as const } : {}) }).where(eq(orders.id, order.id));
	await tx.insert(orderEvents).values({
		orderId: order.id,
		actorLabel: PROVIDER.label,
		kind: full ? 'stage' : 'refund',
		fromStatus: full ? order.status : null,
		toStatus: full ? 'refunded' : null,
		note: `Refunded ${formatMoney(newly, payment.currency)}${full ? ' (in full)' : ''}`
	});
	const summary = await orderSummary(tx, order);
	return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...refundMail({ ...summary, refunded: formatMoney(newly, payment.currency) }) })];
}
