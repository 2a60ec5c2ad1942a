// @ts-check
// The payment fake's state: checkout sessions, payment intents, charges and
// refunds, kept in memory and shaped like the provider's objects (only the
// fields an app reads; see fakes/README.md for what is left out).
import { ApiError, newId, noSuch, nowSeconds } from './errors.js';
import { checkCard, MESSAGES } from './cards.js';
import { readCheckoutParams } from './params.js';
import { createRefund } from './refunds.js';
import { listPage } from './lists.js';

/** @typedef {Record<string, any>} Obj */
/**
 * @typedef {(type: string, object: Obj, previous: Obj | undefined, apiVersion: string | null) => void} Emit
 * @typedef {{ session: Obj, lineItems: Obj[], apiVersion: string | null, intentData: { metadata?: Record<string, string>, description?: string } }} SessionRecord
 * @typedef {import('./cards.js').CardProblem} CardProblem
 * @typedef {{ outcome: 'succeeded', session: Obj, paymentIntent: Obj, charge: Obj, redirectUrl: string }
 *   | { outcome: 'declined', session: Obj, code: string, message: string }
 *   | { outcome: 'invalid', session: Obj, problem: CardProblem }} PayResult
 */

/** @param {Obj} o */
const copy = (o) => structuredClone(o);

/**
 * @param {{ publicUrl: string, emit: Emit }} opts publicUrl: where browsers reach /pay (set again once the port is known)
 */
export function createLedger({ publicUrl, emit }) {
	let base = publicUrl;
	/** @type {Map<string, SessionRecord>} */
	const sessions = new Map();
	/** @type {Map<string, Obj>} */
	const intents = new Map();
	/** @type {Map<string, Obj>} */
	const charges = new Map();
	/** @type {Map<string, Obj>} */
	const refunds = new Map();
	/** @type {Map<string, string>} charge id → session id, to reach the session's api version */
	const chargeSession = new Map();

	/** @param {string} id */
	function record(id) {
		const rec = sessions.get(id);
		if (!rec) throw noSuch('checkout.session', id);
		expireIfDue(rec);
		return rec;
	}

	/**
	 * @param {SessionRecord} rec
	 * @param {'api' | 'timer' | 'control'} why
	 */
	function expire(rec, why) {
		const s = rec.session;
		if (s.status !== 'open') {
			throw new ApiError(
				400,
				'checkout_session_not_open',
				`Only Checkout Sessions with a status in ["open"] can be expired. This one is ${s.status}.`,
				{ replayable: true }
			);
		}
		s.status = 'expired';
		s.url = null;
		if (why === 'timer') s.expires_at = Math.min(s.expires_at, nowSeconds());
		emit('checkout.session.expired', copy(s), undefined, rec.apiVersion);
	}

	/** @param {SessionRecord} rec */
	function expireIfDue(rec) {
		if (rec.session.status === 'open' && rec.session.expires_at <= nowSeconds()) expire(rec, 'timer');
	}

	return {
		/** @param {string} url */
		setPublicUrl(url) {
			base = url;
		},

		/**
		 * @param {Obj} params form-decoded body
		 * @param {string | null} apiVersion the Stripe-Version the caller sent, echoed on its events
		 */
		createSession(params, apiVersion) {
			const p = readCheckoutParams(params);
			const id = newId('cs_test_', 58);
			const created = nowSeconds();
			const lineItems = p.items.map((item) => {
				const total = item.unitAmount * item.quantity;
				return {
					id: newId('li_'),
					object: 'item',
					amount_discount: 0,
					amount_subtotal: total,
					amount_tax: 0,
					amount_total: total,
					currency: p.currency,
					description: item.name,
					price: {
						id: newId('price_'),
						object: 'price',
						active: false,
						currency: p.currency,
						product: newId('prod_'),
						type: 'one_time',
						unit_amount: item.unitAmount
					},
					quantity: item.quantity
				};
			});
			const amount = lineItems.reduce((sum, li) => sum + li.amount_total, 0);
			const session = {
				id,
				object: 'checkout.session',
				amount_subtotal: amount,
				amount_total: amount,
				cancel_url: p.cancelUrl,
				client_reference_id: p.clientReferenceId,
				created,
				currency: p.currency,
				customer: null,
				customer_details: null,
				customer_email: p.customerEmail,
				expires_at: p.expiresAt ?? created + 24 * 3600,
				livemode: false,
				locale: p.locale,
				metadata: p.metadata,
				mode: 'payment',
				payment_intent: null,
				payment_method_types: ['card'],
				payment_status: 'unpaid',
				status: 'open',
				success_url: p.successUrl,
				total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
				ui_mode: 'hosted',
				url: `${base}/pay/${id}`
			};
			sessions.set(id, { session, lineItems, apiVersion, intentData: p.intentData });
			return copy(session);
		},

		/** @param {string} id */
		getSession: (id) => copy(record(id).session),

		/**
		 * GET /v1/checkout/sessions: filters payment_intent, status, customer_details[email].
		 * @param {Obj} params
		 */
		listSessions(params) {
			const all = [...sessions.values()].reverse();
			for (const rec of all) expireIfDue(rec);
			return listPage(
				all.map((r) => r.session),
				params,
				{
					kind: 'checkout.session',
					url: '/v1/checkout/sessions',
					filters: {
						payment_intent: (s, v) => s.payment_intent === v,
						status: (s, v) => s.status === v,
						customer_details: (s, v) => s.customer_details?.email === v?.email
					}
				}
			);
		},

		/** @param {string} id */
		lineItems: (id) => record(id).lineItems.map(copy),

		/**
		 * @param {string} id
		 * @param {'api' | 'control'} why
		 */
		expireSession(id, why) {
			const rec = record(id);
			expire(rec, why);
			return copy(rec.session);
		},

		/** Expire every open session whose expires_at has passed (run on a timer). */
		expireDue() {
			for (const rec of sessions.values()) expireIfDue(rec);
		},

		/**
		 * Pay a session with a test card, as the hosted page or the control API does.
		 * @param {string} id
		 * @param {{ card?: unknown, exp?: unknown, cvc?: unknown }} input
		 * @param {{ requireAll?: boolean }} [opts]
		 * @returns {PayResult}
		 */
		pay(id, input, opts = {}) {
			const rec = record(id);
			const s = rec.session;
			if (s.status !== 'open') {
				throw new ApiError(
					409,
					'checkout_session_not_open',
					`This Checkout Session is ${s.status}, so it cannot be paid.`
				);
			}
			const check = checkCard(input, opts);
			if (!check.ok) return { outcome: 'invalid', session: copy(s), problem: check };
			if (check.outcome === 'declined') {
				return {
					outcome: 'declined',
					session: copy(s),
					code: 'card_declined',
					message: MESSAGES.declined
				};
			}

			const created = nowSeconds();
			const intentData = rec.intentData;
			const metadata = { ...s.metadata, ...(intentData.metadata ?? {}) };
			const piId = newId('pi_');
			const chId = newId('ch_');
			const pmId = newId('pm_');
			const card = {
				brand: 'visa',
				country: 'US',
				exp_month: check.expMonth,
				exp_year: check.expYear,
				funding: 'credit',
				last4: check.last4
			};
			const charge = {
				id: chId,
				object: 'charge',
				amount: s.amount_total,
				amount_captured: s.amount_total,
				amount_refunded: 0,
				billing_details: { address: null, email: s.customer_email, name: null, phone: null },
				captured: true,
				created,
				currency: s.currency,
				description: intentData.description ?? null,
				disputed: false,
				livemode: false,
				metadata,
				outcome: {
					network_status: 'approved_by_network',
					seller_message: 'Payment complete.',
					type: 'authorized'
				},
				paid: true,
				payment_intent: piId,
				payment_method: pmId,
				payment_method_details: { card, type: 'card' },
				receipt_email: s.customer_email,
				refunded: false,
				status: 'succeeded'
			};
			const intent = {
				id: piId,
				object: 'payment_intent',
				amount: s.amount_total,
				amount_capturable: 0,
				amount_received: s.amount_total,
				capture_method: 'automatic',
				client_secret: `${piId}_secret_${newId('', 24)}`,
				created,
				currency: s.currency,
				customer: null,
				description: intentData.description ?? null,
				latest_charge: chId,
				livemode: false,
				metadata,
				payment_method: pmId,
				payment_method_types: ['card'],
				receipt_email: s.customer_email,
				status: 'succeeded'
			};
			charges.set(chId, charge);
			intents.set(piId, intent);
			chargeSession.set(chId, s.id);
			s.status = 'complete';
			s.payment_status = 'paid';
			s.payment_intent = piId;
			s.url = null;
			s.customer_details = { address: null, email: s.customer_email, name: null, phone: null };
			emit('checkout.session.completed', copy(s), undefined, rec.apiVersion);
			return {
				outcome: 'succeeded',
				session: copy(s),
				paymentIntent: copy(intent),
				charge: copy(charge),
				redirectUrl: String(s.success_url).replaceAll('{CHECKOUT_SESSION_ID}', s.id)
			};
		},

		/**
		 * Registers a payment that was made before this process started (the demo atelier's past
		 * orders), so it can be looked up and refunded like one paid on the page.
		 * @param {{ id: string, amount: number, currency: string, amount_refunded?: number, metadata?: Obj, email?: string }} p
		 */
		importPayment(p) {
			if (!/^pi_[A-Za-z0-9_-]+$/.test(String(p.id)) || !Number.isInteger(p.amount) || p.amount <= 0) {
				throw new ApiError(400, 'parameter_invalid', 'Send {id: "pi_…", amount: positive integer, currency}.');
			}
			const created = Math.floor(Date.now() / 1000);
			const chId = `ch_${String(p.id).slice(3)}`;
			const refunded = Math.min(p.amount_refunded ?? 0, p.amount);
			const currency = String(p.currency ?? 'eur').toLowerCase();
			const metadata = p.metadata ?? {};
			charges.set(chId, { id: chId, object: 'charge', amount: p.amount, amount_captured: p.amount, amount_refunded: refunded, captured: true, created, currency, livemode: false, metadata, paid: true, payment_intent: p.id, receipt_email: p.email ?? null, refunded: refunded >= p.amount, refunds: { object: 'list', data: [], has_more: false }, status: 'succeeded' });
			const intent = { id: p.id, object: 'payment_intent', amount: p.amount, amount_received: p.amount, capture_method: 'automatic', created, currency, latest_charge: chId, livemode: false, metadata, status: 'succeeded' };
			intents.set(p.id, intent);
			return copy(intent);
		},

		/** @param {string} id */
		getIntent(id) {
			const pi = intents.get(id);
			if (!pi) throw noSuch('payment_intent', id);
			return copy(pi);
		},

		/** @param {string} id */
		getCharge(id) {
			const ch = charges.get(id);
			if (!ch) throw noSuch('charge', id);
			return copy(ch);
		},

		/** @param {string} id */
		getRefund(id) {
			const re = refunds.get(id);
			if (!re) throw noSuch('refund', id);
			return copy(re);
		},

		/**
		 * GET /v1/refunds: filters charge, payment_intent.
		 * @param {Obj} params
		 */
		listRefunds(params) {
			return listPage([...refunds.values()].reverse(), params, {
				kind: 'refund',
				url: '/v1/refunds',
				filters: { charge: (r, v) => r.charge === v, payment_intent: (r, v) => r.payment_intent === v }
			});
		},

		/** @param {Obj} params */
		createRefund(params) {
			return createRefund(params, {
				charges,
				intents,
				refunds,
				emit,
				apiVersionOf: (chargeId) => {
					const id = chargeSession.get(chargeId);
					return (id && sessions.get(id)?.apiVersion) || null;
				}
			});
		},
		/**
		 * Any stored object by id, for `expand[]`.
		 * @param {string} id
		 * @returns {Obj | undefined}
		 */
		lookup(id) {
			const found = sessions.get(id)?.session ?? intents.get(id) ?? charges.get(id) ?? refunds.get(id);
			return found ? copy(found) : undefined;
		}
	};
}
