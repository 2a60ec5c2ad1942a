import { db } from '$lib/server/db';
import { readFilter, searchOrders } from '$lib/server/order/owner-list';
import type { PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const filter = readFilter(event.url);
	return { filter, ...(await searchOrders(db, filter)) };
};
