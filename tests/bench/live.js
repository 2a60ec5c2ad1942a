// @ts-check
// The configure page in Debian's Chromium: how long drafting and drawing her skirt takes in the browser per
// change (the page records each run as the performance entry "ql:draft+drawing"), over 200 changes typed
// into the measurements; and what JavaScript the page sends before its first paint against the engine's
// chunk, loaded after it. Sizes are the .gz files adapter-node precompressed (as pages.js counts them).
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright';
import { summarise } from './stats.js';

const CHANGES = 200;

/** @param {string} clientDir @param {string} file */
function gzSize(clientDir, file) {
	const path = join(clientDir, file);
	if (!existsSync(path)) return 0;
	if (existsSync(`${path}.gz`)) return readFileSync(`${path}.gz`).length;
	return gzipSync(readFileSync(path), { level: 9 }).length;
}

/** @param {{ appUrl: string, buildDir: string, path?: string }} o */
export async function measureLive(o) {
	const path = o.path ?? '/styles/meadow-a-line/make';
	const browser = await chromium.launch({
		executablePath: '/usr/bin/chromium',
		args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run']
	});
	try {
		const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
		/** @type {{ url: string, at: number }[]} */
		const scripts = [];
		let loadedAt = Infinity;
		page.on('request', (r) => {
			if (r.resourceType() === 'script' || /\.js(\?|$)/.test(r.url())) scripts.push({ url: r.url(), at: Date.now() });
		});
		page.on('load', () => (loadedAt = Date.now()));
		await page.goto(`${o.appUrl}${path}`, { waitUntil: 'load' });
		const fcp = await page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null);
		// The engine is asked for after first paint: its chunk is what loads once the page has.
		await page.getByLabel('Waist', { exact: true }).fill('70');
		await page.getByTestId('garment-drawing').locator('svg').waitFor();
		const clientDir = join(o.buildDir, 'client');
		const file = (/** @type {string} */ url) => new URL(url).pathname.replace(/^\//, '');
		const first = scripts.filter((s) => s.at <= loadedAt).map((s) => file(s.url));
		const later = scripts.filter((s) => s.at > loadedAt).map((s) => file(s.url));
		const kb = (/** @type {string[]} */ files) => files.reduce((a, f) => a + gzSize(clientDir, f), 0) / 1024;

		// 200 changes: each a new waist typed in, as she would correct it; every one drafts and draws.
		await page.evaluate(() => performance.clearMeasures('ql:draft+drawing'));
		const waist = page.getByLabel('Waist', { exact: true });
		// Each change is drawn a frame after it is typed (and a newer one cancels an older still waiting): wait
		// for each drawing before the next change, so every one of the 200 is drafted and timed.
		for (let i = 0; i < CHANGES; i++) {
			await waist.fill(String(60 + (i % 40) + (i % 7) / 10));
			await page.waitForFunction((n) => performance.getEntriesByName('ql:draft+drawing').length >= n, i + 1, { timeout: 10_000 });
		}
		const times = await page.evaluate(() => performance.getEntriesByName('ql:draft+drawing').map((e) => e.duration));
		return {
			path,
			changes: times.length,
			drawMs: summarise(times),
			firstPaintMs: fcp,
			firstJsKB: kb(first),
			firstJsFiles: first.length,
			engineKB: kb(later),
			engineFiles: later
		};
	} finally {
		await browser.close();
	}
}
