import { afterAll, describe, expect, it } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { houseRules, orderLines, orders } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';

const db = testDb();
const quote = async () =>
	(await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ measurements: { waist: 100, hip: 128, length: 60, waistToHip: 22 }, style: 'rue-straight' }) })).json();

let original: Record<string, unknown> | null = null;
afterAll(async () => {
	// Put the atelier's first rules back as the newest version, for the test files that follow.
	if (original) await db.insert(houseRules).values({ rules: original, note: 'restored after the house-rules test' });
});

describe('house rules', () => {
	it('saves a new version that new quotes use, while placed orders keep theirs', async () => {
		const [first] = await db.select().from(houseRules).orderBy(desc(houseRules.id)).limit(1);
		original = first.rules;
		const owner = await signInCookie(DEMO_SIGN_INS.accounts[0].email, DEMO_SIGN_INS.password);
		const [placed] = await db.select().from(orders).where(eq(orders.number, 'QL-1006'));
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, placed.id));

		expect((await quote()).figures.front.hipWidth).toBeCloseTo(34, 1);
		// 2 cm of hip ease on each quarter instead of 1: the quarter hip for H 128 becomes 34 instead of 33.
		const refused = await postForm('/admin/rules', { 'ease.hip': '2' }, owner);
		expect(refused.status).toBe(400);
		expect(await refused.text()).toContain('Say in a few words what changed');
		const bad = await postForm('/admin/rules', { 'ease.hip': '40', note: 'too much' }, owner);
		expect(bad.status).toBe(400);
		expect(await bad.text()).toContain('must be a number from 0 to 10');

		const saved = await postForm('/admin/rules', { 'ease.hip': '2', note: 'more room for the linen range' }, owner);
		expect(saved.status).toBe(200);
		const [newest] = await db.select().from(houseRules).orderBy(desc(houseRules.id)).limit(1);
		expect(newest.id).toBeGreaterThan(first.id);
		expect(newest.note).toBe('more room for the linen range');
		const after = await quote();
		// Half the hip line grows by 2 cm (64 + 2 × 2 = 68). The front stays the wider panel; since the dart
		// rules send intake the side seams cannot take towards the back (60 %), the split is 34.7 / 33.3, not 35 / 33.
		expect(after.figures.front.hipWidth + after.figures.back.hipWidth).toBeCloseTo(68, 1);
		expect(after.figures.front.hipWidth).toBeGreaterThan(34);
		expect(after.figures.front.hipWidth).toBeGreaterThan(after.figures.back.hipWidth);

		// The placed order still points at the rules it was drafted with, and its figures did not move.
		const [again] = await db.select().from(orders).where(eq(orders.id, placed.id));
		expect(again.houseRulesId).toBe(placed.houseRulesId);
		const [lineAgain] = await db.select().from(orderLines).where(eq(orderLines.id, line.id));
		expect(lineAgain.figures).toEqual(line.figures);
	});

	it('draws the sample block live for the owner and refuses the cutter', async () => {
		const owner = await signInCookie(DEMO_SIGN_INS.accounts[0].email, DEMO_SIGN_INS.password);
		const res = await fetch(`${testEnv.appUrl}/api/admin/rules/preview`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: owner, origin: testEnv.appUrl }, body: JSON.stringify({ 'ease.hip': 1.5 }) });
		const body = await res.json();
		expect(body.svg).toMatch(/^<svg/);
		// Sample figure hip 94: quarter 23.5 + 1.5 ease = 25, front 26 (balance 1 cm, common practice).
		expect(body.figures.front.hipWidth).toBeCloseTo(26, 1);
		const cutter = await signInCookie(DEMO_SIGN_INS.accounts[1].email, DEMO_SIGN_INS.password);
		expect((await fetch(`${testEnv.appUrl}/api/admin/rules/preview`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: cutter, origin: testEnv.appUrl }, body: '{}' })).status).toBe(403);
	});
});
