import { sql } from 'drizzle-orm';
import type { Db } from './db/client';

export type Limit = { limit: number; windowSeconds: number };
export type Hit = { allowed: boolean; hits: number; retryAfter: number };

/**
 * Counts one hit against `key` in a fixed window and says whether it is within the limit.
 *
 * Home-made rather than a package because it must count in MariaDB (every app server shares the
 * count) and must be exact under concurrency: one INSERT … ON DUPLICATE KEY UPDATE changes the row
 * under its own row lock, and the count it wrote comes back in the same statement through
 * LAST_INSERT_ID(expr) (per connection), so no read can see another request's hit in between.
 * Thirty concurrent hits against a limit of five allow exactly five.
 *
 * Keys are short, e.g. `signin:email:<address>`; longer keys are hashed to fit the column.
 */
export async function hit(db: Db, key: string, opts: Limit): Promise<Hit> {
	// Concurrent first hits on a new key can deadlock inside InnoDB (each waits on the other's insert);
	// the one MariaDB picks as victim counted nothing, so it simply counts again.
	for (let attempt = 1; ; attempt++) {
		try {
			return await count(db, key, opts);
		} catch (err) {
			if (attempt >= 3 || !deadlock(err)) throw err;
		}
	}
}

function deadlock(err: unknown) {
	for (let e = err as { code?: string; cause?: unknown } | undefined; e; e = e.cause as typeof e) if (e.code === 'ER_LOCK_DEADLOCK') return true;
	return false;
}

async function count(db: Db, key: string, { limit, windowSeconds }: Limit): Promise<Hit> {
	const k = await fitKey(key);
	const window = Math.max(1, Math.round(windowSeconds));
	// Assignments in ON DUPLICATE KEY UPDATE run left to right and see earlier ones: window_start is set
	// last, so both tests read the old window start.
	const expired = sql`window_start <= NOW(3) - INTERVAL ${window} SECOND`;
	const [result] = (await db.execute(sql`
		INSERT INTO rate_counter (\`key\`, hits, window_start) VALUES (${k}, LAST_INSERT_ID(1), NOW(3))
		ON DUPLICATE KEY UPDATE
			hits = LAST_INSERT_ID(IF(${expired}, 1, hits + 1)),
			window_start = IF(${expired}, NOW(3), window_start)`)) as unknown as [{ insertId: number }];
	const hits = Number(result.insertId);
	if (hits <= limit) return { allowed: true, hits, retryAfter: 0 };
	const [rows] = (await db.execute(
		sql`SELECT GREATEST(1, CEIL(${window} - TIMESTAMPDIFF(MICROSECOND, window_start, NOW(3)) / 1e6)) AS wait FROM rate_counter WHERE \`key\` = ${k}`
	)) as unknown as [{ wait: number | string }[]];
	return { allowed: false, hits, retryAfter: Number(rows[0]?.wait ?? window) };
}

/** Whether `key` is over its limit now, without counting a hit (to refuse before any work is done). */
export async function isOver(db: Db, key: string, { limit, windowSeconds }: Limit): Promise<boolean> {
	const k = await fitKey(key);
	const [rows] = (await db.execute(
		sql`SELECT hits FROM rate_counter WHERE \`key\` = ${k} AND window_start > NOW(3) - INTERVAL ${Math.max(1, Math.round(windowSeconds))} SECOND`
	)) as unknown as [{ hits: number }[]];
	return (rows[0]?.hits ?? 0) >= limit;
}

/** Takes one hit back (e.g. a sign-in that turned out right was not a guess). */
export async function forgive(db: Db, key: string) {
	await db.execute(sql`UPDATE rate_counter SET hits = GREATEST(hits - 1, 0) WHERE \`key\` = ${await fitKey(key)}`);
}

/** Forgets a key's count (e.g. after a successful sign-in, or in tests). */
export async function reset(db: Db, key: string) {
	await db.execute(sql`DELETE FROM rate_counter WHERE \`key\` = ${await fitKey(key)}`);
}

async function fitKey(key: string) {
	if (key.length <= 191) return key;
	const digest = await crypto.subtle.digest('SHA-256', new TextEncoder().encode(key));
	return `${key.slice(0, 120)}#${Buffer.from(digest).toString('base64url')}`;
}
