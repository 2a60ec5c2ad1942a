// @ts-check
// Checkout under load: N orders by C concurrent clients, each order as a headless shop places it:
// POST /api/quote → POST /api/orders (201 with a payment page) → pay on the payment fake's control
// API, which then sends the signed checkout.session.completed webhook to the app. Then MariaDB is
// polled until every order is paid or the time runs out, and counted: paid, lost (not paid) and
// duplicated (more than one 'paid' stage event, or more than one paid payment row, for one order).
// The floor is the same clients making the same three round trips to bare health checks (two to the
// app, one to the fake), so it shows what the HTTP path alone costs on this machine.
import mysql from 'mysql2/promise';
import { summarise } from './stats.js';

const STYLES = [
	'rue-straight',
	'quill-pencil',
	'meadow-a-line',
	'swing-half-circle',
	'carousel-full-circle',
	'promenade-six-gore'
];
// Fabric 1 (150 cm wool twill) and 5 (112 cm poplin), in seed order: the two the bench restocks.
const FABRICS = [1, 5];
export const BENCH_FABRIC_IDS = FABRICS;
// Bounds, so a stuck app cannot keep the bench running: per request, and for starting new orders.
const REQUEST_TIMEOUT_MS = 15_000;
const CLIENT_PHASE_MS = 90_000;

/** Runs `work(i)` for i = 0..n-1 on `clients` concurrent loops. */
async function pool(
	/** @type {number} */ n,
	/** @type {number} */ clients,
	/** @type {(i: number) => Promise<void>} */ work,
	deadline = Infinity
) {
	let next = 0;
	await Promise.all(
		Array.from({ length: clients }, async () => {
			for (let i = next++; i < n && performance.now() < deadline; i = next++) await work(i);
		})
	);
	return Math.min(next, n);
}

/** @param {string} url @param {unknown} body */
async function postJson(url, body) {
	const res = await fetch(url, {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(body),
		signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS)
	});
	const text = await res.text();
	let json = null;
	try {
		json = JSON.parse(text);
	} catch {
		/* reported by status */
	}
	return { status: res.status, json };
}

/** @param {number} i */
function item(i) {
	// Figures spread over a usual range, every style in turn, so the orders are not one cached shape.
	const waist = 62 + (i % 9) * 3;
	return {
		measurements: { waist, hip: waist + 24 + (i % 5), length: 56 + (i % 7) * 2, waistToHip: 20 + (i % 3) * 0.5 },
		style: STYLES[i % STYLES.length],
		fabricId: FABRICS[i % FABRICS.length]
	};
}

/**
 * @param {{ appUrl: string, paymentsUrl: string, databaseUrl: string, orders?: number, clients?: number, waitMs?: number, runTag: string }} o
 */
export async function measureCheckout(o) {
	const n = o.orders ?? 500;
	const clients = o.clients ?? 50;
	const db = await mysql.createConnection({ uri: o.databaseUrl });
	try {
		// Stock is checked at checkout, not taken: enough on the two fabrics for every order at once.
		await db.query('UPDATE fabric SET stock_cm = 500000 WHERE id IN (?)', [FABRICS]);

		// Floor: three bare round trips per "order", same clients.
		/** @type {number[]} */
		const floorTimes = [];
		const f0 = performance.now();
		await pool(n, clients, async () => {
			const t = performance.now();
			for (const url of [`${o.appUrl}/healthz`, `${o.appUrl}/healthz`, `${o.paymentsUrl}/_fake/healthz`])
				await (await fetch(url, { signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS) })).arrayBuffer();
			floorTimes.push(performance.now() - t);
		});
		const floorSeconds = (performance.now() - f0) / 1000;

		/** @type {Record<string, number>} */
		const failures = {};
		const fail = (/** @type {string} */ what) => {
			failures[what] = (failures[what] ?? 0) + 1;
		};
		/** @type {number[]} */
		const orderTimes = [];
		/** @type {Set<string>} */
		const numbers = new Set();
		const t0 = performance.now();
		const started = await pool(
			n,
			clients,
			async (i) => {
				const t = performance.now();
				const it = item(i);
				const q = await postJson(`${o.appUrl}/api/quote`, it).catch(() => ({ status: 0, json: null }));
				if (q.status !== 200 || !q.json?.price) return void fail(`quote ${q.status}`);
				const shopper = {
					email: `bench-${o.runTag}-${i}@example.com`,
					name: `Bench Shopper ${i}`,
					line1: 'Werkstattweg 1',
					line2: '',
					city: 'Kiel',
					postcode: '24103',
					country: 'DE',
					measurementConsent: true,
					madeToMeasure: true
				};
				const placed = await postJson(`${o.appUrl}/api/orders`, { items: [it], shopper }).catch(() => ({
					status: 0,
					json: null
				}));
				const session = String(placed.json?.paymentUrl ?? '').match(/\/pay\/(cs_[A-Za-z0-9_]+)/)?.[1];
				if (placed.status !== 201 || !session) return void fail(`order ${placed.status}`);
				numbers.add(placed.json.number);
				const paid = await postJson(`${o.paymentsUrl}/_fake/sessions/${session}/pay`, {
					card: '4242424242424242'
				}).catch(() => ({ status: 0, json: null }));
				if (paid.status !== 200 || paid.json?.outcome !== 'succeeded') return void fail(`pay ${paid.status}`);
				orderTimes.push(performance.now() - t);
			},
			t0 + CLIENT_PHASE_MS
		);
		const clientSeconds = (performance.now() - t0) / 1000;

		// Every order the run placed, found by its shoppers' addresses (also any whose answer was lost).
		const like = `bench-${o.runTag}-%@example.com`;
		const waitMs = o.waitMs ?? 60_000;
		const countPaid = async () => {
			const [rows] = /** @type {any} */ (
				await db.query("SELECT COUNT(*) AS placed, SUM(status = 'paid') AS paid FROM `order` WHERE email LIKE ?", [
					like
				])
			);
			return { placed: Number(rows[0].placed), paid: Number(rows[0].paid ?? 0) };
		};
		let counts = await countPaid();
		while (counts.paid < counts.placed && performance.now() - t0 < clientSeconds * 1000 + waitMs) {
			await new Promise((r) => setTimeout(r, 250));
			counts = await countPaid();
		}
		const allPaidSeconds = (performance.now() - t0) / 1000;
		const [dupEvents] = /** @type {any} */ (
			await db.query(
				"SELECT COUNT(*) AS n FROM (SELECT e.order_id FROM order_event e JOIN `order` o ON o.id = e.order_id WHERE o.email LIKE ? AND e.kind = 'stage' AND e.to_status = 'paid' GROUP BY e.order_id HAVING COUNT(*) > 1) d",
				[like]
			)
		);
		const [dupPayments] = /** @type {any} */ (
			await db.query(
				"SELECT COUNT(*) AS n FROM (SELECT p.order_id FROM payment p JOIN `order` o ON o.id = p.order_id WHERE o.email LIKE ? AND p.state = 'paid' GROUP BY p.order_id HAVING COUNT(*) > 1) d",
				[like]
			)
		);
		const [lag] = /** @type {any} */ (
			await db.query(
				"SELECT TIMESTAMPDIFF(MICROSECOND, MIN(created_at), MAX(paid_at)) / 1e6 AS span FROM `order` WHERE email LIKE ? AND status = 'paid'",
				[like]
			)
		);
		const duplicated = new Set();
		const [dupIds] = /** @type {any} */ (
			await db.query(
				"SELECT e.order_id AS id FROM order_event e JOIN `order` o ON o.id = e.order_id WHERE o.email LIKE ? AND e.kind = 'stage' AND e.to_status = 'paid' GROUP BY e.order_id HAVING COUNT(*) > 1 UNION SELECT p.order_id FROM payment p JOIN `order` o ON o.id = p.order_id WHERE o.email LIKE ? AND p.state = 'paid' GROUP BY p.order_id HAVING COUNT(*) > 1",
				[like, like]
			)
		);
		for (const r of dupIds) duplicated.add(r.id);
		return {
			orders: n,
			clients,
			started,
			placed: counts.placed,
			answered201: numbers.size,
			paid: counts.paid,
			lost: n - counts.paid,
			duplicated: duplicated.size,
			duplicatedPaidEvents: Number(dupEvents[0].n),
			duplicatedPaidPayments: Number(dupPayments[0].n),
			failures,
			clientSeconds,
			allPaidSeconds,
			dbSpanSeconds: Number(lag[0].span ?? 0),
			// From the first order row to the last payment the webhooks recorded, by the database's clock.
			ordersPerSecond: counts.paid / (Number(lag[0].span ?? 0) || allPaidSeconds),
			perOrderMs: summarise(orderTimes),
			floor: { seconds: floorSeconds, ordersPerSecond: n / floorSeconds, perOrderMs: summarise(floorTimes) }
		};
	} finally {
		await db.end();
	}
}
