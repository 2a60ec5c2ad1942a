import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { lowStockFabrics, stageCounts } from '$lib/server/stats';

// Figures for the workroom's own screens; the hooks let only cutters and the owner in.
export const GET = async () => {
	const [counts, lowStock] = await Promise.all([stageCounts(db), lowStockFabrics(db)]);
	return json({ stages: Object.fromEntries(counts.map((c) => [c.stage, c.count])), lowStock });
};
