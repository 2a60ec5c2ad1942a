// @ts-check
// The one launcher behind `npm start`, `npm test` and `npm run bench`: MariaDB, the migrations and the
// demo seed, the build, the mail and payment fakes and the app. Two kinds of system:
// - `local` (npm start): the fixed ports and settings of config.js, the database kept in .data/mariadb,
//   a build into build/ only when the sources changed;
// - `fresh` (npm test, npm run bench): free ports, a new database and build folder of its own under
//   .data/, removed afterwards, so it runs beside a running npm start.
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { freePort, needsBuild, portInUse, run, startService, step, done, stopChildren, ROOT } from './bootstrap.js';
import { appEnv, localConfig } from './config.js';
import { startMariaDB } from '../db/mariadb.js';

const TSX = 'node_modules/tsx/dist/cli.mjs';

/** The settings of a fresh system: free ports, its own secret, folders under `work`. */
async function freshConfig(/** @type {string} */ name, /** @type {string} */ work, /** @type {string} */ runId) {
	const base = localConfig();
	const [dbPort, appPort, paymentsPort, smtpPort, mailWebPort] = await Promise.all([freePort(), freePort(), freePort(), freePort(), freePort()]);
	return {
		...base,
		dbPort,
		dbDataDir: join(work, 'mariadb'),
		appPort,
		paymentsPort,
		smtpPort,
		mailWebPort,
		origin: `http://127.0.0.1:${appPort}`,
		authSecret: `${name}-secret-${runId}-long-enough-for-jwt`,
		uploadDir: join(work, 'uploads'),
		db: { ...base.db, database: `quarterline_${name}` }
	};
}

/**
 * @param {{ name: string, mode?: 'local' | 'fresh', quiet?: boolean, appEnv?: Record<string, string> }} opts
 */
export async function startStack(opts) {
	const mode = opts.mode ?? 'fresh';
	const local = mode === 'local';
	const runId = `${process.pid}-${Date.now().toString(36)}`;
	const work = local ? join(ROOT, '.data') : join(ROOT, '.data', `${opts.name}-${runId}`);
	mkdirSync(work, { recursive: true });
	/** @type {import('node:child_process').ChildProcess[]} */
	const children = [];
	/** @type {null | (() => Promise<void>)} */
	let stopDb = null;
	const stop = async (/** @type {{ keep?: boolean }} */ o = {}) => {
		await stopChildren([...children].reverse());
		children.length = 0;
		if (stopDb) await stopDb();
		stopDb = null;
		if (!local && !o.keep) rmSync(work, { recursive: true, force: true });
	};
	const quiet = opts.quiet ?? !local;
	try {
		const config = local ? localConfig() : await freshConfig(opts.name, work, runId);
		if (local) {
			for (const [name, port] of [['the app', config.appPort], ['the payment fake', config.paymentsPort], ['the mail fake (SMTP)', config.smtpPort], ['the mail fake (inbox page)', config.mailWebPort]]) {
				if (await portInUse(/** @type {number} */ (port))) {
					throw new Error(`Port ${port} for ${name} is taken. Stop the program using it (is another npm start running?), or set another port in .env.`);
				}
			}
		}

		step(`Starting ${local ? '' : 'a fresh '}MariaDB on 127.0.0.1:${config.dbPort}${local ? ' (data in .data/mariadb)' : ''}`);
		const db = await startMariaDB({ dataDir: config.dbDataDir, port: config.dbPort, app: config.db, log: local ? (s) => console.log(`  ${s}`) : undefined });
		stopDb = db.stop;
		done(db.alreadyRunning ? 'it was already running' : '');
		const env = { ...appEnv(config, db.url), ...opts.appEnv };

		// The root tsconfig extends .svelte-kit/tsconfig.json, which only `svelte-kit sync` writes. The seed
		// (through tsx) resolves $lib with its paths, and a build into a kit folder of its own needs it too:
		// on a fresh clone it is not there yet.
		if (!existsSync(join(ROOT, '.svelte-kit', 'tsconfig.json'))) run('npx', ['svelte-kit', 'sync'], { quiet: true });
		step(local ? 'Applying migrations and seeding the demo atelier (kept if already there)' : 'Migrating and seeding the database');
		run(process.execPath, ['src/lib/server/db/migrate.js'], { env, quiet: true, hint: 'Feed the newest file in drizzle/ to the mariadb client to see the SQL error.' });
		run(process.execPath, [TSX, 'src/lib/server/seed/run.ts'], { env, quiet: true });
		done();

		const buildDir = local ? join(ROOT, 'build') : join(work, 'build');
		if (!local || needsBuild()) {
			step('Building the app');
			run('npx', ['vite', 'build', '--logLevel', local ? 'warn' : 'error'], {
				quiet: true,
				env: local ? {} : { QL_BUILD_DIR: buildDir, QL_KIT_DIR: join(work, 'kit') },
				hint: 'Run `npm run build` to see the full build output.'
			});
			done();
		}

		step(local ? 'Starting the mail and payment fakes' : 'Starting the fakes and the app on free ports');
		children.push(
			await startService('mail', ['fakes/mail/server.js'], {
				env: { MAIL_SMTP_PORT: String(config.smtpPort), MAIL_WEB_PORT: String(config.mailWebPort) },
				ready: `http://127.0.0.1:${config.mailWebPort}/healthz`,
				quiet
			})
		);
		children.push(
			await startService('payments', ['fakes/payments/server.js'], {
				env: { PAYMENTS_PORT: String(config.paymentsPort), PAYMENTS_WEBHOOK_URL: `${config.origin}/api/webhooks/stripe`, STRIPE_WEBHOOK_SECRET: config.webhookSecret },
				ready: `http://127.0.0.1:${config.paymentsPort}/_fake/healthz`,
				quiet
			})
		);
		// The demo's past payments, so the owner can refund a demo order through the fake.
		run(process.execPath, [TSX, 'src/lib/server/seed/register-payments.ts'], { env: { ...env, PAYMENTS_URL: `http://127.0.0.1:${config.paymentsPort}` }, quiet: true });
		if (local) {
			done();
			step('Starting the app');
		}
		children.push(await startService('app', [join(buildDir, 'index.js')], { env, ready: `${config.origin}/healthz`, quiet }));
		done();

		/** What tests and benchmarks read to find the running system. */
		const testEnv = {
			...env,
			APP_URL: config.origin,
			MAIL_URL: `http://127.0.0.1:${config.mailWebPort}`,
			PAYMENTS_URL: `http://127.0.0.1:${config.paymentsPort}`,
			DB_SOCKET: db.socket,
			DB_PORT: String(config.dbPort),
			DB_DATA_DIR: config.dbDataDir,
			QL_TEST_WORK: work,
			QL_BUILD_DIR: buildDir
		};
		return { work, config, db, env, testEnv, children, stop };
	} catch (err) {
		await stop();
		throw err;
	}
}
