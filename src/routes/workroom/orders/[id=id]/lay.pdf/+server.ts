import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { layResponse } from '$lib/server/outputs/respond';
import type { RequestHandler } from './$types';

// The order's lay at full size, on a roll as wide as the cloth: for the workroom only.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	return layResponse(db, Number(event.params.id), event.request.headers.get('accept'));
};
