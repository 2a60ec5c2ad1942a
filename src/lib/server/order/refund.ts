import { and, desc, eq, inArray } from 'drizzle-orm';
import Stripe from 'stripe';
import type { Db } from '../db/client';
import { orderEvents, orders, payments } from '../db/schema';
import { formatMoney, toMinor } from '$lib/format';
import { failure, type Failure } from '$lib/failure';
import type { Actor } from './stage';

export type RefundResult = { ok: true; repeated: boolean; message: string } | Failure;

/**
 * Asks the payment provider for a refund of `typed` (an amount as the owner typed it, in the payment's
 * currency). The order changes when the provider's charge.refunded
 * event comes back through the webhook, exactly as for a refund made on the provider's side.
 *
 * `formKey` is made when the refund form loads: the provider's idempotency key is built from it and
 * the amount, so the same form sent again (a double click, three tabs at once) is one refund, and the
 * provider's answer says whether this request made it or only found it made. Requests for one order
 * take turns on the order's row lock, so they reach the provider one at a time and the note on the
 * timeline is written once, by the request that made the refund.
 */
export async function requestRefund(db: Db, stripe: Stripe, orderId: number, typed: number, actor: Actor, reason: string, formKey: string): Promise<RefundResult> {
	try {
		return await db.transaction(async (tx) => {
			// The order's row lock covers its payments too: every path that writes them takes it first.
			const [order] = await tx.select({ id: orders.id }).from(orders).where(eq(orders.id, orderId)).for('update');
			if (!order) return failure(404, 'No such order.');
			const [payment] = await tx.select().from(payments).where(and(eq(payments.orderId, orderId), inArray(payments.state, ['paid', 'partially_refunded']))).orderBy(desc(payments.id)).limit(1);
			if (!payment?.paymentIntentId) return failure(409, 'This order has no payment to refund.');
			// The owner types the amount in the payment's currency ("12.50"); the provider counts minor units.
			const amount = toMinor(typed, payment.currency);
			const left = payment.amount - payment.refundedAmount;
			if (!Number.isInteger(amount) || amount <= 0 || amount > left) return failure(400, `Enter an amount from ${formatMoney(1, payment.currency)} to ${formatMoney(left, payment.currency)}.`, { fields: { amount: ['Enter an amount within what was paid.'] } });
			const money = formatMoney(amount, payment.currency);
			const refund = await stripe.refunds.create(
				{ payment_intent: payment.paymentIntentId, amount, reason: 'requested_by_customer', metadata: { order_id: String(orderId) } },
				{ idempotencyKey: `refund-${orderId}-${formKey}-${amount}` }
			);
			if (refund.lastResponse.headers['idempotent-replayed'] === 'true') {
				return { ok: true as const, repeated: true, message: `This refund of ${money} was already sent from this form a moment ago: nothing more was refunded.` };
			}
			await tx.insert(orderEvents).values({ orderId, actorId: actor.id, actorLabel: actor.label, kind: 'note', note: `Refund of ${money} requested${reason ? `: ${reason}` : ''}` });
			return { ok: true as const, repeated: false, message: `Refund of ${money} sent to the payment service; the order updates when it confirms.` };
		});
	} catch (err) {
		if (!(err instanceof Stripe.errors.StripeError)) throw err;
		return failure(502, `The payment service refused the refund: ${err.message}`);
	}
}
