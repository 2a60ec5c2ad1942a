import { json } from '@sveltejs/kit';
import type { QueueAnswer } from '$lib/api/answers';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { workQueue } from '$lib/server/order/queue';
import type { RequestHandler } from './$types';

// The queue page polls this so the list stays current without a reload.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	return json({ queue: await workQueue(db, ['paid', 'altering']), at: new Date().toISOString() } satisfies QueueAnswer);
};
