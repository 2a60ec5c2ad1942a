import { env } from '$env/dynamic/private';
import { createDb } from './client';

// The pool connects on first use, so importing this during the build touches no database.
const { db, pool } = createDb(env.DATABASE_URL ?? 'mysql://quarterline@127.0.0.1:3307/quarterline');

export { db, pool };
export type { Db } from './client';
