import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { lowStockFabrics, overdueCount, stageCounts } from '$lib/server/order/stats';
import { workQueue } from '$lib/server/order/queue';
import { OPEN_WORK_STAGES } from '$lib/orders/stages';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const [counts, lowStock, overdue, queue] = await Promise.all([stageCounts(db), lowStockFabrics(db), overdueCount(db), workQueue(db)]);
	return { counts: counts.filter((c) => OPEN_WORK_STAGES.includes(c.stage)), lowStock, overdue, queue };
};
