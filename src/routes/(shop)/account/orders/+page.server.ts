import { desc, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { orders } from '$lib/server/db/schema';
import type { PageServerLoad } from './$types';
import { requireRole, SIGNED_IN } from '$lib/server/access';

export const load: PageServerLoad = async (event) => ({
	orders: await db
		.select({ number: orders.number, status: orders.status, total: orders.total, currency: orders.currency, createdAt: orders.createdAt, promisedDate: orders.promisedDate })
		.from(orders)
		.where(eq(orders.userId, requireRole(event, SIGNED_IN).id))
		.orderBy(desc(orders.createdAt))
});
