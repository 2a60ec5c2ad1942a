import { firstName } from '$lib/orders/names';
import { asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderLines, orders, styles } from '../db/schema';
import type { OrderStage } from '$lib/orders/stages';

export type QueueRow = {
	id: number;
	number: string;
	status: OrderStage;
	promisedDate: string;
	daysLeft: number;
	firstName: string;
	lines: { style: string; fabricId: number; fabric: string; colour: string; fabricCm: number }[];
};

/** Orders waiting in the workroom, the oldest promised date first, with what each needs. */
export async function workQueue(db: Db, stages: OrderStage[] = ['paid']): Promise<QueueRow[]> {
	const rows = await db
		.select({
			id: orders.id,
			number: orders.number,
			status: orders.status,
			promisedDate: orders.promisedDate,
			daysLeft: sql<number>`DATEDIFF(${orders.promisedDate}, CURRENT_DATE())`,
			name: orders.shopperName,
			style: styles.name,
			fabricId: fabrics.id,
			fabric: fabrics.name,
			colour: fabrics.colour,
			fabricCm: orderLines.fabricCm
		})
		.from(orders)
		.innerJoin(orderLines, eq(orderLines.orderId, orders.id))
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(inArray(orders.status, stages))
		.orderBy(asc(orders.promisedDate), asc(orders.id), asc(orderLines.id));
	const byId = new Map<number, QueueRow>();
	for (const r of rows) {
		let row = byId.get(r.id);
		if (!row) {
			row = { id: r.id, number: r.number, status: r.status, promisedDate: r.promisedDate, daysLeft: Number(r.daysLeft), firstName: firstName(r.name), lines: [] };
			byId.set(r.id, row);
		}
		row.lines.push({ style: r.style, fabricId: r.fabricId, fabric: r.fabric, colour: r.colour, fabricCm: r.fabricCm });
	}
	return [...byId.values()];
}

export type Lay = { fabricId: number; fabric: string; colour: string; widthCm: number; stockCm: number; neededCm: number; orders: { id: number; number: string; cm: number; promisedDate: string }[] };

/** The queue grouped by fabric: one bolt laid once for several orders, against what is on the shelf. */
export async function lays(db: Db): Promise<Lay[]> {
	const queue = await workQueue(db);
	const shelf = await db.select().from(fabrics).where(isNull(fabrics.retiredAt));
	const byFabric = new Map<number, Lay>();
	for (const o of queue) {
		for (const l of o.lines) {
			let lay = byFabric.get(l.fabricId);
			if (!lay) {
				const f = shelf.find((s) => s.id === l.fabricId);
				lay = { fabricId: l.fabricId, fabric: l.fabric, colour: l.colour, widthCm: f?.widthCm ?? 0, stockCm: f?.stockCm ?? 0, neededCm: 0, orders: [] };
				byFabric.set(l.fabricId, lay);
			}
			lay.neededCm += l.fabricCm;
			lay.orders.push({ id: o.id, number: o.number, cm: l.fabricCm, promisedDate: o.promisedDate });
		}
	}
	return [...byFabric.values()].sort((a, b) => a.orders[0].promisedDate.localeCompare(b.orders[0].promisedDate));
}
