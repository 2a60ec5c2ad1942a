import { fail, redirect } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { createJob, parseJobRequest, recentJobs } from '$lib/server/outputs/jobs';
import { kickJobWorker } from '$lib/server/outputs/worker';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	return { jobs: await recentJobs(db) };
};

export const actions: Actions = {
	// "Prepare files" on the queue (the selected orders) and on the lays (a lay's orders).
	prepare: async (event) => {
		const user = requireRole(event, STAFF);
		const form = await event.request.formData();
		const ids = form.getAll('ids').map(String);
		const kinds = form.getAll('kinds').map(String);
		const parsed = parseJobRequest(ids, kinds);
		if (!parsed.ok) return fail(parsed.status, { message: parsed.message });
		const job = await createJob(db, { orderIds: parsed.orderIds, kinds: parsed.kinds, requestedBy: user.id });
		if (!job.ok) return fail(job.status, { message: job.message });
		kickJobWorker();
		redirect(303, `/workroom/jobs/${job.id}`);
	}
};
