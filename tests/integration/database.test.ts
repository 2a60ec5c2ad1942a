import { afterAll, describe, expect, it } from 'vitest';
import mysql from 'mysql2/promise';
import { migrateDatabase } from '../../src/lib/server/db/migrate.js';
import { createDb } from '../../src/lib/server/db/client';
import { seedDemo } from '../../src/lib/server/seed/demo';
import { testEnv } from '../support/env';

// In the order MariaDB lists them (its collation sorts "_" after the letters).
const TABLES = ['account', 'combined_lay', 'combined_lay_order', 'fabric', 'fit_photo', 'fit_report', 'house_rules', 'mail_outbox', 'measurement_profile', 'measure_card_change', 'order', 'order_event', 'order_line', 'output_job', 'output_preference', 'payment', 'rate_counter', 'session', 'shop_setting', 'sign_in_attempt', 'style', 'upload', 'user', 'verificationToken', 'webhook_event'];

/** A scratch database beside the test one (the app user may create `quarterline_test…` databases). */
async function scratchDatabase(name: string) {
	const url = new URL(testEnv.databaseUrl);
	const admin = await mysql.createConnection({ uri: testEnv.databaseUrl });
	await admin.query(`DROP DATABASE IF EXISTS \`${name}\``);
	await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
	url.pathname = `/${name}`;
	const drop = async () => {
		await admin.query(`DROP DATABASE IF EXISTS \`${name}\``);
		await admin.end();
	};
	return { url: url.toString(), drop };
}

const cleanups: (() => Promise<void>)[] = [];
afterAll(async () => {
	for (const c of cleanups) await c();
});

async function tableSnapshot(url: string) {
	const conn = await mysql.createConnection({ uri: url });
	const snapshot: Record<string, unknown> = {};
	for (const t of TABLES) {
		const [rows] = await conn.query(`CHECKSUM TABLE \`${t}\``);
		const [[{ n }]] = (await conn.query(`SELECT COUNT(*) AS n FROM \`${t}\``)) as unknown as [[{ n: number }]];
		snapshot[t] = { rows: n, checksum: (rows as { Checksum: number }[])[0].Checksum };
	}
	await conn.end();
	return snapshot;
}

describe('the schema', () => {
	it('migrates an empty database to every table the product uses', async () => {
		const { url, drop } = await scratchDatabase('quarterline_test_migrate');
		cleanups.push(drop);
		await migrateDatabase(url);
		const conn = await mysql.createConnection({ uri: url });
		const [rows] = await conn.query('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1');
		await conn.end();
		const names = (rows as { t: string }[]).map((r) => r.t).filter((t) => !t.startsWith('__drizzle'));
		expect(names).toEqual(TABLES);
		// Applying again is a no-op, as npm start does on every run.
		await expect(migrateDatabase(url)).resolves.toBeUndefined();
	});

	it('gives the same rows when the demo seed runs twice', async () => {
		const { url, drop } = await scratchDatabase('quarterline_test_seed');
		cleanups.push(drop);
		await migrateDatabase(url);
		const { db, pool } = createDb(url, 2);
		const at = new Date('2026-11-20T09:00:00Z');
		await seedDemo(db, at);
		const first = await tableSnapshot(url);
		await seedDemo(db, new Date('2026-11-21T09:00:00Z'));
		const second = await tableSnapshot(url);
		await pool.end();
		expect(second).toEqual(first);
		// The invented atelier: 5 demo people, 6 styles, 7 fabrics, 13 orders in every stage.
		expect(first).toMatchObject({ user: { rows: 5 }, style: { rows: 6 }, fabric: { rows: 7 }, order: { rows: 13 }, order_line: { rows: 13 } });
	});
});
