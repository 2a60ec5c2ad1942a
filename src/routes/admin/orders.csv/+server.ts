import { db } from '$lib/server/db';
import { allOrders, readFilter, toCsv } from '$lib/server/admin/orders';
import type { RequestHandler } from './$types';

// The same filters as the orders table; the hooks let only the owner in.
export const GET: RequestHandler = async ({ url }) => {
	const rows = await allOrders(db, readFilter(url));
	const csv = toCsv(
		rows.map((r) => ({ ...r, total: (r.total / 100).toFixed(2), refundedTotal: (r.refundedTotal / 100).toFixed(2) })),
		['number', 'createdAt', 'status', 'shopperName', 'email', 'currency', 'total', 'refundedTotal', 'promisedDate']
	);
	return new Response(csv, {
		headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="orders-${new Date().toISOString().slice(0, 10)}.csv"`, 'cache-control': 'no-store' }
	});
};
