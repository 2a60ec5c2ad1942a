// @ts-check
// Shared steps of `npm start`, `npm test` and `npm run bench`. Node built-ins only, because the
// first thing these do is put the npm packages in place.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));

const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const dim = (/** @type {string} */ s) => (useColour ? `\x1b[2m${s}\x1b[0m` : s);
const bold = (/** @type {string} */ s) => (useColour ? `\x1b[1m${s}\x1b[0m` : s);

let stepStarted = 0;
/** Says what is happening now, so nobody stares at a silent terminal. */
export function step(/** @type {string} */ what) {
	stepStarted = Date.now();
	console.log(`${bold('»')} ${what}…`);
}
export function done(/** @type {string} */ extra = '') {
	console.log(dim(`  done in ${((Date.now() - stepStarted) / 1000).toFixed(1)} s${extra ? ` (${extra})` : ''}`));
}

/** Runs a command in the foreground; throws with a hint naming the step when it fails. */
export function run(/** @type {string} */ cmd, /** @type {string[]} */ args, /** @type {{ hint?: string, env?: NodeJS.ProcessEnv, quiet?: boolean }} */ opts = {}) {
	const r = spawnSync(cmd, args, {
		cwd: ROOT,
		stdio: opts.quiet ? ['ignore', 'pipe', 'pipe'] : 'inherit',
		env: { ...process.env, ...opts.env },
		encoding: 'utf8'
	});
	if (r.status !== 0) {
		if (opts.quiet) process.stderr.write(`${r.stdout ?? ''}${r.stderr ?? ''}`);
		throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status}).${opts.hint ? `\n${opts.hint}` : ''}`);
	}
	return r;
}

/** `npm ci` when node_modules is missing or older than the lock file. */
export function ensurePackages() {
	const marker = join(ROOT, 'node_modules', '.package-lock.json');
	const lock = join(ROOT, 'package-lock.json');
	if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return false;
	step('Installing npm packages (npm ci)');
	run('npm', ['ci', '--no-audit', '--no-fund'], { hint: 'Check that the npm registry is reachable, then run npm start again.' });
	done();
	return true;
}

/** Installs Debian packages that provide the given commands, if a command is missing. */
export function ensureDebianPackages(/** @type {Record<string, string[]>} */ commandToPackages) {
	const has = (/** @type {string} */ c) => ['/usr/sbin', '/usr/bin', '/usr/local/bin', '/usr/local/sbin'].some((d) => existsSync(join(d, c)));
	const missing = [...new Set(Object.entries(commandToPackages).filter(([c]) => !has(c)).flatMap(([, p]) => p))];
	if (missing.length === 0) return;
	step(`Installing ${missing.join(', ')} from Debian's packages`);
	const asRoot = process.getuid?.() === 0 ? [] : ['sudo'];
	const env = { DEBIAN_FRONTEND: 'noninteractive' };
	const hint = `Install them by hand with: apt-get update && apt-get install -y ${missing.join(' ')}`;
	const apt = (/** @type {string[]} */ args) =>
		asRoot.length ? run('sudo', ['apt-get', ...args], { env, hint, quiet: true }) : run('apt-get', args, { env, hint, quiet: true });
	apt(['update', '-qq']);
	apt(['install', '-y', '-qq', '--no-install-recommends', ...missing]);
	done();
}

/** Rebuilds the app when any source is newer than the last build. */
export function needsBuild(/** @type {string} */ outDir = 'build') {
	const handler = join(ROOT, outDir, 'handler.js');
	if (!existsSync(handler)) return true;
	const built = statSync(handler).mtimeMs;
	/** @type {(p: string) => boolean} */
	const newer = (p) => {
		const s = statSync(p);
		if (s.isDirectory()) return readdirSync(p).some((f) => newer(join(p, f)));
		return s.mtimeMs > built;
	};
	return ['src', 'static', 'svelte.config.js', 'vite.config.ts', 'package-lock.json']
		.map((p) => join(ROOT, p))
		.filter(existsSync)
		.some(newer);
}

/** A free TCP port on loopback. */
export function freePort() {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.unref();
		srv.on('error', reject);
		srv.listen(0, '127.0.0.1', () => {
			const addr = srv.address();
			const port = typeof addr === 'object' && addr ? addr.port : 0;
			srv.close(() => resolve(port));
		});
	});
}

/** Whether something answers on a loopback port. */
export function portInUse(/** @type {number} */ port) {
	return new Promise((resolve) => {
		const srv = createServer();
		srv.once('error', () => resolve(true));
		srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(false)));
	});
}

/**
 * Starts a long-running child process with its output prefixed, and resolves when `ready` answers.
 * @param {string} name
 * @param {string[]} args node arguments
 * @param {{ env?: NodeJS.ProcessEnv, ready: string, quiet?: boolean }} opts
 */
export async function startService(name, args, opts) {
	const child = spawn(process.execPath, args, {
		cwd: ROOT,
		env: { ...process.env, ...opts.env },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	const prefix = dim(`[${name}] `);
	let recent = '';
	const forward = (/** @type {NodeJS.WriteStream} */ out) => (/** @type {Buffer} */ chunk) => {
		recent = (recent + chunk.toString()).slice(-4000);
		if (!opts.quiet) out.write(chunk.toString().replace(/^(?=.)/gm, prefix));
	};
	child.stdout?.on('data', forward(process.stdout));
	child.stderr?.on('data', forward(process.stderr));
	const started = Date.now();
	for (;;) {
		if (child.exitCode !== null) throw new Error(`${name} stopped while starting:\n${recent}`);
		try {
			const res = await fetch(opts.ready);
			if (res.ok) break;
		} catch {
			/* not yet listening */
		}
		if (Date.now() - started > 30_000) throw new Error(`${name} did not answer ${opts.ready} within 30 s:\n${recent}`);
		await new Promise((r) => setTimeout(r, 150));
	}
	return child;
}

/** Stops children, then runs the final cleanup, on Ctrl-C or SIGTERM. */
export function onShutdown(/** @type {() => Promise<void>} */ cleanup) {
	let stopping = false;
	const handler = async (/** @type {string} */ signal) => {
		if (stopping) return;
		stopping = true;
		console.log(`\n${signal}: stopping…`);
		try {
			await cleanup();
		} finally {
			process.exit(0);
		}
	};
	process.on('SIGINT', handler);
	process.on('SIGTERM', handler);
}

/**
 * Stops child processes: SIGTERM, then SIGKILL for any still running after `graceMs`.
 * @param {import('node:child_process').ChildProcess[]} children
 */
export async function stopChildren(children, graceMs = 4000) {
	const alive = children.filter((c) => c.exitCode === null && c.signalCode === null);
	await Promise.all(
		alive.map(
			(c) =>
				new Promise((resolve) => {
					const timer = setTimeout(() => c.kill('SIGKILL'), graceMs);
					c.once('exit', () => {
						clearTimeout(timer);
						resolve(undefined);
					});
					c.kill('SIGTERM');
				})
		)
	);
}
