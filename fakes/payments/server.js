// @ts-check
// Local stand-in for the hosted payment provider, for development, the demo
// and the tests. It speaks the part of the provider's HTTP API that the
// official SDK uses for a one-off card checkout, serves its own test payment
// page, and sends signed webhooks. It never moves money and only listens on
// loopback by default.
//
// Routes
//   /v1/...                         provider API subset (see api.js), Bearer sk_test_… required
//   GET  /pay/:sessionId            hosted test payment page
//   POST /pay/:sessionId            its form (card, exp, cvc) → 303 to success_url, or the page again
// Test control (no key needed; loopback only):
//   POST /_fake/sessions/:id/pay     JSON {card, exp?, cvc?} → {outcome:'succeeded'|'declined'|'invalid', …}
//   POST /_fake/sessions/:id/expire  expire now (sends checkout.session.expired)
//   GET  /_fake/events               every event with its delivery attempts and status
//   POST /_fake/events/:id/redeliver same event again, newly signed, with retries
//   POST /_fake/payment_intents      JSON {id, amount, currency, amount_refunded?, metadata?} (or a list):
//                                    register payments made before this process started, e.g. the demo seed's
//   GET  /_fake/healthz              {ok:true}
import { createServer } from 'node:http';
import { pathToFileURL } from 'node:url';
import { ApiError } from './errors.js';
import { parseForm, readBody } from './form.js';
import { createLedger } from './ledger.js';
import { createApi, sendJson } from './api.js';
import { createWebhookSender } from './webhooks.js';
import { closedPage, notFoundPage, payPage } from './page.js';

/**
 * @typedef {import('./webhooks.js').EventRecord} EventRecord
 * @typedef {{
 *   port?: number, host?: string, webhookUrl: string, webhookSecret: string,
 *   publicUrl?: string, retryDelaysMs?: number[], expiryCheckMs?: number,
 *   log?: (line: string) => void
 * }} PaymentFakeOptions
 * @typedef {{ url: string, port: number, close: () => Promise<void>, events: EventRecord[] }} PaymentFake
 */

// Pages carry no script; inline styles only; nothing may frame the card form.
const PAGE_CSP = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; frame-ancestors 'none'";

/**
 * @param {import('node:http').ServerResponse} res
 * @param {number} status
 * @param {string} html
 */
function sendHtml(res, status, html) {
	res.writeHead(status, {
		'content-type': 'text/html; charset=utf-8',
		'content-security-policy': PAGE_CSP,
		'x-content-type-options': 'nosniff',
		'referrer-policy': 'no-referrer',
		'cache-control': 'no-store'
	});
	res.end(html);
}

/**
 * Start the payment fake.
 * @param {PaymentFakeOptions} options
 * @returns {Promise<PaymentFake>}
 */
export async function startPaymentFake({
	port = 0,
	host = '127.0.0.1',
	webhookUrl,
	webhookSecret,
	publicUrl,
	retryDelaysMs = [500, 1000, 2000, 4000, 8000],
	expiryCheckMs = 2000,
	log = () => {}
}) {
	if (!webhookUrl) throw new Error('startPaymentFake: webhookUrl is required');
	if (!webhookSecret) throw new Error('startPaymentFake: webhookSecret is required');

	const sender = createWebhookSender({
		url: webhookUrl,
		secret: webhookSecret,
		retryDelaysMs,
		log
	});
	/** @type {string} */
	let base = publicUrl ?? '';
	const ledger = createLedger({ publicUrl: '', emit: sender.emit });
	const handleApi = createApi({
		ledger,
		findEvent: (id) => {
			const rec = sender.events.find((e) => e.id === id);
			return rec ? structuredClone(rec.event) : undefined;
		}
	});

	/**
	 * @param {import('node:http').IncomingMessage} req
	 * @param {import('node:http').ServerResponse} res
	 * @param {string[]} seg path segments after /_fake
	 */
	async function control(req, res, seg) {
		const method = req.method;
		const [a, id, action] = seg;
		if (method === 'GET' && a === 'healthz' && seg.length === 1) return sendJson(res, 200, { ok: true });
		if (method === 'GET' && a === 'events' && seg.length === 1) return sendJson(res, 200, { data: sender.events });
		if (method === 'POST' && a === 'events' && action === 'redeliver') {
			const rec = sender.redeliver(id);
			if (!rec) throw new ApiError(404, 'resource_missing', `No such event: '${id}'`);
			return sendJson(res, 202, rec);
		}
		if (method === 'POST' && a === 'payment_intents' && seg.length === 1) {
			const raw = await readBody(req);
			/** @type {any} */
			let input;
			try {
				input = JSON.parse(raw || 'null');
			} catch {
				throw new ApiError(400, 'invalid_json', 'The body must be JSON.');
			}
			const list = Array.isArray(input) ? input : [input];
			return sendJson(res, 201, { data: list.map((p) => ledger.importPayment(p)) });
		}
		if (method === 'POST' && a === 'sessions' && action === 'expire') {
			return sendJson(res, 200, ledger.expireSession(id, 'control'));
		}
		if (method === 'POST' && a === 'sessions' && action === 'pay') {
			const raw = await readBody(req);
			/** @type {any} */
			let input = {};
			try {
				input = raw ? JSON.parse(raw) : {};
			} catch {
				throw new ApiError(400, 'invalid_json', 'The body must be JSON such as {"card":"4242424242424242"}.');
			}
			if (typeof input !== 'object' || input === null) input = {};
			const r = ledger.pay(id, input);
			if (r.outcome === 'succeeded') {
				const { outcome, session, paymentIntent, charge, redirectUrl } = r;
				return sendJson(res, 200, {
					outcome,
					session,
					payment_intent: paymentIntent,
					charge,
					redirect_url: redirectUrl
				});
			}
			if (r.outcome === 'declined') {
				return sendJson(res, 402, {
					outcome: 'declined',
					session: r.session,
					error: {
						type: 'card_error',
						code: r.code,
						decline_code: 'generic_decline',
						message: r.message
					}
				});
			}
			return sendJson(res, 400, {
				outcome: 'invalid',
				session: r.session,
				error: {
					type: 'card_error',
					code: r.problem.code,
					param: r.problem.field,
					message: r.problem.message
				}
			});
		}
		throw new ApiError(
			404,
			'unrecognized_url',
			`Unknown control route ${method} /_fake/${seg.join('/')}; see fakes/README.md.`
		);
	}

	/**
	 * @param {import('node:http').IncomingMessage} req
	 * @param {import('node:http').ServerResponse} res
	 * @param {string} id
	 */
	async function hostedPage(req, res, id) {
		let session;
		try {
			session = ledger.getSession(id);
		} catch {
			return sendHtml(res, 404, notFoundPage());
		}
		if (session.status !== 'open') return sendHtml(res, 200, closedPage(session));
		const lineItems = ledger.lineItems(id);
		if (req.method === 'GET') return sendHtml(res, 200, payPage({ session, lineItems }));

		const form = parseForm(await readBody(req, 64 * 1024));
		const values = {
			card: typeof form.card === 'string' ? form.card : '',
			exp: typeof form.exp === 'string' ? form.exp : '',
			cvc: typeof form.cvc === 'string' ? form.cvc : ''
		};
		const r = ledger.pay(id, values, { requireAll: true });
		if (r.outcome === 'succeeded') {
			res.writeHead(303, { location: r.redirectUrl, 'cache-control': 'no-store' });
			res.end();
			return;
		}
		if (r.outcome === 'declined') {
			return sendHtml(res, 402, payPage({ session: r.session, lineItems, values, declined: r.message }));
		}
		return sendHtml(res, 400, payPage({ session: r.session, lineItems, values, problem: r.problem }));
	}

	const server = createServer(async (req, res) => {
		const url = new URL(req.url ?? '/', 'http://fake.invalid');
		const path = url.pathname;
		try {
			if (path === '/v1' || path.startsWith('/v1/')) return await handleApi(req, res, url);
			const seg = path.split('/').filter(Boolean).map(decodeURIComponent);
			if (seg[0] === '_fake') return await control(req, res, seg.slice(1));
			if (seg[0] === 'pay' && seg.length === 2 && (req.method === 'GET' || req.method === 'POST')) {
				return await hostedPage(req, res, seg[1]);
			}
			if (path === '/' && req.method === 'GET') {
				return sendJson(res, 200, {
					service: 'Quarterline payment fake',
					api: `${base}/v1`,
					control: `${base}/_fake`,
					docs: 'fakes/README.md'
				});
			}
			sendJson(res, 404, new ApiError(404, 'unrecognized_url', `Nothing at ${req.method} ${path}.`).toJSON());
		} catch (err) {
			if (res.headersSent) return res.destroy();
			if (err instanceof ApiError) return sendJson(res, err.status, err.toJSON());
			const message = err instanceof Error ? err.message : String(err);
			sendJson(res, 500, { error: { type: 'api_error', code: 'fake_internal_error', message } });
		}
	});

	await new Promise((resolve, reject) => {
		server.once('error', reject);
		server.listen(port, host, () => resolve(undefined));
	});
	const address = server.address();
	const actualPort = typeof address === 'object' && address ? address.port : port;
	const url = `http://${host.includes(':') ? `[${host}]` : host}:${actualPort}`;
	base = (publicUrl ?? url).replace(/\/$/, '');
	ledger.setPublicUrl(base);

	const expiryTimer = setInterval(() => ledger.expireDue(), expiryCheckMs);
	expiryTimer.unref();

	let closing = /** @type {Promise<void> | null} */ (null);
	return {
		url,
		port: actualPort,
		events: sender.events,
		close() {
			closing ??= new Promise((resolve) => {
				clearInterval(expiryTimer);
				sender.close();
				server.close(() => resolve());
				server.closeAllConnections();
			});
			return closing;
		}
	};
}

// Run directly: `node fakes/payments/server.js`.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
	const env = process.env;
	const fake = await startPaymentFake({
		port: Number(env.PAYMENTS_PORT || 4242),
		host: env.PAYMENTS_HOST ?? '127.0.0.1',
		webhookUrl: env.PAYMENTS_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/webhooks/stripe',
		webhookSecret: env.STRIPE_WEBHOOK_SECRET ?? 'whsec_quarterline_local',
		publicUrl: env.PAYMENTS_PUBLIC_URL || undefined,
		log: (line) => console.error(`[payments] ${line}`)
	});
	console.log(
		`Payment fake on ${fake.url} (webhooks to ${env.PAYMENTS_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/webhooks/stripe'})`
	);
	const stop = async () => {
		await fake.close();
		process.exit(0);
	};
	process.once('SIGTERM', stop);
	process.once('SIGINT', stop);
}
