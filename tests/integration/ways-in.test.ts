import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fabrics, measurementProfiles, orderLines, orders, users } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { Browser, GUEST_ADDRESS, checkout } from '../support/shop';

// The source of a shopper's figures (her tape, a size chart, a skirt laid flat) from the form to the
// measure card and the order line; a card saved over only when it is hers.
const db = testDb();
const emailOf = (role: string, n = 0) => DEMO_SIGN_INS.accounts.filter((a) => a.role === role)[n].email;

async function twillId() {
	const [f] = await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill'));
	return f.id;
}

function makeFields(fabricId: number, extra: Record<string, string>) {
	// ASTM D5585-11e1 size 8 curvy waist 28 in = 71.1 cm (TRADE.md); no depth: the house default.
	return { units: 'cm', waist: '71.1', hip: '97.2', length: '60', unknownDepth: 'on', fabricId: String(fabricId), waistband: 'band', closureKind: 'zip', closurePosition: 'centre-back', vent: 'auto', ...extra };
}

describe('where the figures came from', () => {
	it('keeps the source on the measure card, and saves measured figures over it later (her own card only)', async () => {
		const cookie = await signInCookie(emailOf('shopper'), DEMO_SIGN_INS.password);
		const fabricId = await twillId();
		const name = `Chart ${Date.now()}`;
		const res = await postForm('/styles/rue-straight/make?/add', makeFields(fabricId, { figuresSource: 'size_chart', saveCard: 'on', cardName: name, consent: 'on' }), cookie);
		expect(res.status).toBe(303);
		const [card] = await db.select().from(measurementProfiles).where(eq(measurementProfiles.name, name));
		expect(card).toMatchObject({ source: 'size_chart', waist: 71.1, hip: 97.2, waistToHip: null });

		// Measured later: saved in place of the chart card.
		const again = await postForm('/styles/rue-straight/make?/add', { ...makeFields(fabricId, { figuresSource: 'measured', saveCard: 'on', cardName: `${name} measured`, consent: 'on', replaceCardId: String(card.id) }), waist: '70.4', waistToHip: '20.5', unknownDepth: '' }, cookie);
		expect(again.status).toBe(303);
		const [replaced] = await db.select().from(measurementProfiles).where(eq(measurementProfiles.id, card.id));
		expect(replaced).toMatchObject({ source: 'measured', waist: 70.4, waistToHip: 20.5, name: `${name} measured` });
		expect(await db.select().from(measurementProfiles).where(eq(measurementProfiles.name, name))).toEqual([]);

		// Another shopper's card is not hers to save over: refused, and her card unchanged.
		const [lotte] = await db.select({ id: users.id }).from(users).where(eq(users.email, emailOf('shopper', 1)));
		const [{ id: lotteCard }] = await db.insert(measurementProfiles).values({ userId: lotte.id, name: 'Lotte everyday', waist: 66, hip: 92, length: 58, units: 'cm', consentAt: new Date() }).$returningId();
		const refused = await postForm('/styles/rue-straight/make?/add', makeFields(fabricId, { saveCard: 'on', cardName: 'Taken', consent: 'on', replaceCardId: String(lotteCard) }), cookie);
		expect(refused.status).toBe(400);
		expect(await refused.text()).toContain('We found no measure card of yours with that number');
		const [still] = await db.select().from(measurementProfiles).where(and(eq(measurementProfiles.id, lotteCard), eq(measurementProfiles.userId, lotte.id)));
		expect(still).toMatchObject({ name: 'Lotte everyday', waist: 66, source: 'measured' });
	});

	it('puts the source on the order line through the bag and the checkout, and the quote says it', async () => {
		const browser = new Browser();
		const fabricId = await twillId();
		expect((await browser.post('/styles/rue-straight/make?/add', makeFields(fabricId, { figuresSource: 'flat_garment' }))).status).toBe(303);
		const bag = await (await browser.get('/bag')).text();
		expect(bag).toContain('a skirt that fits you, laid flat');
		const email = `flat-${Date.now()}@example.com`;
		const c = await checkout(browser, { ...GUEST_ADDRESS, email });
		expect(c.res.status).toBe(303);
		const lines = await db.select({ source: orderLines.figuresSource }).from(orderLines).innerJoin(orders, eq(orders.id, orderLines.orderId)).where(eq(orders.email, email));
		expect(lines).toHaveLength(1);
		expect(lines[0].source).toBe('flat_garment');

		const quote = await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ style: 'rue-straight', measurements: { waist: 71.1, hip: 97.2, length: 60 }, figuresSource: 'size_chart' }) });
		expect(quote.status).toBe(200);
		const q = await quote.json();
		expect(q.figuresSource).toBe('size_chart');
		expect(q.warnings[0]).toContain('A chart fits a chart body');
		const bad = await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ style: 'rue-straight', measurements: { waist: 71.1, hip: 97.2, length: 60 }, figuresSource: 'guessed' }) });
		expect(bad.status).toBe(400);
	});
});
