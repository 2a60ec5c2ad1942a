// Payments under retries, races and forged events: what the shopper, the owner, the database and the
// payment provider (its fake) each end up with.
import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { fabrics, orderEvents, orders, payments } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { fakeApi, fakeStripe, ownerCookie, postSignedEvent, refundsOf, sessionsFor } from '../support/payments';
import { postForm } from '../support/session';
import { Browser, CARDS, GUEST_ADDRESS, addToBag, checkout, eventually, payWithCard } from '../support/shop';

const db = testDb();

/** A new guest order awaiting payment, with its first checkout session and the link from her mail. */
async function awaitingOrder(tag: string) {
	const browser = new Browser();
	const [twill] = await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill'));
	expect((await addToBag(browser, 'rue-straight', { waist: 70, hip: 96, length: 60, waistToHip: 20, fabricId: twill.id })).status).toBe(303);
	const email = `${tag}-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.com`;
	const c = await checkout(browser, { ...GUEST_ADDRESS, email });
	expect(c.sessionId).toBeTruthy();
	const [payment] = await db.select().from(payments).where(eq(payments.checkoutSessionId, c.sessionId!));
	const [order] = await db.select().from(orders).where(eq(orders.id, payment.orderId));
	const link = new URL((await fakeApi(`/checkout/sessions/${c.sessionId}`)).cancel_url);
	return { order, sessionId: c.sessionId!, email, link: `${link.pathname}${link.search}` };
}

const orderRow = async (id: number) => (await db.select().from(orders).where(eq(orders.id, id)))[0];
const paymentRows = (orderId: number) => db.select().from(payments).where(eq(payments.orderId, orderId));
const paymentEvents = (orderId: number) => db.select().from(orderEvents).where(and(eq(orderEvents.orderId, orderId), eq(orderEvents.kind, 'payment')));

/** A second checkout session for the order, recorded as open: the state eight racing retries used to leave. */
async function secondSession(order: typeof orders.$inferSelect) {
	const s = await fakeStripe().checkout.sessions.create({
		mode: 'payment',
		client_reference_id: order.number,
		customer_email: order.email,
		metadata: { order_id: String(order.id), order_number: order.number },
		success_url: `${testEnv.appUrl}/orders/${order.number}`,
		line_items: [{ quantity: 1, price_data: { currency: order.currency.toLowerCase(), unit_amount: order.total, product_data: { name: 'Made-to-measure skirt' } } }]
	});
	await db.insert(payments).values({ orderId: order.id, checkoutSessionId: s.id, amount: order.total, currency: order.currency, state: 'open' });
	return s.id;
}

describe('one order, one open payment page (finding 4)', () => {
	it('answers eight concurrent "pay now" retries with the one open session, never a second payable one', async () => {
		const { order, sessionId, link } = await awaitingOrder('retry');
		const answers = await Promise.all(Array.from({ length: 8 }, () => postForm(`${link}&/pay`, {})));
		const locations = answers.map((r) => r.headers.get('location') ?? `status ${r.status}`);
		// Every retry goes to a payment page, and it is the same one.
		for (const l of locations) expect(l).toMatch(/\/pay\/cs_/);
		expect(new Set(locations).size).toBe(1);
		// At the provider: one open session for the order (the first one, reused), whatever else was made.
		const open = (await sessionsFor(order.number)).filter((s) => s.status === 'open');
		expect(open.map((s) => s.id)).toEqual([sessionId]);
		expect((await paymentRows(order.id)).filter((p) => p.state === 'open').map((p) => p.checkoutSessionId)).toEqual([sessionId]);
	});

	it('refunds a payment that arrives after the order was paid, and notes it on the timeline', async () => {
		const { order, sessionId } = await awaitingOrder('late');
		const other = await secondSession(order);
		expect((await payWithCard(sessionId, CARDS.success)).status).toBe(200);
		await eventually(async () => (await orderRow(order.id)).status === 'paid');
		expect((await payWithCard(other, CARDS.success)).status).toBe(200);

		const late = await eventually(async () => (await paymentRows(order.id)).find((p) => p.checkoutSessionId === other && p.state === 'refunded'));
		// The provider holds one refund of the whole second payment; the first payment is untouched.
		const intent = (await fakeApi(`/checkout/sessions/${other}`)).payment_intent;
		expect((await refundsOf(intent)).map((r) => r.amount)).toEqual([order.total]);
		const first = (await fakeApi(`/checkout/sessions/${sessionId}`)).payment_intent;
		expect(await refundsOf(first)).toEqual([]);
		expect(late.refundedAmount).toBe(order.total);
		const after = await orderRow(order.id);
		expect([after.status, after.refundedTotal]).toEqual(['paid', 0]);
		const notes = (await paymentEvents(order.id)).map((e) => e.note ?? '');
		expect(notes).toHaveLength(1);
		expect(notes[0]).toMatch(/already paid.*refunded automatically/i);
	});

	it('expires the open session at the provider when the owner cancels the order', async () => {
		const { order, sessionId } = await awaitingOrder('cancel');
		const res = await postForm(`/admin/orders/${order.id}?/move`, { to: 'cancelled' }, await ownerCookie());
		expect(res.status).toBe(200);
		expect((await orderRow(order.id)).status).toBe('cancelled');
		expect((await fakeApi(`/checkout/sessions/${sessionId}`)).status).toBe('expired');
		expect((await payWithCard(sessionId, CARDS.success)).status).toBe(409);
		await eventually(async () => (await paymentRows(order.id))[0].state === 'expired');
	});

	it('refunds a payment that lands on a cancelled order and leaves the order cancelled', async () => {
		const { order, sessionId } = await awaitingOrder('cancelled-late');
		// The payment completes in the moment the order is cancelled (the race the lock cannot see).
		await db.update(orders).set({ status: 'cancelled' }).where(eq(orders.id, order.id));
		expect((await payWithCard(sessionId, CARDS.success)).status).toBe(200);
		await eventually(async () => (await paymentRows(order.id))[0].state === 'refunded');
		const intent = (await fakeApi(`/checkout/sessions/${sessionId}`)).payment_intent;
		expect((await refundsOf(intent)).map((r) => r.amount)).toEqual([order.total]);
		expect((await orderRow(order.id)).status).toBe('cancelled');
		expect((await paymentEvents(order.id)).map((e) => e.note)).toEqual([expect.stringMatching(/cancelled.*refunded automatically/i)]);
	});
});

describe('the webhook checks what it is told (finding 5)', () => {
	const completed = (id: string, order: typeof orders.$inferSelect, over: Record<string, unknown> = {}) => ({
		id,
		object: 'checkout.session',
		status: 'complete',
		payment_status: 'paid',
		payment_intent: `pi_forged_${Date.now()}`,
		amount_total: order.total,
		currency: order.currency.toLowerCase(),
		client_reference_id: order.number,
		metadata: { order_id: String(order.id), order_number: order.number },
		...over
	});

	async function expectWarned(order: typeof orders.$inferSelect, pattern: RegExp) {
		const after = await orderRow(order.id);
		expect([after.status, after.paidAt]).toEqual(['awaiting_payment', null]);
		expect((await paymentRows(order.id)).map((p) => p.state)).toEqual(['open']);
		const notes = (await paymentEvents(order.id)).map((e) => e.note ?? '');
		expect(notes).toEqual([expect.stringMatching(pattern)]);
		// The owner sees it on the order's page, set apart as a warning.
		const page = await (await fetch(`${testEnv.appUrl}/admin/orders/${order.id}`, { headers: { cookie: await ownerCookie() } })).text();
		const warning = page.match(/data-testid="payment-warnings"[\s\S]*?<\/section>/)?.[0] ?? '';
		expect(warning).toContain(notes[0].replaceAll('&', '&amp;'));
	}

	it('leaves the order unpaid when a signed event pays 0.01 for it', async () => {
		const { order, sessionId } = await awaitingOrder('cent');
		expect((await postSignedEvent('checkout.session.completed', completed(sessionId, order, { amount_total: 1 }))).status).toBe(200);
		await expectWarned(order, /€0\.01.*expected.*nothing was changed/i);
	});

	it('leaves the order unpaid when the currency differs', async () => {
		const { order, sessionId } = await awaitingOrder('currency');
		expect((await postSignedEvent('checkout.session.completed', completed(sessionId, order, { currency: 'usd' }))).status).toBe(200);
		await expectWarned(order, /USD.*expected.*nothing was changed/i);
	});

	it('leaves the order unpaid when the session is not the one on record', async () => {
		const { order } = await awaitingOrder('stranger');
		const stranger = `cs_test_stranger${Date.now()}`;
		expect((await postSignedEvent('checkout.session.completed', completed(stranger, order))).status).toBe(200);
		await expectWarned(order, new RegExp(`${stranger}.*not.*on record.*nothing was changed`, 'i'));
	});
});
