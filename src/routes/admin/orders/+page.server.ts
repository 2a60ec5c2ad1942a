import { db } from '$lib/server/db';
import { readFilter, searchOrders } from '$lib/server/admin/orders';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => {
	const filter = readFilter(url);
	return { filter, ...(await searchOrders(db, filter)) };
};
