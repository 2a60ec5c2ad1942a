import { db } from '$lib/server/db';
import { noOrder, ticketsResponse } from '$lib/server/ticket/respond';
import type { RequestHandler } from './$types';

// One order's cutting ticket. The hooks' guard lets only cutters and the owner reach /workroom/**.
export const GET: RequestHandler = async ({ params, url }) => {
	if (!/^[1-9]\d{0,8}$/.test(params.id)) return noOrder(params.id);
	return ticketsResponse(db, [Number(params.id)], url.origin);
};
