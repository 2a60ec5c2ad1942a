import { sql } from 'drizzle-orm';
import type { Db } from './db/client';
import { rateCounters } from './db/schema';

export type Limit = { limit: number; windowSeconds: number };
export type Hit = { allowed: boolean; hits: number; retryAfter: number };

/**
 * Counts one hit against `key` in a fixed window kept in MariaDB (rate_counter), so every app server
 * counts alike. Written by hand rather than with a limiter package because it is one upsert on a table
 * we already have: the increment and the window reset happen in that one statement, so concurrent
 * requests cannot both slip under the limit, and the row is read back inside the same transaction
 * (still locked by the upsert) so each caller sees its own count.
 */
export async function hit(db: Db, key: string, opts: Limit): Promise<Hit> {
	// Concurrent first hits on a new key can deadlock inside InnoDB (both wait on the other's insert);
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
	return db.transaction(async (tx) => {
		// MariaDB applies ON DUPLICATE KEY UPDATE assignments left to right: `hits` is decided while
		// window_start still holds the old value, then window_start moves on.
		await tx.execute(sql`
			INSERT INTO ${rateCounters} (\`key\`, hits, window_start) VALUES (${key}, 1, NOW(3))
			ON DUPLICATE KEY UPDATE
				hits = IF(window_start < NOW(3) - INTERVAL ${windowSeconds} SECOND, 1, hits + 1),
				window_start = IF(window_start < NOW(3) - INTERVAL ${windowSeconds} SECOND, NOW(3), window_start)`);
		const [rows] = await tx.execute(sql`
			SELECT hits, TIMESTAMPDIFF(MICROSECOND, NOW(3), window_start + INTERVAL ${windowSeconds} SECOND) AS left_us
			FROM ${rateCounters} WHERE \`key\` = ${key}`);
		const row = (rows as unknown as { hits: number; left_us: number | string }[])[0];
		const hits = Number(row.hits);
		return { allowed: hits <= limit, hits, retryAfter: Math.max(1, Math.ceil(Number(row.left_us) / 1e6)) };
	});
}
