import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { produceDxf } from '$lib/server/outputs/dxf';
import { OutputProblem, problemResponse } from '$lib/server/outputs/problem';
import type { RequestHandler } from './$types';

// The order's pattern as an open DXF for cutting tables and CAD: the same access as its ticket.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	try {
		const file = await produceDxf(db, Number(event.params.id));
		return new Response(new Uint8Array(file.bytes), {
			headers: {
				'content-type': file.mime,
				'content-disposition': `attachment; filename="${file.name}"`,
				'content-length': String(file.bytes.length),
				// Drafted from one person's body measurements: never kept by a shared cache.
				'cache-control': 'private, no-store'
			}
		});
	} catch (e) {
		if (e instanceof OutputProblem) return problemResponse(e);
		throw e;
	}
};
