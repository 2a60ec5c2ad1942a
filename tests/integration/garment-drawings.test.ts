// Her finished skirt where she looks for it after ordering: in the order mails as an inline image (a PNG
// named by Content-ID from the HTML, so mail clients show it without fetching anything), and on the
// order page in her cloth's colour.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { fabrics, orderLines, orders } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { eventually, paidOrder } from '../support/shop';

const db = testDb();

type Mail = { id: string; subject: string; html: string; attachments: { filename: string | null; contentType: string; size: number; cid: string | null }[] };

describe('the garment drawing of an order line', () => {
	it('goes with the paid mail as an inline PNG, and shows on the order page in the cloth', async () => {
		const [twill] = await db.select().from(fabrics).where(eq(fabrics.slug, 'harbour-wool-twill'));
		const { number, email } = await paidOrder(twill.id);
		const [order] = await db.select().from(orders).where(eq(orders.number, number));
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, order.id));
		const mail: Mail = await eventually(async () => {
			const body = await (await fetch(`${testEnv.mailUrl}/api/messages?to=${encodeURIComponent(email)}`)).json();
			return (body.data as Mail[]).find((m) => m.subject === `Order ${number} is paid`);
		});
		const cid = `skirt-${line.id}@quarterline`;
		expect(mail.html).toContain(`src="cid:${cid}"`);
		expect(mail.html).toMatch(/alt="Your [^"]+ in harbour wool twill, navy, front and back"/);
		const image = mail.attachments.find((a) => a.cid === cid);
		expect(image?.contentType).toBe('image/png');
		expect(image!.size).toBeGreaterThan(2_000);

		// The order page (from the mail's signed link) draws the same skirt in the twill's navy.
		const link = mail.html.match(/href="([^"]+\/orders\/QL-\d+\?t=[^"]+)"/)![1].replace(/&amp;/g, '&');
		const page = await (await fetch(link.replace(/^https?:\/\/[^/]+/, testEnv.appUrl))).text();
		expect(page).toContain('data-testid="order-drawing"');
		expect(page).toContain(`fill="${twill.swatchHex}"`);
		expect(page).toMatch(/data-length="60"/);
	});
});
