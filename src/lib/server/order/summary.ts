import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderLines, orders, styles } from '../db/schema';
import { formatDate, formatMoney } from '$lib/format';
import { orderLink } from './link';
import type { Tx } from './stage';

/** The few lines of an order every e-mail repeats: what, how much, when. */
export async function orderSummary(db: Db | Tx, order: typeof orders.$inferSelect) {
	const lines = await db
		.select({ style: styles.name, fabric: fabrics.name, colour: fabrics.colour, total: orderLines.lineTotal })
		.from(orderLines)
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orderLines.orderId, order.id));
	return {
		number: order.number,
		shopperName: order.shopperName,
		total: formatMoney(order.total, order.currency),
		promisedDate: formatDate(order.promisedDate),
		lines: lines.map((l) => `${l.style} in ${l.fabric.toLowerCase()}, ${l.colour.toLowerCase()}: ${formatMoney(l.total, order.currency)}`),
		link: orderLink(order.number)
	};
}
