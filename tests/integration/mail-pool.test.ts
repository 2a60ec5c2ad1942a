// A mail that carries her skirt's drawing is sent with its outbox row locked; the drawing must be made
// without asking the pool for a second connection meanwhile. Before, each sending held one connection and
// waited for another: as many mails at once as the pool had connections (20 orders placed together, as the
// bench's 50 shoppers did) and every request of the shop waited for ever.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, eq, inArray } from 'drizzle-orm';
import { startMailFake } from '../../fakes/mail/server.js';
import { createDb } from '../../src/lib/server/db/client';
import { orderLines, orders, outbox } from '../../src/lib/server/db/schema';
import { deliverOne, enqueueMail } from '../../src/lib/server/mail/outbox';
import { testEnv } from '../support/env';

let fake: Awaited<ReturnType<typeof startMailFake>>;
// Two connections: three mails at once were enough to wait for ever.
const { db, pool } = createDb(testEnv.databaseUrl, 2);

beforeAll(async () => {
	fake = await startMailFake({ smtpPort: 0, webPort: 0 });
});
afterAll(async () => {
	await pool.end();
	await fake?.close();
});

describe('mails with drawings, many at once', () => {
	it('are all sent through a pool of two connections', async () => {
		// A line of an order still being made: another test erases, at her request, the measurements of a
		// shopper's finished orders, and a line without them has no drawing to send.
		const [line] = await db
			.select({ id: orderLines.id, orderId: orderLines.orderId })
			.from(orderLines)
			.innerJoin(orders, eq(orders.id, orderLines.orderId))
			.where(inArray(orders.status, ['paid', 'cutting']))
			.orderBy(asc(orderLines.id))
			.limit(1);
		const html = `<p>Your skirt</p><img src="cid:skirt-${line.id}@quarterline" alt="">`;
		const ids: number[] = [];
		for (let i = 0; i < 6; i++) ids.push(await enqueueMail(db, { to: `pool-${i}@example.com`, orderId: line.orderId, subject: `Pool ${i}`, text: 'Your skirt', html }));
		const settings = { host: '127.0.0.1', port: fake.smtpPort, from: 'Atelier Ondine <atelier@ondine.example>', retryScale: 0.01 };
		const sent = await Promise.race([
			Promise.all(ids.map((id) => deliverOne(db, settings, id))),
			new Promise<'stuck'>((resolve) => setTimeout(() => resolve('stuck'), 20_000))
		]);
		// The app's own outbox worker drains the same table and may send one first (then ours skips it).
		expect(sent).not.toBe('stuck');
		const ours = (sent as boolean[]).filter(Boolean).length;
		expect(ours).toBeGreaterThan(0);
		await expect.poll(async () => (await db.select({ sentAt: outbox.sentAt }).from(outbox).where(inArray(outbox.id, ids))).every((r) => r.sentAt !== null), { timeout: 10_000 }).toBe(true);
		// Each one this test sent carried the drawing as an inline PNG, as the mail fake received it.
		const mine = fake.messages.filter((m) => m.envelope.to.some((t) => t.startsWith('pool-')));
		expect(mine).toHaveLength(ours);
		for (const m of mine) expect(m.attachments).toEqual([expect.objectContaining({ contentType: 'image/png', cid: expect.stringContaining(`skirt-${line.id}@quarterline`) })]);
	}, 30_000);
});
