// The HTTP answers of the ticket routes, shared by the single and the batch route: a PDF inline, or a
// JSON message saying which order is missing or why it cannot be drafted again.
import { DraftInputError } from '$lib/drafting';
import { failure, type Failure, type FailureStatus } from '$lib/failure';
import { failureJson } from '../answer';
import type { Db } from '../db/client';
import { shopSettingsOf } from '../house/rules';
import { siteOrigin } from '../origin';
import { loadTickets } from './ticket-load';
import { renderTickets } from '../ticket/pdf';

/** The most orders one batch may print (a day's cutting, with room to spare). */
export const MAX_BATCH = 50;

const message = (status: FailureStatus, text: string) => failureJson(failure(status, text));

/** Order ids from a query value like "1,2,3": each a positive whole number, at most MAX_BATCH of them
 * after repeats are dropped; or the reason they are not. */
export function parseIds(raw: string | null): { ok: true; ids: number[] } | Failure {
	if (!raw || !raw.trim()) return failure(400, 'Give the orders to print as ?ids=1,2,3.');
	const parts = raw.split(',').map((s) => s.trim());
	const bad = parts.filter((s) => !/^[1-9]\d{0,8}$/.test(s));
	if (bad.length)
		return failure(
			400,
			`These are not order ids: ${bad
				.slice(0, 5)
				.map((b) => JSON.stringify(b))
				.join(', ')}.`
		);
	const ids = [...new Set(parts.map(Number))];
	if (ids.length > MAX_BATCH) return failure(400, `At most ${MAX_BATCH} orders at once; you asked for ${ids.length}.`);
	return { ok: true, ids };
}

/** A file name safe in a header: letters, digits and hyphens only. */
const safe = (s: string) => s.replace(/[^A-Za-z0-9-]+/g, '-');

/** The tickets of the orders as one PDF, or 404 naming the ids with no order, or 422 when an order's
 * stored measurements no longer draft. */
export async function ticketsResponse(db: Db, ids: number[]): Promise<Response> {
	let found;
	try {
		found = await loadTickets(db, ids);
	} catch (e) {
		if (e instanceof DraftInputError) return message(422, `This order cannot be drafted again: ${e.message}`);
		throw e;
	}
	const missing = ids.filter((_, i) => !found[i]);
	if (missing.length)
		return message(
			404,
			missing.length === 1 ? `There is no order ${missing[0]}.` : `There are no orders ${missing.join(', ')}.`
		);
	const orders = found.filter((o) => o !== null);
	const tickets = orders.flatMap((o) => o.tickets);
	if (!tickets.length) return message(404, 'These orders have no skirts to cut.');
	const { paperSize } = await shopSettingsOf(db);
	const pdf = await renderTickets(tickets, { paper: paperSize === 'Letter' ? 'Letter' : 'A4', origin: siteOrigin() });
	const numbers = orders.map((o) => o.number);
	const name =
		numbers.length === 1
			? `ticket-${safe(numbers[0])}.pdf`
			: `tickets-${safe(numbers[0])}-and-${numbers.length - 1}-more.pdf`;
	return new Response(new Uint8Array(pdf), {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `inline; filename="${name}"`,
			'content-length': String(pdf.length),
			// Body measurements are on it: never kept by a shared cache.
			'cache-control': 'private, no-store'
		}
	});
}

