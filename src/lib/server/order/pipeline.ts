import { sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { OPEN_WORK_STAGES, ORDER_STAGES, type OrderStage } from '$lib/orders/stages';

type Rows<T> = [T[], unknown];

/** Each stage: how many orders, the age in days of the oldest, and how many are past their date. */
export async function pipelineBoard(db: Db) {
	const [rows] = (await db.execute(sql`
		SELECT o.status AS stage,
		       COUNT(*) AS n,
		       MAX(DATEDIFF(CURRENT_DATE(), DATE(COALESCE(e.entered, o.created_at)))) AS oldestDays,
		       SUM(o.promised_date < CURRENT_DATE() AND o.status IN (${sql.join(OPEN_WORK_STAGES.map((s) => sql`${s}`), sql`, `)})) AS overdue
		FROM \`order\` o
		LEFT JOIN (SELECT order_id, to_status, MAX(created_at) AS entered FROM order_event WHERE kind = 'stage' GROUP BY order_id, to_status) e
		       ON e.order_id = o.id AND e.to_status = o.status
		GROUP BY o.status`)) as unknown as Rows<{ stage: OrderStage; n: number; oldestDays: number | null; overdue: number | string }>;
	const by = new Map(rows.map((r) => [r.stage, r]));
	return ORDER_STAGES.map((stage) => ({
		stage,
		count: Number(by.get(stage)?.n ?? 0),
		oldestDays: by.get(stage)?.oldestDays ?? null,
		overdue: Number(by.get(stage)?.overdue ?? 0)
	}));
}

/** Orders placed each week, and the median days from paid to shipped of the orders shipped that week. */
export async function weeklyFigures(db: Db, weeks = 12) {
	const [placed] = (await db.execute(sql`
		SELECT DATE_FORMAT(DATE_SUB(DATE(created_at), INTERVAL WEEKDAY(created_at) DAY), '%Y-%m-%d') AS week, COUNT(*) AS n
		FROM \`order\`
		WHERE created_at >= DATE_SUB(CURRENT_DATE(), INTERVAL ${weeks} WEEK)
		GROUP BY week ORDER BY week`)) as unknown as Rows<{ week: string; n: number }>;
	// MariaDB's MEDIAN is a window function: one value per partition, repeated on each row.
	const [median] = (await db.execute(sql`
		SELECT DISTINCT week, MEDIAN(days) OVER (PARTITION BY week) AS median
		FROM (
			SELECT DATE_FORMAT(DATE_SUB(DATE(s.created_at), INTERVAL WEEKDAY(s.created_at) DAY), '%Y-%m-%d') AS week,
			       TIMESTAMPDIFF(HOUR, o.paid_at, s.created_at) / 24 AS days
			FROM order_event s JOIN \`order\` o ON o.id = s.order_id
			WHERE s.to_status = 'shipped' AND o.paid_at IS NOT NULL AND s.created_at >= DATE_SUB(CURRENT_DATE(), INTERVAL ${weeks} WEEK)
		) shipped ORDER BY week`)) as unknown as Rows<{ week: string; median: number | string }>;
	const start = new Date();
	start.setUTCHours(0, 0, 0, 0);
	start.setUTCDate(start.getUTCDate() - ((start.getUTCDay() + 6) % 7) - 7 * (weeks - 1));
	const placedBy = new Map(placed.map((r) => [r.week, Number(r.n)]));
	const medianBy = new Map(median.map((r) => [r.week, Number(r.median)]));
	return Array.from({ length: weeks }, (_, i) => {
		const d = new Date(start.getTime() + i * 7 * 86_400_000).toISOString().slice(0, 10);
		return { week: d, orders: placedBy.get(d) ?? 0, medianDaysToShip: medianBy.has(d) ? Math.round(medianBy.get(d)! * 10) / 10 : null };
	});
}
