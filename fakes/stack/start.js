// @ts-check
// `npm start`: from a fresh clone to a running shop with demo data. Node built-ins only until the
// packages are installed; every step says what it is doing and, if it fails, how to fix it.
import { ensureDebianPackages, ensurePackages, needsBuild, onShutdown, portInUse, run, startService, step, done, stopChildren } from './bootstrap.js';
import { appEnv, localConfig } from './config.js';
import { startMariaDB } from '../db/mariadb.js';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';

const config = localConfig();
/** @type {import('node:child_process').ChildProcess[]} */
const children = [];
/** @type {null | (() => Promise<void>)} */
let stopDb = null;
let stopping = false;

async function main() {
	console.log('Quarterline: setting up the demo atelier on this machine.\n');
	ensurePackages();
	ensureDebianPackages({ mariadbd: ['mariadb-server'], mariadb: ['mariadb-client'] });

	for (const [name, port] of [['the app', config.appPort], ['the payment fake', config.paymentsPort], ['the mail fake (SMTP)', config.smtpPort], ['the mail fake (inbox page)', config.mailWebPort]]) {
		if (await portInUse(/** @type {number} */ (port))) {
			throw new Error(`Port ${port} for ${name} is taken. Stop the program using it (is another npm start running?), or set another port in .env.`);
		}
	}

	step(`Starting MariaDB on 127.0.0.1:${config.dbPort} (data in .data/mariadb)`);
	const db = await startMariaDB({ dataDir: config.dbDataDir, port: config.dbPort, app: config.db, log: (s) => console.log(`  ${s}`) });
	stopDb = db.stop;
	done(db.alreadyRunning ? 'it was already running' : '');
	const env = appEnv(config, db.url);

	step('Applying database migrations');
	run(process.execPath, ['src/lib/server/db/migrate.js'], {
		env,
		quiet: true,
		hint: 'Feed the newest file in drizzle/ to the mariadb client to see the SQL error.'
	});
	done();

	step('Seeding the demo atelier (kept if already there)');
	run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/lib/server/seed/run.ts'], { env, quiet: true });
	done();

	if (needsBuild()) {
		step('Building the app');
		run('npx', ['vite', 'build', '--logLevel', 'warn'], { quiet: true, hint: 'Run `npm run build` to see the full build output.' });
		done();
	}

	step('Starting the mail and payment fakes');
	children.push(
		await startService('mail', ['fakes/mail/server.js'], {
			env: { MAIL_SMTP_PORT: String(config.smtpPort), MAIL_WEB_PORT: String(config.mailWebPort) },
			ready: `http://127.0.0.1:${config.mailWebPort}/healthz`
		})
	);
	children.push(
		await startService('payments', ['fakes/payments/server.js'], {
			env: {
				PAYMENTS_PORT: String(config.paymentsPort),
				PAYMENTS_WEBHOOK_URL: `${config.origin}/api/webhooks/stripe`,
				STRIPE_WEBHOOK_SECRET: config.webhookSecret
			},
			ready: `http://127.0.0.1:${config.paymentsPort}/_fake/healthz`
		})
	);
	run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/lib/server/seed/register-payments.ts'], { env: { ...env, PAYMENTS_URL: `http://127.0.0.1:${config.paymentsPort}` }, quiet: true });
	done();

	step('Starting the app');
	children.push(await startService('app', ['build/index.js'], { env, ready: `http://127.0.0.1:${config.appPort}/healthz` }));
	done();
	for (const child of children) {
		child.on('exit', (code) => {
			if (stopping) return;
			console.error(`A service stopped unexpectedly (exit ${code}); shutting down.`);
			void shutdown().then(() => process.exit(1));
		});
	}

	const pad = (/** @type {string} */ s) => s.padEnd(10);
	console.log(`
Quarterline is running.

  Shop        ${config.origin}
  Workroom    ${config.origin}/workroom
  Back office ${config.origin}/admin
  Mail inbox  http://127.0.0.1:${config.mailWebPort}   (every e-mail the shop sends lands here)
  Payments    http://127.0.0.1:${config.paymentsPort}  (test card 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)
  Database    127.0.0.1:${config.dbPort}, database ${config.db.database}

Demo sign-ins (password for all: ${DEMO_SIGN_INS.password})
${DEMO_SIGN_INS.accounts.map((a) => `  ${pad(a.role)} ${a.email}`).join('\n')}

Press Ctrl-C to stop; the data stays in .data/ for the next npm start.`);
}

async function shutdown() {
	stopping = true;
	await stopChildren(children.reverse());
	if (stopDb) {
		console.log('Stopping MariaDB…');
		await stopDb();
	}
}

onShutdown(shutdown);
main().catch(async (err) => {
	console.error(`\nnpm start stopped: ${err instanceof Error ? err.message : err}`);
	await shutdown();
	process.exit(1);
});
