import { describe, expect, it } from 'vitest';
import { and, count, eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { fabrics, orderEvents, orders, payments } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { Browser, CARDS, GUEST_ADDRESS, addToBag, checkout, eventually, mailsTo, payWithCard } from '../support/shop';

const db = testDb();
const stripe = new Stripe('sk_test_offline', { maxNetworkRetries: 0 });

async function fabric(slug: string) {
	const [f] = await db.select().from(fabrics).where(eq(fabrics.slug, slug));
	return f;
}

async function orderBySession(sessionId: string) {
	const [p] = await db.select().from(payments).where(eq(payments.checkoutSessionId, sessionId));
	const [o] = await db.select().from(orders).where(eq(orders.id, p.orderId));
	return { payment: p, order: o };
}

async function newOrder(email: string) {
	const browser = new Browser();
	const twill = await fabric('harbour-wool-twill');
	expect((await addToBag(browser, 'rue-straight', { waist: 70, hip: 96, length: 60, waistToHip: 20, fabricId: twill.id })).status).toBe(303);
	const c = await checkout(browser, { ...GUEST_ADDRESS, email });
	expect(c.res.status).toBe(303);
	expect(c.sessionId).toBeTruthy();
	return { browser, sessionId: c.sessionId!, location: c.location };
}

describe('checkout through the payment fake', () => {
	it('stores the order awaiting payment with prices recomputed on the server, then pays it once', async () => {
		const email = `pay-${Date.now()}@example.com`;
		const { sessionId } = await newOrder(email);
		const before = await orderBySession(sessionId);
		expect(before.order.status).toBe('awaiting_payment');
		// Priced from the database: line + shipping = total, and the session asks for exactly that.
		const session = await (await fetch(`${testEnv.paymentsUrl}/v1/checkout/sessions/${sessionId}`, { headers: { authorization: `Bearer ${testEnv.stripeKey}` } })).json();
		expect(session.amount_total).toBe(before.order.total);
		expect(before.order.total).toBe(before.order.subtotal + before.order.shipping);
		await eventually(async () => (await mailsTo(email)).some((m) => m.subject === `Order ${before.order.number} received: awaiting payment`));

		expect((await payWithCard(sessionId, CARDS.success)).status).toBe(200);
		const paid = await eventually(async () => {
			const { order } = await orderBySession(sessionId);
			return order.status === 'paid' ? order : null;
		});
		expect(paid.paidAt).not.toBeNull();
		const confirmation = await eventually(async () => (await mailsTo(email)).find((m) => m.subject === `Order ${paid.number} is paid`));
		expect(confirmation.text).toContain(paid.number);
		expect(confirmation.text).toMatch(/\/orders\/QL-\d+\?t=/);
	});

	it('changes the order once and sends one mail when the event arrives five times', async () => {
		const email = `replay-${Date.now()}@example.com`;
		const { sessionId } = await newOrder(email);
		await payWithCard(sessionId, CARDS.success);
		const { order } = await eventually(async () => {
			const r = await orderBySession(sessionId);
			return r.order.status === 'paid' ? r : null;
		});
		const { data: events } = await (await fetch(`${testEnv.paymentsUrl}/_fake/events`)).json();
		const completed = events.find((e: { type: string; event: { data: { object: { id: string } } } }) => e.type === 'checkout.session.completed' && e.event.data.object.id === sessionId);
		for (let i = 0; i < 4; i++) await fetch(`${testEnv.paymentsUrl}/_fake/events/${completed.id}/redeliver`, { method: 'POST' });
		await new Promise((r) => setTimeout(r, 1500));
		const [{ n }] = await db.select({ n: count() }).from(orderEvents).where(and(eq(orderEvents.orderId, order.id), eq(orderEvents.toStatus, 'paid')));
		expect(n).toBe(1);
		expect((await mailsTo(email)).filter((m) => m.subject.endsWith('is paid'))).toHaveLength(1);
	});

	it('refuses a wrong or stale signature with 400 and changes nothing', async () => {
		const email = `forged-${Date.now()}@example.com`;
		const { sessionId } = await newOrder(email);
		const payload = JSON.stringify({ id: `evt_forged_${Date.now()}`, object: 'event', type: 'checkout.session.completed', data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'paid', payment_intent: 'pi_forged' } } });
		const post = (header: string) => fetch(`${testEnv.appUrl}/api/webhooks/stripe`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload });
		const wrong = stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_ours' });
		expect((await post(wrong)).status).toBe(400);
		// Older than the SDK's 300 s tolerance.
		const stale = stripe.webhooks.generateTestHeaderString({ payload, secret: testEnv.webhookSecret, timestamp: Math.floor(Date.now() / 1000) - 3600 });
		expect((await post(stale)).status).toBe(400);
		expect((await fetch(`${testEnv.appUrl}/api/webhooks/stripe`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload })).status).toBe(400);
		expect((await orderBySession(sessionId)).order.status).toBe('awaiting_payment');
	});

	it('leaves the order unpaid when the card is declined', async () => {
		const { sessionId } = await newOrder(`declined-${Date.now()}@example.com`);
		const r = await payWithCard(sessionId, CARDS.decline);
		expect(r.status).toBe(402);
		await new Promise((res) => setTimeout(res, 800));
		const { order, payment } = await orderBySession(sessionId);
		expect(order.status).toBe('awaiting_payment');
		expect(payment.state).toBe('open');
	});

	it('marks an expired session and keeps the order awaiting payment for a retry', async () => {
		const { sessionId } = await newOrder(`expired-${Date.now()}@example.com`);
		await fetch(`${testEnv.paymentsUrl}/_fake/sessions/${sessionId}/expire`, { method: 'POST' });
		const payment = await eventually(async () => {
			const r = await orderBySession(sessionId);
			return r.payment.state === 'expired' ? r : null;
		});
		expect(payment.order.status).toBe('awaiting_payment');
	});

	it('ignores a price sent with the form and refuses unknown fabrics and empty stock', async () => {
		const browser = new Browser();
		const twill = await fabric('harbour-wool-twill');
		// A made-up price field is not part of the form: the order is priced from the database.
		await browser.post('/styles/rue-straight/make?/add', { units: 'cm', waist: '70', hip: '96', length: '60', waistToHip: '20', fabricId: String(twill.id), price: '1', total: '1' });
		const c = await checkout(browser, { ...GUEST_ADDRESS, email: `tamper-${Date.now()}@example.com`, total: '1' });
		const { order } = await orderBySession(c.sessionId!);
		expect(order.total).toBeGreaterThan(8900);

		const unknown = await new Browser().post('/styles/rue-straight/make?/add', { units: 'cm', waist: '70', hip: '96', length: '60', waistToHip: '20', fabricId: '987654' });
		expect(unknown.status).toBe(400);
		expect(await unknown.text()).toContain('That fabric is not in our catalogue');

		const crepe = await fabric('plum-silk-wool-crepe');
		const before = await db.select({ n: count() }).from(orders);
		const empty = await new Browser().post('/styles/rue-straight/make?/add', { units: 'cm', waist: '70', hip: '96', length: '60', waistToHip: '20', fabricId: String(crepe.id) });
		expect(empty.status).toBe(400);
		expect(await empty.text()).toContain('not enough of this fabric left');
		expect(await db.select({ n: count() }).from(orders)).toEqual(before);
	});
});
