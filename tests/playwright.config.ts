import { defineConfig } from '@playwright/test';

// The app, the fakes and the database are started by tests/run.js (npm test), which passes their
// addresses in the environment; Playwright only drives Debian's Chromium against them.
export default defineConfig({
	testDir: './e2e',
	outputDir: '../test-results',
	fullyParallel: false,
	workers: 1,
	retries: 0,
	timeout: 60_000,
	expect: { timeout: 10_000 },
	reporter: [['list'], ['json']],
	use: {
		baseURL: process.env.APP_URL ?? 'http://127.0.0.1:3000',
		trace: 'off',
		screenshot: 'only-on-failure',
		launchOptions: {
			executablePath: '/usr/bin/chromium',
			args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic']
		}
	}
});
