import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { fabrics, orderLines, orders, payments } from '$lib/server/db/schema';
import { orderToken } from '../link';
import type { Tx } from '../stage';
import { failure, type Failure } from '$lib/failure';

type OrderRow = typeof orders.$inferSelect;

export type Opened = { ok: true; url: string } | Failure;

export const PAYMENT_ARRIVED = 'Your payment has reached the payment service and is being confirmed: this page shows it as paid in a moment. Nothing more is needed.';

// A session with less time than this left is not handed out again: she might not finish paying before
// it lapses. The provider's sessions last 24 hours unless told otherwise.
const REUSE_MIN_SECONDS = 30 * 60;

/**
 * Expires a session at the provider. A session that is no longer open cannot be expired: the provider
 * then says what it is, and a completed one is reported as such (its payment is on its way to the webhook).
 */
async function expireAtProvider(stripe: Stripe, id: string): Promise<'expired' | 'complete'> {
	try {
		await stripe.checkout.sessions.expire(id);
		return 'expired';
	} catch (err) {
		if (!(err instanceof Stripe.errors.StripeInvalidRequestError)) throw err;
		const s = await stripe.checkout.sessions.retrieve(id);
		if (s.status === 'open') throw err;
		return s.status === 'complete' ? 'complete' : 'expired';
	}
}

/**
 * The order's payment page: its open session when the provider says it is still open and has time
 * left, otherwise a new one after every older one is expired at the provider. The caller holds the
 * order row lock (SELECT … FOR UPDATE) in `tx`, so retries wait for each other and an order never has
 * two payable sessions. Provider failures throw (Stripe errors); the caller says so to the shopper.
 */
export async function openSession(tx: Tx, stripe: Stripe, order: OrderRow, origin: string): Promise<Opened> {
	// No lock of its own: every path that writes an order's payments holds the order's row lock first,
	// and a locking read here would take gap locks that make concurrent checkouts deadlock.
	const mine = await tx.select().from(payments).where(eq(payments.orderId, order.id));
	for (const p of mine.filter((row) => row.state === 'open')) {
		const s = await stripe.checkout.sessions.retrieve(p.checkoutSessionId);
		if (s.status === 'complete') return failure(409, PAYMENT_ARRIVED, { reason: 'arrived' });
		const timeLeft = s.expires_at - Math.floor(Date.now() / 1000);
		if (s.status === 'open' && s.url && timeLeft > REUSE_MIN_SECONDS && s.amount_total === order.total) return { ok: true, url: s.url };
		if (s.status === 'open' && (await expireAtProvider(stripe, s.id)) === 'complete') return failure(409, PAYMENT_ARRIVED, { reason: 'arrived' });
		await tx.update(payments).set({ state: 'expired' }).where(eq(payments.id, p.id));
	}
	const lines = await tx
		.select({ total: orderLines.lineTotal, fabric: fabrics.name })
		.from(orderLines)
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orderLines.orderId, order.id));
	const back = `${origin}/orders/${encodeURIComponent(order.number)}?t=${orderToken(order.number)}`;
	const currency = order.currency.toLowerCase();
	// One key per attempt: if this transaction fails after the provider made the session, the retry
	// sends the same key and gets that same session back instead of a second one.
	const idempotencyKey = `ql-pay-${order.id}-${order.createdAt.getTime()}-${mine.length + 1}`;
	const session = await stripe.checkout.sessions.create(
		{
			mode: 'payment',
			client_reference_id: order.number,
			customer_email: order.email,
			metadata: { order_id: String(order.id), order_number: order.number },
			success_url: `${back}&paid=1`,
			cancel_url: back,
			line_items: [
				...lines.map((l) => ({ quantity: 1, price_data: { currency, unit_amount: l.total, product_data: { name: `Made-to-measure skirt in ${l.fabric}` } } })),
				...(order.shipping > 0 ? [{ quantity: 1, price_data: { currency, unit_amount: order.shipping, product_data: { name: 'Shipping' } } }] : [])
			]
		},
		{ idempotencyKey }
	);
	await tx.insert(payments).values({ orderId: order.id, checkoutSessionId: session.id, amount: order.total, currency: order.currency, state: 'open' });
	return { ok: true, url: session.url! };
}

/**
 * Closes every open payment page of an order (cancelling it). Called with the order row locked, so no
 * retry can open a new one meanwhile. A session that was paid in that very moment stays as it is: its
 * payment reaches the webhook, which refunds it because the order is no longer awaiting payment.
 */
export async function closeOpenSessions(tx: Tx, stripe: Stripe, orderId: number) {
	const open = await tx.select().from(payments).where(eq(payments.orderId, orderId));
	for (const p of open.filter((row) => row.state === 'open')) {
		if ((await expireAtProvider(stripe, p.checkoutSessionId)) === 'expired') await tx.update(payments).set({ state: 'expired' }).where(eq(payments.id, p.id));
	}
}
