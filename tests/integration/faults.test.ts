import { describe, expect, it } from 'vitest';
import { and, eq, isNull, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import { startMailFake } from '../../fakes/mail/server.js';
import { startMariaDB } from '../../fakes/db/mariadb.js';
import { orderEvents, orders, outbox, payments } from '../../src/lib/server/db/schema';
import { startAppInstance, freePort } from '../support/app';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { Browser, CARDS, addToBag, checkout, eventually, mailsTo, payWithCard } from '../support/shop';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';

const db = testDb();
const stripe = new Stripe('sk_test_offline', { maxNetworkRetries: 0 });

const shopper = (email: string) => ({ email, name: 'Juno Halvorsen', line1: 'Torggata 2', line2: '', city: 'Oslo', postcode: '0181', country: 'NO', measurementConsent: true, madeToMeasure: true });
const skirt = { measurements: { waist: 74, hip: 100, length: 60, waistToHip: 21 }, style: 'rue-straight', fabricId: 1 };

async function apiOrder(base: string, email: string) {
	const res = await fetch(`${base}/api/orders`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ items: [skirt], shopper: shopper(email) }) });
	return { status: res.status, body: await res.json() };
}

const orderByNumber = async (number: string) => (await db.select().from(orders).where(eq(orders.number, number)))[0];

describe('webhooks delivered again and out of order', () => {
	it('pays the order once and sends one mail, whatever the order and number of deliveries', async () => {
		const email = `storm-${Date.now()}@example.com`;
		const { body } = await apiOrder(testEnv.appUrl, email);
		const sessionId = body.paymentUrl.match(/cs_[A-Za-z0-9_]+/)[0];
		const completed = JSON.stringify({ id: `evt_storm_paid_${Date.now()}`, object: 'event', type: 'checkout.session.completed', created: Math.floor(Date.now() / 1000), data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'paid', status: 'complete', amount_total: body.total, currency: body.currency.toLowerCase(), payment_intent: `pi_storm_${Date.now()}` } } });
		const expired = JSON.stringify({ id: `evt_storm_exp_${Date.now()}`, object: 'event', type: 'checkout.session.expired', created: Math.floor(Date.now() / 1000), data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'unpaid', status: 'expired' } } });
		// Five of each, the expiry first and then interleaved: the order must end paid, once. The payment
		// carries the order's amount and currency, as the provider's does (the webhook checks both).
		const deliveries = [expired, completed, expired, completed, completed, expired, completed, expired, completed, expired];
		const send = (payload: string) =>
			fetch(`${testEnv.appUrl}/api/webhooks/stripe`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': stripe.webhooks.generateTestHeaderString({ payload, secret: testEnv.webhookSecret }) }, body: payload });
		const statuses = await Promise.all(deliveries.map(send));
		expect(statuses.every((r) => r.status === 200)).toBe(true);
		const order = await orderByNumber(body.number);
		// An expiry seen before the payment marks that session expired; the later payment still counts.
		expect(order.status).toBe('paid');
		const paidEvents = await db.select().from(orderEvents).where(and(eq(orderEvents.orderId, order.id), eq(orderEvents.toStatus, 'paid')));
		expect(paidEvents).toHaveLength(1);
		await new Promise((r) => setTimeout(r, 1000));
		expect((await mailsTo(email)).filter((m) => m.subject.endsWith('is paid'))).toHaveLength(1);
	});
});

describe('the payment service away at checkout', () => {
	it('keeps the order awaiting payment with a clear retry message, and a later retry completes it', async () => {
		const dead = await freePort();
		const b = await startAppInstance({ STRIPE_API_PORT: String(dead) });
		const browser = new Browser();
		const get = (path: string) => fetch(`${b.url}${path}`, { redirect: 'manual', headers: { cookie: browser.header() } }).then((r) => browser.keep(r));
		const post = (path: string, fields: Record<string, string>) =>
			fetch(`${b.url}${path}`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: b.url, cookie: browser.header() }, body: new URLSearchParams(fields) }).then((r) => browser.keep(r));
		expect((await post('/styles/rue-straight/make?/add', { units: 'cm', waist: '74', hip: '100', length: '60', waistToHip: '21', fabricId: '1' })).status).toBe(303);
		const placed = await post('/checkout', { email: `away-${Date.now()}@example.com`, name: 'Juno Halvorsen', line1: 'Torggata 2', city: 'Oslo', postcode: '0181', country: 'NO', measurementConsent: 'on', madeToMeasure: 'on' });
		expect(placed.status).toBe(303);
		const location = placed.headers.get('location')!;
		expect(location).toMatch(/\/orders\/QL-\d+\?t=.+&retry=1/);
		const page = await (await get(location)).text();
		expect(page).toContain('We could not reach the payment service just now');
		const number = location.match(/QL-\d+/)![0];
		expect((await orderByNumber(number)).status).toBe('awaiting_payment');

		// Later, with the payment service back (the main app talks to the running fake): pay now.
		const token = new URL(location, b.url).searchParams.get('t')!;
		const retry = await fetch(`${testEnv.appUrl}/orders/${number}?/pay&t=${token}`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: testEnv.appUrl }, body: '' });
		expect(retry.status).toBe(303);
		const sessionId = retry.headers.get('location')!.match(/cs_[A-Za-z0-9_]+/)![0];
		await payWithCard(sessionId, CARDS.success);
		await eventually(async () => (await orderByNumber(number)).status === 'paid');
	});
});

describe('the mail server away', () => {
	it('completes the order and sends the mail from the outbox once the server is back', async () => {
		const smtpPort = await freePort();
		const c = await startAppInstance({ SMTP_PORT: String(smtpPort), OUTBOX_INTERVAL_MS: '300', OUTBOX_RETRY_SCALE: '0.02' });
		const email = `nomail-${Date.now()}@example.com`;
		const { status, body } = await apiOrder(c.url, email);
		expect(status).toBe(201);
		const order = await orderByNumber(body.number);
		// The first try (at once, or by the outbox worker if it held the row) fails and is recorded.
		const queued = await eventually(async () => {
			const [row] = await db.select().from(outbox).where(eq(outbox.orderId, order.id));
			return row.attempts >= 1 ? row : null;
		});
		expect(queued.sentAt).toBeNull();
		expect(queued.lastError).toBeTruthy();
		const mail = await startMailFake({ smtpPort });
		try {
			await eventually(async () => (await db.select().from(outbox).where(and(eq(outbox.orderId, order.id), isNull(outbox.sentAt)))).length === 0, 15_000);
			// Every app server drains the shared outbox, so the first app server (with its own mail
			// fake) may send it before this one does: it must arrive once, at one of the two.
			const subject = `Order ${body.number} received: awaiting payment`;
			const here = mail.messages.filter((m: { subject: string }) => m.subject === subject).length;
			const there = (await mailsTo(email)).filter((m) => m.subject === subject).length;
			expect(here + there).toBe(1);
		} finally {
			await mail.close();
		}
	});
});

describe('MariaDB restarted under load', () => {
	it('fails requests cleanly with 503 while it is away, then the pool reconnects; nothing half-written', async () => {
		const url = new URL(testEnv.databaseUrl);
		const app = { user: decodeURIComponent(url.username), password: decodeURIComponent(url.password), database: url.pathname.slice(1) };
		const quote = () => fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ ...skirt }) }).then((r) => r.status);
		expect(await quote()).toBe(200);
		const before = await db.select({ n: sql<number>`COUNT(*)` }).from(orders);
		const { spawnSync } = await import('node:child_process');
		const inFlight = Array.from({ length: 20 }, (_, i) => new Promise((r) => setTimeout(r, i * 15)).then(quote));
		spawnSync('mariadb-admin', ['--no-defaults', `--socket=${process.env.DB_SOCKET}`, '-uroot', 'shutdown']);
		const during = [...(await Promise.all(inFlight)), await quote(), (await apiOrder(testEnv.appUrl, `down-${Date.now()}@example.com`)).status];
		expect(during.every((s) => s === 200 || s === 503)).toBe(true);
		expect(during).toContain(503);
		const down = await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(skirt) });
		expect(down.status).toBe(503);
		expect((await down.json()).message).toContain('not answering for a moment');
		await startMariaDB({ dataDir: process.env.DB_DATA_DIR!, port: Number(process.env.DB_PORT), app });
		await eventually(async () => (await quote()) === 200, 15_000);
		expect(await quote()).toBe(200);
		// Every order has its lines: the outage left no order half-written.
		const [orphans] = (await db.execute(sql`SELECT COUNT(*) AS n FROM \`order\` o LEFT JOIN order_line l ON l.order_id = o.id WHERE l.id IS NULL`)) as unknown as [{ n: number }[]];
		expect(Number(orphans[0].n)).toBe(0);
		const after = await db.select({ n: sql<number>`COUNT(*)` }).from(orders);
		expect(Number(after[0].n)).toBeGreaterThanOrEqual(Number(before[0].n));
	});
});

describe('two app servers on one database', () => {
	it('shares sessions and lets a webhook to one pay a checkout started on the other', async () => {
		const b = await startAppInstance();
		const owner = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
		const cookie = await signInCookie(owner.email, DEMO_SIGN_INS.password);
		const onB = await fetch(`${b.url}/admin`, { redirect: 'manual', headers: { cookie } });
		expect(onB.status).toBe(200);
		// Started on B; the payment fake delivers its webhook to the first app server.
		const { status, body } = await apiOrder(b.url, `two-${Date.now()}@example.com`);
		expect(status).toBe(201);
		const sessionId = body.paymentUrl.match(/cs_[A-Za-z0-9_]+/)[0];
		await payWithCard(sessionId, CARDS.success);
		const paid = await eventually(async () => {
			const o = await orderByNumber(body.number);
			return o.status === 'paid' ? o : null;
		});
		const [p] = await db.select().from(payments).where(eq(payments.checkoutSessionId, sessionId));
		expect(p.state).toBe('paid');
		expect(paid.paidAt).not.toBeNull();
	});

	it('sets a Secure session cookie behind HTTPS', async () => {
		const port = await freePort();
		const origin = `https://127.0.0.1:${port}`;
		// adapter-node takes the public address from ORIGIN, as it does behind a TLS-terminating proxy.
		const d = await startAppInstance({ ORIGIN: origin }, port);
		const owner = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
		const res = await fetch(`http://127.0.0.1:${d.port}/auth/callback/credentials`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', origin }, body: new URLSearchParams({ email: owner.email, password: DEMO_SIGN_INS.password, callbackUrl: '/' }) });
		const cookie = res.headers.getSetCookie().find((c) => c.startsWith('__Secure-authjs.session-token='));
		expect(cookie).toBeDefined();
		expect(cookie).toMatch(/; Secure/i);
		expect(cookie).toMatch(/HttpOnly/i);
		expect(cookie).toMatch(/SameSite=Lax/i);
	});
});

describe('a guest walks the shop while another app server serves her', () => {
	it('keeps her bag across app servers (the bag lives in her cookie)', async () => {
		const b = await startAppInstance();
		const browser = new Browser();
		expect((await addToBag(browser, 'quill-pencil', { waist: 70, hip: 96, length: 62, waistToHip: 20, fabricId: 1 })).status).toBe(303);
		const bag = await fetch(`${b.url}/bag`, { headers: { cookie: browser.header() } });
		expect(await bag.text()).toContain('Quill pencil skirt');
		const { sessionId } = await checkout(browser);
		expect(sessionId).toBeTruthy();
	});
});
