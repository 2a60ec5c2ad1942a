// @ts-check
// Applies the committed Drizzle migrations in drizzle/ to DATABASE_URL.
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import { fileURLToPath } from 'node:url';

export async function migrateDatabase(/** @type {string} */ url) {
	const connection = await mysql.createConnection({ uri: url, multipleStatements: true });
	try {
		await migrate(drizzle(connection), { migrationsFolder: fileURLToPath(new URL('../../../../drizzle', import.meta.url)) });
	} finally {
		await connection.end();
	}
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const url = process.env.DATABASE_URL;
	if (!url) {
		console.error('Set DATABASE_URL (npm start does it for you).');
		process.exit(1);
	}
	await migrateDatabase(url);
	console.log('migrations applied');
}
