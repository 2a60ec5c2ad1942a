// @ts-check
// Request-body helpers for the payment fake. The provider's API takes
// application/x-www-form-urlencoded bodies with bracket notation
// (line_items[0][price_data][unit_amount]=2500, expand[]=line_items), which is
// what the official SDK writes; this turns them back into nested values.

// Values are strings, lists and objects of those, nested as deep as the keys go.
/** @typedef {Record<string, any>} FormObject */
/** @typedef {string | any[] | FormObject} FormValue */

/** Keys that would reach Object.prototype if a body named them. */
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * Read a request body up to a limit.
 * @param {import('node:http').IncomingMessage} req
 * @param {number} [limit] bytes
 * @returns {Promise<string>}
 */
export function readBody(req, limit = 1024 * 1024) {
	return new Promise((resolve, reject) => {
		/** @type {Buffer[]} */
		const chunks = [];
		let size = 0;
		req.on('data', (/** @type {Buffer} */ chunk) => {
			size += chunk.length;
			if (size > limit) {
				reject(Object.assign(new Error('Request body too large'), { tooLarge: true }));
				req.destroy();
				return;
			}
			chunks.push(chunk);
		});
		req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
		req.on('error', reject);
	});
}

/**
 * Split `a[b][0][]` into ['a', 'b', '0', ''].
 * @param {string} key
 * @returns {string[]}
 */
function splitKey(key) {
	const open = key.indexOf('[');
	if (open <= 0 || !key.endsWith(']')) return [key];
	const parts = [key.slice(0, open)];
	const rest = key.slice(open);
	const re = /\[([^\]]*)\]/g;
	let consumed = 0;
	for (const m of rest.matchAll(re)) {
		if (m.index !== consumed) return [key];
		parts.push(m[1]);
		consumed += m[0].length;
	}
	return consumed === rest.length ? parts : [key];
}

/**
 * Parse a form-encoded (or query) string with bracket notation into nested
 * objects; objects whose keys are 0..n-1 become arrays, `[]` appends.
 * @param {string} text
 * @returns {FormObject}
 */
export function parseForm(text) {
	/** @type {FormObject} */
	const root = {};
	for (const [rawKey, value] of new URLSearchParams(text)) {
		const parts = splitKey(rawKey);
		if (parts.some((p) => FORBIDDEN_KEYS.has(p))) continue;
		/** @type {any} */
		let node = root;
		for (let i = 0; i < parts.length; i++) {
			const part = parts[i];
			const last = i === parts.length - 1;
			if (part === '') {
				// `key[]` appends; a later `[x]` after `[]` is not a shape the SDK writes.
				if (!Array.isArray(node.__list)) node.__list = [];
				if (last) node.__list.push(value);
				else break;
				continue;
			}
			if (last) {
				node[part] = value;
			} else {
				const next = parts[i + 1];
				if (next === '') {
					if (typeof node[part] !== 'object') node[part] = { __list: [] };
				} else if (typeof node[part] !== 'object') {
					node[part] = {};
				}
				node = node[part];
			}
		}
	}
	return /** @type {FormObject} */ (normalise(root));
}

/**
 * @param {any} value
 * @returns {FormValue}
 */
function normalise(value) {
	if (typeof value !== 'object' || value === null) return value;
	if (Array.isArray(value.__list)) return value.__list.map(normalise);
	const keys = Object.keys(value);
	const indexed = keys.length > 0 && keys.every((k) => /^\d+$/.test(k));
	if (indexed) {
		const sorted = keys.map(Number).sort((a, b) => a - b);
		if (sorted.every((n, i) => n === i)) return sorted.map((n) => normalise(value[String(n)]));
	}
	/** @type {FormObject} */
	const out = {};
	for (const k of keys) out[k] = normalise(value[k]);
	return out;
}
