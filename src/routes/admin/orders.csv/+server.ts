import { db } from '$lib/server/db';
import { plainAmount } from '$lib/format';
import { allOrders, readFilter, toCsv } from '$lib/server/order/owner-list';
import type { RequestHandler } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

// The same filters as the orders table: every shopper's name and e-mail, for the owner only.
export const GET: RequestHandler = async (event) => {
	requireRole(event, OWNER);
	const rows = await allOrders(db, readFilter(event.url));
	const csv = toCsv(
		// Plain decimals in each order's own currency (its column beside them): what a spreadsheet sums.
		rows.map((r) => ({ ...r, total: plainAmount(r.total, r.currency), refundedTotal: plainAmount(r.refundedTotal, r.currency) })),
		['number', 'createdAt', 'status', 'shopperName', 'email', 'currency', 'total', 'refundedTotal', 'promisedDate']
	);
	return new Response(csv, {
		headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="orders-${new Date().toISOString().slice(0, 10)}.csv"`, 'cache-control': 'no-store' }
	});
};
