// Combined lays: six paid orders of one cloth laid together from the lays view, then marked cut at the
// same moment by two cutters. One wins: all six move to cutting in one transaction with an event each,
// the lay's length comes off the shelf once; the other is told the lay is already cut (409).
import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq, inArray } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { combinedLayOrders, combinedLays, fabrics, orderEvents, orders } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { eventually, paidOrder } from '../support/shop';

const db = testDb();
const cutters = DEMO_SIGN_INS.accounts.filter((a) => a.role === 'cutter');
let cutterA = '';
let cutterB = '';
let shopper = '';

beforeAll(async () => {
	cutterA = await signInCookie(cutters[0].email, DEMO_SIGN_INS.password);
	cutterB = await signInCookie(cutters[1].email, DEMO_SIGN_INS.password);
	shopper = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === 'shopper')!.email, DEMO_SIGN_INS.password);
});

function post(path: string, fields: [string, string][], cookie: string) {
	return fetch(`${testEnv.appUrl}${path}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: testEnv.appUrl, cookie },
		body: new URLSearchParams(fields)
	});
}

describe('a combined lay of six orders', () => {
	it('is laid from the lays view, drawn, and cut once: six orders move together, the cloth comes off once, a second cutter gets 409', async () => {
		const [cloth] = await db.select().from(fabrics).where(eq(fabrics.slug, 'oat-linen-canvas'));
		await db.update(fabrics).set({ stockCm: 5000 }).where(eq(fabrics.id, cloth.id));
		const styles = ['rue-straight', 'meadow-a-line', 'quill-pencil', 'rue-straight', 'swing-half-circle', 'meadow-a-line'];
		const numbers: string[] = [];
		for (const style of styles) numbers.push((await paidOrder(cloth.id, undefined, style)).number);
		const six = await eventually(async () => {
			const rows = await db.select().from(orders).where(inArray(orders.number, numbers));
			return rows.length === 6 && rows.every((o) => o.status === 'paid') ? rows : null;
		}, 20_000);
		const ids = six.map((o) => o.id);

		// The view lists them under the cloth.
		const view = await fetch(`${testEnv.appUrl}/workroom/lays`, { headers: { cookie: cutterA } }).then((r) => r.text());
		for (const n of numbers) expect(view).toContain(n);

		// Too few orders: a clear message and no lay.
		const before = (await db.select().from(combinedLays)).length;
		const one = await post('/workroom/lays?/lay', [['fabricId', String(cloth.id)], ['ids', String(ids[0])]], cutterA);
		expect(one.status).toBe(400);
		expect(await one.text()).toContain('at least two orders');
		expect((await db.select().from(combinedLays)).length).toBe(before);
		// A shopper cannot make one.
		expect((await post('/workroom/lays?/lay', [['fabricId', String(cloth.id)], ...ids.map((id): [string, string] => ['ids', String(id)])], shopper)).status).toBe(403);

		const made = await post('/workroom/lays?/lay', [['fabricId', String(cloth.id)], ...ids.map((id): [string, string] => ['ids', String(id)])], cutterA);
		expect(made.status).toBe(303);
		const layId = Number(made.headers.get('location')!.split('/').pop());
		const [lay] = await db.select().from(combinedLays).where(eq(combinedLays.id, layId));
		expect(lay.status).toBe('open');
		expect((await db.select().from(combinedLayOrders).where(eq(combinedLayOrders.layId, layId))).map((r) => r.orderId).sort()).toEqual([...ids].sort());
		// Every piece of every order is on it, and the figures add up: saved = Σ alone − combined.
		expect(new Set(lay.layout.pieces.map((p) => p.group)).size).toBe(6);
		const alone = lay.lines.reduce((a, l) => a + l.aloneCm, 0);
		expect(lay.savedCm).toBeCloseTo(alone - lay.lengthCm, 0);
		expect(lay.savedCm).toBeGreaterThan(0);
		expect(lay.utilisation).toBeGreaterThan(0.5);
		expect(lay.utilisation).toBeLessThan(1);

		// The lay page shows the figures and draws the lay.
		const page = await fetch(`${testEnv.appUrl}/workroom/lays/${layId}`, { headers: { cookie: cutterA } }).then((r) => r.text());
		expect(page).toContain('Mark this lay cut');
		expect(page).toContain(`${(lay.lengthCm / 100).toFixed(2)} m`);
		expect(page).toContain('<svg');
		expect(page).toContain(`Combined lay ${layId}: `);

		const [stockBefore] = await db.select().from(fabrics).where(eq(fabrics.id, cloth.id));
		const [a, b] = await Promise.all([post(`/workroom/lays/${layId}?/cut`, [], cutterA), post(`/workroom/lays/${layId}?/cut`, [], cutterB)]);
		expect([a.status, b.status].sort()).toEqual([200, 409]);
		const loser = a.status === 409 ? a : b;
		expect(await loser.text()).toContain('This lay was already marked cut by');

		const after = await db.select().from(orders).where(inArray(orders.id, ids));
		expect(after.every((o) => o.status === 'cutting')).toBe(true);
		const events = await db.select().from(orderEvents).where(and(inArray(orderEvents.orderId, ids), eq(orderEvents.toStatus, 'cutting')));
		expect(events.length).toBe(6);
		expect(events.every((e) => e.note?.startsWith(`Cut on lay ${layId}`))).toBe(true);
		const [stockAfter] = await db.select().from(fabrics).where(eq(fabrics.id, cloth.id));
		expect(stockAfter.stockCm).toBeCloseTo(stockBefore.stockCm - lay.lengthCm, 1);
		const [cut] = await db.select().from(combinedLays).where(eq(combinedLays.id, layId));
		expect(cut.status).toBe('cut');

		// A retry changes nothing.
		expect((await post(`/workroom/lays/${layId}?/cut`, [], cutterA)).status).toBe(409);
		const [stockLater] = await db.select().from(fabrics).where(eq(fabrics.id, cloth.id));
		expect(stockLater.stockCm).toBe(stockAfter.stockCm);
	}, 120_000);

	it('refuses a lay whose order has moved on, and changes nothing', async () => {
		const [cloth] = await db.select().from(fabrics).where(eq(fabrics.slug, 'oat-linen-canvas'));
		const numbers = [(await paidOrder(cloth.id)).number, (await paidOrder(cloth.id, undefined, 'quill-pencil')).number];
		const two = await eventually(async () => {
			const rows = await db.select().from(orders).where(inArray(orders.number, numbers));
			return rows.length === 2 && rows.every((o) => o.status === 'paid') ? rows : null;
		}, 20_000);
		const made = await post('/workroom/lays?/lay', [['fabricId', String(cloth.id)], ...two.map((o): [string, string] => ['ids', String(o.id)])], cutterA);
		expect(made.status).toBe(303);
		const layId = Number(made.headers.get('location')!.split('/').pop());
		await db.update(orders).set({ status: 'cancelled' }).where(eq(orders.id, two[1].id));
		const [stock] = await db.select().from(fabrics).where(eq(fabrics.id, cloth.id));
		const res = await post(`/workroom/lays/${layId}?/cut`, [], cutterA);
		expect(res.status).toBe(409);
		expect(await res.text()).toContain(`${two[1].number} is Cancelled now`);
		const [first] = await db.select().from(orders).where(eq(orders.id, two[0].id));
		expect(first.status).toBe('paid');
		const [stockAfter] = await db.select().from(fabrics).where(eq(fabrics.id, cloth.id));
		expect(stockAfter.stockCm).toBe(stock.stockCm);
	}, 60_000);
});
