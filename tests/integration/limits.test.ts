import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { rateCounters } from '../../src/lib/server/db/schema';
import { hit, isOver, reset } from '../../src/lib/server/limits';
import { testDb } from '../support/db';

const db = testDb();

describe('the shared fixed-window rate limit', () => {
	it('lets exactly the limit through when thirty hits arrive at once, and counts them all in one row', async () => {
		const key = `test:burst:${Date.now()}`;
		const results = await Promise.all(Array.from({ length: 30 }, () => hit(db, key, { limit: 5, windowSeconds: 60 })));
		expect(results.filter((r) => r.allowed)).toHaveLength(5);
		// Every hit saw its own count: 1 … 30, none twice (an atomic upsert, not read-then-write).
		expect(results.map((r) => r.hits).sort((a, b) => a - b)).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));
		const refused = results.find((r) => !r.allowed)!;
		expect(refused.retryAfter).toBeGreaterThan(0);
		expect(refused.retryAfter).toBeLessThanOrEqual(60);
		const [row] = await db.select().from(rateCounters).where(eq(rateCounters.key, key));
		expect(row.hits).toBe(30);
		expect(await isOver(db, key, { limit: 5, windowSeconds: 60 })).toBe(true);
	});

	it('starts a new window once the old one has passed', async () => {
		const key = `test:window:${Date.now()}`;
		for (let i = 0; i < 3; i++) await hit(db, key, { limit: 2, windowSeconds: 1 });
		expect(await isOver(db, key, { limit: 2, windowSeconds: 1 })).toBe(true);
		await new Promise((r) => setTimeout(r, 1100));
		expect(await isOver(db, key, { limit: 2, windowSeconds: 1 })).toBe(false);
		expect(await hit(db, key, { limit: 2, windowSeconds: 1 })).toEqual({ allowed: true, hits: 1, retryAfter: 0 });
		await reset(db, key);
		expect(await db.select().from(rateCounters).where(eq(rateCounters.key, key))).toHaveLength(0);
	});

	it('takes keys longer than the column (a long e-mail address) without an error', async () => {
		const key = `test:long:${'x'.repeat(300)}@example.com`;
		expect((await hit(db, key, { limit: 1, windowSeconds: 60 })).allowed).toBe(true);
		expect((await hit(db, key, { limit: 1, windowSeconds: 60 })).allowed).toBe(false);
	});
});
