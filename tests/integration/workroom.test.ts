import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fabrics, orderEvents, orderLines, orders } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { actionMessage, refundFormKey } from '../support/payments';
import { postForm, signInCookie } from '../support/session';
import { eventually, mailsTo, paidOrder } from '../support/shop';

const db = testDb();
const cookie: Record<'shopper' | 'cutter' | 'owner', string> = { shopper: '', cutter: '', owner: '' };
const cutter2 = DEMO_SIGN_INS.accounts.filter((a) => a.role === 'cutter')[1];
let cutter2Cookie = '';

beforeAll(async () => {
	for (const role of ['shopper', 'cutter', 'owner'] as const) cookie[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	cutter2Cookie = await signInCookie(cutter2.email, DEMO_SIGN_INS.password);
});

async function orderId(number: string) {
	const [o] = await db.select().from(orders).where(eq(orders.number, number));
	return o;
}

function move(id: number, body: Record<string, unknown>, who = cookie.cutter) {
	return fetch(`${testEnv.appUrl}/api/workroom/orders/${id}/stage`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: who, origin: testEnv.appUrl }, body: JSON.stringify(body) });
}

async function twill() {
	const [f] = await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill'));
	return f;
}

describe('who may open the workroom and the back office', () => {
	// Orders 4 and 5 for the printed files: the access walk erases, at her request, the measurements of a shopper's finished orders (order 1 among them), and a ticket then has nothing to draft.
	const pages = ['/workroom', '/workroom/lays', '/workroom/orders/1', '/workroom/orders/4/ticket.pdf', '/workroom/tickets.pdf?ids=4', '/api/workroom/queue', '/api/workroom/summary'];
	const admin = ['/admin', '/admin/orders', '/admin/orders/1', '/admin/orders.csv', '/admin/rules'];
	for (const path of [...pages, ...admin]) {
		const ownerOnly = path.startsWith('/admin');
		const api = path.startsWith('/api/');
		it(`${path}: anonymous ${api ? 401 : 303}, shopper 403, cutter ${ownerOnly ? 403 : 200}, owner 200`, async () => {
			const get = (c?: string) => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: c ? { cookie: c } : {} }).then((r) => r.status);
			expect(await get()).toBe(api ? 401 : 303);
			expect(await get(cookie.shopper)).toBe(403);
			expect(await get(cookie.cutter)).toBe(ownerOnly ? 403 : 200);
			expect(await get(cookie.owner)).toBe(200);
		});
	}

	it('refuses a stage move from a shopper and from nobody', async () => {
		expect((await move(1, { to: 'cutting' }, cookie.shopper)).status).toBe(403);
		expect((await move(1, { to: 'cutting' }, '')).status).toBe(401);
	});

	it('does not let a shopper open another shopper’s order by changing the number', async () => {
		// QL-1003 belongs to the demo shopper Lotte; the demo shopper Priya tries it.
		const page = await fetch(`${testEnv.appUrl}/orders/QL-1003`, { headers: { cookie: cookie.shopper } });
		expect(page.status).toBe(404);
		const api = await fetch(`${testEnv.appUrl}/api/orders/QL-1003`, { headers: { cookie: cookie.shopper } });
		expect(api.status).toBe(404);
		const own = await fetch(`${testEnv.appUrl}/orders/QL-1001`, { headers: { cookie: cookie.shopper } });
		expect(own.status).toBe(200);
	});
});

describe('moving an order through the workroom', () => {
	it('cuts, sews, finishes and ships, writing who and when, with the stock taken off once', async () => {
		const fabric = await twill();
		const { number, email } = await paidOrder(fabric.id);
		const o = await orderId(number);
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, o.id));
		expect((await move(o.id, { to: 'sewn' })).status).toBe(409);
		// Two cutters press "Mark cut" at the same moment: one wins, the other is told it moved on.
		const [a, b] = await Promise.all([move(o.id, { to: 'cutting' }), move(o.id, { to: 'cutting' }, cutter2Cookie)]);
		expect([a.status, b.status].sort()).toEqual([200, 409]);
		const after = await twill();
		expect(after.stockCm).toBeCloseTo(fabric.stockCm - line.fabricCm, 1);
		expect((await move(o.id, { to: 'sewn' })).status).toBe(200);
		expect((await move(o.id, { to: 'finished' })).status).toBe(200);
		const noTracking = await move(o.id, { to: 'shipped' });
		expect(noTracking.status).toBe(400);
		expect((await noTracking.json()).message).toContain('tracking number');
		expect((await move(o.id, { to: 'shipped', carrier: 'Parcelkite', tracking: 'PK999001' })).status).toBe(200);
		const events = await db.select().from(orderEvents).where(eq(orderEvents.orderId, o.id));
		expect(events.filter((e) => e.kind === 'stage').map((e) => e.toStatus)).toEqual(['awaiting_payment', 'paid', 'cutting', 'sewn', 'finished', 'shipped']);
		expect(events.find((e) => e.toStatus === 'sewn')?.actorLabel).toBe('Tomasz Weller');
		const shipped = await eventually(async () => (await mailsTo(email)).find((m) => m.subject === `Order ${number} has shipped`));
		expect(shipped.text).toContain('PK999001');
	});

	it('refuses to cut past the stock, unless the owner overrides', async () => {
		const fabric = await twill();
		const { number } = await paidOrder(fabric.id);
		const o = await orderId(number);
		await db.update(fabrics).set({ stockCm: 20 }).where(eq(fabrics.id, fabric.id));
		try {
			const refused = await move(o.id, { to: 'cutting' });
			expect(refused.status).toBe(409);
			expect((await refused.json()).message).toContain('Not enough Harbour wool twill');
			expect((await twill()).stockCm).toBe(20);
			expect((await move(o.id, { to: 'cutting', overrideStock: true })).status).toBe(409); // a cutter cannot override
			expect((await move(o.id, { to: 'cutting', overrideStock: true }, cookie.owner)).status).toBe(200);
			expect((await twill()).stockCm).toBeLessThan(0);
		} finally {
			await db.update(fabrics).set({ stockCm: fabric.stockCm }).where(eq(fabrics.id, fabric.id));
		}
	});

	it('lists the queue oldest promised date first', async () => {
		const res = await fetch(`${testEnv.appUrl}/api/workroom/queue`, { headers: { cookie: cookie.cutter } });
		const { queue } = await res.json();
		const dates = queue.map((q: { promisedDate: string }) => q.promisedDate);
		expect(dates).toEqual([...dates].sort());
		expect(queue.every((q: { status: string }) => q.status === 'paid')).toBe(true);
	});
});

describe('refunds through the payment fake', () => {
	it('refunds part, then the rest, and the order follows the provider’s events', async () => {
		const fabric = await twill();
		const { number } = await paidOrder(fabric.id);
		// The refund form shows once the provider's payment event has marked the order paid.
		const o = await eventually(async () => ((await orderId(number)).status === 'paid' ? orderId(number) : null));
		// Each refund from the page as it loads, with the form's own key.
		const refund = async (amount: string) => postForm(`/admin/orders/${o.id}?/refund`, { amount, reason: 'test', refundKey: await refundFormKey(o.id, cookie.owner) }, cookie.owner);
		const first = await refund('10.00');
		expect(actionMessage(await first.text())).toMatch(/^Refund of €10\.00 sent to the payment service/);
		const partial = await eventually(async () => ((await orderId(number)).refundedTotal === 1000 ? orderId(number) : null));
		expect(partial.status).toBe('paid');
		const tooMuch = await refund(String(o.total));
		expect(tooMuch.status).toBe(400);
		expect((await refund(((o.total - 1000) / 100).toFixed(2))).status).toBe(200);
		const full = await eventually(async () => ((await orderId(number)).status === 'refunded' ? orderId(number) : null));
		expect(full.refundedTotal).toBe(o.total);
		expect((await postForm(`/admin/orders/${o.id}?/refund`, { amount: '1' }, cookie.cutter)).status).toBe(403);
	});
});

describe('refunds on the demo atelier’s past orders', () => {
	it('refunds a seeded delivered order through the payment fake, which learned of it at start', async () => {
		const o = await orderId('QL-1002');
		const res = await postForm(`/admin/orders/${o.id}?/refund`, { amount: '12.50', reason: 'hem let down by hand', refundKey: await refundFormKey(o.id, cookie.owner) }, cookie.owner);
		expect(res.status).toBe(200);
		const after = await eventually(async () => ((await orderId('QL-1002')).refundedTotal === o.refundedTotal + 1250 ? orderId('QL-1002') : null));
		expect(after.status).toBe('delivered'); // a partial refund leaves the stage alone
	});
});

describe('the orders table', () => {
	it('searches, filters by stage and exports the same rows as CSV', async () => {
		const get = (q: string) => fetch(`${testEnv.appUrl}${q}`, { headers: { cookie: cookie.owner } });
		const html = await (await get('/admin/orders?q=Sunniva')).text();
		expect(html).toContain('QL-1006');
		expect(html).not.toContain('QL-1007');
		const csv = await (await get('/admin/orders.csv?stage=delivered')).text();
		const lines = csv.trim().split('\r\n');
		expect(lines[0]).toBe('number,createdAt,status,shopperName,email,currency,total,refundedTotal,promisedDate');
		expect(lines.slice(1).every((l) => l.split(',')[2] === 'delivered')).toBe(true);
		expect(lines.slice(1).map((l) => l.split(',')[0]).sort()).toEqual(['QL-1001', 'QL-1002']);
	});
});
