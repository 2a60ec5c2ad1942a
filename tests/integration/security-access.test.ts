import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fabrics, orderEvents, orderLines, orders, payments, users } from '../../src/lib/server/db/schema';
import { freePort, startAppInstance } from '../support/app';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { raw } from '../support/routes';
import { signInCookie } from '../support/session';
import { Browser, addToBag, paidOrder } from '../support/shop';

// The holes a check of the running shop found, each reproduced as an outsider or a role would try
// it, and what the database, the files and the pages must show instead.
const db = testDb();
const who = (role: 'shopper' | 'cutter' | 'owner') => DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
const cookies: Record<'shopper' | 'cutter' | 'owner', string> = { shopper: '', cutter: '', owner: '' };

beforeAll(async () => {
	for (const role of ['shopper', 'cutter', 'owner'] as const) cookies[role] = await signInCookie(who(role).email, DEMO_SIGN_INS.password);
});

const form = (cookie: string) => ({ cookie, 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl, accept: 'text/html' });

describe('access follows the route SvelteKit matched, however the path is spelled', () => {
	it('gives an outsider no orders CSV, no tickets and no queue through percent-encoded paths', async () => {
		const csv = await raw('GET', '/%61dmin/orders.csv');
		expect(csv.status).toBe(303);
		expect(csv.location).toMatch(/^\/signin\?next=/);
		expect(csv.body).not.toContain('@');
		const tickets = await raw('GET', '/%77orkroom/tickets.pdf?ids=1,2');
		expect(tickets.status).toBe(303);
		expect(tickets.headers['content-type'] ?? '').not.toContain('pdf');
		const queue = await raw('GET', '/api/%77orkroom/queue');
		expect(queue.status).toBe(401);
		expect(queue.body).not.toContain('QL-');
	});

	it('does not let a shopper make an account owner', async () => {
		const cutter = who('cutter');
		const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, cutter.email));
		for (const path of [`/%61dmin/staff/${row.id}?/role`, `/admin/staff/${row.id}?/role`, `/ADMIN/staff/${row.id}?/role`]) {
			const res = await raw('POST', path, form(cookies.shopper), 'role=owner&confirm=on');
			expect([403, 404]).toContain(res.status);
		}
		const [after] = await db.select({ role: users.role }).from(users).where(eq(users.id, row.id));
		expect(after.role).toBe('cutter');
	});

	it('refunds nothing for a shopper or a cutter', async () => {
		const { number } = await paidOrder(1);
		const [order] = await db.select().from(orders).where(eq(orders.number, number));
		for (const role of ['shopper', 'cutter'] as const) {
			for (const path of [`/%61dmin/orders/${order.id}?/refund`, `/admin/orders/${order.id}?/refund`]) {
				const res = await raw('POST', path, form(cookies[role]), 'amount=1&reason=x');
				expect(res.status).toBe(403);
			}
		}
		const [after] = await db.select({ refundedTotal: orders.refundedTotal, status: orders.status }).from(orders).where(eq(orders.id, order.id));
		expect(after).toEqual({ refundedTotal: 0, status: 'paid' });
		expect(await db.select().from(orderEvents).where(and(eq(orderEvents.orderId, order.id), eq(orderEvents.kind, 'refund')))).toEqual([]);
		const [p] = await db.select({ refunded: payments.refundedAmount }).from(payments).where(eq(payments.orderId, order.id));
		expect(p.refunded).toBe(0);
	});

	it('moves no order and takes no cloth for a shopper through the workroom API', async () => {
		const { number } = await paidOrder(2);
		const [order] = await db.select().from(orders).where(eq(orders.number, number));
		const [before] = await db.select({ stock: fabrics.stockCm }).from(fabrics).where(eq(fabrics.id, 2));
		for (const path of [`/api/%77orkroom/orders/${order.id}/stage`, `/api/workroom/orders/${order.id}/stage`, `/api/workroom/orders/${order.id}/stage/`]) {
			const res = await raw('POST', path, { cookie: cookies.shopper, 'content-type': 'application/json', origin: testEnv.appUrl }, JSON.stringify({ to: 'cutting' }));
			expect([403, 308]).toContain(res.status);
		}
		const [after] = await db.select({ status: orders.status }).from(orders).where(eq(orders.id, order.id));
		expect(after.status).toBe('paid');
		const [stock] = await db.select({ stock: fabrics.stockCm }).from(fabrics).where(eq(fabrics.id, 2));
		expect(stock.stock).toBe(before.stock);
	});

	it('answers 404, not 500, for ids that cannot be', async () => {
		for (const path of ['/admin/orders/abc', '/admin/orders/99999999999999999999', '/admin/orders/-1', '/admin/orders/1.5', '/admin/catalogue/styles/0', '/admin/staff/not-a-uuid']) {
			expect((await raw('GET', path, { cookie: cookies.owner })).status, path).toBe(404);
		}
		for (const path of ['/workroom/orders/NaN', '/workroom/orders/1e3', '/workroom/orders/99999999999999999999/ticket.pdf', '/orders/QL-abc', '/uploads/abc', '/styles/Rue%20Straight']) {
			expect((await raw('GET', path, { cookie: cookies.cutter })).status, path).toBe(404);
		}
		const api = await raw('POST', '/api/workroom/orders/NaN/stage', { cookie: cookies.cutter, 'content-type': 'application/json', origin: testEnv.appUrl }, '{"to":"cutting"}');
		expect(api.status).toBe(404);
	});
});

describe('page data says no more than the page', () => {
	it("gives the workroom a first name, never the shopper's contact details or payments", async () => {
		const { number, email } = await paidOrder(1);
		const [order] = await db.select().from(orders).where(eq(orders.number, number));
		const [pay] = await db.select().from(payments).where(eq(payments.orderId, order.id));
		for (const path of [`/workroom/orders/${order.id}/__data.json`, `/workroom/orders/${order.id}`, '/workroom/__data.json', '/api/workroom/queue', '/workroom/lays/__data.json']) {
			const res = await raw('GET', path, { cookie: cookies.cutter });
			expect(res.status, path).toBe(200);
			for (const secret of [email, order.shippingAddress.line1, order.shippingAddress.postcode, pay.checkoutSessionId, 'cs_', 'pi_', order.shopperName.split(' ')[1], '"userId"', '"email"']) {
				expect(res.body.includes(secret), `${path} carries ${secret}`).toBe(false);
			}
		}
		const page = await raw('GET', `/workroom/orders/${order.id}`, { cookie: cookies.cutter });
		expect(page.body).toContain(`For ${order.shopperName.split(' ')[0]}`);
	});

	it("keeps a shopper's order page (with her address) from cutters", async () => {
		const res = await raw('GET', '/orders/QL-1001', { cookie: cookies.cutter });
		expect(res.status).toBe(404);
		expect(res.body).not.toContain('Quayside');
		const own = await raw('GET', '/orders/QL-1001', { cookie: cookies.shopper });
		expect(own.body).toContain('Quayside');
	});

	it('tells the back office no user ids, and a signed-in person only her own name and role', async () => {
		const [line] = await db.select({ orderId: orderLines.orderId }).from(orderLines).limit(1);
		const res = await raw('GET', `/admin/orders/${line.orderId}/__data.json`, { cookie: cookies.owner });
		expect(res.status).toBe(200);
		expect(res.body).not.toContain('"userId"');
		expect(res.body).not.toContain('"actorId"');
		expect(res.body).not.toContain('"shippingAddress"');
		const account = await raw('GET', '/account/__data.json', { cookie: cookies.shopper });
		expect(account.body).not.toContain('"userId"');
		expect(account.body).not.toContain('"consentAt"');
	});
});

describe('caching and transport', () => {
	it('marks personal pages private and no-store, and leaves the shop window cacheable', async () => {
		for (const [path, role] of [['/account', 'shopper'], ['/account/orders', 'shopper'], ['/orders/QL-1001', 'shopper'], ['/workroom', 'cutter'], ['/workroom/orders/1', 'cutter'], ['/admin', 'owner'], ['/admin/orders/1', 'owner'], ['/api/workroom/queue', 'cutter'], ['/workroom/orders/1/__data.json', 'cutter']] as const) {
			const res = await raw('GET', path, { cookie: cookies[role] });
			expect(res.status, path).toBe(200);
			expect(res.headers['cache-control'], path).toBe('private, no-store');
		}
		const home = await raw('GET', '/');
		expect(home.headers['cache-control'] ?? '').not.toContain('no-store');
	});

	it('sends HSTS and marks every cookie Secure only when the shop is configured for HTTPS', async () => {
		const plain = await raw('GET', '/');
		expect(plain.headers['strict-transport-security']).toBeUndefined();
		const port = await freePort();
		const origin = `https://127.0.0.1:${port}`;
		const app = await startAppInstance({ ORIGIN: origin }, port);
		const home = await fetch(`${app.url}/`);
		expect(home.headers.get('strict-transport-security')).toBe('max-age=31536000');
		// The bag cookie, set by the measuring form, and the session cookie.
		const browser = new Browser();
		const added = await fetch(`${app.url}/styles/rue-straight/make?/add`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin, accept: 'text/html' },
			body: new URLSearchParams({ units: 'cm', waist: '72', hip: '98', length: '60', waistToHip: '20', fabricId: '1', waistband: 'band', closureKind: 'zip', closurePosition: 'centre-back', vent: 'auto' })
		});
		expect(added.status).toBe(303);
		const bag = added.headers.getSetCookie().find((c) => c.startsWith('ql_bag='));
		expect(bag).toMatch(/; Secure/i);
		const signIn = await fetch(`${app.url}/auth/callback/credentials`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', origin }, body: new URLSearchParams({ email: who('owner').email, password: DEMO_SIGN_INS.password, callbackUrl: '/' }) });
		const set = signIn.headers.getSetCookie();
		expect(set.length).toBeGreaterThan(0);
		for (const c of set) expect(c, c.split('=')[0]).toMatch(/; Secure/i);
		// Over plain HTTP the bag cookie is not Secure (a browser would drop it on a non-local host).
		expect((await addToBag(browser, 'rue-straight', { waist: 72, hip: 98, length: 60, waistToHip: 20, fabricId: 1 })).headers.getSetCookie().find((c) => c.startsWith('ql_bag='))).not.toMatch(/; Secure/i);
	});
});
