import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import mysql from 'mysql2/promise';
import { backupDatabase } from '../../fakes/db/backup.js';
import { testEnv } from '../support/env';

describe('npm run db:backup', () => {
	it('writes a dump that restores into an empty database with every order', async () => {
		const file = join(process.env.QL_TEST_WORK!, 'backup-test.sql');
		await backupDatabase(testEnv.databaseUrl, file);
		expect(readFileSync(file, 'utf8')).toContain('CREATE TABLE `order`');

		const url = new URL(testEnv.databaseUrl);
		const conn = await mysql.createConnection({ uri: testEnv.databaseUrl });
		await conn.query('DROP DATABASE IF EXISTS quarterline_test_restore');
		await conn.query('CREATE DATABASE quarterline_test_restore CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
		const restore = spawnSync('mariadb', ['--no-defaults', `--host=${url.hostname}`, `--port=${url.port}`, `--user=${decodeURIComponent(url.username)}`, 'quarterline_test_restore'], {
			input: readFileSync(file),
			env: { ...process.env, MYSQL_PWD: decodeURIComponent(url.password) }
		});
		expect(restore.status, restore.stderr?.toString()).toBe(0);
		const [source] = (await conn.query('SELECT number, total, status FROM `order` ORDER BY number')) as unknown as [unknown[]];
		const [restored] = (await conn.query('SELECT number, total, status FROM quarterline_test_restore.`order` ORDER BY number')) as unknown as [unknown[]];
		expect(restored).toEqual(source);
		expect(source.length).toBeGreaterThanOrEqual(13); // the demo seed's thirteen and whatever the tests added
		await conn.query('DROP DATABASE quarterline_test_restore');
		await conn.end();
		rmSync(file);
	});
});
