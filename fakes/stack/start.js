// @ts-check
// `npm start`: from a fresh clone to a running shop with demo data. Node built-ins only until the
// packages are installed; every step says what it is doing and, if it fails, how to fix it. The
// steps themselves are the shared launcher's (stack.js), in its `local` mode.
import { ensureDebianPackages, ensurePackages, onShutdown } from './bootstrap.js';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';

/** @type {null | { stop: (o?: { keep?: boolean }) => Promise<void>, children: import('node:child_process').ChildProcess[] }} */
let stack = null;
let stopping = false;

async function main() {
	console.log('Quarterline: setting up the demo atelier on this machine.\n');
	ensurePackages();
	ensureDebianPackages({ mariadbd: ['mariadb-server'], mariadb: ['mariadb-client'] });
	const { startStack } = await import('./stack.js');
	const s = await startStack({ name: 'local', mode: 'local' });
	stack = s;
	for (const child of s.children) {
		child.on('exit', (code) => {
			if (stopping) return;
			console.error(`A service stopped unexpectedly (exit ${code}); shutting down.`);
			void shutdown().then(() => process.exit(1));
		});
	}
	const { config } = s;
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
	if (stack) {
		console.log('Stopping the app, the fakes and MariaDB…');
		await stack.stop({ keep: true });
	}
}

onShutdown(shutdown);
main().catch(async (err) => {
	console.error(`\nnpm start stopped: ${err instanceof Error ? err.message : err}`);
	await shutdown();
	process.exit(1);
});
