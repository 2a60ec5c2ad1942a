// @ts-check
// `npm test`: the same bootstrapping as npm start, but with a fresh MariaDB of its own, its own
// build folder and free ports, so it runs beside a running npm start. Then svelte-check, vitest
// (unit and integration) and Playwright; the last line sums every runner: "N passed, N failed".
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureDebianPackages, ensurePackages, freePort, run, startService, step, done, ROOT } from '../fakes/stack/bootstrap.js';
import { appEnv, localConfig } from '../fakes/stack/config.js';
import { startMariaDB } from '../fakes/db/mariadb.js';

const runId = `${process.pid}-${Date.now().toString(36)}`;
const work = join(ROOT, '.data', `test-${runId}`);
/** @type {import('node:child_process').ChildProcess[]} */
const children = [];
/** @type {null | (() => Promise<void>)} */
let stopDb = null;
const tally = { passed: 0, failed: 0, skipped: 0 };
// `npm test -- unit e2e` runs only those parts; QL_TEST_FILES narrows vitest and Playwright to
// matching files (e.g. QL_TEST_FILES=ticket npm test -- integration).
const only = process.argv.slice(2);
const fileFilter = (process.env.QL_TEST_FILES ?? '').split(/[ ,]+/).filter(Boolean);
const wants = (/** @type {string} */ part) => only.length === 0 || only.includes(part);

async function main() {
	ensurePackages();
	ensureDebianPackages({ mariadbd: ['mariadb-server'], mariadb: ['mariadb-client'], chromium: ['chromium'], pdftoppm: ['poppler-utils'] });
	mkdirSync(work, { recursive: true });

	const base = localConfig();
	const [dbPort, appPort, paymentsPort, smtpPort, mailWebPort] = await Promise.all([freePort(), freePort(), freePort(), freePort(), freePort()]);
	const config = {
		...base,
		dbPort,
		appPort,
		paymentsPort,
		smtpPort,
		mailWebPort,
		origin: `http://127.0.0.1:${appPort}`,
		authSecret: `test-secret-${runId}-long-enough-for-jwt`,
		uploadDir: join(work, 'uploads'),
		db: { ...base.db, database: 'quarterline_test' }
	};

	step(`Starting a fresh MariaDB for the tests on 127.0.0.1:${dbPort}`);
	const db = await startMariaDB({ dataDir: join(work, 'mariadb'), port: dbPort, app: config.db });
	stopDb = db.stop;
	done();
	const env = {
		...appEnv(config, db.url),
		// Mail retries fast in tests, so an outage test does not wait minutes.
		OUTBOX_INTERVAL_MS: '500'
	};

	step('Migrating and seeding the test database');
	run(process.execPath, ['src/lib/server/db/migrate.js'], { env, quiet: true });
	run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/lib/server/seed/run.ts'], { env, quiet: true });
	done();

	if (wants('check')) {
		step('svelte-check');
		const r = spawnSync('npm', ['run', '--silent', 'check'], { cwd: ROOT, stdio: 'inherit' });
		count('svelte-check', r.status === 0 ? 1 : 0, r.status === 0 ? 0 : 1);
	}

	const buildDir = join(work, 'build');
	step('Building the app for the tests');
	run('npx', ['vite', 'build', '--logLevel', 'error'], { quiet: true, env: { QL_BUILD_DIR: buildDir } });
	done();

	step('Starting the fakes and the app on free ports');
	children.push(
		await startService('mail', ['fakes/mail/server.js'], {
			env: { MAIL_SMTP_PORT: String(smtpPort), MAIL_WEB_PORT: String(mailWebPort) },
			ready: `http://127.0.0.1:${mailWebPort}/healthz`,
			quiet: true
		})
	);
	children.push(
		await startService('payments', ['fakes/payments/server.js'], {
			env: { PAYMENTS_PORT: String(paymentsPort), PAYMENTS_WEBHOOK_URL: `${config.origin}/api/webhooks/stripe`, STRIPE_WEBHOOK_SECRET: config.webhookSecret },
			ready: `http://127.0.0.1:${paymentsPort}/_fake/healthz`,
			quiet: true
		})
	);
	children.push(await startService('app', [join(buildDir, 'index.js')], { env, ready: `${config.origin}/healthz`, quiet: !process.env.QL_TEST_APP_LOG }));
	done();

	// What the tests read to find the running system.
	const testEnv = {
		...env,
		QL_TEST: '1',
		APP_URL: config.origin,
		MAIL_URL: `http://127.0.0.1:${mailWebPort}`,
		PAYMENTS_URL: `http://127.0.0.1:${paymentsPort}`,
		DB_SOCKET: db.socket,
		DB_PORT: String(dbPort),
		QL_TEST_WORK: work,
		QL_BUILD_DIR: buildDir
	};

	const projects = ['unit', 'integration'].filter(wants);
	if (projects.length) {
		step(`vitest (${projects.join(' + ')})`);
		const out = join(work, 'vitest.json');
		spawnSync('npx', ['vitest', 'run', ...projects.flatMap((p) => ['--project', p]), ...fileFilter, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`], {
			cwd: ROOT,
			stdio: 'inherit',
			env: { ...process.env, ...testEnv }
		});
		const report = existsSync(out) ? JSON.parse(readFileSync(out, 'utf8')) : null;
		if (!report) count('vitest', 0, 1);
		else count('vitest', report.numPassedTests, report.numFailedTests + (report.success || report.numFailedTests ? 0 : 1), report.numPendingTests + report.numTodoTests);
	}

	if (wants('e2e')) {
		step('Playwright in Chromium');
		const out = join(work, 'playwright.json');
		spawnSync('npx', ['playwright', 'test', '-c', 'tests/playwright.config.ts', ...fileFilter], {
			cwd: ROOT,
			stdio: 'inherit',
			env: { ...process.env, ...testEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: out }
		});
		const report = existsSync(out) ? JSON.parse(readFileSync(out, 'utf8')) : null;
		if (!report) count('playwright', 0, 1);
		else count('playwright', report.stats.expected + report.stats.flaky, report.stats.unexpected + (report.errors?.length ?? 0), report.stats.skipped);
	}
}

/** @param {string} runner @param {number} passed @param {number} failed @param {number} [skipped] */
function count(runner, passed, failed, skipped = 0) {
	tally.passed += passed;
	tally.failed += failed;
	tally.skipped += skipped;
	console.log(`  ${runner}: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
}

async function cleanup() {
	for (const c of children.reverse()) c.kill('SIGTERM');
	await new Promise((r) => setTimeout(r, 300));
	if (stopDb) await stopDb();
	if (!process.env.QL_KEEP_TEST_DATA) rmSync(work, { recursive: true, force: true });
}

let exitCode = 0;
try {
	await main();
} catch (err) {
	console.error(`\nnpm test could not run: ${err instanceof Error ? err.message : err}`);
	tally.failed += 1;
} finally {
	await cleanup();
	exitCode = tally.failed > 0 ? 1 : 0;
	console.log(`${tally.passed} passed, ${tally.failed} failed${tally.skipped ? `, ${tally.skipped} skipped` : ''}`);
	process.exit(exitCode);
}
