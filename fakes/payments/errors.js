// @ts-check
import { randomBytes } from 'node:crypto';

/**
 * An error the fake answers in the provider's JSON shape
 * `{ error: { type, code, message, param? } }`. The SDK turns 400/404 into
 * StripeInvalidRequestError, 401 into StripeAuthenticationError, and type
 * 'idempotency_error' into StripeIdempotencyError.
 */
export class ApiError extends Error {
	/**
	 * @param {number} status
	 * @param {string} code
	 * @param {string} message
	 * @param {{ param?: string, type?: string, replayable?: boolean, extra?: Record<string, unknown> }} [opts]
	 *   replayable: the request got as far as changing or reading state, so an
	 *   idempotent retry must see the same answer (parameter errors are not kept,
	 *   as with the provider).
	 */
	constructor(status, code, message, opts = {}) {
		super(message);
		this.status = status;
		this.code = code;
		this.param = opts.param;
		this.type = opts.type ?? 'invalid_request_error';
		this.replayable = opts.replayable ?? false;
		this.extra = opts.extra ?? {};
	}

	toJSON() {
		return {
			error: {
				type: this.type,
				code: this.code,
				message: this.message,
				...(this.param ? { param: this.param } : {}),
				...this.extra
			}
		};
	}
}

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/**
 * A random id with the provider's prefixes (cs_test_, pi_, ch_, re_, evt_…).
 * @param {string} prefix
 * @param {number} [length]
 */
export function newId(prefix, length = 24) {
	const bytes = randomBytes(length);
	let out = '';
	for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
	return prefix + out;
}

/** Seconds since the epoch, the provider's timestamp unit. */
export function nowSeconds() {
	return Math.floor(Date.now() / 1000);
}

/**
 * @param {string} param
 * @param {string} [message]
 */
export function missing(param, message) {
	return new ApiError(400, 'parameter_missing', message ?? `Missing required param: ${param}.`, {
		param
	});
}

/**
 * @param {string} param
 * @param {string} message
 */
export function invalid(param, message) {
	return new ApiError(400, 'parameter_invalid', message, { param });
}

/**
 * @param {string} kind e.g. 'checkout.session'
 * @param {string} id
 * @param {string} [param] set when the id came from a body parameter (the provider answers 400 then)
 */
export function noSuch(kind, id, param) {
	return new ApiError(param ? 400 : 404, 'resource_missing', `No such ${kind}: '${id}'`, {
		param: param ?? 'id',
		replayable: true
	});
}
