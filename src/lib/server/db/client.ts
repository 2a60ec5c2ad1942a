import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';

/** A Drizzle client on its own pool; the app makes one, and scripts and tests make their own. */
export function createDb(url: string, connectionLimit = 20) {
	const pool = mysql.createPool({
		uri: url,
		connectionLimit,
		waitForConnections: true,
		// A request should fail fast with a clear message when the database is away, not hang.
		connectTimeout: 5_000,
		enableKeepAlive: true,
		// DECIMAL columns come back as numbers (our lengths have one decimal: no precision is lost).
		decimalNumbers: true,
		timezone: 'Z',
		dateStrings: ['DATE']
	});
	const db = drizzle(pool, { schema, mode: 'default' });
	return { db, pool };
}

export type Db = ReturnType<typeof createDb>['db'];
