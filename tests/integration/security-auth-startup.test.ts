// Outside local use the app refuses to start on secrets anyone can read (the examples this
// repository publishes), and says which setting to change.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { freePort, startAppInstance } from '../support/app';

const EXAMPLE = Object.fromEntries(
	readFileSync(join(process.cwd(), '.env.example'), 'utf8')
		.split('\n')
		.map((l) => l.match(/^([A-Z0-9_]+)=(.*)$/))
		.filter((m) => m !== null)
		.map((m) => [m[1], m[2]])
);
const STRONG = {
	AUTH_SECRET: 'k3J9vQ2mX7pL0sR4tW8yZ1bN6cF5dH3gA9eU2iO7',
	STRIPE_WEBHOOK_SECRET: 'whsec_Q8r2Lm9Tz4Xc7Vb1Nn5Kp3Hs6Jd0Fg',
	DATABASE_URL: (() => {
		const u = new URL(process.env.DATABASE_URL!);
		u.password = 'Zr7-wq2Lx9-Pm4Tk8';
		return u.toString();
	})()
};

/** Starts the built app with these settings on top of the test stack's; resolves when it exits. */
async function startExpectingExit(env: Record<string, string | undefined>) {
	const port = await freePort();
	const child = spawn(process.execPath, [join(process.env.QL_BUILD_DIR!, 'index.js')], {
		env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', ORIGIN: `http://127.0.0.1:${port}`, ...env },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let log = '';
	child.stdout.on('data', (d) => (log += d));
	child.stderr.on('data', (d) => (log += d));
	const code = await new Promise<number | null>((resolve) => {
		const kill = setTimeout(() => child.kill('SIGKILL'), 15_000);
		child.once('exit', (c) => {
			clearTimeout(kill);
			resolve(c);
		});
	});
	return { code, log };
}

describe('refusing published secrets outside local use', () => {
	it('NODE_ENV=production with the test stack’s local webhook secret and database password: exits non-zero naming both', async () => {
		const { code, log } = await startExpectingExit({ NODE_ENV: 'production', AUTH_SECRET: STRONG.AUTH_SECRET });
		expect(code).not.toBe(0);
		expect(code).not.toBeNull();
		expect(log).toContain('STRIPE_WEBHOOK_SECRET');
		expect(log).toContain('DATABASE_URL');
		expect(log).not.toContain('AUTH_SECRET');
	});

	it('an AUTH_SECRET from .env.example, a short one, or none at all: refused, naming AUTH_SECRET', async () => {
		for (const secret of [EXAMPLE.AUTH_SECRET, 'short-secret', '']) {
			const { code, log } = await startExpectingExit({ ...STRONG, NODE_ENV: 'production', AUTH_SECRET: secret });
			expect(code, secret).not.toBe(0);
			expect(log, secret).toContain('AUTH_SECRET');
			expect(log, secret).not.toContain('STRIPE_WEBHOOK_SECRET');
		}
	});

	it('an ORIGIN that is not loopback counts as a real deployment even without NODE_ENV', async () => {
		const { code, log } = await startExpectingExit({
			NODE_ENV: '',
			ORIGIN: 'https://shop.ondine.example',
			STRIPE_WEBHOOK_SECRET: EXAMPLE.STRIPE_WEBHOOK_SECRET
		});
		expect(code).not.toBe(0);
		expect(log).toContain('STRIPE_WEBHOOK_SECRET');
	});

	it('starts in production when every secret is its own', async () => {
		const app = await startAppInstance({ ...STRONG, NODE_ENV: 'production' });
		expect((await fetch(`${app.url}/healthz`)).status).toBe(200);
		await app.stop();
	});
});
