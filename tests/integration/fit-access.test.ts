// Who reaches the fit loop: her report by her account or her order's signed link (another shopper and
// another order's link find nothing); the fit reports for the owner and the cutters she allows; the fit
// page for the owner. Refused requests change nothing.
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fitReports, users } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { TIGHT_WAIST, decide, deliveredOrder, postReport, tokenFor } from '../support/fit';

const db = testDb();
const accounts = DEMO_SIGN_INS.accounts;
const cookies: Record<string, string> = {};
const get = (path: string, cookie?: string) => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });

beforeAll(async () => {
	const shoppers = accounts.filter((a) => a.role === 'shopper');
	cookies.owner = await signInCookie(accounts.find((a) => a.role === 'owner')!.email, DEMO_SIGN_INS.password);
	cookies.cutter = await signInCookie(accounts.find((a) => a.role === 'cutter')!.email, DEMO_SIGN_INS.password);
	cookies.her = await signInCookie(shoppers[1].email, DEMO_SIGN_INS.password);
	cookies.another = await signInCookie(shoppers[0].email, DEMO_SIGN_INS.password);
});

describe('her fit report', () => {
	it('opens for her account and her link; another shopper and another order’s link find nothing', async () => {
		const mine = await deliveredOrder(db, { account: accounts.filter((a) => a.role === 'shopper')[1].email });
		const other = await deliveredOrder(db);
		expect((await get(`/orders/${mine.number}/fit`, cookies.her)).status).toBe(200);
		expect((await get(`/orders/${mine.number}/fit?t=${tokenFor(mine.number)}`)).status).toBe(200);
		for (const [who, res] of [
			['anonymous', await get(`/orders/${mine.number}/fit`)],
			['another shopper', await get(`/orders/${mine.number}/fit`, cookies.another)],
			['another order’s link', await get(`/orders/${mine.number}/fit?t=${tokenFor(other.number)}`)],
			['a cutter', await get(`/orders/${mine.number}/fit`, cookies.cutter)]
		] as const) {
			expect(res.status, who).toBe(404);
		}
		for (const opts of [{ cookie: cookies.another }, { token: tokenFor(other.number) }, {}, { cookie: cookies.owner }]) {
			expect((await postReport(mine.number, TIGHT_WAIST(mine.lineId), opts)).status).toBe(404);
		}
		expect(await db.select().from(fitReports).where(eq(fitReports.orderId, mine.id))).toHaveLength(0);
		// Her own account may write it.
		expect((await postReport(mine.number, TIGHT_WAIST(mine.lineId), { cookie: cookies.her })).status).toBe(303);
	});
});

describe('the workroom’s fit reports', () => {
	it('are for the owner, and a cutter only with her leave', async () => {
		const o = await deliveredOrder(db);
		await postReport(o.number, TIGHT_WAIST(o.lineId), { token: tokenFor(o.number) });
		const [report] = await db.select().from(fitReports).where(eq(fitReports.orderId, o.id));
		for (const path of ['/workroom/fit-reports', `/workroom/fit-reports/${report.id}`]) {
			expect((await get(path)).headers.get('location')).toMatch(/^\/signin/);
			expect((await get(path, cookies.her)).status).toBe(403);
			expect((await get(path, cookies.cutter)).status).toBe(403);
			expect((await get(path, cookies.owner)).status).toBe(200);
		}
		expect((await get('/admin/fit', cookies.cutter)).status).toBe(403);
		expect((await get('/admin/fit', cookies.her)).status).toBe(403);
		expect((await get('/admin/fit', cookies.owner)).status).toBe(200);

		// A cutter without leave cannot decide; nothing changes.
		expect((await decide(report.id, { decision: 'remake', 'change.waist': '+2' }, cookies.cutter)).status).toBe(403);
		expect((await decide(report.id, { decision: 'remake', 'change.waist': '+2' }, cookies.her)).status).toBe(403);
		expect((await db.select().from(fitReports).where(eq(fitReports.id, report.id)))[0].decision).toBeNull();

		// The owner gives the cutter leave on the Staff page; the cutter decides; the leave is taken back.
		const [cutter] = await db.select({ id: users.id }).from(users).where(eq(users.email, accounts.find((a) => a.role === 'cutter')!.email));
		try {
			expect((await postForm(`/admin/staff/${cutter.id}?/fitLeave`, { allow: 'on' }, cookies.owner)).status).toBe(200);
			expect((await get(`/workroom/fit-reports/${report.id}`, cookies.cutter)).status).toBe(200);
			expect((await decide(report.id, { decision: 'alteration', 'change.waist': '+2' }, cookies.cutter)).status).toBe(200);
			expect((await db.select().from(fitReports).where(eq(fitReports.id, report.id)))[0].decision).toBe('alteration');
		} finally {
			await postForm(`/admin/staff/${cutter.id}?/fitLeave`, {}, cookies.owner);
		}
		expect((await get('/workroom/fit-reports', cookies.cutter)).status).toBe(403);
		// The cutter cannot give herself leave.
		expect((await postForm(`/admin/staff/${cutter.id}?/fitLeave`, { allow: 'on' }, cookies.cutter)).status).toBe(403);
		expect((await db.select({ leave: users.fitDecider }).from(users).where(eq(users.id, cutter.id)))[0].leave).toBe(false);
	});
});
