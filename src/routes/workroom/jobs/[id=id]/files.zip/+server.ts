import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { jobResultKey } from '$lib/server/outputs/jobs';
import { readUpload } from '$lib/server/catalogue/storage';
import type { RequestHandler } from './$types';

// The finished job's files in one zip; 404 until it is done.
export const GET: RequestHandler = async (event) => {
	requireRole(event, STAFF);
	const id = Number(event.params.id);
	const key = await jobResultKey(db, id);
	const bytes = key ? await readUpload(key) : null;
	if (!bytes) return json({ message: 'These files are not ready, or the job does not exist.' }, { status: 404, headers: { 'cache-control': 'private, no-store' } });
	return new Response(new Uint8Array(bytes), {
		headers: {
			'content-type': 'application/zip',
			'content-disposition': `attachment; filename="quarterline-files-job-${id}.zip"`,
			'content-length': String(bytes.length),
			// Patterns drafted from people's measurements: never kept by a shared cache.
			'cache-control': 'private, no-store'
		}
	});
};
