import { env } from '$env/dynamic/private';
import { db } from '../db';
import { saveUpload } from '../catalogue/storage';
import { drainJobs, requeueStale } from './jobs';

// The job worker of this app process, started beside the mail outbox worker (hooks.server.ts). It wakes
// on a timer and at once when a job is queued from this process; one drain at a time.
let timer: ReturnType<typeof setInterval> | null = null;
let busy = false;
let lastSweep = 0;

const saveZip = (bytes: Uint8Array) => saveUpload(bytes, { mime: 'application/zip', ext: 'zip' });

async function tick() {
	if (busy) return;
	busy = true;
	try {
		if (Date.now() - lastSweep > 60_000) {
			lastSweep = Date.now();
			await requeueStale(db);
		}
		await drainJobs(db, saveZip);
	} catch {
		/* the database may be away for a moment; the next tick tries again */
	} finally {
		busy = false;
	}
}

/** Looks for work now rather than at the next tick (called after a job is queued). */
export function kickJobWorker() {
	if (timer) setImmediate(() => void tick());
}

export function stopJobWorker() {
	if (timer) clearInterval(timer);
	timer = null;
}

export function startJobWorker(everyMs = Number(env.JOBS_INTERVAL_MS ?? 3_000)) {
	if (timer) return;
	timer = setInterval(() => void tick(), everyMs);
	timer.unref();
}
