import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { ticketsResponse } from '$lib/server/outputs/ticket-respond';
import type { RequestHandler } from './$types';

// One order's cutting ticket: body measurements on paper, so for the workroom only.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	return ticketsResponse(db, [Number(event.params.id)]);
};
