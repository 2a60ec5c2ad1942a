import { json } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';
import { fieldErrors } from '$lib/forms/errors';
import { orderApiSchema } from '$lib/forms/order-api';
import { toCm } from '$lib/forms/quote';
import { validateMeasurements } from '$lib/drafting';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { stripe } from '$lib/server/payments/stripe';
import { placeOrder, startPayment } from '$lib/server/shop/checkout';
import type { RequestHandler } from './$types';

// Places an order awaiting payment and opens its payment page, priced on the server like the
// checkout form. 201 with { number, paymentUrl }; 400/409 with a message; 503 if payment is away.
export const POST: RequestHandler = async ({ request, locals, url }) => {
	const body = await request.json().catch(() => undefined);
	const parsed = orderApiSchema.safeParse(body);
	if (!parsed.success) return json({ message: 'Some values need a second look.', fields: fieldErrors(parsed.error) }, { status: 400 });
	const { items, shopper } = parsed.data;
	const bag = items.map((item, i) => ({ id: `api-${i}-${crypto.randomUUID().slice(0, 8)}`, style: item.style, fabricId: item.fabricId, options: item.options, units: item.units, measurements: toCm(item.measurements, item.units) }));
	for (const [i, item] of bag.entries()) {
		const problems = validateMeasurements(item.measurements);
		if (problems.length) return json({ message: 'Some values need a second look.', fields: Object.fromEntries(problems.map((p) => [`items.${i}.measurements.${p.field}`, [p.message]])) }, { status: 400 });
	}
	const placed = await placeOrder(db, bag, {
		email: shopper.email,
		name: shopper.name,
		userId: locals.user?.id ?? null,
		address: { name: shopper.name, line1: shopper.line1, ...(shopper.line2 ? { line2: shopper.line2 } : {}), city: shopper.city, postcode: shopper.postcode, country: shopper.country }
	});
	if (!placed.ok) return json({ message: placed.problem.message }, { status: placed.problem.status === 404 ? 400 : placed.problem.status });
	void deliverQueued(placed.mailIds);
	const payment = await startPayment(db, stripe(), placed.order.id, env.ORIGIN ?? url.origin);
	if (!payment.ok) return json({ number: placed.order.number, message: payment.message }, { status: 503 });
	return json({ number: placed.order.number, total: placed.order.total, currency: placed.order.currency, paymentUrl: payment.url }, { status: 201 });
};
