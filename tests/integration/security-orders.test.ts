// Orders placed twice, floods of orders, and messages that must say what really happened.
import { describe, expect, it } from 'vitest';
import { and, eq, inArray, like } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fabrics, measurementProfiles, orderEvents, orders, users } from '../../src/lib/server/db/schema';
import { startAppInstance } from '../support/app';
import { testDb } from '../support/db';
import { actionMessage, ownerCookie, refundFormKey, refundsOf, sessionsFor } from '../support/payments';
import { postForm, signInCookie } from '../support/session';
import { Browser, GUEST_ADDRESS, addToBag, eventually, mailsTo, paidOrder } from '../support/shop';

const db = testDb();
const unique = (tag: string) => `${tag}-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.com`;
const twillId = async () => (await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill')))[0].id;
const receivedMails = async (email: string) => (await mailsTo(email)).filter((m) => /received: awaiting payment/.test(m.subject));

describe('the checkout form places one order however often it is sent (finding 11)', () => {
	it('turns two concurrent submits of one form into one order, one mail and one payment page', async () => {
		const browser = new Browser();
		expect((await addToBag(browser, 'rue-straight', { waist: 70, hip: 96, length: 60, waistToHip: 20, fabricId: await twillId() })).status).toBe(303);
		const page = await (await browser.get('/checkout')).text();
		const key = page.match(/name="checkoutKey"[^>]*value="([^"]+)"/)?.[1] ?? page.match(/value="([^"]+)"[^>]*name="checkoutKey"/)?.[1] ?? '';
		const email = unique('twice');
		const fields = { ...GUEST_ADDRESS, email, checkoutKey: key };
		const [a, b] = await Promise.all([browser.post('/checkout', fields), browser.post('/checkout', fields)]);
		const placed = await db.select().from(orders).where(eq(orders.email, email));
		expect(placed).toHaveLength(1);
		expect(placed[0].checkoutKey).toBe(key);
		// Both answers lead to the same payment page.
		expect(a.headers.get('location')).toMatch(/\/pay\/cs_/);
		expect(b.headers.get('location')).toBe(a.headers.get('location'));
		// Sent once more later (the bag is empty by then): still that order's payment page.
		const again = await browser.post('/checkout', fields);
		expect(again.headers.get('location')).toBe(a.headers.get('location'));
		await eventually(async () => (await receivedMails(email)).length > 0);
		await new Promise((r) => setTimeout(r, 1500));
		expect(await receivedMails(email)).toHaveLength(1);
	});
});

describe('POST /api/orders is limited per client and per e-mail address (finding 11)', () => {
	async function place(app: { url: string }, client: string, email: string) {
		const res = await fetch(`${app.url}/api/orders`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', 'x-forwarded-for': client },
			body: JSON.stringify({ items: [{ measurements: { waist: 70, hip: 96, length: 60 }, style: 'rue-straight', fabricId: await twillId() }], shopper: { ...GUEST_ADDRESS, email, measurementConsent: true, madeToMeasure: true } })
		});
		return { status: res.status, retryAfter: res.headers.get('retry-after'), body: await res.json() };
	}
	// A second app server on the same database, told to read the client's address from X-Forwarded-For (as
	// behind a proxy) so the test can speak as several clients; small limits keep the test short.
	const appWith = () => startAppInstance({ ADDRESS_HEADER: 'x-forwarded-for', ORDER_LIMIT_PER_CLIENT: '4', ORDER_LIMIT_PER_EMAIL: '2' });
	const client = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}`;

	it('places four orders for one client and answers the rest 429 with Retry-After, mailing nobody else', async () => {
		const app = await appWith();
		const from = client();
		const emails = Array.from({ length: 7 }, () => unique('flood'));
		const answers = await Promise.all(emails.map((e) => place(app, from, e)));
		expect(answers.map((a) => a.status).sort()).toEqual([201, 201, 201, 201, 429, 429, 429]);
		for (const refused of answers.filter((a) => a.status === 429)) {
			expect(Number(refused.retryAfter)).toBeGreaterThan(0);
			expect(refused.body.message).toMatch(/too many orders from your address/i);
		}
		expect(await db.select().from(orders).where(inArray(orders.email, emails))).toHaveLength(4);
		await new Promise((r) => setTimeout(r, 1500));
		const mailed = await Promise.all(emails.map(async (e) => (await receivedMails(e)).length));
		expect(mailed.reduce((s, n) => s + n, 0)).toBe(4);
	});

	it('places two orders for one e-mail address, whichever clients send them, then answers 429', async () => {
		const app = await appWith();
		const email = unique('one-address');
		const answers = [];
		for (let i = 0; i < 3; i++) answers.push(await place(app, client(), email));
		expect(answers.map((a) => a.status)).toEqual([201, 201, 429]);
		expect(answers[2].body.message).toMatch(/too many orders for this e-mail address/i);
		expect(Number(answers[2].retryAfter)).toBeGreaterThan(0);
		expect(await db.select().from(orders).where(eq(orders.email, email))).toHaveLength(2);
	});
});

describe('messages say what happened (finding 12)', () => {
	it('makes one refund of three concurrent requests and says the other two did nothing', async () => {
		const { number } = await paidOrder(await twillId(), unique('refund'));
		const order = await eventually(async () => (await db.select().from(orders).where(and(eq(orders.number, number), eq(orders.status, 'paid'))))[0]);
		const owner = await ownerCookie();
		const refundKey = await refundFormKey(order.id, owner);
		const fields = { amount: '10.00', reason: 'Hem shortened by the shopper', refundKey };
		const answers = await Promise.all([1, 2, 3].map(() => postForm(`/admin/orders/${order.id}?/refund`, fields, owner)));
		const messages = await Promise.all(answers.map(async (r) => actionMessage(await r.text()) ?? `status ${r.status}`));
		expect(messages.filter((m) => /^Refund of €10\.00 sent/.test(m))).toHaveLength(1);
		expect(messages.filter((m) => /already sent.*nothing more was refunded/i.test(m))).toHaveLength(2);

		const [session] = (await sessionsFor(number)).filter((s) => s.status === 'complete');
		expect((await refundsOf(session.payment_intent!)).map((r) => r.amount)).toEqual([1000]);
		const notes = await db.select().from(orderEvents).where(and(eq(orderEvents.orderId, order.id), like(orderEvents.note, 'Refund of%requested%')));
		expect(notes).toHaveLength(1);
	});

	it('says it found no such card when someone deletes a measure card that is not hers, and keeps it', async () => {
		const [priya, lotte] = ['priya@example.com', 'lotte@example.com'];
		const [owner] = await db.select().from(users).where(eq(users.email, lotte));
		const [{ id }] = await db.insert(measurementProfiles).values({ userId: owner.id, name: 'Lotte, winter', waist: 71, hip: 97, length: 62, consentAt: new Date() }).$returningId();
		const cookie = await signInCookie(priya, DEMO_SIGN_INS.password);
		const res = await postForm('/account?/deleteCard', { id: String(id) }, cookie);
		const text = await res.text();
		expect(text).toMatch(/no measure card of yours/i);
		expect(text).not.toMatch(/Measure card deleted/);
		expect(await db.select().from(measurementProfiles).where(eq(measurementProfiles.id, id))).toHaveLength(1);
	});
});
