import { json } from '@sveltejs/kit';
import type { FailureAnswer, ShopperOrderAnswer } from '$lib/api/answers';
import { db } from '$lib/server/db';
import { orderForShopper } from '$lib/server/order/view';
import type { RequestHandler } from './$types';

// The order page polls this to keep its timeline current without a reload.
export const GET: RequestHandler = async ({ params, locals, url }) => {
	const order = await orderForShopper(db, params.number, locals.user, url.searchParams.get('t'));
	if (!order) return json({ message: 'No such order.' } satisfies FailureAnswer, { status: 404 });
	return json(order satisfies ShopperOrderAnswer, { headers: { 'cache-control': 'no-store' } });
};
