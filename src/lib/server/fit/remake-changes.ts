// What a remake changes against the first cut: the workroom's corrections as they were decided on the
// fit report that ordered the remake (each figure old → new), with the reason she was given and the
// report they came from. Read by the remake's workroom page and printed on its cutting ticket.
import { eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fitReports, orders, type FitCorrection } from '../db/schema';

export type RemakeChanges = {
	/** The order whose skirt was reported on (the first cut). */
	firstNumber: string;
	reportId: number;
	/** When the report was decided (ISO), as the report is named on paper. */
	decidedAt: string | null;
	reason: string;
	corrections: FitCorrection[];
};

/** The changes of each remake order among the ids; orders that are not remakes are absent. */
export async function remakeChangesOf(db: Pick<Db, 'select'>, orderIds: number[]): Promise<Map<number, RemakeChanges>> {
	const ids = [...new Set(orderIds)];
	if (!ids.length) return new Map();
	const rows = await db
		.select({ remakeId: fitReports.remakeOrderId, reportId: fitReports.id, decidedAt: fitReports.decidedAt, corrections: fitReports.corrections, reason: fitReports.reason, firstNumber: orders.number })
		.from(fitReports)
		.innerJoin(orders, eq(orders.id, fitReports.orderId))
		.where(inArray(fitReports.remakeOrderId, ids));
	return new Map(
		rows.map((r) => [
			r.remakeId!,
			{ firstNumber: r.firstNumber, reportId: r.reportId, decidedAt: r.decidedAt?.toISOString() ?? null, reason: r.reason ?? '', corrections: r.corrections ?? [] }
		])
	);
}

/** One order's remake changes, or null when it is not a remake. */
export async function remakeChanges(db: Pick<Db, 'select'>, orderId: number): Promise<RemakeChanges | null> {
	return (await remakeChangesOf(db, [orderId])).get(orderId) ?? null;
}
