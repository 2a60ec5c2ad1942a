// Tells the local payment fake about the demo atelier's past payments (the fake keeps its state in
// memory, so it starts each run knowing nothing), so the owner can refund a demo order as a real one.
import { inArray, like, and } from 'drizzle-orm';
import { createDb } from '../db/client';
import { payments } from '../db/schema';

const url = process.env.DATABASE_URL;
const fake = process.env.PAYMENTS_URL;
if (!url || !fake) throw new Error('Set DATABASE_URL and PAYMENTS_URL.');
const { db, pool } = createDb(url, 2);
try {
	const rows = await db
		.select()
		.from(payments)
		.where(and(like(payments.paymentIntentId, 'pi\\_demo\\_%'), inArray(payments.state, ['paid', 'partially_refunded', 'refunded'])));
	const body = rows.map((p) => ({ id: p.paymentIntentId, amount: p.amount, currency: p.currency, amount_refunded: p.refundedAmount, metadata: { order_id: String(p.orderId) } }));
	if (body.length) {
		const res = await fetch(`${fake}/_fake/payment_intents`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
		if (!res.ok) throw new Error(`the payment fake answered ${res.status}: ${await res.text()}`);
	}
	console.log(`${body.length} demo payments registered with the payment fake`);
} finally {
	await pool.end();
}
