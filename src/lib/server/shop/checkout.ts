import { and, eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../db/client';
import { fabrics, orderEvents, orderLines, orders, payments, type ShippingAddress } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { orderReceivedMail } from '../mail/templates';
import { orderToken } from '../orders/link';
import { orderSummary } from '../orders/summary';
import type { BagItem } from '../../forms/quote';
import { formatMetres } from '../../format';
import { shippingCost } from '../../pricing';
import { quoteSkirt, type QuoteProblem } from './quote';
import { shopSettingsOf } from './rules';

export type Shopper = { email: string; name: string; address: ShippingAddress; userId: string | null };

/**
 * Turns the bag into an order awaiting payment. Every price is computed again here from the
 * database and the engine: nothing the browser says about money is trusted.
 */
export async function placeOrder(db: Db, items: BagItem[], shopper: Shopper) {
	if (items.length === 0) return { ok: false as const, problem: { status: 400, message: 'Your bag is empty.' } satisfies QuoteProblem };
	type Quoted = Extract<Awaited<ReturnType<typeof quoteSkirt>>, { ok: true }> & { item: BagItem };
	const quoted: Quoted[] = [];
	for (const item of items) {
		const q = await quoteSkirt(db, { measurements: item.measurements, style: item.style, options: item.options, fabricId: item.fabricId, units: item.units }, { drawing: false });
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

	const { order, mailId } = await db.transaction(async (tx) => {
		const [{ id }] = await tx
			.insert(orders)
			.values({
				number: `tmp-${crypto.randomUUID().slice(0, 12)}`,
				userId: shopper.userId,
				email: shopper.email,
				shopperName: shopper.name,
				status: 'awaiting_payment',
				currency: settings.currency,
				subtotal,
				shipping,
				total: subtotal + shipping,
				promisedDate,
				shippingAddress: shopper.address,
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
	return { ok: true as const, order, mailIds: [mailId] };
}

/**
 * Opens a payment page for an order awaiting payment. Older open sessions are expired first, so a
 * shopper who retries can never pay twice.
 */
export async function startPayment(db: Db, stripe: Stripe, orderId: number, origin: string) {
	const [order] = await db.select().from(orders).where(eq(orders.id, orderId));
	if (!order || order.status !== 'awaiting_payment') return { ok: false as const, message: 'This order is not awaiting payment.' };
	const open = await db.select().from(payments).where(and(eq(payments.orderId, orderId), eq(payments.state, 'open')));
	for (const p of open) {
		await stripe.checkout.sessions.expire(p.checkoutSessionId).catch(() => null);
		await db.update(payments).set({ state: 'expired' }).where(eq(payments.id, p.id));
	}
	const lines = await db
		.select({ total: orderLines.lineTotal, fabric: fabrics.name, options: orderLines.options })
		.from(orderLines)
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orderLines.orderId, orderId));
	const back = `${origin}/orders/${encodeURIComponent(order.number)}?t=${orderToken(order.number)}`;
	const currency = order.currency.toLowerCase();
	let session: Stripe.Checkout.Session;
	try {
		session = await stripe.checkout.sessions.create({
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
		});
	} catch {
		return { ok: false as const, message: 'We could not reach the payment service just now. Your order is saved and awaiting payment: please try again in a minute.' };
	}
	await db.insert(payments).values({ orderId, checkoutSessionId: session.id, amount: order.total, currency: order.currency, state: 'open' });
	return { ok: true as const, url: session.url! };
}
