import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { lays } from '$lib/server/order/queue';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	return { lays: await lays(db) };
};
