// @ts-check
// A whole system on free ports with a fresh database of its own: MariaDB, the mail and payment
// fakes and the built app. npm test and npm run bench each start one, so both run beside npm start.
import { rmSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { freePort, run, startService, step, done, stopChildren, ROOT } from './bootstrap.js';
import { appEnv, localConfig } from './config.js';
import { startMariaDB } from '../db/mariadb.js';

/**
 * @param {{ name: string, quiet?: boolean, appEnv?: Record<string, string> }} opts
 */
export async function startStack(opts) {
	const runId = `${process.pid}-${Date.now().toString(36)}`;
	const work = join(ROOT, '.data', `${opts.name}-${runId}`);
	mkdirSync(work, { recursive: true });
	/** @type {import('node:child_process').ChildProcess[]} */
	const children = [];
	/** @type {null | (() => Promise<void>)} */
	let stopDb = null;
	const stop = async (/** @type {{ keep?: boolean }} */ o = {}) => {
		await stopChildren(children.reverse());
		if (stopDb) await stopDb();
		if (!o.keep) rmSync(work, { recursive: true, force: true });
	};
	try {
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
			authSecret: `${opts.name}-secret-${runId}-long-enough-for-jwt`,
			uploadDir: join(work, 'uploads'),
			db: { ...base.db, database: `quarterline_${opts.name}` }
		};

		step(`Starting a fresh MariaDB on 127.0.0.1:${dbPort}`);
		const db = await startMariaDB({ dataDir: join(work, 'mariadb'), port: dbPort, app: config.db });
		stopDb = db.stop;
		done();
		const env = { ...appEnv(config, db.url), ...opts.appEnv };

		step('Migrating and seeding the database');
		run(process.execPath, ['src/lib/server/db/migrate.js'], { env, quiet: true });
		run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/lib/server/seed/run.ts'], { env, quiet: true });
		done();

		const buildDir = join(work, 'build');
		step('Building the app');
		run('npx', ['vite', 'build', '--logLevel', 'error'], { quiet: true, env: { QL_BUILD_DIR: buildDir, QL_KIT_DIR: join(work, 'kit') } });
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
		run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/lib/server/seed/register-payments.ts'], { env: { ...env, PAYMENTS_URL: `http://127.0.0.1:${paymentsPort}` }, quiet: true });
		children.push(await startService('app', [join(buildDir, 'index.js')], { env, ready: `${config.origin}/healthz`, quiet: opts.quiet ?? true }));
		done();

		/** What tests and benchmarks read to find the running system. */
		const testEnv = {
			...env,
			APP_URL: config.origin,
			MAIL_URL: `http://127.0.0.1:${mailWebPort}`,
			PAYMENTS_URL: `http://127.0.0.1:${paymentsPort}`,
			DB_SOCKET: db.socket,
			DB_PORT: String(dbPort),
			DB_DATA_DIR: join(work, 'mariadb'),
			QL_TEST_WORK: work,
			QL_BUILD_DIR: buildDir
		};
		return { work, config, db, env, testEnv, children, stop };
	} catch (err) {
		await stop();
		throw err;
	}
}
