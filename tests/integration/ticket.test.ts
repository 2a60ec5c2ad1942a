import { asc, eq, inArray } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import { beforeAll, describe, expect, it } from 'vitest';
import { formatCm } from '../../src/lib/drafting';
import { orderLines, orders } from '../../src/lib/server/db/schema';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { DEMO_ORDERS } from '../../src/lib/server/seed/orders';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';

const db = testDb();
const cookies: Record<'cutter' | 'shopper', string> = { cutter: '', shopper: '' };

// The demo seed's paid orders (src/lib/server/seed/orders.ts), looked up by number: other test files may
// move their stage, but not their figures.
const PAID = DEMO_ORDERS.filter((o) => o.stage === 'paid').map((o) => o.number);

type Panel = {
	hipWidth: number;
	waistWidth: number;
	sideRaise: number;
	darts: { fromCentre: number; intake: number; length: number }[];
};
let seeded: {
	id: number;
	number: string;
	figures: { back: Panel & { centreShaping: number }; front: Panel & { centreDrop: number } };
}[] = [];

beforeAll(async () => {
	for (const role of ['cutter', 'shopper'] as const) {
		const account = DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
		cookies[role] = await signInCookie(account.email, DEMO_SIGN_INS.password);
	}
	const rows = await db
		.select({ id: orders.id, number: orders.number, figures: orderLines.figures })
		.from(orders)
		.innerJoin(orderLines, eq(orderLines.orderId, orders.id))
		.where(inArray(orders.number, PAID))
		.orderBy(asc(orders.number));
	seeded = rows as typeof seeded;
	expect(seeded.length).toBeGreaterThanOrEqual(2);
});

async function pdfText(res: Response) {
	const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
	try {
		return (await parser.getText()).text;
	} finally {
		await parser.destroy();
	}
}

const get = (path: string, cookie?: string) =>
	fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const row = (label: string, back: number, front: number) =>
	new RegExp(`${esc(label)}\\s+${esc(formatCm(back))}\\s+${esc(formatCm(front))}`);

describe('cutting ticket routes', () => {
	it('gives the cutter a PDF with the order number and the figures stored with the order line', async () => {
		const o = seeded[0];
		const res = await get(`/workroom/orders/${o.id}/ticket.pdf`, cookies.cutter);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('application/pdf');
		expect(res.headers.get('content-disposition')).toBe(`inline; filename="ticket-${o.number}.pdf"`);
		const text = await pdfText(res);
		expect(text).toContain(o.number);
		const { back, front } = o.figures;
		expect(text).toMatch(row('Hip width (centre line to side seam, on the hip line)', back.hipWidth, front.hipWidth));
		expect(text).toMatch(row('Waist width (to the waist mark, darts open)', back.waistWidth, front.waistWidth));
		expect(text).toMatch(row('Side raise (side waist point above the waist line)', back.sideRaise, front.sideRaise));
		expect(text).toMatch(row('Centre back shaping / centre front drop', back.centreShaping, front.centreDrop));
		back.darts.forEach((d, i) => {
			const f = front.darts[i];
			if (!f) return;
			expect(text).toMatch(row(`Dart ${i + 1}: position, centre line to its middle`, d.fromCentre, f.fromCentre));
			expect(text).toMatch(row(`Dart ${i + 1}: intake`, d.intake, f.intake));
			expect(text).toMatch(row(`Dart ${i + 1}: length`, d.length, f.length));
		});
		// Re-drafted with the order's own house rules, the figures agree with those stored: no warning.
		expect(text).not.toContain('differ from those stored');
		expect(text).toMatch(/Scale 1:\d+: 1 cm on the page/);
	});

	it('prints a batch of two orders in one PDF', async () => {
		const [a, b] = seeded;
		const res = await get(`/workroom/tickets.pdf?ids=${a.id},${b.id}`, cookies.cutter);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('application/pdf');
		const text = await pdfText(res);
		expect(text).toContain(a.number);
		expect(text).toContain(b.number);
		// The queue's checkboxes send the ids as repeated parameters.
		const form = await get(`/workroom/tickets.pdf?ids=${a.id}&ids=${b.id}`, cookies.cutter);
		expect(form.status).toBe(200);
		const both = await pdfText(form);
		expect(both).toContain(a.number);
		expect(both).toContain(b.number);
	});

	it('answers 404 for an order that does not exist and 400 for ids it cannot read', async () => {
		const missing = await get('/workroom/orders/99999999/ticket.pdf', cookies.cutter);
		expect(missing.status).toBe(404);
		expect((await missing.json()).message).toMatch(/no order/i);
		expect((await get('/workroom/orders/abc/ticket.pdf', cookies.cutter)).status).toBe(404);
		expect((await get(`/workroom/tickets.pdf?ids=${seeded[0].id},99999999`, cookies.cutter)).status).toBe(404);
		for (const ids of ['', '1,x', '0', '-3', Array.from({ length: 51 }, (_, i) => i + 1).join(',')]) {
			const res = await get(`/workroom/tickets.pdf?ids=${encodeURIComponent(ids)}`, cookies.cutter);
			expect(res.status, `ids=${ids}`).toBe(400);
			expect((await res.json()).message).toBeTruthy();
		}
	});

	it('sends a visitor who is not signed in to sign in, and refuses a shopper', async () => {
		const path = `/workroom/orders/${seeded[0].id}/ticket.pdf`;
		const anonymous = await get(path);
		expect(anonymous.status).toBe(303);
		expect(anonymous.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(path)}`);
		expect((await get(path, cookies.shopper)).status).toBe(403);
		const batch = `/workroom/tickets.pdf?ids=${seeded[0].id}`;
		expect((await get(batch)).status).toBe(303);
		expect((await get(batch, cookies.shopper)).status).toBe(403);
	});
});
