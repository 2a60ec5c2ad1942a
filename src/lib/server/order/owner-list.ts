import { and, asc, count, desc, eq, gte, like, lt, or, sql, type SQL } from 'drizzle-orm';
import { z } from 'zod';
import type { Db } from '../db/client';
import { orders } from '../db/schema';
import { ORDER_STAGES } from '$lib/orders/stages';

const SORTS = { placed: orders.createdAt, promised: orders.promisedDate, total: orders.total, number: orders.id } as const;

/** The orders table's filters, read from the address bar (bad values fall back to the defaults). */
export const orderFilterSchema = z.object({
	q: z.string().trim().max(100).catch(''),
	stage: z.enum(ORDER_STAGES).optional().catch(undefined),
	from: z.iso.date().optional().catch(undefined),
	to: z.iso.date().optional().catch(undefined),
	sort: z.enum(Object.keys(SORTS) as [keyof typeof SORTS, ...(keyof typeof SORTS)[]]).catch('placed'),
	dir: z.enum(['asc', 'desc']).catch('desc'),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export type OrderFilter = z.infer<typeof orderFilterSchema>;
export const PER_PAGE = 20;

export function readFilter(url: URL): OrderFilter {
	return orderFilterSchema.parse(Object.fromEntries(url.searchParams));
}

function where(f: OrderFilter): SQL | undefined {
	const parts: (SQL | undefined)[] = [];
	if (f.q) {
		// LIKE wildcards typed by the owner are matched literally.
		const needle = `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
		parts.push(or(like(orders.number, needle), like(orders.shopperName, needle), like(orders.email, needle)));
	}
	if (f.stage) parts.push(eq(orders.status, f.stage));
	if (f.from) parts.push(gte(orders.createdAt, new Date(`${f.from}T00:00:00Z`)));
	if (f.to) parts.push(lt(orders.createdAt, sql`DATE_ADD(${f.to}, INTERVAL 1 DAY)`));
	return and(...parts);
}

const columns = {
	id: orders.id,
	number: orders.number,
	shopperName: orders.shopperName,
	email: orders.email,
	status: orders.status,
	total: orders.total,
	refundedTotal: orders.refundedTotal,
	currency: orders.currency,
	createdAt: orders.createdAt,
	promisedDate: orders.promisedDate
};

export async function searchOrders(db: Db, f: OrderFilter, perPage = PER_PAGE) {
	const order = f.dir === 'asc' ? asc(SORTS[f.sort]) : desc(SORTS[f.sort]);
	const [rows, [{ n }]] = await Promise.all([
		db.select(columns).from(orders).where(where(f)).orderBy(order, desc(orders.id)).limit(perPage).offset((f.page - 1) * perPage),
		db.select({ n: count() }).from(orders).where(where(f))
	]);
	return { rows, total: n, pages: Math.max(1, Math.ceil(n / perPage)) };
}

/** Every order matching the filter, for the CSV export. */
export function allOrders(db: Db, f: OrderFilter) {
	const order = f.dir === 'asc' ? asc(SORTS[f.sort]) : desc(SORTS[f.sort]);
	return db.select(columns).from(orders).where(where(f)).orderBy(order, desc(orders.id)).limit(50_000);
}

/** RFC 4180 CSV; a cell starting with = + - @ is prefixed with ' so a spreadsheet never runs it. */
export function toCsv(rows: Record<string, unknown>[], headers: string[]) {
	const cell = (v: unknown) => {
		let s = v instanceof Date ? v.toISOString() : String(v ?? '');
		if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
		return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
	};
	return [headers.join(','), ...rows.map((r) => headers.map((h) => cell(r[h])).join(','))].join('\r\n') + '\r\n';
}
