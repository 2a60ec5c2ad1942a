import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { jobView } from '$lib/server/outputs/jobs';
import type { RequestHandler } from './$types';

// The job page polls this for its progress bar (page plumbing for the workroom, not part of the documented API).
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	const job = await jobView(db, Number(event.params.id));
	if (!job) return json({ message: 'No such job.' }, { status: 404, headers: { 'cache-control': 'private, no-store' } });
	return json({ job }, { headers: { 'cache-control': 'private, no-store' } });
};
