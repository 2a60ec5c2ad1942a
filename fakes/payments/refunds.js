// @ts-check
// POST /v1/refunds: a refund of part or all of what is left on a charge,
// refused (as by the provider) when it asks for more than is left.
import { ApiError, invalid, missing, newId, noSuch, nowSeconds } from './errors.js';
import { readMetadata } from './params.js';

/** @typedef {Record<string, any>} Obj */

/**
 * @param {Obj} params form-decoded body
 * @param {{
 *   charges: Map<string, Obj>, intents: Map<string, Obj>, refunds: Map<string, Obj>,
 *   emit: import('./ledger.js').Emit, apiVersionOf: (chargeId: string) => string | null
 * }} state
 */
export function createRefund(params, { charges, intents, refunds, emit, apiVersionOf }) {
	for (const key of Object.keys(params)) {
		if (!['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand'].includes(key)) {
			throw invalid(key, `Received unknown parameter: ${key}`);
		}
	}
	/** @type {Obj | undefined} */
	let charge;
	if (typeof params.charge === 'string' && params.charge) {
		charge = charges.get(params.charge);
		if (!charge) throw noSuch('charge', params.charge, 'charge');
	} else if (typeof params.payment_intent === 'string' && params.payment_intent) {
		const pi = intents.get(params.payment_intent);
		if (!pi) throw noSuch('payment_intent', params.payment_intent, 'payment_intent');
		charge = charges.get(pi.latest_charge);
	}
	if (!charge) throw missing('payment_intent', 'One of payment_intent or charge is required.');

	const left = charge.amount - charge.amount_refunded;
	let amount = left;
	if (params.amount !== undefined) {
		if (typeof params.amount !== 'string' || !/^\d+$/.test(params.amount) || Number(params.amount) < 1) {
			throw new ApiError(400, 'parameter_invalid_integer', 'Invalid positive integer', {
				param: 'amount'
			});
		}
		amount = Number(params.amount);
	}
	const reasons = ['duplicate', 'fraudulent', 'requested_by_customer'];
	const reason = params.reason === undefined || params.reason === '' ? null : params.reason;
	if (reason !== null && !reasons.includes(reason)) {
		throw invalid('reason', `Invalid reason: must be one of ${reasons.join(', ')}`);
	}
	if (left === 0) {
		throw new ApiError(400, 'charge_already_refunded', `Charge ${charge.id} has already been refunded.`, {
			param: 'amount',
			replayable: true
		});
	}
	if (amount > left) {
		throw new ApiError(
			400,
			'amount_too_large',
			`Refund amount (${amount}) is greater than unrefunded amount on charge (${left}), in ${charge.currency} minor units.`,
			{ param: 'amount', replayable: true }
		);
	}
	const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
	charge.amount_refunded += amount;
	charge.refunded = charge.amount_refunded === charge.amount;
	const refund = {
		id: newId('re_'),
		object: 'refund',
		amount,
		charge: charge.id,
		created: nowSeconds(),
		currency: charge.currency,
		metadata: readMetadata(params.metadata),
		payment_intent: charge.payment_intent,
		reason,
		status: 'succeeded'
	};
	refunds.set(refund.id, refund);
	emit('charge.refunded', structuredClone(charge), previous, apiVersionOf(charge.id));
	return structuredClone(refund);
}
