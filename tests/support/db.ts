import { afterAll } from 'vitest';
import { createDb } from '../../src/lib/server/db/client';
import { testEnv } from './env';

/** A Drizzle client on the test database, closed after the file's tests. */
export function testDb() {
	const { db, pool } = createDb(testEnv.databaseUrl, 4);
	afterAll(() => pool.end());
	return db;
}
