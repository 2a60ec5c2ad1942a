import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { env } from '$env/dynamic/private';
import { checkoutFormSchema } from '$lib/forms/checkout';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { orderLink } from '$lib/server/order/link';
import { stripe } from '$lib/server/order/payments/stripe';
import { clearBag, readBag } from '$lib/server/quote/bag';
import { asBodyFailure } from '$lib/failure';
import { viewBag } from '$lib/server/quote/bag-view';
import { orderByCheckoutKey, placeOrder, startPayment } from '$lib/server/order/place';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ cookies, locals }) => {
	const items = readBag(cookies);
	if (items.length === 0) redirect(303, '/bag');
	const form = await superValidate(zod4(checkoutFormSchema), { errors: false });
	// Made when the page loads and sent back with the form: the same form sent twice is one order.
	form.data.checkoutKey = crypto.randomUUID();
	if (locals.user) {
		form.data.email = locals.user.email;
		form.data.name = locals.user.name;
	}
	return { form, bag: await viewBag(db, items) };
};

export const actions: Actions = {
	default: async ({ request, cookies, locals, url }) => {
		const form = await superValidate(request, zod4(checkoutFormSchema));
		if (!form.valid) return fail(400, { form });
		const d = form.data;
		// Sent before (a double click, a retry after a lost answer, the back button): that order, not another.
		const earlier = d.checkoutKey ? await orderByCheckoutKey(db, d.checkoutKey) : null;
		if (earlier && earlier.email !== d.email) return message(form, 'This checkout page was already used for another order: reload it and send the form again.', { status: 409 });
		const placed = earlier
			? { ok: true as const, order: earlier, mailIds: [] as number[] }
			: await placeOrder(db, readBag(cookies), {
					email: d.email,
					name: d.name,
					userId: locals.user?.id ?? null,
					checkoutKey: d.checkoutKey ?? null,
					address: { name: d.name, line1: d.line1, ...(d.line2 ? { line2: d.line2 } : {}), city: d.city, postcode: d.postcode, country: d.country }
				});
		if (!placed.ok) return message(form, placed.message, { status: asBodyFailure(placed).status });
		clearBag(cookies);
		void deliverQueued(placed.mailIds);
		const payment = await startPayment(db, stripe(), placed.order.id, env.ORIGIN ?? url.origin);
		// The order is saved either way. When the payment service is away she lands on her order page,
		// which says so and offers to try again; when it is paid already, on her order page as well.
		if (!payment.ok) {
			const link = new URL(orderLink(placed.order.number));
			redirect(303, `${link.pathname}${link.search}${payment.reason === 'away' ? '&retry=1' : ''}`);
		}
		redirect(303, payment.url);
	}
};
