import { db } from '$lib/server/db';
import { fitReportList, requireFitDecider } from '$lib/server/fit/workroom';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	await requireFitDecider(db, event);
	return { reports: await fitReportList(db) };
};
