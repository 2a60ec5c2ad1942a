import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { failureJson } from '$lib/server/answer';
import { parseIds, ticketsResponse } from '$lib/server/outputs/ticket-respond';
import type { RequestHandler } from './$types';

// Several orders' cutting tickets in one PDF: /workroom/tickets.pdf?ids=1,2,3, or ?ids=1&ids=2 as the
// queue's checkboxes send them.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	const parsed = parseIds(event.url.searchParams.getAll('ids').join(','));
	if (!parsed.ok) return failureJson(parsed);
	return ticketsResponse(db, parsed.ids);
};
