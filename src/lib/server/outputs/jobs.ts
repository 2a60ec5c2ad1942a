// Background jobs that make the files of many orders at once (a lay, a selection in the queue) and keep
// them as one zip. The table is the queue: a request inserts a row, a worker in the app process claims it
// with a row lock, makes each order's files, records progress after every order, and stores the zip.
//
// Several workers: the claim is SELECT ... FOR UPDATE SKIP LOCKED on the oldest queued row, then the row
// is marked running with the worker's id inside the same transaction, so two app servers (or a separate
// worker process started with startJobWorker and no HTTP server) never take the same job. Every later
// write is conditional on `claimed_by`, so a job handed to another worker after its first one went
// quiet is never written by both. A worker that dies leaves its job running with an old heartbeat;
// any worker puts such jobs back in the queue (three attempts, then failed). The zips live in the
// shared upload store (an object store once there are several machines). Past a handful of workers,
// or for jobs of hours, a broker (a Redis or AMQP queue) would replace the polling; the rows stay as
// the record the pages read.
import { hostname } from 'node:os';
import { Zip, ZipDeflate, ZipPassThrough } from 'fflate';
import { and, asc, desc, eq, inArray, lt, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { orders, outputJobs, users, type OutputJobFailure } from '../db/schema';
import { OutputProblem } from './problem';
import { PRODUCERS } from './producers';
import type { OutputFile } from './types';
import { failure, type Failure } from '$lib/failure';
import { yieldToRequests } from '../hooks/busy';

/** The most orders one job may take (a day's cutting, with room to spare; as the ticket batch). */
export const MAX_JOB_ORDERS = 50;
/** A running job whose worker has not written for this long is taken to be orphaned. */
export const STALE_AFTER_MS = 5 * 60_000;
const MAX_ATTEMPTS = 3;

/** This process as a worker: host, pid and a random part (a restarted process is a new worker). */
export const WORKER_ID = `${hostname().slice(0, 30)}:${process.pid}:${Math.random().toString(36).slice(2, 8)}`;

export type NewJob = { kinds: string[]; orderIds: number[]; requestedBy: string | null };

/** Reads the form's order ids and kinds, or says what is wrong with them. */
export function parseJobRequest(ids: string[], kinds: string[]): { ok: true; orderIds: number[]; kinds: string[] } | Failure {
	const bad = ids.filter((s) => !/^[1-9]\d{0,8}$/.test(s.trim()));
	if (bad.length) return failure(400, `These are not order ids: ${bad.slice(0, 5).map((b) => JSON.stringify(b)).join(', ')}.`);
	const orderIds = [...new Set(ids.map((s) => Number(s.trim())))];
	if (!orderIds.length) return failure(400, 'Select at least one order to prepare files for.');
	if (orderIds.length > MAX_JOB_ORDERS) return failure(400, `At most ${MAX_JOB_ORDERS} orders in one job; you selected ${orderIds.length}.`);
	const unknown = kinds.filter((k) => !Object.hasOwn(PRODUCERS, k));
	if (unknown.length) return failure(400, `Unknown kinds of file: ${unknown.slice(0, 5).join(', ')}.`);
	return { ok: true, orderIds, kinds: kinds.length ? [...new Set(kinds)] : Object.keys(PRODUCERS) };
}

/**
 * Queues a job, or finds the same one this person queued a moment ago and has not finished (a double
 * click or a resent form makes one job, not two). Orders that do not exist are refused here, before
 * any work.
 */
export async function createJob(db: Db, job: NewJob): Promise<{ ok: true; id: number } | Failure> {
	const found = await db.select({ id: orders.id }).from(orders).where(inArray(orders.id, job.orderIds));
	const missing = job.orderIds.filter((id) => !found.some((f) => f.id === id));
	if (missing.length) return failure(404, missing.length === 1 ? `There is no order ${missing[0]}.` : `There are no orders ${missing.join(', ')}.`);
	const same = job.requestedBy
		? await db
				.select({ id: outputJobs.id, kinds: outputJobs.kinds, orderIds: outputJobs.orderIds })
				.from(outputJobs)
				.where(
					and(
						eq(outputJobs.requestedBy, job.requestedBy),
						inArray(outputJobs.status, ['queued', 'running']),
						sql`${outputJobs.createdAt} > CURRENT_TIMESTAMP(3) - INTERVAL 1 MINUTE`
					)
				)
		: [];
	const key = (k: string[], o: number[]) => JSON.stringify([[...k].sort(), [...o].sort((a, b) => a - b)]);
	const twin = same.find((s) => key(s.kinds, s.orderIds) === key(job.kinds, job.orderIds));
	if (twin) return { ok: true, id: twin.id };
	const [row] = await db
		.insert(outputJobs)
		.values({ kinds: job.kinds, orderIds: job.orderIds, requestedBy: job.requestedBy, total: job.orderIds.length, failures: [] })
		.$returningId();
	return { ok: true, id: row.id };
}

/** Claims the oldest queued job for this worker, or null when none waits. */
export async function claimJob(db: Db, worker = WORKER_ID): Promise<number | null> {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.select({ id: outputJobs.id })
			.from(outputJobs)
			.where(eq(outputJobs.status, 'queued'))
			.orderBy(asc(outputJobs.id))
			.limit(1)
			.for('update', { skipLocked: true });
		if (!row) return null;
		const now = new Date();
		await tx
			.update(outputJobs)
			.set({ status: 'running', claimedBy: worker, startedAt: now, heartbeatAt: now, attempts: sql`${outputJobs.attempts} + 1` })
			.where(eq(outputJobs.id, row.id));
		return row.id;
	});
}

/** Puts back in the queue the jobs whose worker went quiet (or fails them after three tries). */
export async function requeueStale(db: Db, staleMs = STALE_AFTER_MS) {
	const cutoff = new Date(Date.now() - staleMs);
	const orphaned = and(eq(outputJobs.status, 'running'), lt(outputJobs.heartbeatAt, cutoff));
	await db
		.update(outputJobs)
		.set({ status: 'failed', finishedAt: new Date(), claimedBy: null, error: 'The worker making these files stopped three times; ask for them again.' })
		.where(and(orphaned, sql`${outputJobs.attempts} >= ${MAX_ATTEMPTS}`));
	await db.update(outputJobs).set({ status: 'queued', claimedBy: null, done: 0, failures: [] }).where(orphaned);
}

/** Collects zip entries into one array of bytes (fflate's streaming zip, so each order's files can be
 * let go once they are compressed: a big batch never holds every file at once). */
function zipCollector() {
	const chunks: Uint8Array[] = [];
	let fail: (e: Error) => void = () => {};
	let finish: () => void = () => {};
	const ended = new Promise<void>((res, rej) => {
		finish = res;
		fail = rej;
	});
	const zip = new Zip((err, chunk, final) => {
		if (err) return fail(err);
		chunks.push(chunk);
		if (final) finish();
	});
	return {
		add(file: OutputFile) {
			// PDFs are compressed already; the DXF is text and shrinks several times over.
			const entry = file.mime === 'application/pdf' ? new ZipPassThrough(file.name) : new ZipDeflate(file.name, { level: 6 });
			entry.mtime = new Date();
			zip.add(entry);
			entry.push(file.bytes, true);
		},
		async end() {
			zip.end();
			await ended;
			const out = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
			let at = 0;
			for (const c of chunks) {
				out.set(c, at);
				at += c.length;
			}
			return out;
		}
	};
}

export type SaveZip = (bytes: Uint8Array) => Promise<{ key: string }>;

/**
 * Makes the files of a claimed job: each order, each kind, progress written after every order; the zip
 * saved with `save`. An order whose file cannot be made is named in the job with the reason, and the
 * others still go in the zip; a job where nothing could be made fails.
 */
export async function runJob(db: Db, id: number, save: SaveZip, worker = WORKER_ID): Promise<void> {
	const mine = and(eq(outputJobs.id, id), eq(outputJobs.claimedBy, worker), eq(outputJobs.status, 'running'));
	const [job] = await db.select().from(outputJobs).where(mine);
	if (!job) return;
	const numbers = new Map(
		(await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.id, job.orderIds.length ? job.orderIds : [0]))).map((o) => [o.id, o.number])
	);
	const zip = zipCollector();
	const failures: OutputJobFailure[] = [];
	let files = 0;
	let done = 0;
	for (const orderId of job.orderIds) {
		for (const kind of job.kinds) {
			const producer = PRODUCERS[kind];
			try {
				if (!producer) throw new OutputProblem(400, `No longer made here: ${kind} files.`);
				zip.add(await producer.produce(db, orderId));
				files++;
			} catch (e) {
				if (!(e instanceof OutputProblem)) console.error(`output job ${id}, order ${orderId}, ${kind}:`, e);
				failures.push({
					orderId,
					number: numbers.get(orderId) ?? null,
					kind,
					message: e instanceof OutputProblem ? e.message : 'Something went wrong on our side making this file; the others were made.'
				});
			}
		}
		done++;
		const [res] = await db.update(outputJobs).set({ done, failures, heartbeatAt: new Date() }).where(mine);
		if (res.affectedRows === 0) return; // taken back from this worker: another one finishes it
		// Requests first between orders (hooks/busy.ts): a file job is background work.
		await yieldToRequests();
	}
	if (!files) {
		await db.update(outputJobs).set({ status: 'failed', finishedAt: new Date(), error: 'No file could be made for any of these orders; see each order below.' }).where(mine);
		return;
	}
	try {
		const bytes = await zip.end();
		const { key } = await save(bytes);
		await db.update(outputJobs).set({ status: 'done', finishedAt: new Date(), resultKey: key, resultBytes: bytes.length }).where(mine);
	} catch (e) {
		console.error(`output job ${id}: the zip could not be stored`, e);
		await db.update(outputJobs).set({ status: 'failed', finishedAt: new Date(), error: 'The files were made but could not be stored; ask for them again.' }).where(mine);
	}
}

/** Claims and runs queued jobs one after another until none is left; returns how many ran. */
export async function drainJobs(db: Db, save: SaveZip, worker = WORKER_ID): Promise<number> {
	let ran = 0;
	for (let id = await claimJob(db, worker); id !== null; id = await claimJob(db, worker)) {
		await runJob(db, id, save, worker);
		ran++;
	}
	return ran;
}

/** What the job page and its JSON show: no body measurements, only order numbers and counts. */
export interface JobView {
	id: number;
	status: 'queued' | 'running' | 'done' | 'failed';
	done: number;
	total: number;
	kinds: { kind: string; label: string }[];
	orders: { id: number; number: string | null }[];
	failures: OutputJobFailure[];
	error: string | null;
	requestedBy: string | null;
	createdAt: string;
	finishedAt: string | null;
	download: string | null;
	bytes: number | null;
}

function viewOf(
	row: typeof outputJobs.$inferSelect,
	requester: string | null,
	numbers: Map<number, string>
): JobView {
	return {
		id: row.id,
		status: row.status,
		done: row.done,
		total: row.total,
		kinds: row.kinds.map((kind) => ({ kind, label: PRODUCERS[kind]?.label ?? kind })),
		orders: row.orderIds.map((id) => ({ id, number: numbers.get(id) ?? null })),
		failures: row.failures,
		error: row.error,
		requestedBy: requester,
		createdAt: row.createdAt.toISOString(),
		finishedAt: row.finishedAt?.toISOString() ?? null,
		download: row.status === 'done' && row.resultKey ? `/workroom/jobs/${row.id}/files.zip` : null,
		bytes: row.resultBytes
	};
}

export async function jobView(db: Db, id: number): Promise<JobView | null> {
	if (!Number.isSafeInteger(id) || id < 1) return null;
	const [r] = await db
		.select({ job: outputJobs, requester: users.name })
		.from(outputJobs)
		.leftJoin(users, eq(users.id, outputJobs.requestedBy))
		.where(eq(outputJobs.id, id));
	if (!r) return null;
	const ids = r.job.orderIds.length ? r.job.orderIds : [0];
	const numbers = new Map((await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.id, ids))).map((o) => [o.id, o.number]));
	return viewOf(r.job, r.requester, numbers);
}

/** The latest jobs, newest first, for the jobs page. */
export async function recentJobs(db: Db, limit = 20): Promise<JobView[]> {
	const rows = await db
		.select({ job: outputJobs, requester: users.name })
		.from(outputJobs)
		.leftJoin(users, eq(users.id, outputJobs.requestedBy))
		.orderBy(desc(outputJobs.id))
		.limit(limit);
	const ids = [...new Set(rows.flatMap((r) => r.job.orderIds))];
	const numbers = new Map((ids.length ? await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.id, ids)) : []).map((o) => [o.id, o.number]));
	return rows.map((r) => viewOf(r.job, r.requester, numbers));
}

/** The stored zip's key of a finished job, or null. */
export async function jobResultKey(db: Db, id: number): Promise<string | null> {
	if (!Number.isSafeInteger(id) || id < 1) return null;
	const [r] = await db.select({ key: outputJobs.resultKey, status: outputJobs.status }).from(outputJobs).where(eq(outputJobs.id, id));
	return r?.status === 'done' ? r.key : null;
}
