import { json } from '@sveltejs/kit';
import type { PaymentAwayAnswer, PlacedOrderAnswer } from '$lib/api/answers';
import { env } from '$env/dynamic/private';
import { asBodyFailure, failure } from '$lib/failure';
import { failureJson, invalidBody } from '$lib/server/answer';
import { orderApiSchema } from '$lib/forms/order-api';
import { bagItemOf } from '$lib/forms/quote';
import { validateMeasurements } from '$lib/drafting';
import { createHash } from 'node:crypto';
import { db } from '$lib/server/db';
import { hit } from '$lib/server/limits';
import { deliverQueued } from '$lib/server/mail';
import { stripe } from '$lib/server/order/payments/stripe';
import { placeOrder, startPayment } from '$lib/server/order/place';
import type { RequestHandler } from './$types';

// Each order mails its address and opens a payment page, so orders are counted per client and per
// e-mail address in fixed one-hour windows (settings, so a bench or a busy headless shop can raise them).
const WINDOW_SECONDS = 3600;
const limitOf = (value: string | undefined, fallback: number) => (value && /^\d+$/.test(value) ? Number(value) : fallback);

function tooMany(what: string, retryAfter: number) {
	const minutes = Math.ceil(retryAfter / 60);
	return failureJson(failure(429, `Too many orders ${what} in the last hour: try again in ${minutes} minute${minutes === 1 ? '' : 's'}. Nothing was ordered.`), { 'retry-after': String(retryAfter) });
}

// Places an order awaiting payment and opens its payment page, priced on the server like the
// checkout form. 201 with { number, paymentUrl }; 400/409 with a message; 429 with Retry-After past
// the limits; 503 if payment is away.
export const POST: RequestHandler = async ({ request, locals, url, getClientAddress }) => {
	const body = await request.json().catch(() => undefined);
	const parsed = orderApiSchema.safeParse(body);
	if (!parsed.success) return failureJson(invalidBody(parsed.error));
	const { items, shopper } = parsed.data;
	const bag = items.map((item, i) => bagItemOf(item, `api-${i}-${crypto.randomUUID().slice(0, 8)}`));
	for (const [i, item] of bag.entries()) {
		const problems = validateMeasurements(item.measurements);
		if (problems.length) return failureJson(failure(400, 'Some values need a second look.', { fields: Object.fromEntries(problems.map((p) => [`items.${i}.measurements.${p.field}`, [p.message]])) }));
	}
	const perClient = await hit(db, `orders:client:${getClientAddress()}`, { limit: limitOf(env.ORDER_LIMIT_PER_CLIENT, 20), windowSeconds: WINDOW_SECONDS });
	if (!perClient.allowed) return tooMany('from your address', perClient.retryAfter);
	// Hashed: an address can be longer than the counter's key, and the counter need not hold it.
	const mailbox = createHash('sha256').update(shopper.email.trim().toLowerCase()).digest('hex');
	const perEmail = await hit(db, `orders:email:${mailbox}`, { limit: limitOf(env.ORDER_LIMIT_PER_EMAIL, 5), windowSeconds: WINDOW_SECONDS });
	if (!perEmail.allowed) return tooMany('for this e-mail address', perEmail.retryAfter);
	const placed = await placeOrder(db, bag, {
		email: shopper.email,
		name: shopper.name,
		userId: locals.user?.id ?? null,
		address: { name: shopper.name, line1: shopper.line1, ...(shopper.line2 ? { line2: shopper.line2 } : {}), city: shopper.city, postcode: shopper.postcode, country: shopper.country }
	});
	if (!placed.ok) return failureJson(asBodyFailure(placed));
	void deliverQueued(placed.mailIds);
	const payment = await startPayment(db, stripe(), placed.order.id, env.ORIGIN ?? url.origin);
	// The order stands; the client can open its payment page later from the order's own link.
	if (!payment.ok) return json({ number: placed.order.number, message: payment.message } satisfies PaymentAwayAnswer, { status: 503 });
	return json({ number: placed.order.number, total: placed.order.total, currency: placed.order.currency, paymentUrl: payment.url } satisfies PlacedOrderAnswer, { status: 201 });
};
