import { db } from '$lib/server/db';
import { exportPersonalData } from '$lib/server/shop/personal-data';
import type { RequestHandler } from './$types';

// Her own data, as a file she can keep (the hooks let only signed-in people reach /account).
export const GET: RequestHandler = async ({ locals }) => {
	const data = await exportPersonalData(db, locals.user!.id);
	return new Response(JSON.stringify(data, null, 2), {
		headers: {
			'content-type': 'application/json; charset=utf-8',
			'content-disposition': 'attachment; filename="atelier-ondine-my-data.json"',
			'cache-control': 'no-store'
		}
	});
};
