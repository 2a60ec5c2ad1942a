import { db } from '$lib/server/db';
import { exportPersonalData } from '$lib/server/account/personal-data';
import type { RequestHandler } from './$types';
import { requireRole, SIGNED_IN } from '$lib/server/access';

// Her own data, as a file she can keep.
export const GET: RequestHandler = async (event) => {
	const data = await exportPersonalData(db, requireRole(event, SIGNED_IN).id);
	return new Response(JSON.stringify(data, null, 2), {
		headers: {
			'content-type': 'application/json; charset=utf-8',
			'content-disposition': 'attachment; filename="atelier-ondine-my-data.json"',
			'cache-control': 'no-store'
		}
	});
};
