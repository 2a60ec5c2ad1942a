import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { patternResponse } from '$lib/server/outputs/respond';
import type { RequestHandler } from './$types';

// The order's pattern at full size (?paper=a4|letter|a0|roll|projector, &width= cm for a roll): the
// same pieces as the cutting ticket, for the workroom only.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	return patternResponse(db, Number(event.params.id), event.url.searchParams, event.locals.user?.id, event.request.headers.get('accept'));
};
