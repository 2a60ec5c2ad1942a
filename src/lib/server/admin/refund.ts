import { and, desc, eq, inArray } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../db/client';
import { orderEvents, payments } from '../db/schema';
import { formatMoney } from '../../format';
import type { Actor } from '../orders/stage';

/**
 * Asks the payment provider for a refund. The order changes when the provider's charge.refunded
 * event comes back through the webhook, exactly as for a refund made on the provider's side.
 */
export async function requestRefund(db: Db, stripe: Stripe, orderId: number, amount: number, actor: Actor, reason: string) {
	const [payment] = await db.select().from(payments).where(and(eq(payments.orderId, orderId), inArray(payments.state, ['paid', 'partially_refunded']))).orderBy(desc(payments.id)).limit(1);
	if (!payment?.paymentIntentId) return { ok: false as const, message: 'This order has no payment to refund.' };
	const left = payment.amount - payment.refundedAmount;
	if (!Number.isInteger(amount) || amount <= 0 || amount > left) return { ok: false as const, message: `Enter an amount from ${formatMoney(1, payment.currency)} to ${formatMoney(left, payment.currency)}.` };
	try {
		await stripe.refunds.create({ payment_intent: payment.paymentIntentId, amount, reason: 'requested_by_customer', metadata: { order_id: String(orderId) } }, { idempotencyKey: `refund-${orderId}-${payment.refundedAmount}-${amount}` });
	} catch (err) {
		return { ok: false as const, message: `The payment service refused the refund: ${(err as Error).message}` };
	}
	await db.insert(orderEvents).values({ orderId, actorId: actor.id, actorLabel: actor.label, kind: 'note', note: `Refund of ${formatMoney(amount, payment.currency)} requested${reason ? `: ${reason}` : ''}` });
	return { ok: true as const, left: left - amount, currency: payment.currency };
}
