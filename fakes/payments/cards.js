// @ts-check
// Test card numbers. The two numbers are the provider's published test
// numbers (its testing documentation: 4242 4242 4242 4242 succeeds, 4000 0000
// 0000 0002 is a generic decline); any future expiry and any 3-digit CVC are
// accepted, as there. Every other number is refused, so nobody is tempted to
// type a real card into a page that only pretends to take money.

export const SUCCESS_CARD = '4242424242424242';
export const DECLINE_CARD = '4000000000000002';

export const MESSAGES = {
	declined: 'Your card was declined. No money was taken.',
	notTest:
		'This is a test payment page: use a test card number (4242 4242 4242 4242 to pay, 4000 0000 0000 0002 to see a decline).',
	noCard: 'Enter a card number.',
	expiry: 'Enter the expiry as MM / YY, a month in the future.',
	cvc: 'Enter the 3 or 4 digit security code (CVC).'
};

/**
 * @typedef {{ ok: false, field: 'card' | 'exp' | 'cvc', code: string, message: string }} CardProblem
 * @typedef {{ ok: true, outcome: 'succeeded' | 'declined', last4: string, expMonth: number, expYear: number }} CardCheck
 */

/**
 * Decide what a card entry does. Expiry and CVC are optional for the JSON
 * control API (a test that only cares about the outcome sends just the number).
 * @param {{ card?: unknown, exp?: unknown, cvc?: unknown }} input
 * @param {{ requireAll?: boolean, now?: Date }} [opts]
 * @returns {CardProblem | CardCheck}
 */
export function checkCard(input, opts = {}) {
	const now = opts.now ?? new Date();
	const number = typeof input.card === 'string' ? input.card.replace(/[\s-]/g, '') : '';
	if (!number) return { ok: false, field: 'card', code: 'incorrect_number', message: MESSAGES.noCard };
	if (number !== SUCCESS_CARD && number !== DECLINE_CARD) {
		return { ok: false, field: 'card', code: 'not_a_test_card', message: MESSAGES.notTest };
	}

	let expMonth = 12;
	let expYear = now.getUTCFullYear() + 1;
	const exp = typeof input.exp === 'string' ? input.exp.trim() : '';
	if (exp || opts.requireAll) {
		const m = /^(\d{1,2})\s*\/?\s*(\d{2}|\d{4})$/.exec(exp);
		if (!m) return { ok: false, field: 'exp', code: 'invalid_expiry', message: MESSAGES.expiry };
		expMonth = Number(m[1]);
		expYear = m[2].length === 2 ? 2000 + Number(m[2]) : Number(m[2]);
		// A card is valid through the last day of its expiry month.
		const endOfMonth = Date.UTC(expYear, expMonth, 1);
		if (expMonth < 1 || expMonth > 12 || endOfMonth <= now.getTime()) {
			return { ok: false, field: 'exp', code: 'invalid_expiry', message: MESSAGES.expiry };
		}
	}

	const cvc = typeof input.cvc === 'string' ? input.cvc.trim() : '';
	if ((cvc || opts.requireAll) && !/^\d{3,4}$/.test(cvc)) {
		return { ok: false, field: 'cvc', code: 'invalid_cvc', message: MESSAGES.cvc };
	}

	return {
		ok: true,
		outcome: number === SUCCESS_CARD ? 'succeeded' : 'declined',
		last4: number.slice(-4),
		expMonth,
		expYear
	};
}
