// Seeds the demo atelier into DATABASE_URL (run by npm start and npm test through tsx).
import { createDb } from '../db/client';
import { seedDemo } from './demo';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL (npm start does it for you).');
const { db, pool } = createDb(url, 2);
try {
	await seedDemo(db);
	console.log('demo atelier seeded');
} finally {
	await pool.end();
}
