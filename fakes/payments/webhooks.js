// @ts-check
// Signed webhook delivery. The signature scheme is the provider's published
// one: header `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of
// "<t>.<raw body>" keyed with the endpoint secret>`, which the SDK's
// webhooks.constructEvent checks (default tolerance 300 s).
//
// One sender per process: attempts leave one at a time, first attempts in the
// order the events happened. A failed attempt (non-2xx, connection error or
// timeout) is queued again after the next delay in retryDelaysMs and does not
// hold back later events, so, as with the real provider, a receiver that was
// down can see events out of order once it is back.
import { createHmac } from 'node:crypto';
import { newId, nowSeconds } from './errors.js';

/**
 * @typedef {{ run: number, attempt: number, at: string, status: number | null, error: string | null, durationMs: number, responseBody?: string }} Attempt
 * @typedef {'pending' | 'retrying' | 'delivered' | 'failed'} DeliveryStatus
 * @typedef {{ id: string, type: string, created: number, event: Record<string, any>, status: DeliveryStatus, runs: number, attempts: Attempt[] }} EventRecord
 * @typedef {{ record: EventRecord, run: number, attempt: number }} Job
 */

/**
 * The header value for a body, as the provider computes it.
 * @param {string} body
 * @param {string} secret
 * @param {number} [timestamp] unix seconds
 */
export function signatureHeader(body, secret, timestamp = nowSeconds()) {
	const v1 = createHmac('sha256', secret).update(`${timestamp}.${body}`, 'utf8').digest('hex');
	return `t=${timestamp},v1=${v1}`;
}

/**
 * @param {{ url: string, secret: string, retryDelaysMs: number[], timeoutMs?: number, log?: (line: string) => void }} opts
 */
export function createWebhookSender({ url, secret, retryDelaysMs, timeoutMs = 10_000, log = () => {} }) {
	/** @type {EventRecord[]} */
	const events = [];
	/** @type {Job[]} */
	const queue = [];
	/** @type {Set<NodeJS.Timeout>} */
	const timers = new Set();
	/** @type {AbortController | null} */
	let inFlight = null;
	let busy = false;
	let closed = false;

	/** @param {Job} job */
	async function attempt(job) {
		const { record } = job;
		// Pretty-printed like the provider's payloads; the receiver must verify the raw bytes.
		const body = JSON.stringify(record.event, null, 2);
		const started = Date.now();
		/** @type {Attempt} */
		const entry = {
			run: job.run,
			attempt: job.attempt,
			at: new Date(started).toISOString(),
			status: null,
			error: null,
			durationMs: 0
		};
		inFlight = new AbortController();
		const timer = setTimeout(() => inFlight?.abort(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs);
		try {
			const res = await fetch(url, {
				method: 'POST',
				headers: {
					'content-type': 'application/json; charset=utf-8',
					'stripe-signature': signatureHeader(body, secret),
					'user-agent': 'Quarterline-PaymentFake/1 (local test server)'
				},
				body,
				signal: inFlight.signal
			});
			entry.status = res.status;
			entry.responseBody = (await res.text()).slice(0, 500);
		} catch (err) {
			entry.error =
				err instanceof Error ? String(/** @type {any} */ (err).cause?.code ?? err.cause ?? err.message) : String(err);
		} finally {
			clearTimeout(timer);
			inFlight = null;
		}
		entry.durationMs = Date.now() - started;
		record.attempts.push(entry);
		const ok = entry.status !== null && entry.status >= 200 && entry.status < 300;
		if (ok) {
			record.status = 'delivered';
			return;
		}
		const delay = retryDelaysMs[job.attempt - 1];
		if (delay === undefined || closed) {
			record.status = 'failed';
			log(
				`webhook ${record.type} ${record.id} given up after ${job.attempt} attempts (${entry.status ?? entry.error})`
			);
			return;
		}
		record.status = 'retrying';
		const t = setTimeout(() => {
			timers.delete(t);
			queue.push({ record, run: job.run, attempt: job.attempt + 1 });
			pump();
		}, delay);
		timers.add(t);
	}

	async function pump() {
		if (busy || closed) return;
		busy = true;
		try {
			for (let job = queue.shift(); job && !closed; job = queue.shift()) {
				// Only the newest run of an event goes on; a redelivery supersedes older retries.
				if (job.run !== job.record.runs) continue;
				await attempt(job);
			}
		} finally {
			busy = false;
		}
	}

	/** @param {EventRecord} record */
	function start(record) {
		record.runs += 1;
		record.status = 'pending';
		queue.push({ record, run: record.runs, attempt: 1 });
		void pump();
	}

	return {
		events,

		/**
		 * Record an event and queue its delivery.
		 * @param {string} type
		 * @param {Record<string, any>} object
		 * @param {Record<string, any> | undefined} previous
		 * @param {string | null} apiVersion
		 */
		emit(type, object, previous, apiVersion) {
			const created = nowSeconds();
			const event = {
				id: newId('evt_'),
				object: 'event',
				api_version: apiVersion,
				created,
				data: previous ? { object, previous_attributes: previous } : { object },
				livemode: false,
				pending_webhooks: 1,
				request: { id: null, idempotency_key: null },
				type
			};
			/** @type {EventRecord} */
			const record = {
				id: event.id,
				type,
				created,
				event,
				status: 'pending',
				runs: 0,
				attempts: []
			};
			events.push(record);
			start(record);
			return record;
		},

		/**
		 * Send an event again (same id and body, new signature), with retries.
		 * @param {string} id
		 */
		redeliver(id) {
			const record = events.find((e) => e.id === id);
			if (record) start(record);
			return record;
		},

		close() {
			closed = true;
			for (const t of timers) clearTimeout(t);
			timers.clear();
			queue.length = 0;
			inFlight?.abort(new Error('payment fake closing'));
		}
	};
}
