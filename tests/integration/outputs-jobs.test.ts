// Files for many orders at once: a job queued from the workroom, made by the app's background worker,
// zipped and downloaded. The zip is opened with fflate's unzip and each DXF compared with the one the
// single-order route gives.
import { eq, inArray, sql } from 'drizzle-orm';
import { unzipSync } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { orders, outputJobs, users } from '../../src/lib/server/db/schema';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { makeBadOrders } from './outputs.helpers';

const db = testDb();
const cookies: Record<'cutter' | 'shopper', string> = { cutter: '', shopper: '' };
// Three paid orders of the demo seed: a straight, an A-line and a pencil skirt.
const BATCH = ['QL-1008', 'QL-1009', 'QL-1010'];
let ids: Record<string, number> = {};
let bad: Awaited<ReturnType<typeof makeBadOrders>>;

beforeAll(async () => {
	for (const role of ['cutter', 'shopper'] as const)
		cookies[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	const rows = await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.number, BATCH));
	ids = Object.fromEntries(rows.map((r) => [r.number, r.id]));
	bad = await makeBadOrders(db, '72');
});
afterAll(async () => bad?.remove());

const get = (path: string, cookie?: string) => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
/** The queue's form as a browser without JavaScript posts it: repeated `ids`, optional `kinds`. */
function prepare(orderIds: (number | string)[], kinds: string[], cookie: string) {
	const body = new URLSearchParams();
	for (const id of orderIds) body.append('ids', String(id));
	for (const k of kinds) body.append('kinds', k);
	return fetch(`${testEnv.appUrl}/workroom/jobs?/prepare`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: testEnv.appUrl, cookie },
		body
	});
}
async function jobIdOf(res: Response) {
	expect(res.status).toBe(303);
	const m = /^\/workroom\/jobs\/(\d+)$/.exec(res.headers.get('location') ?? '');
	expect(m, res.headers.get('location') ?? '').not.toBeNull();
	return Number(m![1]);
}
type Job = { status: string; done: number; total: number; failures: { orderId: number; number: string; kind: string; message: string }[]; error: string | null; download: string | null };
/** Polls the job's JSON, as the job page does, until it is done or stopped. */
async function finished(id: number): Promise<Job> {
	for (let i = 0; i < 200; i++) {
		const res = await get(`/workroom/jobs/${id}/progress`, cookies.cutter);
		expect(res.status).toBe(200);
		const { job } = (await res.json()) as { job: Job };
		expect(job.done).toBeLessThanOrEqual(job.total);
		if (job.status === 'done' || job.status === 'failed') return job;
		await new Promise((r) => setTimeout(r, 150));
	}
	throw new Error(`job ${id} did not finish`);
}

describe('files for many orders, made in the background', () => {
	it('zips the ticket and the DXF of three orders, under their order numbers', async () => {
		const id = await jobIdOf(await prepare(BATCH.map((n) => ids[n]), ['ticket', 'dxf'], cookies.cutter));
		const job = await finished(id);
		expect(job).toMatchObject({ status: 'done', done: 3, total: 3, failures: [], error: null, download: `/workroom/jobs/${id}/files.zip` });
		const [row] = await db.select({ requestedBy: outputJobs.requestedBy, email: users.email, resultKey: outputJobs.resultKey }).from(outputJobs).leftJoin(users, eq(users.id, outputJobs.requestedBy)).where(eq(outputJobs.id, id));
		expect(row.email).toBe(DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter')!.email);
		expect(row.resultKey).toMatch(/^[0-9a-f]{32}\.zip$/);

		const res = await get(job.download!, cookies.cutter);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('application/zip');
		const files = unzipSync(new Uint8Array(await res.arrayBuffer()));
		expect(Object.keys(files).sort()).toEqual(BATCH.flatMap((n) => [`${n}-pattern.dxf`, `${n}-ticket.pdf`]).sort());
		for (const n of BATCH) {
			expect(new TextDecoder().decode(files[`${n}-ticket.pdf`].slice(0, 5))).toBe('%PDF-');
			const single = new TextDecoder().decode(await (await get(`/workroom/orders/${ids[n]}/pattern.dxf`, cookies.cutter)).arrayBuffer());
			expect(new TextDecoder().decode(files[`${n}-pattern.dxf`])).toBe(single);
		}
		// The job page shows it ready, with the download.
		const page = await (await get(`/workroom/jobs/${id}`, cookies.cutter)).text();
		expect(page).toContain('Ready: 3 orders');
		expect(page).toContain(`/workroom/jobs/${id}/files.zip`);
	});

	it('names the order that failed and why, and still gives the others', async () => {
		const id = await jobIdOf(await prepare([ids['QL-1008'], bad.ids.retired], ['dxf'], cookies.cutter));
		const job = await finished(id);
		expect(job.status).toBe('done');
		expect(job.failures).toHaveLength(1);
		expect(job.failures[0]).toMatchObject({ orderId: bad.ids.retired, number: bad.numbers.retired, kind: 'dxf' });
		expect(job.failures[0].message).toMatch(/a style the atelier has retired/);
		const files = unzipSync(new Uint8Array(await (await get(job.download!, cookies.cutter)).arrayBuffer()));
		expect(Object.keys(files)).toEqual(['QL-1008-pattern.dxf']);
		const page = await (await get(`/workroom/jobs/${id}`, cookies.cutter)).text();
		expect(page).toContain('Not made');
		expect(page).toContain(bad.numbers.retired);

		// Nothing made at all: the job stops, and says so for each order.
		const none = await finished(await jobIdOf(await prepare([bad.ids.noDraft, bad.ids.undraftable], ['dxf'], cookies.cutter)));
		expect(none.status).toBe('failed');
		expect(none.download).toBeNull();
		expect(none.failures.map((f) => f.number)).toEqual([bad.numbers.noDraft, bad.numbers.undraftable]);
		expect(none.failures[0].message).toMatch(/no skirt to draft/);
		expect(none.failures[1].message).toMatch(/cannot be drafted again/);
	});

	it('refuses a selection it cannot read, and orders that do not exist, queuing nothing', async () => {
		const count = async () => (await db.select({ n: sql<number>`count(*)` }).from(outputJobs))[0].n;
		const before = await count();
		for (const [orderIds, kinds, status, message] of [
			[[], [], 400, /Select at least one order/],
			[['abc'], [], 400, /not order ids/],
			[[ids['QL-1008']], ['poster'], 400, /Unknown kinds of file: poster/],
			[[ids['QL-1008'], 99999999], [], 404, /no order 99999999/]
		] as const) {
			const res = await prepare([...orderIds], [...kinds], cookies.cutter);
			expect(res.status).toBe(status);
			expect(await res.text()).toMatch(message);
		}
		expect(await count()).toBe(before);
	});

	it('shows a job to the staff only: a shopper is refused the page, its progress and its zip', async () => {
		const [latest] = await db.select({ id: outputJobs.id }).from(outputJobs).where(eq(outputJobs.status, 'done')).limit(1);
		for (const path of [`/workroom/jobs/${latest.id}`, `/workroom/jobs/${latest.id}/files.zip`, `/workroom/jobs/${latest.id}/progress`, '/workroom/jobs']) {
			const res = await get(path, cookies.shopper);
			expect(res.status, path).toBe(403);
			expect(res.headers.get('content-type') ?? '', path).not.toContain('zip');
		}
		const count = async () => (await db.select({ n: sql<number>`count(*)` }).from(outputJobs))[0].n;
		const before = await count();
		expect((await prepare([ids['QL-1008']], [], cookies.shopper)).status).toBe(403);
		expect(await count()).toBe(before);
		// A job that does not exist is a plain 404 for the staff.
		expect((await get('/workroom/jobs/99999999', cookies.cutter)).status).toBe(404);
		expect((await get('/workroom/jobs/99999999/progress', cookies.cutter)).status).toBe(404);
		expect((await get('/workroom/jobs/99999999/files.zip', cookies.cutter)).status).toBe(404);
	});
});
