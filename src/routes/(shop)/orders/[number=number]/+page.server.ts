import { error, fail, redirect } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { orderForShopper, orderIdOf } from '$lib/server/order/view';
import { fitStateOfOrder } from '$lib/server/fit/report';
import { stripe } from '$lib/server/order/payments/stripe';
import { startPayment } from '$lib/server/order/place';
import { orderLineDrawings } from '$lib/server/outputs/garment';
import type { Actions, PageServerLoad } from './$types';

const NOT_FOUND = 'We could not find that order. Open it from the link in your e-mail, or sign in to the account you ordered with.';

export const load: PageServerLoad = async ({ params, locals, url }) => {
	const token = url.searchParams.get('t');
	const order = await orderForShopper(db, params.number, locals.user, token);
	if (!order) error(404, NOT_FOUND);
	// "Tell us how it fits" once the skirt has arrived and while the remake window (a setting) is open.
	const [state, drawings] = await Promise.all([fitStateOfOrder(db, order.number), orderLineDrawings(db, order.number)]);
	return { order, drawings, token, fit: state?.fit ?? null, fitCloses: state?.closes ?? null, remakeOf: state?.remakeOf ?? null, justPaid: url.searchParams.has('paid'), retry: url.searchParams.has('retry') };
};

export const actions: Actions = {
	pay: async ({ params, locals, url }) => {
		const order = await orderForShopper(db, params.number, locals.user, url.searchParams.get('t'));
		if (!order) error(404, NOT_FOUND);
		const payment = await startPayment(db, stripe(), await orderIdOf(db, order.number), env.ORIGIN ?? url.origin);
		if (!payment.ok) return fail(payment.reason === 'away' ? 503 : 409, { payError: payment.message });
		redirect(303, payment.url);
	}
};
