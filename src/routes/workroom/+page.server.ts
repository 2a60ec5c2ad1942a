import { db } from '$lib/server/db';
import { lowStockFabrics, overdueCount, stageCounts } from '$lib/server/stats';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const [counts, lowStock, overdue] = await Promise.all([stageCounts(db), lowStockFabrics(db), overdueCount(db)]);
	return { counts: counts.filter((c) => ['paid', 'cutting', 'sewn', 'finished'].includes(c.stage)), lowStock, overdue };
};
