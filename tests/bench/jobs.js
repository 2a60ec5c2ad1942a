// @ts-check
// Outputs for the cutting table: the open DXF over HTTP, and the peak memory of the app process while
// its background worker makes every file kind of a 20-order batch (ticket, DXF, tiled A4 pattern, lay) and
// zips them.
import { readFileSync, writeFileSync } from 'node:fs';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { signInCookie } from './ticket.js';
import { summarise } from './stats.js';

/** Every kind of file a job makes, the heaviest included (the tiled print, the lay with its search). */
export const KINDS = ['ticket', 'dxf', 'pattern-a4', 'lay'];

export const DXF_ROUTE = '/workroom/orders/[id=id]/pattern.dxf';

const cutterEmail = () => DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter')?.email ?? '';

/** GET pattern.dxf as the cutter, one at a time, beside GET /healthz (a bare round trip) as the floor.
 * @param {{ appUrl: string, orderId: number, runs?: number, warmup?: number }} o */
export async function measureDxfRoute(o) {
	const runs = o.runs ?? 40;
	const warmup = o.warmup ?? 5;
	const cookie = await signInCookie(o.appUrl, cutterEmail());
	const timeGet = async (/** @type {string} */ url) => {
		const t = performance.now();
		const res = await fetch(url, { headers: { cookie }, redirect: 'manual' });
		const body = Buffer.from(await res.arrayBuffer());
		return { ms: performance.now() - t, status: res.status, bytes: body.length, dxf: body.subarray(0, 20).toString().includes('SECTION') };
	};
	const url = `${o.appUrl}/workroom/orders/${o.orderId}/pattern.dxf`;
	const first = await timeGet(url);
	if (first.status !== 200 || !first.dxf) throw new Error(`GET ${url} answered ${first.status}, not a DXF`);
	for (let i = 0; i < warmup; i++) await timeGet(url);
	/** @type {number[]} */ const times = [];
	/** @type {number[]} */ const floor = [];
	for (let i = 0; i < runs; i++) {
		times.push((await timeGet(url)).ms);
		floor.push((await timeGet(`${o.appUrl}/healthz`)).ms);
	}
	return { ...summarise(times), bytes: first.bytes, floor: summarise(floor) };
}

/** Resident memory of a process from /proc (kB): now and its high-water mark. */
function memoryOf(/** @type {number} */ pid) {
	const status = readFileSync(`/proc/${pid}/status`, 'utf8');
	const kb = (/** @type {string} */ key) => Number(new RegExp(`^${key}:\\s+(\\d+) kB`, 'm').exec(status)?.[1] ?? NaN);
	return { rssKb: kb('VmRSS'), hwmKb: kb('VmHWM') };
}

/**
 * A job of `count` orders (ticket, DXF, tiled A4 pattern and lay PDF each), queued as the queue page does and polled as the job page
 * does; the app's resident-set high-water mark is reset first (Linux: "5" to /proc/PID/clear_refs), so
 * the peak is this batch's, not an earlier load test's.
 * @param {{ appUrl: string, appPid: number, orderIds: number[] }} o */
export async function measureBatch(o) {
	const cookie = await signInCookie(o.appUrl, cutterEmail());
	let reset = true;
	try {
		writeFileSync(`/proc/${o.appPid}/clear_refs`, '5');
	} catch {
		reset = false;
	}
	const before = memoryOf(o.appPid);
	const body = new URLSearchParams();
	for (const id of o.orderIds) body.append('ids', String(id));
	for (const kind of KINDS) body.append('kinds', kind);
	const t = performance.now();
	const res = await fetch(`${o.appUrl}/workroom/jobs?/prepare`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: o.appUrl, cookie },
		body
	});
	const id = /\/workroom\/jobs\/(\d+)$/.exec(res.headers.get('location') ?? '')?.[1];
	if (res.status !== 303 || !id) throw new Error(`queuing the job answered ${res.status}`);
	let peakRssKb = before.rssKb;
	/** @type {any} */
	let job = null;
	for (let i = 0; i < 2400; i++) {
		await new Promise((r) => setTimeout(r, 100));
		peakRssKb = Math.max(peakRssKb, memoryOf(o.appPid).rssKb);
		const poll = await fetch(`${o.appUrl}/workroom/jobs/${id}/progress`, { headers: { cookie } });
		job = (await poll.json()).job;
		if (job.status === 'done' || job.status === 'failed') break;
	}
	const seconds = (performance.now() - t) / 1000;
	const after = memoryOf(o.appPid);
	if (job?.status !== 'done') throw new Error(`job ${id} ended ${job?.status}: ${job?.error ?? JSON.stringify(job?.failures?.slice(0, 2))}`);
	return {
		orders: o.orderIds.length,
		seconds,
		zipBytes: job.bytes,
		failures: job.failures.length,
		rssBeforeMb: before.rssKb / 1024,
		peakMb: (reset ? after.hwmKb : peakRssKb) / 1024,
		peakFrom: reset ? 'VmHWM after a reset' : 'VmRSS sampled every 100 ms',
		sampledPeakMb: peakRssKb / 1024
	};
}
