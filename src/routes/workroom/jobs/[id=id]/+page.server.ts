import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { jobView } from '$lib/server/outputs/jobs';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const job = await jobView(db, Number(event.params.id));
	if (!job) error(404, 'No such job.');
	return { job };
};
