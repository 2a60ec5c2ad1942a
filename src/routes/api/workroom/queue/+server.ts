import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { workQueue } from '$lib/server/workroom/queue';

// The queue page polls this so the list stays current without a reload.
export const GET = async () => json({ queue: await workQueue(db), at: new Date().toISOString() }, { headers: { 'cache-control': 'no-store' } });
