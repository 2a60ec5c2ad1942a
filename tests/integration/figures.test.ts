// Real figures through the shop: the knee and the fit adjustments are drafted, stored on the order line
// and printed on the ticket; a figure outside what a block fits is asked about and refused until confirmed.
import { describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import { fabrics, orderLines, orders } from '../../src/lib/server/db/schema';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { Browser, addToBag } from '../support/shop';

const db = testDb();
const shopper = (email: string) => ({ email, name: 'Ilse Marrow', line1: 'Kanalweg 9', line2: '', city: 'Delft', postcode: '2611', country: 'NL', measurementConsent: true, madeToMeasure: true });
const twillId = async () => (await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill')))[0].id;
const post = async (path: string, body: unknown) => {
	const res = await fetch(`${testEnv.appUrl}${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
	return { status: res.status, body: await res.json() };
};
const linesCount = async () => (await db.select({ n: count() }).from(orderLines))[0].n;

describe('figures beyond the four girths', () => {
	it('a pencil skirt with her knee and fit adjustments: the quote drafts them, the order line keeps them, the ticket prints them', async () => {
		const fabricId = await twillId();
		const measurements = { waist: 70, hip: 98, length: 80, waistToHip: 20, waistToKnee: 53, adjustments: { hollowBack: 1.5, roundedAbdomen: 1, oneHip: { side: 'right', higher: 1 } } };
		const q = await post('/api/quote', { measurements, style: 'quill-pencil', fabricId });
		expect(q.status).toBe(200);
		// The vent opens to 2 cm above her own knee (house rule vent.reachAboveKnee), not the 58.5 cm default.
		expect(q.body.figures.kneeDepth).toBe(53);
		const placed = await post('/api/orders', { items: [{ measurements, style: 'quill-pencil', fabricId }], shopper: shopper(`knee-${Date.now()}@example.com`) });
		expect(placed.status).toBe(201);
		const [order] = await db.select().from(orders).where(eq(orders.number, placed.body.number));
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, order.id));
		expect(line.measurements).toMatchObject({ waist: 70, hip: 98, length: 80, waistToHip: 20, waistToKnee: 53 });
		expect(line.adjustments).toEqual({ hollowBack: 1.5, roundedAbdomen: 1, oneHip: { side: 'right', higher: 1 } });
		expect((line.figures as { kneeDepth: number }).kneeDepth).toBe(53);

		const account = DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter')!;
		const cookie = await signInCookie(account.email, DEMO_SIGN_INS.password);
		const res = await fetch(`${testEnv.appUrl}/workroom/orders/${order.id}/ticket.pdf`, { headers: { cookie } });
		expect(res.status).toBe(200);
		const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
		const text = (await parser.getText()).text.replace(/\s+/g, ' ');
		await parser.destroy();
		expect(text).toMatch(/Waist to knee 53 cm/);
		expect(text).toContain('Hollow back: centre back waist lowered 1.5 cm');
		expect(text).toContain('Rounded abdomen: centre front waist raised 1 cm');
		expect(text).toContain('Right hip 1 cm higher');
		// Both halves of the one-hip figure, and the re-drafted figures agree with the stored ones (no banner).
		expect(text).toMatch(/Her right half: hip width/);
		expect(text).toMatch(/Her left half: hip width/);
		expect(text).not.toContain('differ from those stored');
	});

	it('refuses a hip of 150 over a 65 waist with "did you mean 105?" and stores nothing, then drafts it once confirmed', async () => {
		const fabricId = await twillId();
		const measurements = { waist: 65, hip: 150, length: 60, waistToHip: 22 };
		const refused = await post('/api/quote', { measurements, style: 'rue-straight', fabricId });
		expect(refused.status).toBe(400);
		expect(refused.body.message).toMatch(/Please check your hip: 150 cm over a 65 cm waist/);
		expect(refused.body.confirm).toMatchObject({ field: 'hip', value: 150, suggestion: 105 });
		const inches = await post('/api/quote', { measurements: { waist: 25.5, hip: 59, length: 23.5, waistToHip: 8.5 }, style: 'rue-straight', units: 'in' });
		expect(inches.status).toBe(400);
		expect(inches.body.confirm.message).toMatch(/Please check your hip: 59″ over a 25½″ waist/);

		const before = await linesCount();
		const order = await post('/api/orders', { items: [{ measurements, style: 'rue-straight', fabricId }], shopper: shopper(`slip-${Date.now()}@example.com`) });
		expect(order.status).toBe(400);
		expect(order.body.message).toMatch(/Please check your hip/);
		const browser = new Browser();
		const bag = await addToBag(browser, 'rue-straight', { ...measurements, fabricId });
		expect(bag.status).toBe(400);
		expect(await bag.text()).toContain('Did you mean 105 cm?');
		expect(browser.cookies.has('ql_bag')).toBe(false);
		expect(await linesCount()).toBe(before);

		const confirmed = await post('/api/quote', { measurements: { ...measurements, confirmed: true }, style: 'rue-straight', fabricId });
		expect(confirmed.status).toBe(200);
		expect(confirmed.body.warnings.join(' ')).toMatch(/calico/);
		const placed = await post('/api/orders', { items: [{ measurements: { ...measurements, confirmed: true }, style: 'rue-straight', fabricId }], shopper: shopper(`sure-${Date.now()}@example.com`) });
		expect(placed.status).toBe(201);
		const [o] = await db.select().from(orders).where(eq(orders.number, placed.body.number));
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, o.id));
		expect(line.measurements).toMatchObject({ hip: 150, confirmed: true });
	});
});
