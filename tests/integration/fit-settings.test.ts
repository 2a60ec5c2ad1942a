// The fit promise's settings page (back office, owner only): what she saves is the rule the fit report
// obeys and the words every page says; bad input and other roles change nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, inArray } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fitReports, orders, shopSettings } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { TIGHT_WAIST, decide, deliveredOrder, postReport, tokenFor } from '../support/fit';

const db = testDb();
const KEYS = ['remakeWindowDays', 'photoRetentionDays', 'freeRemakesPerOrder'];
const DEFAULTS = { remakeWindowDays: '30', photoRetentionDays: '90', freeRemakesPerOrder: '1' };
const cookieOf = (role: string) => signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
const page = async (path: string, cookie?: string) => (await fetch(`${testEnv.appUrl}${path}`, { headers: cookie ? { cookie } : {} })).text();
const stored = async () => Object.fromEntries((await db.select().from(shopSettings).where(inArray(shopSettings.key, KEYS))).map((r) => [r.key, r.value]));
const save = (fields: Record<string, string>, cookie?: string) => postForm('/admin/settings', { ...DEFAULTS, ...fields }, cookie);

let owner = '';
beforeAll(async () => {
	owner = await cookieOf('owner');
});
// Later test files read the promise of 30 days: put the defaults back through the page (which also
// drops the app's cached copy).
afterAll(async () => {
	await save({}, owner);
});

describe('the fit promise settings', () => {
	it('shows the owner the current settings, with the defaults of the seed', async () => {
		const html = await page('/admin/settings', owner);
		expect(html).toMatch(/id="remakeWindowDays"[^>]*value="30"/);
		expect(html).toMatch(/id="photoRetentionDays"[^>]*value="90"/);
		expect(html).toMatch(/id="freeRemakesPerOrder"[^>]*value="1"/);
	});

	it('a window of 10 days refuses a report 12 days after delivery and takes one 8 days after; pages say 10 days', async () => {
		const res = await save({ remakeWindowDays: '10' }, owner);
		expect(res.status).toBe(200);
		expect(await stored()).toMatchObject({ remakeWindowDays: 10, photoRetentionDays: 90, freeRemakesPerOrder: 1 });
		// Every page's footer and the fit page say the new window.
		expect(await page('/')).toContain('tell us within 10 days of delivery');

		const late = await deliveredOrder(db, { deliveredDaysAgo: 12 });
		const t = tokenFor(late.number);
		expect(await page(`/orders/${late.number}?t=${t}`)).not.toContain('Tell us how it fits');
		expect(await page(`/orders/${late.number}/fit?t=${t}`)).toContain('Fit reports are taken within 10 days of delivery');
		expect((await postReport(late.number, TIGHT_WAIST(late.lineId), { token: t })).status).toBe(409);
		expect(await db.select().from(fitReports).where(eq(fitReports.orderId, late.id))).toHaveLength(0);

		const inTime = await deliveredOrder(db, { deliveredDaysAgo: 8 });
		expect(await page(`/orders/${inTime.number}?t=${tokenFor(inTime.number)}`)).toContain('Tell us how it fits');
		expect((await postReport(inTime.number, TIGHT_WAIST(inTime.lineId), { token: tokenFor(inTime.number) })).status).toBe(303);

		// Back to 30 days: the same late order may report now.
		expect((await save({}, owner)).status).toBe(200);
		expect(await page('/')).toContain('tell us within 30 days of delivery');
		expect((await postReport(late.number, TIGHT_WAIST(late.lineId), { token: t })).status).toBe(303);
		expect(await db.select().from(fitReports).where(eq(fitReports.orderId, late.id))).toHaveLength(1);
	});

	it('no free remakes: the workroom can alter but a remake is refused, and no remake order is made', async () => {
		expect((await save({ freeRemakesPerOrder: '0' }, owner)).status).toBe(200);
		expect(await page('/')).toContain('we alter it, free of charge');
		const o = await deliveredOrder(db);
		await postReport(o.number, TIGHT_WAIST(o.lineId), { token: tokenFor(o.number) });
		const [report] = await db.select().from(fitReports).where(eq(fitReports.orderId, o.id));
		const res = await decide(report.id, { decision: 'remake', 'change.waist': '+2', reason: 'Cut again with 2 cm more at the waist.' }, owner);
		expect(res.status).toBe(409);
		expect(await res.text()).toContain('offers no free remakes');
		expect(await db.select().from(orders).where(and(eq(orders.kind, 'remake'), eq(orders.remakeOfId, o.id)))).toHaveLength(0);
		expect((await save({}, owner)).status).toBe(200);
	});

	it('refuses bad input with a message per field and changes nothing', async () => {
		const before = await stored();
		for (const [field, value, words] of [
			['remakeWindowDays', 'abc', 'Give the remake window as a number of days.'],
			['remakeWindowDays', '3', 'The remake window is at least 7 days.'],
			['remakeWindowDays', '400', 'The remake window is at most 365 days.'],
			['photoRetentionDays', '12.5', 'Give how long photos are kept in whole days.'],
			['freeRemakesPerOrder', '4', 'At most 3 free remakes per order.'],
			['freeRemakesPerOrder', '-1', 'Free remakes cannot be fewer than 0.']
		]) {
			const res = await save({ [field]: value, remakeWindowDays: field === 'remakeWindowDays' ? value : '20' }, owner);
			expect(res.status, `${field}=${value}`).toBe(400);
			expect(await res.text()).toContain(words);
			expect(await stored()).toEqual(before);
		}
	});

	it('a shopper or a cutter posting the form is refused and changes nothing; a guest is sent to sign in', async () => {
		const before = await stored();
		for (const role of ['shopper', 'cutter']) {
			const res = await save({ remakeWindowDays: '9' }, await cookieOf(role));
			expect(res.status, role).toBe(403);
		}
		const guest = await save({ remakeWindowDays: '9' });
		expect([303, 401, 403]).toContain(guest.status);
		expect(await stored()).toEqual(before);
		expect(await page('/')).toContain('tell us within 30 days of delivery');
	});
});
