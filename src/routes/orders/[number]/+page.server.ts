import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { orderForShopper } from '$lib/server/orders/view';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, locals, url }) => {
	const token = url.searchParams.get('t');
	const order = await orderForShopper(db, params.number, locals.user, token);
	if (!order) error(404, 'We could not find that order. Open it from the link in your e-mail, or sign in to the account you ordered with.');
	return { order, token, justPaid: url.searchParams.has('paid') };
};
