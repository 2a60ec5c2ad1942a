// The fit loop's rules: a report only on a delivered order and within the remake window (30 days, the
// shop's own promise), one free remake per order, and a remake is never charged nor counted as takings.
import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fitReports, orderEvents, orderLines, orders, payments } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { TIGHT_WAIST, decide, deliveredOrder, postReport, tokenFor } from '../support/fit';

const db = testDb();
const ownerCookie = () => signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!.email, DEMO_SIGN_INS.password);
const page = async (path: string, cookie?: string) => (await fetch(`${testEnv.appUrl}${path}`, { headers: cookie ? { cookie } : {} })).text();
const reportsOf = (orderId: number) => db.select().from(fitReports).where(eq(fitReports.orderId, orderId));
/** The takings figure the owner reads on the pipeline page. */
const takings = async (cookie: string) => (await page('/admin', cookie)).match(/data-testid="takings">([^<]+)</)?.[1];

describe('the remake window', () => {
	it('refuses a report on an order not yet delivered, saying how to reach the atelier', async () => {
		const o = await deliveredOrder(db, { notDelivered: true });
		const html = await page(`/orders/${o.number}/fit?t=${tokenFor(o.number)}`);
		expect(html).toContain('once your skirt has been delivered');
		expect(html).toContain('atelier@ondine.example');
		expect(html).not.toContain('data-testid="fit-form"');
		const res = await postReport(o.number, TIGHT_WAIST(o.lineId), { token: tokenFor(o.number) });
		expect(res.status).toBe(409);
		expect(await reportsOf(o.id)).toHaveLength(0);
	});

	it('refuses a report 31 days after delivery and takes one 29 days after', async () => {
		const late = await deliveredOrder(db, { deliveredDaysAgo: 31 });
		const html = await page(`/orders/${late.number}/fit?t=${tokenFor(late.number)}`);
		expect(html).toContain('within 30 days of delivery');
		expect((await postReport(late.number, TIGHT_WAIST(late.lineId), { token: tokenFor(late.number) })).status).toBe(409);
		expect(await reportsOf(late.id)).toHaveLength(0);

		const inTime = await deliveredOrder(db, { deliveredDaysAgo: 29 });
		expect(await page(`/orders/${inTime.number}/fit?t=${tokenFor(inTime.number)}`)).toContain('data-testid="fit-form"');
		const res = await postReport(inTime.number, TIGHT_WAIST(inTime.lineId), { token: tokenFor(inTime.number) });
		expect(res.status).toBe(303);
		const [r] = await reportsOf(inTime.id);
		expect(r.answers.waist).toEqual({ feel: -1, amountCm: 2 });
		expect(r.status).toBe('new');
		// A second report on the same skirt is refused, the first one kept.
		expect((await postReport(inTime.number, TIGHT_WAIST(inTime.lineId), { token: tokenFor(inTime.number) })).status).toBe(409);
		expect(await reportsOf(inTime.id)).toHaveLength(1);
	});

	it('reads an amount in inches as centimetres (2 in = 5.1 cm)', async () => {
		const o = await deliveredOrder(db);
		await postReport(o.number, { ...TIGHT_WAIST(o.lineId), units: 'in', 'amount.waist': '2' }, { token: tokenFor(o.number) });
		const [r] = await reportsOf(o.id);
		expect(r.answers.waist?.amountCm).toBe(5.1);
	});
});

describe('remakes', () => {
	it('makes one free remake per order, with no payment and no takings, and refuses a second', async () => {
		const owner = await ownerCookie();
		const o = await deliveredOrder(db);
		// Read after the first order is in: it was paid (for its own skirt) within the last 30 days.
		const before = await takings(owner);
		await postReport(o.number, TIGHT_WAIST(o.lineId), { token: tokenFor(o.number) });
		const [report] = await reportsOf(o.id);
		const res = await decide(report.id, { decision: 'remake', 'change.waist': '+2', reason: 'Cut again with 2 cm more at the waist.' }, owner);
		expect(res.status).toBe(200);

		const [remake] = await db.select().from(orders).where(and(eq(orders.kind, 'remake'), eq(orders.remakeOfId, o.id)));
		expect(remake).toMatchObject({ status: 'paid', total: 0, subtotal: 0, shipping: 0, paidAt: null });
		expect(await db.select().from(payments).where(eq(payments.orderId, remake.id))).toHaveLength(0);
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, remake.id));
		expect(line.measurements.waist).toBe(74);
		expect(line.lineTotal).toBe(0);
		expect(await takings(owner)).toBe(before);
		// The queue marks it as a remake.
		expect(await page('/workroom', owner)).toMatch(new RegExp(`${remake.number}</a>(<!--[^>]*-->)*<span[^>]*data-testid="remake-mark"`));

		// The remake is delivered and reported on too: the free remake of the first order is spent.
		await db.update(orders).set({ status: 'delivered' }).where(eq(orders.id, remake.id));
		await db.insert(orderEvents).values({ orderId: remake.id, actorLabel: 'Workroom', kind: 'stage', fromStatus: 'shipped', toStatus: 'delivered' });
		const [remakeLine] = await db.select({ id: orderLines.id }).from(orderLines).where(eq(orderLines.orderId, remake.id));
		expect((await postReport(remake.number, TIGHT_WAIST(remakeLine.id), { token: tokenFor(remake.number) })).status).toBe(303);
		const [second] = await reportsOf(remake.id);
		const again = await decide(second.id, { decision: 'remake', 'change.waist': '+1' }, owner);
		expect(again.status).toBe(409);
		expect(await again.text()).toContain('free remake');
		expect(await db.select().from(orders).where(eq(orders.remakeOfId, o.id))).toHaveLength(1);
		expect((await reportsOf(remake.id))[0].status).not.toBe('decided');

		// An alteration is still possible: the remake takes the alteration path.
		expect((await decide(second.id, { decision: 'alteration', 'change.waist': '+1' }, owner)).status).toBe(200);
		const [altered] = await db.select().from(orders).where(eq(orders.id, remake.id));
		expect(altered.status).toBe('awaiting_return');
		expect(await takings(owner)).toBe(before);
	});

	it('declines only with a reason she reads', async () => {
		const owner = await ownerCookie();
		const o = await deliveredOrder(db);
		await postReport(o.number, TIGHT_WAIST(o.lineId), { token: tokenFor(o.number) });
		const [report] = await reportsOf(o.id);
		expect((await decide(report.id, { decision: 'decline', reason: '' }, owner)).status).toBe(400);
		expect((await reportsOf(o.id))[0].status).not.toBe('decided');
		expect((await decide(report.id, { decision: 'decline', reason: 'The waist was drafted to the measurement you gave; it is within the ease.' }, owner)).status).toBe(200);
		expect(await page(`/orders/${o.number}/fit?t=${tokenFor(o.number)}`)).toContain('it is within the ease');
	});
});
