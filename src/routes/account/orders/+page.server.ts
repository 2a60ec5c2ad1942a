import { desc, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { orders } from '$lib/server/db/schema';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => ({
	orders: await db
		.select({ number: orders.number, status: orders.status, total: orders.total, currency: orders.currency, createdAt: orders.createdAt, promisedDate: orders.promisedDate })
		.from(orders)
		.where(eq(orders.userId, locals.user!.id))
		.orderBy(desc(orders.createdAt))
});
