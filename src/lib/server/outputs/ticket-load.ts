// Loads the orders to print and turns each order line into a ticket (ticket.ts re-drafts it with the
// house rules version the order was drafted with).
import { asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, houseRules, orderLines, orders, styles } from '../db/schema';
import { makeTicket, type Ticket } from './ticket';
import { remakeChangesOf } from '../fit/remake-changes';

/** One order's tickets, one per order line. */
export interface OrderTickets {
	orderId: number;
	number: string;
	tickets: Ticket[];
}

/** The tickets of each order, in the order the ids were given; null for an id with no order. */
export async function loadTickets(db: Db, orderIds: number[]): Promise<(OrderTickets | null)[]> {
	const ids = [...new Set(orderIds.filter((id) => Number.isSafeInteger(id) && id > 0))];
	if (!ids.length) return orderIds.map(() => null);
	const orderRows = await db
		.select({
			id: orders.id,
			number: orders.number,
			shopperName: orders.shopperName,
			status: orders.status,
			promisedDate: orders.promisedDate,
			houseRulesId: orders.houseRulesId,
			rules: houseRules.rules
		})
		.from(orders)
		.innerJoin(houseRules, eq(houseRules.id, orders.houseRulesId))
		.where(inArray(orders.id, ids));
	const lineRows = orderRows.length
		? await db
				.select({
					id: orderLines.id,
					orderId: orderLines.orderId,
					measurements: orderLines.measurements,
					figuresSource: orderLines.figuresSource,
					adjustments: orderLines.adjustments,
					options: orderLines.options,
					figures: orderLines.figures,
					fabricCm: orderLines.fabricCm,
					cutterLay: orderLines.cutterLay,
					styleName: styles.name,
					fabric: {
						name: fabrics.name,
						colour: fabrics.colour,
						fibreContent: fabrics.fibreContent,
						widthCm: fabrics.widthCm,
						nap: fabrics.nap,
						stretch: fabrics.stretch,
						shrinkagePct: fabrics.shrinkagePct,
						shrinkageAcrossPct: fabrics.shrinkageAcrossPct
					}
				})
				.from(orderLines)
				.innerJoin(styles, eq(styles.id, orderLines.styleId))
				.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
				.where(
					inArray(
						orderLines.orderId,
						orderRows.map((o) => o.id)
					)
				)
				.orderBy(asc(orderLines.orderId), asc(orderLines.id))
		: [];
	const remakes = await remakeChangesOf(db, orderRows.map((o) => o.id));
	const byId = new Map<number, OrderTickets>();
	for (const o of orderRows) {
		const lines = lineRows.filter((l) => l.orderId === o.id);
		const tickets = lines.map((l, i) =>
			makeTicket({
				orderId: o.id,
				number: o.number,
				shopperName: o.shopperName,
				status: o.status,
				promisedDate: o.promisedDate,
				houseRulesId: o.houseRulesId,
				rules: o.rules,
				line: {
					id: l.id,
					index: i + 1,
					count: lines.length,
					styleName: l.styleName,
					measurements: l.measurements,
					figuresSource: l.figuresSource,
					adjustments: l.adjustments,
					options: l.options,
					figures: l.figures,
					fabricCm: l.fabricCm,
					cutterLay: l.cutterLay
				},
				fabric: l.fabric
			})
		);
		// A remake's ticket says what changed against the first cut.
		for (const t of tickets) t.remake = remakes.get(o.id) ?? null;
		byId.set(o.id, { orderId: o.id, number: o.number, tickets });
	}
	return orderIds.map((id) => byId.get(id) ?? null);
}
