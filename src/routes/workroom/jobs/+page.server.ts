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
		if ('problem' in parsed) return fail(400, { message: parsed.problem });
		const job = await createJob(db, { ...parsed, requestedBy: user.id });
		if ('problem' in job) return fail(404, { message: job.problem });
		kickJobWorker();
		redirect(303, `/workroom/jobs/${job.id}`);
	}
};
