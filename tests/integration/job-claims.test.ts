// The job table as a queue for several workers: a claim skips a row another transaction holds (SKIP
// LOCKED, so no two workers take one job and none waits for another), and a job whose worker went quiet
// is queued again, then failed after its third try. The app's own worker polls the same table meanwhile,
// so each check is made on rows the app cannot see or take yet.
import { eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { claimJob, requeueStale } from '../../src/lib/server/outputs/jobs';
import { outputJobs } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';

const db = testDb();

describe('claiming jobs', () => {
	it('skips a job another transaction holds, without waiting for it', async () => {
		await db.transaction(async (tx) => {
			// Inserted and not committed: locked by this transaction, invisible to the app's worker.
			await tx.insert(outputJobs).values({ kinds: ['dxf'], orderIds: [1], total: 1, failures: [] });
			const t = performance.now();
			const claimed = await claimJob(db, 'test-worker-b');
			expect(claimed).toBeNull();
			// SKIP LOCKED answers at once; a plain FOR UPDATE would wait for this transaction (50 s by default).
			expect(performance.now() - t).toBeLessThan(10_000);
			tx.rollback();
		}).catch((e) => {
			if (!String(e).includes('Rollback')) throw e;
		});
	});

	it('queues a job again when its worker went quiet, and fails it after the third try', async () => {
		const stale = new Date(Date.now() - 10 * 60_000);
		const [{ id: again }] = await db
			.insert(outputJobs)
			.values({ kinds: ['nothing-here'], orderIds: [], total: 0, failures: [], status: 'running', claimedBy: 'gone', heartbeatAt: stale, attempts: 1 })
			.$returningId();
		const [{ id: tired }] = await db
			.insert(outputJobs)
			.values({ kinds: ['nothing-here'], orderIds: [], total: 0, failures: [], status: 'running', claimedBy: 'gone', heartbeatAt: stale, attempts: 3 })
			.$returningId();
		await requeueStale(db);
		const [a] = await db.select().from(outputJobs).where(eq(outputJobs.id, again));
		// Queued again (or already taken up again by the app's worker).
		expect(a.claimedBy === null || a.claimedBy !== 'gone').toBe(true);
		expect(['queued', 'running', 'failed']).toContain(a.status);
		const [b] = await db.select().from(outputJobs).where(eq(outputJobs.id, tired));
		expect(b.status).toBe('failed');
		expect(b.error).toMatch(/stopped three times/);
		await db.delete(outputJobs).where(sql`${outputJobs.id} IN (${again}, ${tired})`);
	});
});
