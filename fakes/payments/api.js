// @ts-check
// The /v1 part of the payment fake: the requests the official SDK makes for
// checkout sessions, payment intents, charges, refunds and events. Bodies are
// form-encoded, answers are the provider's JSON objects and error shape.
import { createHash } from 'node:crypto';
import { ApiError, newId } from './errors.js';
import { parseForm, readBody } from './form.js';

/**
 * @typedef {ReturnType<typeof import('./ledger.js').createLedger>} Ledger
 * @typedef {{ status: number, body: unknown }} Answer
 * @typedef {{ fingerprint: string, answer: Answer }} Saved
 */

/**
 * @param {import('node:http').ServerResponse} res
 * @param {number} status
 * @param {unknown} body
 * @param {Record<string, string>} [headers]
 */
export function sendJson(res, status, body, headers = {}) {
	const text = JSON.stringify(body, null, 2);
	res.writeHead(status, {
		'content-type': 'application/json; charset=utf-8',
		'content-length': Buffer.byteLength(text),
		'cache-control': 'no-store',
		...headers
	});
	res.end(text);
}

/**
 * The secret key from `Authorization: Bearer sk_test_…` (or Basic with the key
 * as user name, as curl -u sends it). Only test keys are accepted.
 * @param {string | undefined} header
 */
function apiKey(header) {
	if (!header) {
		throw new ApiError(
			401,
			'api_key_missing',
			'You did not provide an API key. Send it as a Bearer token: Authorization: Bearer sk_test_….'
		);
	}
	let key = '';
	const [scheme, value = ''] = header.split(' ');
	if (/^bearer$/i.test(scheme)) key = value.trim();
	else if (/^basic$/i.test(scheme)) key = Buffer.from(value, 'base64').toString('utf8').split(':')[0];
	if (!key.startsWith('sk_test_') || key.length <= 'sk_test_'.length) {
		const shown = key.length > 12 ? `${key.slice(0, 8)}********${key.slice(-4)}` : '********';
		throw new ApiError(
			401,
			'api_key_invalid',
			`Invalid API Key provided: ${shown}. This local test server accepts secret test keys (sk_test_…) only.`
		);
	}
	return key;
}

/**
 * @param {Ledger} ledger
 * @param {Record<string, any>} obj
 * @param {string[]} parts
 * @param {string} path
 */
function expandPath(ledger, obj, parts, path) {
	const [head, ...rest] = parts;
	const cannot = () =>
		new ApiError(400, 'parameter_invalid', `This property cannot be expanded (${path}).`, {
			param: 'expand'
		});
	if (obj.object === 'checkout.session' && head === 'line_items') {
		if (rest.length) throw cannot();
		const data = ledger.lineItems(obj.id);
		obj.line_items = {
			object: 'list',
			data,
			has_more: false,
			url: `/v1/checkout/sessions/${obj.id}/line_items`
		};
		return;
	}
	if (!head || !(head in obj)) throw cannot();
	let value = obj[head];
	if (typeof value === 'string') {
		value = ledger.lookup(value);
		if (!value) throw cannot();
		obj[head] = value;
	}
	if (value === null) return;
	if (rest.length) {
		if (typeof value !== 'object') throw cannot();
		expandPath(ledger, value, rest, path);
	}
}

/**
 * @param {Ledger} ledger
 * @param {Record<string, any>} obj
 * @param {unknown} expand
 */
function applyExpand(ledger, obj, expand) {
	if (expand === undefined) return obj;
	const paths = Array.isArray(expand) ? expand : [expand];
	for (const path of paths) {
		if (typeof path !== 'string' || path.split('.').length > 4) {
			throw new ApiError(400, 'parameter_invalid', 'expand takes up to four levels of property names.', {
				param: 'expand'
			});
		}
		expandPath(ledger, obj, path.split('.'), path);
	}
	return obj;
}

/**
 * @param {{ ledger: Ledger, findEvent: (id: string) => Record<string, any> | undefined }} deps
 */
export function createApi({ ledger, findEvent }) {
	/** @type {Map<string, Saved>} */
	const idempotent = new Map();

	/**
	 * @param {string} method
	 * @param {string} path
	 * @param {Record<string, any>} params
	 * @param {string | null} apiVersion
	 * @returns {Record<string, any>}
	 */
	function route(method, path, params, apiVersion) {
		const seg = path.split('/').slice(2).map(decodeURIComponent); // after '/v1'
		const x = (/** @type {Record<string, any>} */ o) => applyExpand(ledger, o, params.expand);
		const [a, b, c, d] = seg;
		if (a === 'checkout' && b === 'sessions') {
			if (method === 'POST' && seg.length === 2) return x(ledger.createSession(params, apiVersion));
			if (method === 'GET' && seg.length === 2) return ledger.listSessions(params);
			if (method === 'GET' && seg.length === 3) return x(ledger.getSession(c));
			if (method === 'GET' && seg.length === 4 && d === 'line_items') {
				const data = ledger.lineItems(c);
				return { object: 'list', data, has_more: false, url: path };
			}
			if (method === 'POST' && seg.length === 4 && d === 'expire') return x(ledger.expireSession(c, 'api'));
		}
		if (seg.length === 2 && method === 'GET') {
			if (a === 'payment_intents') return x(ledger.getIntent(b));
			if (a === 'charges') return x(ledger.getCharge(b));
			if (a === 'refunds') return x(ledger.getRefund(b));
			if (a === 'events') {
				const ev = findEvent(b);
				if (!ev) throw new ApiError(404, 'resource_missing', `No such event: '${b}'`, { param: 'id' });
				return ev;
			}
		}
		if (a === 'refunds' && seg.length === 1 && method === 'POST') return x(ledger.createRefund(params));
		if (a === 'refunds' && seg.length === 1 && method === 'GET') return ledger.listRefunds(params);
		throw new ApiError(
			404,
			'unrecognized_url',
			`Unrecognized request URL (${method}: ${path}). This local fake knows checkout sessions, payment intents, charges, refunds and events only; see fakes/README.md.`
		);
	}

	/**
	 * @param {import('node:http').IncomingMessage} req
	 * @param {import('node:http').ServerResponse} res
	 * @param {URL} url
	 */
	return async function handleApi(req, res, url) {
		const method = req.method ?? 'GET';
		const requestId = newId('req_', 14);
		const apiVersion = typeof req.headers['stripe-version'] === 'string' ? req.headers['stripe-version'] : null;
		const headers = {
			'request-id': requestId,
			...(apiVersion ? { 'stripe-version': apiVersion } : {})
		};
		try {
			const key = apiKey(req.headers.authorization);
			let raw = '';
			if (method === 'POST') {
				raw = await readBody(req);
				const type = req.headers['content-type'] ?? '';
				if (raw && !type.startsWith('application/x-www-form-urlencoded')) {
					throw new ApiError(
						400,
						'parameter_invalid',
						'Request bodies must be form-encoded (application/x-www-form-urlencoded), as the SDK sends them.'
					);
				}
			}
			const params = method === 'POST' ? parseForm(raw) : parseForm(url.search.slice(1));

			const idemKey = req.headers['idempotency-key'];
			const slot = method === 'POST' && typeof idemKey === 'string' && idemKey ? `${key}\n${idemKey}` : null;
			const fingerprint = createHash('sha256').update(`${method} ${url.pathname}\n${raw}`).digest('hex');
			if (slot) {
				const saved = idempotent.get(slot);
				if (saved && saved.fingerprint !== fingerprint) {
					throw new ApiError(
						400,
						'idempotency_key_in_use',
						`Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idemKey}' if you meant to execute a different request.`,
						{ type: 'idempotency_error' }
					);
				}
				if (saved) {
					sendJson(res, saved.answer.status, saved.answer.body, {
						...headers,
						'idempotent-replayed': 'true',
						'original-request': requestId
					});
					return;
				}
			}

			/** @type {Answer} */
			let answer;
			try {
				answer = { status: 200, body: route(method, url.pathname, params, apiVersion) };
			} catch (err) {
				if (!(err instanceof ApiError) || !err.replayable) throw err;
				answer = { status: err.status, body: err.toJSON() };
			}
			if (slot) idempotent.set(slot, { fingerprint, answer });
			sendJson(res, answer.status, answer.body, headers);
		} catch (err) {
			if (err instanceof ApiError) {
				sendJson(res, err.status, err.toJSON(), headers);
			} else if (err && typeof err === 'object' && 'tooLarge' in err) {
				sendJson(
					res,
					413,
					new ApiError(413, 'request_too_large', 'Request bodies are limited to 1 MB.').toJSON(),
					headers
				);
			} else {
				const message = err instanceof Error ? err.message : String(err);
				sendJson(
					res,
					500,
					{
						error: {
							type: 'api_error',
							code: 'fake_internal_error',
							message: `The payment fake failed: ${message}`
						}
					},
					headers
				);
			}
		}
	};
}
