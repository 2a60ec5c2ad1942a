import { error, fail, redirect } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { fitReports, orders } from '$lib/server/db/schema';
import { orderForShopper } from '$lib/server/order/view';
import { fitOffer } from '$lib/server/fit/report';
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
	const [row] = await db.select({ id: orders.id, status: orders.status, remakeOfId: orders.remakeOfId }).from(orders).where(eq(orders.number, order.number));
	const [first] = row.remakeOfId ? await db.select({ number: orders.number }).from(orders).where(eq(orders.id, row.remakeOfId)) : [];
	const [report] = await db.select({ id: fitReports.id }).from(fitReports).where(eq(fitReports.orderId, row.id)).limit(1);
	const offer = report ? null : await fitOffer(db, row);
	const fit = report ? ('sent' as const) : offer ? ('open' as const) : null;
	return { order, drawings: await orderLineDrawings(db, order.number), token, fit, fitCloses: offer?.closes ?? null, remakeOf: first?.number ?? null, justPaid: url.searchParams.has('paid'), retry: url.searchParams.has('retry') };
};

export const actions: Actions = {
	pay: async ({ params, locals, url }) => {
		const order = await orderForShopper(db, params.number, locals.user, url.searchParams.get('t'));
		if (!order) error(404, NOT_FOUND);
		const [row] = await db.select({ id: orders.id }).from(orders).where(eq(orders.number, order.number));
		const payment = await startPayment(db, stripe(), row.id, env.ORIGIN ?? url.origin);
		if (!payment.ok) return fail(payment.reason === 'away' ? 503 : 409, { payError: payment.message });
		redirect(303, payment.url);
	}
};
