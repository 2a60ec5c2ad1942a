// @ts-check
// Checks the body of POST /v1/checkout/sessions the way the provider does:
// unknown parameters are refused by name, so a typo in the app fails here
// instead of silently doing nothing.
import { ApiError, invalid, missing, nowSeconds } from './errors.js';

// Accepted and acted on, or accepted and without effect in a card-only fake.
const KNOWN = new Set([
	'mode',
	'line_items',
	'success_url',
	'cancel_url',
	'client_reference_id',
	'customer_email',
	'metadata',
	'expires_at',
	'payment_intent_data',
	'locale',
	'submit_type',
	'billing_address_collection',
	'payment_method_types',
	'customer_creation',
	'ui_mode',
	'expand'
]);

/**
 * @param {unknown} value
 * @param {string} param
 */
function readUrl(value, param) {
	if (typeof value !== 'string' || value === '') return null;
	try {
		const url = new URL(value.replaceAll('{CHECKOUT_SESSION_ID}', 'x'));
		if (url.protocol === 'http:' || url.protocol === 'https:') return value;
	} catch {
		// falls through to the refusal below
	}
	throw invalid(param, `Not a valid URL: ${param}`);
}

/**
 * @param {unknown} value
 * @param {string} param
 * @param {{ min?: number, max?: number }} [range]
 */
function readInt(value, param, range = {}) {
	if (typeof value !== 'string' || !/^-?\d+$/.test(value)) {
		throw new ApiError(400, 'parameter_invalid_integer', `Invalid integer: ${String(value)}`, {
			param
		});
	}
	const n = Number(value);
	if ((range.min !== undefined && n < range.min) || (range.max !== undefined && n > range.max)) {
		throw invalid(param, `${param} must be between ${range.min} and ${range.max}.`);
	}
	return n;
}

/**
 * @param {Record<string, any>} params
 */
export function readCheckoutParams(params) {
	for (const key of Object.keys(params)) {
		if (!KNOWN.has(key)) throw invalid(key, `Received unknown parameter: ${key}`);
	}
	if (params.mode === undefined) throw missing('mode');
	if (params.mode !== 'payment') {
		throw invalid('mode', `Invalid mode: this local fake supports mode=payment only (got ${String(params.mode)}).`);
	}
	if (params.ui_mode !== undefined && params.ui_mode !== 'hosted') {
		throw invalid('ui_mode', 'This local fake serves the hosted page only (ui_mode=hosted).');
	}
	const types = params.payment_method_types;
	if (types !== undefined && !(Array.isArray(types) && types.every((t) => t === 'card'))) {
		throw invalid('payment_method_types', 'This local fake takes cards only (payment_method_types[]=card).');
	}

	const successUrl = readUrl(params.success_url, 'success_url');
	if (!successUrl) throw missing('success_url');
	const cancelUrl = readUrl(params.cancel_url, 'cancel_url');

	const raw = params.line_items;
	if (raw === undefined) throw missing('line_items', 'line_items is required in payment mode.');
	if (!Array.isArray(raw) || raw.length === 0 || raw.length > 100) {
		throw invalid('line_items', 'line_items must be a list of 1 to 100 items.');
	}
	const items = raw.map((li, i) => {
		const at = `line_items[${i}]`;
		if (typeof li !== 'object' || li === null || Array.isArray(li)) throw invalid(at, `Invalid ${at}.`);
		if (li.price !== undefined) {
			throw invalid(`${at}[price]`, 'This local fake has no stored prices: send price_data instead of price.');
		}
		const pd = li.price_data;
		if (typeof pd !== 'object' || pd === null) throw missing(`${at}[price_data]`);
		if (typeof pd.currency !== 'string' || !/^[a-zA-Z]{3}$/.test(pd.currency)) {
			throw invalid(`${at}[price_data][currency]`, 'Invalid currency: use a three-letter ISO code such as eur.');
		}
		const currency = pd.currency.toLowerCase();
		if (i > 0 && currency !== String(raw[0].price_data.currency).toLowerCase()) {
			throw invalid(`${at}[price_data][currency]`, 'All line items must use the same currency.');
		}
		if (pd.unit_amount === undefined) throw missing(`${at}[price_data][unit_amount]`);
		// Eight digits of minor units is the provider's ceiling for one amount.
		const unitAmount = readInt(pd.unit_amount, `${at}[price_data][unit_amount]`, {
			min: 0,
			max: 99999999
		});
		const name = pd.product_data?.name;
		if (typeof name !== 'string' || name.trim() === '') throw missing(`${at}[price_data][product_data][name]`);
		if (li.quantity === undefined) throw missing(`${at}[quantity]`);
		const quantity = readInt(li.quantity, `${at}[quantity]`, { min: 1, max: 999999 });
		return { name, unitAmount, quantity, currency };
	});
	const total = items.reduce((sum, it) => sum + it.unitAmount * it.quantity, 0);
	if (total < 1) throw invalid('line_items', 'The total must be more than zero.');
	if (total > 99999999) throw invalid('line_items', 'The total is above the largest amount allowed (99999999).');

	/** @type {number | null} */
	let expiresAt = null;
	if (params.expires_at !== undefined) {
		const now = nowSeconds();
		// The provider wants 30 minutes to 24 hours; the fake allows any future
		// time up to 24 hours so a test can let a session lapse in seconds.
		expiresAt = readInt(params.expires_at, 'expires_at', { min: now + 1, max: now + 24 * 3600 });
	}

	const email = params.customer_email;
	if (email !== undefined && (typeof email !== 'string' || !/^[^\s@]+@[^\s@]+$/.test(email))) {
		throw invalid('customer_email', 'Invalid email address: customer_email.');
	}
	const ref = params.client_reference_id;
	if (ref !== undefined && (typeof ref !== 'string' || ref.length > 200)) {
		throw invalid('client_reference_id', 'client_reference_id must be a string of at most 200 characters.');
	}

	const pid = params.payment_intent_data;
	/** @type {{ metadata?: Record<string, string>, description?: string }} */
	const intentData = {};
	if (pid !== undefined) {
		if (typeof pid !== 'object' || pid === null) throw invalid('payment_intent_data', 'Invalid payment_intent_data.');
		for (const key of Object.keys(pid)) {
			if (key !== 'metadata' && key !== 'description') {
				throw invalid(`payment_intent_data[${key}]`, `Received unknown parameter: payment_intent_data[${key}]`);
			}
		}
		if (pid.metadata !== undefined) intentData.metadata = readMetadata(pid.metadata);
		if (typeof pid.description === 'string') intentData.description = pid.description;
	}

	return {
		items,
		currency: items[0].currency,
		successUrl,
		cancelUrl,
		clientReferenceId: typeof ref === 'string' && ref !== '' ? ref : null,
		customerEmail: typeof email === 'string' ? email : null,
		metadata: readMetadata(params.metadata),
		expiresAt,
		locale: typeof params.locale === 'string' ? params.locale : null,
		intentData
	};
}

/**
 * @param {unknown} value
 * @returns {Record<string, string>}
 */
export function readMetadata(value) {
	if (value === undefined || value === '') return {};
	if (typeof value !== 'object' || value === null || Array.isArray(value)) {
		throw invalid('metadata', 'Invalid object: metadata must be a hash of string keys and values.');
	}
	/** @type {Record<string, string>} */
	const out = {};
	// Limits from the provider's metadata documentation: 50 keys, 40-character keys, 500-character values.
	const entries = Object.entries(value);
	if (entries.length > 50) throw invalid('metadata', 'You can have at most 50 metadata keys.');
	for (const [k, v] of entries) {
		if (typeof v !== 'string') throw invalid(`metadata[${k}]`, 'Metadata values must be strings.');
		if (k.length > 40) throw invalid(`metadata[${k}]`, 'Metadata keys can be at most 40 characters.');
		if (v.length > 500) throw invalid(`metadata[${k}]`, 'Metadata values can be at most 500 characters.');
		if (v !== '') out[k] = v;
	}
	return out;
}
