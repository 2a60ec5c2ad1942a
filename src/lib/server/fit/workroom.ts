// The workroom's side of the fit loop: who may decide, the list of reports, and one report beside the
// figures of the skirt as it was first drafted.
import { error } from '@sveltejs/kit';
import { count, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, fitReports, orderLines, orders, styles, users } from '../db/schema';
import { requireRole, STAFF } from '../access';
import { shopSettingsOf } from '../house/rules';
import { cardFor } from './card';
import { photosOf, purgeExpiredPhotos } from './photos';
import { remakesUsed } from './decide';
import { firstName } from '$lib/orders/names';

type Event = Parameters<typeof requireRole>[0];

/**
 * The owner, or a cutter she has allowed (Staff page), may open and decide fit reports. Other cutters
 * are refused (403): the reports carry photos of a body and her figures.
 */
export async function requireFitDecider(db: Db, event: Event) {
	const user = requireRole(event, STAFF);
	if (!(await hasFitLeave(db, user))) error(403, 'Fit reports are for the owner and the cutters she allows. Ask her for leave on the Staff page.');
	return user;
}

/** Whether this person may open fit reports and their photos: the owner, or a cutter she allows. */
export async function hasFitLeave(db: Db, user: { id: string; role: string }): Promise<boolean> {
	if (user.role === 'owner') return true;
	if (user.role !== 'cutter') return false;
	const [row] = await db.select({ leave: users.fitDecider }).from(users).where(eq(users.id, user.id));
	return Boolean(row?.leave);
}

/** Reports nobody has opened yet (the workroom menu's count). */
export async function newReportCount(db: Db): Promise<number> {
	const [row] = await db.select({ n: count() }).from(fitReports).where(eq(fitReports.status, 'new'));
	return Number(row?.n ?? 0);
}

export async function fitReportList(db: Db) {
	const rows = await db
		.select({ id: fitReports.id, status: fitReports.status, wish: fitReports.wish, decision: fitReports.decision, at: fitReports.createdAt, number: orders.number, shopperName: orders.shopperName, style: styles.name, answers: fitReports.answers })
		.from(fitReports)
		.innerJoin(orders, eq(orders.id, fitReports.orderId))
		.innerJoin(orderLines, eq(orderLines.id, fitReports.orderLineId))
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.orderBy(sql`FIELD(${fitReports.status}, 'new', 'waiting', 'decided')`, desc(fitReports.createdAt))
		.limit(300);
	// The workroom sees a first name, as on its other pages.
	return rows.map((r) => ({ ...r, shopperName: firstName(r.shopperName), at: r.at.toISOString() }));
}

export async function fitReportForStaff(db: Db, id: number) {
	const settings = await shopSettingsOf(db);
	await purgeExpiredPhotos(db, settings.photoRetentionDays);
	const [row] = await db
		.select({ report: fitReports, order: orders, line: orderLines, style: styles.name, styleKind: styles.kind, fabric: fabrics.name, colour: fabrics.colour })
		.from(fitReports)
		.innerJoin(orders, eq(orders.id, fitReports.orderId))
		.innerJoin(orderLines, eq(orderLines.id, fitReports.orderLineId))
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(fitReports.id, id));
	if (!row) return null;
	// Opened by the workroom: no longer new, waiting for its decision.
	if (row.report.status === 'new') await db.update(fitReports).set({ status: 'waiting' }).where(eq(fitReports.id, id));
	const [photos, card, used, remake] = await Promise.all([
		photosOf(db, id),
		cardFor(db, row.order.userId, row.line.measurements),
		remakesUsed(db, row.order.remakeOfId ?? row.order.id),
		row.report.remakeOrderId ? db.select({ id: orders.id, number: orders.number }).from(orders).where(eq(orders.id, row.report.remakeOrderId)) : Promise.resolve([])
	]);
	const r = row.report;
	return {
		report: { id: r.id, status: r.status === 'new' ? ('waiting' as const) : r.status, answers: r.answers, marks: r.marks, note: r.note, wish: r.wish, units: r.units, decision: r.decision, reason: r.reason, corrections: r.corrections ?? [], createdAt: r.createdAt.toISOString(), decidedAt: r.decidedAt?.toISOString() ?? null },
		order: { id: row.order.id, number: row.order.number, firstName: row.order.shopperName.trim().split(/\s+/)[0], status: row.order.status, kind: row.order.kind, guest: !row.order.userId },
		line: { style: row.style, styleKind: row.styleKind, fabric: row.fabric, colour: row.colour, measurements: row.line.measurements, adjustments: row.line.adjustments ?? null, figures: row.line.figures, figuresSource: row.line.figuresSource },
		card: card ? { name: card.name } : null,
		photos: photos.map((p) => ({ id: p.id, width: p.width, height: p.height })),
		freeRemakesLeft: Math.max(0, settings.freeRemakesPerOrder - used),
		remake: remake[0] ?? null
	};
}
