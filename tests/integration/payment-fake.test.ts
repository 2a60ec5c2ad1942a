// The payment fake, driven the way the shop drives it: the official SDK for the
// API, a browser-style form POST for the hosted page, and a small webhook
// receiver that checks signatures with the SDK's own constructEvent.
// Test card numbers are the provider's published ones (its testing docs).
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentFake } from '../../fakes/payments/server.js';

const SECRET = 'whsec_quarterline_test';
const SUCCESS = '4242 4242 4242 4242';
const DECLINE = '4000 0000 0000 0002';

type Delivery = { body: string; signature: string; event: Stripe.Event };

let receiver: Server;
const deliveries: Delivery[] = [];
/** Statuses the receiver answers before it goes back to 200. */
const plan: number[] = [];
let fake: Awaited<ReturnType<typeof startPaymentFake>>;
let stripe: Stripe;

async function waitFor<T>(probe: () => T | undefined | false | 0, what: string, ms = 5000): Promise<T> {
	const until = Date.now() + ms;
	for (;;) {
		const v = probe();
		if (v) return v;
		if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
		await new Promise((r) => setTimeout(r, 20));
	}
}

const forSession = (type: string, id: string) =>
	deliveries.filter((d) => d.event.type === type && (d.event.data.object as { id: string }).id === id);

/** Wait until `count` deliveries of `type` for session `id` have arrived; returns them. */
const delivered = (type: string, id: string, count = 1) =>
	waitFor(() => forSession(type, id).length >= count && forSession(type, id), `${count} × ${type}`);

function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}, options?: Stripe.RequestOptions) {
	return stripe.checkout.sessions.create(
		{
			mode: 'payment',
			line_items: [
				{
					price_data: {
						currency: 'eur',
						unit_amount: 12900,
						product_data: { name: 'Pencil skirt, wool crepe' }
					},
					quantity: 2
				},
				{
					price_data: { currency: 'eur', unit_amount: 1500, product_data: { name: 'Shipping' } },
					quantity: 1
				}
			],
			success_url: 'http://127.0.0.1:3000/checkout/done?session={CHECKOUT_SESSION_ID}',
			cancel_url: 'http://127.0.0.1:3000/bag',
			client_reference_id: 'Q-1042',
			customer_email: 'ines.marlow@example.test',
			metadata: { order_id: 'Q-1042' },
			...extra
		},
		options
	);
}

async function payViaControl(id: string, card: string) {
	const res = await fetch(`${fake.url}/_fake/sessions/${id}/pay`, {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify({ card })
	});
	return { status: res.status, body: await res.json() };
}

function postForm(url: string, fields: Record<string, string>) {
	return fetch(url, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams(fields).toString()
	});
}

beforeAll(async () => {
	receiver = createServer((req, res) => {
		let body = '';
		req.setEncoding('utf8');
		req.on('data', (c: string) => (body += c));
		req.on('end', () => {
			const signature = String(req.headers['stripe-signature'] ?? '');
			deliveries.push({ body, signature, event: JSON.parse(body) });
			res.statusCode = plan.shift() ?? 200;
			res.end();
		});
	});
	await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', r));
	const port = (receiver.address() as AddressInfo).port;
	fake = await startPaymentFake({
		port: 0,
		webhookUrl: `http://127.0.0.1:${port}/api/webhooks/stripe`,
		webhookSecret: SECRET,
		retryDelaysMs: [20, 40, 60],
		expiryCheckMs: 100
	});
	stripe = new Stripe('sk_test_quarterline', {
		host: '127.0.0.1',
		port: fake.port,
		protocol: 'http',
		maxNetworkRetries: 0
	});
});

afterAll(async () => {
	await fake?.close();
	await new Promise((r) => receiver?.close(r));
});

describe('payment fake: API through the SDK', () => {
	it('creates and retrieves a checkout session', async () => {
		const s = await newSession();
		expect(s.id).toMatch(/^cs_test_/);
		expect(s.object).toBe('checkout.session');
		expect(s.amount_total).toBe(2 * 12900 + 1500);
		expect(s.currency).toBe('eur');
		expect([s.status, s.payment_status, s.payment_intent]).toEqual(['open', 'unpaid', null]);
		expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
		expect(s.metadata).toEqual({ order_id: 'Q-1042' });

		const again = await stripe.checkout.sessions.retrieve(s.id, { expand: ['line_items'] });
		expect(again.client_reference_id).toBe('Q-1042');
		expect(again.customer_email).toBe('ines.marlow@example.test');
		expect(again.line_items?.data.map((li) => [li.description, li.quantity, li.amount_total])).toEqual([
			['Pencil skirt, wool crepe', 2, 25800],
			['Shipping', 1, 1500]
		]);
	});

	it('answers the same Idempotency-Key with the same session, and refuses it for other parameters', async () => {
		const a = await newSession({}, { idempotencyKey: 'order-Q-1042-try-1' });
		const b = await newSession({}, { idempotencyKey: 'order-Q-1042-try-1' });
		expect(b.id).toBe(a.id);
		const err = await newSession({ client_reference_id: 'Q-9999' }, { idempotencyKey: 'order-Q-1042-try-1' }).catch(
			(e) => e
		);
		expect(err).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
	});

	it('refuses bad requests in the provider error shape', async () => {
		const noItems = await stripe.checkout.sessions
			.create({ mode: 'payment', success_url: 'http://127.0.0.1:3000/done' })
			.catch((e) => e);
		expect(noItems).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		expect([noItems.statusCode, noItems.param]).toEqual([400, 'line_items']);

		const unknown = await stripe.checkout.sessions.retrieve('cs_test_nothing_here').catch((e) => e);
		expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		expect([unknown.statusCode, unknown.code]).toEqual([404, 'resource_missing']);
	});

	it('answers a wrong or missing API key with 401', async () => {
		const live = new Stripe('sk_live_not_here', {
			host: '127.0.0.1',
			port: fake.port,
			protocol: 'http',
			maxNetworkRetries: 0
		});
		const err = await live.checkout.sessions.retrieve('cs_test_x').catch((e) => e);
		expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
		expect(err.statusCode).toBe(401);

		const bare = await fetch(`${fake.url}/v1/checkout/sessions/cs_test_x`);
		expect(bare.status).toBe(401);
		const body = await bare.json();
		expect(body.error.type).toBe('invalid_request_error');
		expect(body.error.message).toMatch(/API key/);
	});
});

describe('payment fake: paying', () => {
	it('pays through /_fake and sends a checkout.session.completed webhook the SDK verifies', async () => {
		const s = await newSession();
		const paid = await payViaControl(s.id, SUCCESS);
		expect(paid.status).toBe(200);
		expect(paid.body.redirect_url).toBe(`http://127.0.0.1:3000/checkout/done?session=${s.id}`);

		const after = await stripe.checkout.sessions.retrieve(s.id);
		expect([after.status, after.payment_status]).toEqual(['complete', 'paid']);
		const pi = await stripe.paymentIntents.retrieve(String(after.payment_intent));
		expect([pi.id.startsWith('pi_'), pi.status, pi.amount, pi.metadata.order_id]).toEqual([
			true,
			'succeeded',
			27300,
			'Q-1042'
		]);
		expect(String(pi.latest_charge)).toMatch(/^ch_/);

		const [d] = await delivered('checkout.session.completed', s.id);
		const event = stripe.webhooks.constructEvent(d.body, d.signature, SECRET);
		expect(event.type).toBe('checkout.session.completed');
		expect(event.id).toMatch(/^evt_/);
		const obj = event.data.object as Stripe.Checkout.Session;
		expect([obj.payment_status, obj.metadata?.order_id, obj.payment_intent]).toEqual(['paid', 'Q-1042', pi.id]);

		const tampered = d.body.replace('"amount_total": 27300', '"amount_total": 100');
		expect(tampered).not.toBe(d.body);
		expect(() => stripe.webhooks.constructEvent(tampered, d.signature, SECRET)).toThrow(
			Stripe.errors.StripeSignatureVerificationError
		);
		expect(() => stripe.webhooks.constructEvent(d.body, d.signature, 'whsec_someone_else')).toThrow(
			Stripe.errors.StripeSignatureVerificationError
		);
	});

	it('shows the hosted page and redirects a successful form POST with 303', async () => {
		const s = await newSession();
		const page = await fetch(String(s.url));
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('<html lang="en">');
		expect(html).toContain('Quarterline test payment — no real money moves');
		expect(html).toContain('Pencil skirt, wool crepe');
		expect(html).toContain('€273.00');
		expect(html).toMatch(/<label for="card">Card number<\/label>/);
		expect(html).toMatch(/<button type="submit">Pay €273.00<\/button>/);
		expect(html).toContain('href="http://127.0.0.1:3000/bag"');

		const res = await postForm(String(s.url), { card: SUCCESS, exp: '12 / 40', cvc: '123' });
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toBe(`http://127.0.0.1:3000/checkout/done?session=${s.id}`);
		expect((await stripe.checkout.sessions.retrieve(s.id)).payment_status).toBe('paid');
		expect(await (await fetch(String(s.url))).text()).toContain('This payment is complete');
	});

	it('keeps a session open after a declined card, explains other numbers, and lets the shopper try again', async () => {
		const s = await newSession();
		const declined = await postForm(String(s.url), { card: DECLINE, exp: '12/40', cvc: '123' });
		expect(declined.status).toBe(402);
		expect(await declined.text()).toContain('Your card was declined. No money was taken.');

		const other = await postForm(String(s.url), {
			card: '5555 1234 5678 9012',
			exp: '12/40',
			cvc: '123'
		});
		expect(await other.text()).toContain('This is a test payment page: use a test card number');

		const control = await payViaControl(s.id, DECLINE);
		expect([control.status, control.body.outcome, control.body.error.code]).toEqual([402, 'declined', 'card_declined']);

		const still = await stripe.checkout.sessions.retrieve(s.id);
		expect([still.status, still.payment_status, still.payment_intent]).toEqual(['open', 'unpaid', null]);

		const retry = await postForm(String(s.url), { card: SUCCESS, exp: '12/40', cvc: '123' });
		expect(retry.status).toBe(303);
		await delivered('checkout.session.completed', s.id);
		expect(forSession('checkout.session.completed', s.id)).toHaveLength(1);
	});
});

describe('payment fake: webhook delivery', () => {
	it('retries a receiver that answers 500 twice, then 200: three attempts', async () => {
		const s = await newSession();
		plan.push(500, 500);
		await payViaControl(s.id, SUCCESS);
		const rec = await waitFor(
			() =>
				fake.events.find(
					(e) => e.type === 'checkout.session.completed' && e.event.data.object.id === s.id && e.status === 'delivered'
				),
			'delivered after retries'
		);
		expect(rec.attempts.map((a) => a.status)).toEqual([500, 500, 200]);
		const got = forSession('checkout.session.completed', s.id);
		expect(got).toHaveLength(3);
		for (const d of got) expect(stripe.webhooks.constructEvent(d.body, d.signature, SECRET).id).toBe(rec.id);

		const listed = await (await fetch(`${fake.url}/_fake/events`)).json();
		const same = listed.data.find((e: { id: string }) => e.id === rec.id);
		expect([same.status, same.attempts.length]).toEqual(['delivered', 3]);
	});

	it('gives up after the last delay, and redelivers on request with a fresh signature', async () => {
		const s = await newSession();
		plan.push(500, 500, 500, 500);
		await payViaControl(s.id, SUCCESS);
		const rec = await waitFor(
			() => fake.events.find((e) => e.event.data.object.id === s.id && e.status === 'failed'),
			'given up'
		);
		expect(rec.attempts).toHaveLength(4); // the first try and one per retry delay

		const res = await fetch(`${fake.url}/_fake/events/${rec.id}/redeliver`, { method: 'POST' });
		expect(res.status).toBe(202);
		await waitFor(() => rec.status === 'delivered', 'redelivered');
		const got = forSession('checkout.session.completed', s.id);
		expect(got).toHaveLength(5);
		const last = got[4];
		expect(stripe.webhooks.constructEvent(last.body, last.signature, SECRET).id).toBe(rec.id);
	});

	it('expires a session through the SDK and sends checkout.session.expired', async () => {
		const s = await newSession();
		const expired = await stripe.checkout.sessions.expire(s.id);
		expect([expired.status, expired.url]).toEqual(['expired', null]);
		const [d] = await delivered('checkout.session.expired', s.id);
		expect(stripe.webhooks.constructEvent(d.body, d.signature, SECRET).type).toBe('checkout.session.expired');

		expect((await payViaControl(s.id, SUCCESS)).status).toBe(409);
		expect(await (await fetch(`${fake.url}/pay/${s.id}`)).text()).toContain('This payment page has expired');
		const again = await stripe.checkout.sessions.expire(s.id).catch((e) => e);
		expect(again).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
	});

	it('expires a session on its own once expires_at passes', async () => {
		const s = await newSession({ expires_at: Math.floor(Date.now() / 1000) + 1 });
		await waitFor(() => forSession('checkout.session.expired', s.id).length === 1, 'timer expiry', 4000);
		expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('expired');
	});

	it('refunds in part, then in full, sending charge.refunded each time, and refuses more than is left', async () => {
		const s = await newSession();
		await payViaControl(s.id, SUCCESS);
		const pi = String((await stripe.checkout.sessions.retrieve(s.id)).payment_intent);
		const refundEvents = () =>
			deliveries.filter(
				(d) => d.event.type === 'charge.refunded' && (d.event.data.object as Stripe.Charge).payment_intent === pi
			);

		const part = await stripe.refunds.create({
			payment_intent: pi,
			amount: 5000,
			reason: 'requested_by_customer'
		});
		expect([part.amount, part.status]).toEqual([5000, 'succeeded']);
		expect((await stripe.refunds.retrieve(part.id)).amount).toBe(5000);

		const tooMuch = await stripe.refunds.create({ payment_intent: pi, amount: 30000 }).catch((e) => e);
		expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		expect([tooMuch.statusCode, tooMuch.code]).toEqual([400, 'amount_too_large']);

		const rest = await stripe.refunds.create({ payment_intent: pi });
		expect(rest.amount).toBe(27300 - 5000);

		await waitFor(() => refundEvents().length === 2, 'two refund webhooks');
		const charges = refundEvents().map(
			(d) => stripe.webhooks.constructEvent(d.body, d.signature, SECRET).data.object as Stripe.Charge
		);
		expect(charges.map((c) => [c.amount, c.amount_refunded, c.refunded, c.metadata.order_id])).toEqual([
			[27300, 5000, false, 'Q-1042'],
			[27300, 27300, true, 'Q-1042']
		]);

		const none = await stripe.refunds.create({ payment_intent: pi, amount: 1 }).catch((e) => e);
		expect(none).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		expect(none.code).toBe('charge_already_refunded');
	});

	it('lists sessions and refunds newest first, filtered and paged as the provider documents', async () => {
		const a = await newSession();
		const b = await newSession();
		await stripe.checkout.sessions.expire(a.id);
		const open = await stripe.checkout.sessions.list({ status: 'open', limit: 100 });
		expect(open.data.map((s) => s.id)).toContain(b.id);
		expect(open.data.map((s) => s.id)).not.toContain(a.id);
		const newest = await stripe.checkout.sessions.list({ limit: 1 });
		expect([newest.data[0].id, newest.has_more]).toEqual([b.id, true]);
		const next = await stripe.checkout.sessions.list({ limit: 1, starting_after: b.id });
		expect(next.data[0].id).toBe(a.id);

		await payViaControl(b.id, SUCCESS);
		const pi = String((await stripe.checkout.sessions.retrieve(b.id)).payment_intent);
		expect((await stripe.checkout.sessions.list({ payment_intent: pi })).data.map((s) => s.id)).toEqual([b.id]);
		const first = await stripe.refunds.create({ payment_intent: pi, amount: 100 });
		const second = await stripe.refunds.create({ payment_intent: pi, amount: 200 });
		const refunds = await stripe.refunds.list({ payment_intent: pi });
		expect(refunds.data.map((r) => [r.id, r.amount])).toEqual([
			[second.id, 200],
			[first.id, 100]
		]);
		const bad = await stripe.refunds.list({ limit: 101 }).catch((e) => e);
		expect([bad.statusCode, bad.param]).toEqual([400, 'limit']);
	});
});
