import { eq, inArray, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import type { Db } from '../db/client';
import { fabrics, orderLines } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { shippedMail } from '../mail/templates';
import { moveOrder, MoveRefused, type Actor } from './stage';
import { orderSummary } from './summary';
import { closeOpenSessions } from './payments/sessions';
import { stripe } from './payments/stripe';
import type { OrderStage } from '$lib/orders/stages';
import { failure } from '$lib/failure';
import { formatMetres } from '$lib/format';

export type StageRequest = {
	orderId: number;
	to: OrderStage;
	actor: Actor & { role: 'shopper' | 'cutter' | 'owner' };
	note?: string | null;
	carrier?: string | null;
	tracking?: string | null;
	/** The owner may let stock go below zero (a bolt that was never counted in). */
	overrideStock?: boolean;
};

/**
 * A workroom or back-office move, with what each stage brings: cutting takes the cloth off stock
 * (fabric rows locked in the same transaction as the order), shipping needs a carrier and a
 * tracking number and queues the shipped e-mail, cancelling is for the owner only and closes the
 * order's open payment page at the provider (under the order's lock, so none opens meanwhile).
 */
export async function workroomMove(db: Db, req: StageRequest) {
	if (req.to === 'cancelled' && req.actor.role !== 'owner') return failure(403, 'Only the owner can cancel an order.');
	if (req.to === 'shipped' && (!req.carrier?.trim() || !req.tracking?.trim())) {
		return failure(400, 'Enter the carrier and the tracking number to mark an order shipped.', { fields: { carrier: ['Enter the carrier.'], tracking: ['Enter the tracking number.'] } });
	}
	return moveOrder(db, {
		orderId: req.orderId,
		to: req.to,
		actor: req.actor,
		note: req.note ?? (req.to === 'shipped' ? `Sent with ${req.carrier}, tracking ${req.tracking}` : null),
		set: req.to === 'shipped' ? { carrier: req.carrier!.trim(), trackingNumber: req.tracking!.trim() } : undefined,
		alongside: async (tx, order) => {
			if (req.to === 'cancelled') {
				try {
					await closeOpenSessions(tx, stripe(), order.id);
				} catch (err) {
					if (!(err instanceof Stripe.errors.StripeError)) throw err;
					throw new MoveRefused(409, 'We could not reach the payment service to close the payment page of this order, so it is not cancelled yet. Try again in a minute.');
				}
			}
			if (req.to === 'cutting') {
				const lines = await tx.select({ fabricId: orderLines.fabricId, cm: orderLines.fabricCm }).from(orderLines).where(eq(orderLines.orderId, order.id));
				const need = new Map<number, number>();
				for (const l of lines) need.set(l.fabricId, (need.get(l.fabricId) ?? 0) + l.cm);
				const rows = await tx.select().from(fabrics).where(inArray(fabrics.id, [...need.keys()])).for('update');
				for (const f of rows) {
					const cm = need.get(f.id)!;
					if (f.stockCm < cm && !(req.overrideStock && req.actor.role === 'owner')) {
						throw new MoveRefused(409, `Not enough ${f.name} (${f.colour}) on the shelf: ${formatMetres(f.stockCm)} left, this order needs ${formatMetres(cm)}. Count the bolt again, or ask the owner to override.`);
					}
					await tx.update(fabrics).set({ stockCm: sql`${fabrics.stockCm} - ${cm}` }).where(eq(fabrics.id, f.id));
				}
			}
			if (req.to === 'shipped') {
				const summary = await orderSummary(tx, order);
				return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...shippedMail({ ...summary, carrier: req.carrier!.trim(), tracking: req.tracking!.trim() }) })];
			}
		}
	});
}
