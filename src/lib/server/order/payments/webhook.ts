import { and, eq, ne, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '$lib/server/db/client';
import { orderEvents, orders, payments, webhookEvents } from '$lib/server/db/schema';
import { enqueueMail } from '$lib/server/mail/outbox';
import { paymentConfirmedMail, refundMail } from '$lib/server/mail/templates';
import { moveLocked, type Tx } from '../stage';
import { orderSummary } from '../summary';
import { formatMoney } from '$lib/format';
import { remakePromise } from '$lib/fit/promise';
import { shopSettingsOf } from '$lib/server/house/rules';
import { STAGE_LABELS } from '$lib/orders/stages';

const PROVIDER = { id: null, label: 'Payment provider' };
type OrderRow = typeof orders.$inferSelect;
type PaymentRow = typeof payments.$inferSelect;

/**
 * Applies one verified provider event. Each event id is recorded once, in the same transaction as
 * its effect, so a redelivered event changes nothing; and each effect checks the state it starts
 * from, so events arriving out of order never undo one another. Returns outbox ids to send. Throws
 * when the provider cannot be reached for an automatic refund: nothing is recorded then, and the
 * provider delivers the event again later.
 */
export async function applyEvent(db: Db, stripe: Stripe, event: Stripe.Event): Promise<{ duplicate: boolean; mailIds: number[] }> {
	return db.transaction(async (tx) => {
		const [res] = await tx.execute(sql`INSERT IGNORE INTO ${webhookEvents} (id, type) VALUES (${event.id}, ${event.type})`);
		if ((res as unknown as { affectedRows: number }).affectedRows === 0) return { duplicate: true, mailIds: [] };
		switch (event.type) {
			case 'checkout.session.completed':
				return { duplicate: false, mailIds: await sessionPaid(tx, stripe, event.data.object) };
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

/** Money as the owner reads it, with the code beside it (a wrong currency is what she must spot). */
function money(amount: number | null, currency: string | null) {
	const code = (currency ?? '').toUpperCase();
	try {
		return `${formatMoney(amount ?? 0, code)} (${code})`;
	} catch {
		// Not a currency Intl knows: show the raw figures rather than fail the event.
		return `${amount ?? 0} minor units of "${code}"`;
	}
}

/** A payment problem on the order's timeline (the owner's order page shows these as warnings), and in the log. */
async function paymentNote(tx: Tx, order: Pick<OrderRow, 'id' | 'number'>, note: string) {
	console.warn(`[payments] order ${order.number}: ${note}`);
	await tx.insert(orderEvents).values({ orderId: order.id, actorLabel: PROVIDER.label, kind: 'payment', note });
}

async function sessionPaid(tx: Tx, stripe: Stripe, session: Stripe.Checkout.Session) {
	if (session.payment_status !== 'paid') return [];
	const paid = money(session.amount_total, session.currency);
	const [known] = await tx.select().from(payments).where(eq(payments.checkoutSessionId, session.id));
	if (!known) {
		const order = await orderNamedBy(tx, session);
		if (order) await paymentNote(tx, order, `Payment check failed: the provider reported ${paid} paid through session ${session.id}, which is not a payment page on record for this order. Nothing was changed; check this payment at the payment provider before acting on it.`);
		else console.warn(`[payments] session ${session.id} reported ${paid} paid and matches no order; nothing was changed.`);
		return [];
	}
	// The order row first, then the payment: the order every path takes its locks in (checkout, cancel, refunds).
	const [order] = await tx.select().from(orders).where(eq(orders.id, known.orderId)).for('update');
	const [payment] = await tx.select().from(payments).where(eq(payments.id, known.id)).for('update');
	if (!order || payment.state === 'paid' || payment.state === 'refunded' || payment.state === 'partially_refunded') return [];
	const currency = (session.currency ?? '').toUpperCase();
	if (session.amount_total !== payment.amount || session.amount_total !== order.total || currency !== payment.currency.toUpperCase() || currency !== order.currency.toUpperCase()) {
		await paymentNote(tx, order, `Payment check failed: the provider reported ${paid} paid through session ${session.id}, but this order expected ${money(order.total, order.currency)}. Nothing was changed; check this payment at the payment provider before acting on it.`);
		return [];
	}
	if (order.status !== 'awaiting_payment') return refundLatePayment(tx, stripe, order, payment, session);
	const intent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
	await tx.update(payments).set({ state: 'paid', paymentIntentId: intent }).where(eq(payments.id, payment.id));
	await moveLocked(tx, order, { to: 'paid', by: 'provider', actor: PROVIDER, set: { paidAt: new Date() }, note: `Paid ${formatMoney(payment.amount, payment.currency)}` });
	const summary = await orderSummary(tx, { ...order, status: 'paid' });
	const promise = remakePromise(await shopSettingsOf(tx));
	return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...paymentConfirmedMail({ ...summary, promise }) })];
}

/** The order a session names in its metadata or reference, for a warning about a session we never made. */
async function orderNamedBy(tx: Tx, session: Stripe.Checkout.Session) {
	const id = Number(session.metadata?.order_id);
	if (Number.isSafeInteger(id) && id > 0) {
		const [o] = await tx.select({ id: orders.id, number: orders.number }).from(orders).where(eq(orders.id, id));
		if (o) return o;
	}
	if (!session.client_reference_id) return null;
	const [o] = await tx.select({ id: orders.id, number: orders.number }).from(orders).where(eq(orders.number, session.client_reference_id));
	return o ?? null;
}

/**
 * A payment that came in for an order already paid, cancelled or refunded (a second payment page paid,
 * or one paid as the order was cancelled) goes back to the shopper at once. What to refund is asked of
 * the provider, not taken from the event, so a refund only ever reverses the payment that really came
 * in through this order's own session. Runs inside the event's transaction: if the provider cannot be
 * reached, nothing is recorded and the event comes again; the idempotency key keeps that to one refund.
 */
async function refundLatePayment(tx: Tx, stripe: Stripe, order: OrderRow, payment: PaymentRow, session: Stripe.Checkout.Session) {
	const real = await stripe.checkout.sessions.retrieve(session.id);
	const intent = typeof real.payment_intent === 'string' ? real.payment_intent : real.payment_intent?.id;
	const [elsewhere] = intent ? await tx.select({ id: payments.id }).from(payments).where(and(eq(payments.paymentIntentId, intent), ne(payments.id, payment.id))) : [];
	if (real.status !== 'complete' || real.payment_status !== 'paid' || !intent || elsewhere || real.amount_total !== payment.amount) {
		await paymentNote(tx, order, `Payment check failed: an event reported session ${session.id} paid, but the payment provider does not show a payment of ${money(payment.amount, payment.currency)} through it. Nothing was changed.`);
		return [];
	}
	const refund = await stripe.refunds.create({ payment_intent: intent, reason: 'duplicate', metadata: { order_id: String(order.id), checkout_session: session.id } }, { idempotencyKey: `ql-late-payment-${session.id}` });
	// Recorded as refunded now, so the provider's charge.refunded event for it finds nothing left to do
	// and never touches the order, whose own payment stands.
	await tx.update(payments).set({ state: 'refunded', paymentIntentId: intent, refundedAmount: refund.amount }).where(eq(payments.id, payment.id));
	const was = order.status === 'cancelled' ? 'was cancelled' : order.status === 'paid' ? 'was already paid' : `was already paid (now ${STAGE_LABELS[order.status]})`;
	const refunded = formatMoney(refund.amount, payment.currency);
	await paymentNote(tx, order, `A payment of ${refunded} arrived through session ${session.id} after the order ${was}; it was refunded automatically.`);
	const summary = await orderSummary(tx, order);
	return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...refundMail({ ...summary, refunded }) })];
}

async function chargeRefunded(tx: Tx, charge: Stripe.Charge) {
	const intent = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
	if (!intent) return [];
	const [known] = await tx.select().from(payments).where(eq(payments.paymentIntentId, intent));
	if (!known) return [];
	const [order] = await tx.select().from(orders).where(eq(orders.id, known.orderId)).for('update');
	const [payment] = await tx.select().from(payments).where(eq(payments.id, known.id)).for('update');
	// Refund events can arrive out of order: only a larger refunded amount than we know counts.
	if (!order || charge.amount_refunded <= payment.refundedAmount) return [];
	const full = charge.amount_refunded >= payment.amount;
	await tx.update(payments).set({ refundedAmount: charge.amount_refunded, state: full ? 'refunded' : 'partially_refunded' }).where(eq(payments.id, payment.id));
	const newly = charge.amount_refunded - payment.refundedAmount;
	const note = `Refunded ${formatMoney(newly, payment.currency)}${full ? ' (in full)' : ''}`;
	if (full && order.status !== 'refunded') {
		await moveLocked(tx, order, { to: 'refunded', by: 'provider', actor: PROVIDER, set: { refundedTotal: charge.amount_refunded }, note });
	} else {
		await tx.update(orders).set({ refundedTotal: charge.amount_refunded }).where(eq(orders.id, order.id));
		await tx.insert(orderEvents).values({ orderId: order.id, actorLabel: PROVIDER.label, kind: 'refund', note });
	}
	const summary = await orderSummary(tx, order);
	return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...refundMail({ ...summary, refunded: formatMoney(newly, payment.currency) }) })];
}
