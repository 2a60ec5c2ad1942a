import { count, sql } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { orders, users } from '$lib/server/db/schema';
import { pipelineBoard, weeklyFigures } from '$lib/server/order/pipeline';
import { lowStockFabrics } from '$lib/server/order/stats';
import type { PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const [board, weeks, lowStock, staff, takings] = await Promise.all([
		pipelineBoard(db),
		weeklyFigures(db),
		lowStockFabrics(db),
		db.select({ role: users.role, n: count() }).from(users).where(sql`${users.role} <> 'shopper'`).groupBy(users.role),
		db
			.select({ total: sql<number>`COALESCE(SUM(${orders.total} - ${orders.refundedTotal}), 0)` })
			.from(orders)
			.where(sql`${orders.paidAt} IS NOT NULL AND ${orders.paidAt} >= DATE_SUB(CURRENT_DATE(), INTERVAL 30 DAY)`)
	]);
	return { board, weeks, lowStock, staff, takings30: Number(takings[0]?.total ?? 0), overdue: board.reduce((s, b) => s + b.overdue, 0) };
};
