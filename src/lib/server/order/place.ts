import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import type { Db } from '../db/client';
import { orderEvents, orderLines, orders, type ShippingAddress } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { orderReceivedMail } from '../mail/templates';
import { orderSummary } from './summary';
import { openSession, type Opened } from './payments/sessions';
import type { BagItem } from '$lib/forms/quote';
import { formatMetres } from '$lib/format';
import { shippingCost } from '$lib/pricing';
import { quoteSkirt, type QuoteProblem } from '../quote/quote';
import { shopSettingsOf } from '../house/rules';

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
 * database and the engine: nothing the browser says about money is trusted.
 */
export async function placeOrder(db: Db, items: BagItem[], shopper: Shopper) {
	if (items.length === 0) return { ok: false as const, problem: { status: 400, message: 'Your bag is empty.' } satisfies QuoteProblem };
	const quoted: Quoted[] = [];
	for (const item of items) {
		const q = await quoteSkirt(db, { measurements: item.measurements, style: item.style, options: item.options, fabricId: item.fabricId, units: item.units, figuresSource: item.figuresSource }, { drawing: false });
		if (!q.ok) return q;
		quoted.push({ item, ...q });
	}
	// Enough cloth on the shelf for every skirt in the bag (stock is taken off when the order is cut).
	const need = new Map<number, number>();
	for (const q of quoted) need.set(q.fabric!.id, (need.get(q.fabric!.id) ?? 0) + q.quote.fabric!.lengthCm);
	for (const q of quoted) {
		const f = q.fabric!;
		if (f.stockCm < need.get(f.id)!) {
			return { ok: false as const, problem: { status: 409, message: `${f.name} (${f.colour}) has only ${formatMetres(f.stockCm)} left, and your bag needs ${formatMetres(need.get(f.id)!)}. Choose another fabric for one of your skirts.` } satisfies QuoteProblem };
		}
	}
	const settings = await shopSettingsOf(db);
	const subtotal = quoted.reduce((s, q) => s + q.quote.price!.total - q.quote.price!.shipping, 0);
	const shipping = shippingCost(subtotal, settings.shipping);
	const promisedDate = quoted.map((q) => q.quote.shipBy).sort().at(-1)!;

	let created;
	try {
		created = await insertOrder(db, quoted, shopper, { subtotal, shipping, promisedDate, currency: settings.currency });
	} catch (err) {
		// The same form sent twice at once: the second insert waited for the first on the unique key and
		// lost. Hers is the order the first one placed (its mail has gone once, from the first).
		const earlier = shopper.checkoutKey && duplicateKey(err, 'checkout_key') ? await orderByCheckoutKey(db, shopper.checkoutKey) : null;
		if (!earlier) throw err;
		return { ok: true as const, order: earlier, mailIds: [] as number[], again: true };
	}
	return { ok: true as const, order: created.order, mailIds: [created.mailId], again: false };
}

type Quoted = Extract<Awaited<ReturnType<typeof quoteSkirt>>, { ok: true }> & { item: BagItem };

async function insertOrder(db: Db, quoted: Quoted[], shopper: Shopper, money: { subtotal: number; shipping: number; promisedDate: string; currency: string }) {
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
				houseRulesId: quoted[0].rulesId
			})
			.$returningId();
		// The number follows the row id, so it is unique across app servers without a counter table.
		const number = `QL-${1000 + id}`;
		await tx.update(orders).set({ number }).where(eq(orders.id, id));
		for (const q of quoted) {
			const p = q.quote.price!;
			await tx.insert(orderLines).values({
				orderId: id,
				styleId: q.style.id,
				fabricId: q.fabric!.id,
				// Stretch comes from the cloth; kept with the order so a reprinted ticket drafts the same vent.
				options: { style: q.style.kind, ...q.item.options, stretch: q.fabric!.stretch },
				measurements: { ...q.item.measurements, waistToHip: q.item.measurements.waistToHip ?? null },
				figuresSource: q.item.figuresSource ?? 'measured',
				figures: q.draft.figures as unknown as Record<string, unknown>,
				fabricCm: q.quote.fabric!.lengthCm,
				pricing: { fabric: p.fabric, making: p.making, options: p.options, total: p.fabric + p.making + p.options },
				lineTotal: p.fabric + p.making + p.options
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
export async function startPayment(db: Db, stripe: Stripe, orderId: number, origin: string): Promise<Opened | { ok: false; reason: 'not_awaiting' | 'away'; message: string }> {
	try {
		return await db.transaction(async (tx) => {
			const [order] = await tx.select().from(orders).where(eq(orders.id, orderId)).for('update');
			if (!order || order.status !== 'awaiting_payment') return { ok: false as const, reason: 'not_awaiting' as const, message: 'This order is not awaiting payment.' };
			return openSession(tx, stripe, order, origin);
		});
	} catch (err) {
		if (!(err instanceof Stripe.errors.StripeError)) throw err;
		console.error(`[payments] could not open a payment page for order ${orderId}: ${err.message}`);
		return { ok: false as const, reason: 'away' as const, message: 'We could not reach the payment service just now. Your order is saved and awaiting payment: please try again in a minute.' };
	}
}
