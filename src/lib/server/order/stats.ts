import { and, asc, count, inArray, isNull, lt, min, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orders } from '../db/schema';
import { OPEN_WORK_STAGES, ORDER_STAGES, type OrderStage } from '$lib/orders/stages';

/** Orders per stage with the age of the oldest one, from one grouped query. */
export async function stageCounts(db: Db) {
	const rows = await db
		.select({ status: orders.status, n: count(), oldest: min(orders.createdAt) })
		.from(orders)
		.groupBy(orders.status);
	const byStage = new Map(rows.map((r) => [r.status, r]));
	return ORDER_STAGES.map((stage: OrderStage) => ({
		stage,
		count: byStage.get(stage)?.n ?? 0,
		oldest: byStage.get(stage)?.oldest ?? null
	}));
}

// Below two metres a bolt cannot take one more long skirt: the workroom should reorder.
export const LOW_STOCK_CM = 200;

export function lowStockFabrics(db: Db, belowCm = LOW_STOCK_CM) {
	return db
		.select({ id: fabrics.id, name: fabrics.name, colour: fabrics.colour, stockCm: fabrics.stockCm, widthCm: fabrics.widthCm })
		.from(fabrics)
		.where(and(isNull(fabrics.retiredAt), lt(fabrics.stockCm, belowCm)))
		.orderBy(asc(fabrics.stockCm));
}

export async function overdueCount(db: Db) {
	const [row] = await db
		.select({ n: count() })
		.from(orders)
		.where(and(inArray(orders.status, [...OPEN_WORK_STAGES]), lt(orders.promisedDate, sql`CURRENT_DATE()`)));
	return row.n;
}

/** Money taken in the last `days` days, after refunds (orders paid in that time). */
export async function takingsSince(db: Db, days: number) {
	const [row] = await db
		.select({ total: sql<number>`COALESCE(SUM(${orders.total} - ${orders.refundedTotal}), 0)` })
		.from(orders)
		.where(sql`${orders.paidAt} IS NOT NULL AND ${orders.paidAt} >= DATE_SUB(CURRENT_DATE(), INTERVAL ${days} DAY)`);
	return Number(row?.total ?? 0);
}
