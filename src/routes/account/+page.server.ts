import { desc, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { measurementProfiles, orders } from '$lib/server/db/schema';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const userId = locals.user!.id;
	const [cards, myOrders] = await Promise.all([
		db.select().from(measurementProfiles).where(eq(measurementProfiles.userId, userId)).orderBy(desc(measurementProfiles.updatedAt)),
		db
			.select({ number: orders.number, status: orders.status, total: orders.total, currency: orders.currency, createdAt: orders.createdAt, promisedDate: orders.promisedDate })
			.from(orders)
			.where(eq(orders.userId, userId))
			.orderBy(desc(orders.createdAt))
	]);
	return { cards, orders: myOrders };
};
