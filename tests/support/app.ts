import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { afterAll } from 'vitest';

export function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.on('error', reject);
		srv.listen(0, '127.0.0.1', () => {
			const a = srv.address();
			srv.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
		});
	});
}

// Every app server a test file starts is stopped when the file is done (hooks registered at import
// time; a hook registered inside a test would never run).
const started = new Set<() => Promise<void>>();
afterAll(async () => {
	await Promise.all([...started].map((stop) => stop()));
});

/**
 * Another app server from the same build, on its own port, sharing the test database (or pointed
 * elsewhere by `env`): for two-instance, outage and HTTPS-cookie tests. Stopped after the file.
 */
export async function startAppInstance(env: Record<string, string> = {}, port?: number) {
	port ??= await freePort();
	const url = `http://127.0.0.1:${port}`;
	const child: ChildProcess = spawn(process.execPath, [join(process.env.QL_BUILD_DIR!, 'index.js')], {
		env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', ORIGIN: url, ...env },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let log = '';
	child.stdout?.on('data', (d) => (log += d));
	child.stderr?.on('data', (d) => (log += d));
	const until = Date.now() + 20_000;
	for (;;) {
		if (child.exitCode !== null) throw new Error(`second app stopped: ${log}`);
		const ok = await fetch(`${url}/healthz`).then((r) => r.ok).catch(() => false);
		if (ok) break;
		if (Date.now() > until) throw new Error(`second app did not start: ${log}`);
		await new Promise((r) => setTimeout(r, 100));
	}
	const stop = () =>
		new Promise<void>((resolve) => {
			started.delete(stop);
			if (child.exitCode !== null || child.signalCode !== null) return resolve();
			const kill = setTimeout(() => child.kill('SIGKILL'), 4000);
			child.once('exit', () => {
				clearTimeout(kill);
				resolve();
			});
			child.kill('SIGTERM');
		});
	started.add(stop);
	return { url, port, origin: env.ORIGIN ?? url, stop, log: () => log };
}
