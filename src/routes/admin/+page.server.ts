import { db } from '$lib/server/db';
import { staffCounts } from '$lib/server/account/staff';
import { pipelineBoard, weeklyFigures } from '$lib/server/order/pipeline';
import { lowStockFabrics, takingsSince } from '$lib/server/order/stats';
import type { PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const [board, weeks, lowStock, staff, takings] = await Promise.all([
		pipelineBoard(db),
		weeklyFigures(db),
		lowStockFabrics(db),
		staffCounts(db),
		takingsSince(db, 30)
	]);
	return { board, weeks, lowStock, staff, takings30: takings, overdue: board.reduce((s, b) => s + b.overdue, 0) };
};
