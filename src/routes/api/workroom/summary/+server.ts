import { json } from '@sveltejs/kit';
import type { SummaryAnswer } from '$lib/api/answers';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { lowStockFabrics, stageCounts } from '$lib/server/order/stats';
import type { RequestHandler } from './$types';

// Figures for the workroom's own screens.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	const [counts, lowStock] = await Promise.all([stageCounts(db), lowStockFabrics(db)]);
	return json({ stages: Object.fromEntries(counts.map((c) => [c.stage, c.count])), lowStock } satisfies SummaryAnswer);
};
