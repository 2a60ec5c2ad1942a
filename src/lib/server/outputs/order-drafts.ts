// An order's skirts drafted again from what was stored with each line (the ticket's own redraftLine, so
// every output shows the same pieces as the ticket), for the full-scale outputs. Refuses, with a reason,
// an order that is not there, has no skirt to draft, or is of a style the atelier has retired.
import { asc, eq } from 'drizzle-orm';
import { DraftInputError, type Draft } from '$lib/drafting';
import type { Db } from '../db/client';
import { fabrics, houseRules, orderLines, orders, styles } from '../db/schema';
import { redraftLine } from './ticket';
import { OutputProblem } from './problem';

export interface OrderDrafts {
	orderId: number;
	number: string;
	lines: { index: number; styleName: string; draft: Draft }[];
}

export async function loadOrderDrafts(db: Db, orderId: number): Promise<OrderDrafts> {
	if (!Number.isSafeInteger(orderId) || orderId < 1) throw new OutputProblem(404, `There is no order ${orderId}.`);
	const [order] = await db
		.select({ id: orders.id, number: orders.number, rules: houseRules.rules })
		.from(orders)
		.innerJoin(houseRules, eq(houseRules.id, orders.houseRulesId))
		.where(eq(orders.id, orderId));
	if (!order) throw new OutputProblem(404, `There is no order ${orderId}.`);
	const rows = await db
		.select({
			measurements: orderLines.measurements,
			options: orderLines.options,
			adjustments: orderLines.adjustments,
			styleName: styles.name,
			retiredAt: styles.retiredAt,
			stretch: fabrics.stretch
		})
		.from(orderLines)
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orderLines.orderId, orderId))
		.orderBy(asc(orderLines.id));
	if (!rows.length) throw new OutputProblem(404, `Order ${order.number} has no skirt to draft, so there is no pattern to give.`);
	const retired = rows.find((r) => r.retiredAt);
	if (retired)
		throw new OutputProblem(404, `Order ${order.number} is for the ${retired.styleName}, a style the atelier has retired: its pattern is no longer given out.`);
	const lines = rows.map((r, i) => {
		try {
			const draft = redraftLine({ rules: order.rules, line: r, fabric: r });
			return { index: i + 1, styleName: r.styleName, draft };
		} catch (e) {
			if (e instanceof DraftInputError) throw new OutputProblem(422, `Order ${order.number} cannot be drafted again: ${e.message}`);
			throw e;
		}
	});
	return { orderId: order.id, number: order.number, lines };
}
