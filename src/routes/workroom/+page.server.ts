import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { lowStockFabrics, overdueCount, stageCounts } from '$lib/server/stats';
import { workQueue } from '$lib/server/workroom/queue';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const [counts, lowStock, overdue, queue] = await Promise.all([stageCounts(db), lowStockFabrics(db), overdueCount(db), workQueue(db, ['paid', 'altering'])]);
	return { counts: counts.filter((c) => ['paid', 'cutting', 'sewn', 'finished'].includes(c.stage)), lowStock, overdue, queue };
};
