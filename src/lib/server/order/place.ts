import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import type { Db } from '../db/client';
import { fabrics, orderEvents, orderLines, orders, type ShippingAddress } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { orderReceivedMail } from '../mail/templates';
import { orderSummary } from './summary';
import { openSession, type Opened } from './payments/sessions';
import type { BagItem } from '$lib/forms/quote';
import { formatMetres } from '$lib/format';
import type { LinePricing } from '$lib/pricing';
import type { Draft } from '$lib/drafting';
import { failure, type Failure } from '$lib/failure';
import { quoteBag } from '../quote/quote';
import { storedMeasurements } from './lines';

export type Shopper = { email: string; name: string; address: ShippingAddress; userId: string | null; checkoutKey?: string | null };

/** The order a checkout form with this key placed, if any. */
export async function orderByCheckoutKey(db: Db, key: string) {
	const [order] = await db.select().from(orders).where(eq(orders.checkoutKey, key));
	return order ?? null;
}

/** MariaDB's duplicate-key error (1062), whether drizzle hands it over bare or wrapped. */
function duplicateKey(err: unknown, index: string) {
	for (let e = err as { code?: string; message?: string; cause?: unknown } | undefined; e; e = e.cause as typeof e) {
		if (e.code === 'ER_DUP_ENTRY') return String(e.message).includes(index);
	}
	return false;
}

/**
 * Turns the bag into an order awaiting payment. Every price is computed again here from the
 * database and the engine, in one quote of the whole bag: nothing the browser says about money is trusted.
 */
export async function placeOrder(db: Db, items: BagItem[], shopper: Shopper): Promise<Failure | { ok: true; order: OrderRow; mailIds: number[]; again: boolean }> {
	if (items.length === 0) return failure(400, 'Your bag is empty.');
	const bag = await quoteBag(db, items);
	const quoted: Placed[] = [];
	for (const [i, q] of bag.lines.entries()) {
		if (!q.ok) return q;
		// A fabric is always chosen in the bag, so every line has its cloth and its price.
		if (!q.fabric || q.fabricCm === null || !q.pricing) return failure(400, 'Choose a fabric for every skirt in your bag.');
		quoted.push({ item: items[i], draft: q.draft, styleId: q.style.id, fabric: q.fabric, fabricCm: q.fabricCm, pricing: q.pricing });
	}
	// Enough cloth on the shelf for every skirt in the bag (stock is taken off when the order is cut).
	const need = new Map<number, number>();
	for (const q of quoted) need.set(q.fabric.id, (need.get(q.fabric.id) ?? 0) + q.fabricCm);
	for (const q of quoted) {
		const f = q.fabric;
		if (f.stockCm < need.get(f.id)!) {
			return failure(409, `${f.name} (${f.colour}) has only ${formatMetres(f.stockCm)} left, and your bag needs ${formatMetres(need.get(f.id)!)}. Choose another fabric for one of your skirts.`);
		}
	}
	let created;
	try {
		created = await insertOrder(db, quoted, shopper, { subtotal: bag.subtotal, shipping: bag.shipping, promisedDate: bag.shipBy!, currency: bag.currency, rulesId: bag.rulesId });
	} catch (err) {
		// The same form sent twice at once: the second insert waited for the first on the unique key and
		// lost. Hers is the order the first one placed (its mail has gone once, from the first).
		const earlier = shopper.checkoutKey && duplicateKey(err, 'checkout_key') ? await orderByCheckoutKey(db, shopper.checkoutKey) : null;
		if (!earlier) throw err;
		return { ok: true as const, order: earlier, mailIds: [] as number[], again: true };
	}
	return { ok: true as const, order: created.order, mailIds: [created.mailId], again: false };
}

type OrderRow = typeof orders.$inferSelect;
type Placed = { item: BagItem; draft: Draft; styleId: number; fabric: typeof fabrics.$inferSelect; fabricCm: number; pricing: LinePricing };

async function insertOrder(db: Db, quoted: Placed[], shopper: Shopper, money: { subtotal: number; shipping: number; promisedDate: string; currency: string; rulesId: number }) {
	const { subtotal, shipping, promisedDate } = money;
	return db.transaction(async (tx) => {
		const [{ id }] = await tx
			.insert(orders)
			.values({
				number: `tmp-${crypto.randomUUID().slice(0, 12)}`,
				userId: shopper.userId,
				email: shopper.email,
				shopperName: shopper.name,
				status: 'awaiting_payment',
				currency: money.currency,
				subtotal,
				shipping,
				total: subtotal + shipping,
				promisedDate,
				shippingAddress: shopper.address,
				checkoutKey: shopper.checkoutKey ?? null,
				// Every line of the bag was drafted with this one version.
				houseRulesId: money.rulesId
			})
			.$returningId();
		// The number follows the row id, so it is unique across app servers without a counter table.
		const number = `QL-${1000 + id}`;
		await tx.update(orders).set({ number }).where(eq(orders.id, id));
		for (const q of quoted) {
			await tx.insert(orderLines).values({
				orderId: id,
				styleId: q.styleId,
				fabricId: q.fabric.id,
				// Stretch comes from the cloth; kept with the order so a reprinted ticket drafts the same vent.
				options: { style: q.draft.choice.style, ...q.item.options, stretch: q.fabric.stretch },
				measurements: storedMeasurements(q.item.measurements),
				adjustments: q.item.measurements.adjustments ?? null,
				figures: q.draft.figures,
				fabricCm: q.fabricCm,
				pricing: q.pricing,
				lineTotal: q.pricing.total
			});
		}
		await tx.insert(orderEvents).values({ orderId: id, actorId: shopper.userId, actorLabel: shopper.name, kind: 'stage', fromStatus: null, toStatus: 'awaiting_payment', note: 'Order placed' });
		const [row] = await tx.select().from(orders).where(eq(orders.id, id));
		const mailId = await enqueueMail(tx, { to: shopper.email, orderId: id, ...orderReceivedMail(await orderSummary(tx, row)) });
		return { order: row, mailId };
	});
}

/**
 * The payment page for an order awaiting payment: its open one, or a new one (see openSession). The
 * order row is locked for the whole exchange with the provider, so concurrent retries take turns.
 */
export async function startPayment(db: Db, stripe: Stripe, orderId: number, origin: string): Promise<Opened> {
	try {
		return await db.transaction(async (tx) => {
			const [order] = await tx.select().from(orders).where(eq(orders.id, orderId)).for('update');
			if (!order || order.status !== 'awaiting_payment') return failure(409, 'This order is not awaiting payment.', { reason: 'not_awaiting' });
			return openSession(tx, stripe, order, origin);
		});
	} catch (err) {
		if (!(err instanceof Stripe.errors.StripeError)) throw err;
		console.error(`[payments] could not open a payment page for order ${orderId}: ${err.message}`);
		return failure(503, 'We could not reach the payment service just now. Your order is saved and awaiting payment: please try again in a minute.', { reason: 'away' });
	}
}
