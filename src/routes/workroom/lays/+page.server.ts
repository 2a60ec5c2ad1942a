import { db } from '$lib/server/db';
import { lays } from '$lib/server/workroom/queue';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => ({ lays: await lays(db) });
