// @ts-check
// Lighthouse (the npm package, 12.x: the last line that runs on Node 20) against Debian's Chromium with
// its default mobile profile (a phone-sized screen, simulated slow 4G and a 4× slower CPU) on the home,
// style and configure pages; and the delay of typing a measurement, measured in Chromium through the
// Event Timing API as interaction to next paint (INP). Published "good" bounds beside each figure:
// LCP ≤ 2.5 s, CLS ≤ 0.1, INP ≤ 200 ms (web.dev, Core Web Vitals); TBT ≤ 200 ms is Lighthouse's own
// green band for mobile. Everything is on this machine: the app on 127.0.0.1, no other host asked.
// Run alone (it starts a system of its own): node tests/bench/lighthouse.js
import { pathToFileURL } from 'node:url';

export const LIGHTHOUSE_PAGES = [
	['home', '/'],
	['style', '/styles/rue-straight'],
	['configure', '/styles/rue-straight/make']
];
const CHROMIUM = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const FLAGS = ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-dev-shm-usage'];

/** One Lighthouse run per page (after one unmeasured warm-up load each, so the server has its caches). */
export async function measureLighthouse(/** @type {{ appUrl: string }} */ { appUrl }) {
	const { default: lighthouse } = await import('lighthouse');
	const chromeLauncher = await import('chrome-launcher');
	const chrome = await chromeLauncher.launch({ chromePath: CHROMIUM, chromeFlags: FLAGS, logLevel: 'silent' });
	/** @type {Record<string, any>} */
	const out = { version: '', pages: {} };
	try {
		for (const [name, path] of LIGHTHOUSE_PAGES) {
			await fetch(`${appUrl}${path}`);
			const r = await lighthouse(`${appUrl}${path}`, { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility'] });
			if (!r) throw new Error(`no Lighthouse result for ${path}`);
			const { lhr } = r;
			out.version = lhr.lighthouseVersion;
			const a = lhr.audits;
			out.pages[name] = {
				path,
				formFactor: lhr.configSettings.formFactor,
				throttling: lhr.configSettings.throttlingMethod,
				lcpMs: a['largest-contentful-paint'].numericValue,
				tbtMs: a['total-blocking-time'].numericValue,
				cls: a['cumulative-layout-shift'].numericValue,
				fcpMs: a['first-contentful-paint'].numericValue,
				performance: Math.round((lhr.categories.performance.score ?? 0) * 100),
				accessibility: Math.round((lhr.categories.accessibility.score ?? 0) * 100),
				accessibilityFailed: Object.values(a)
					.filter((x) => lhr.categories.accessibility.auditRefs.some((ref) => ref.id === x.id) && x.score === 0)
					.map((x) => x.id),
				runtimeError: lhr.runtimeError?.message ?? null
			};
		}
	} finally {
		await chrome.kill();
	}
	return out;
}

/**
 * Typing the four measurements on the configure page, a key at a time as a shopper types, in Chromium
 * with the CPU slowed 4× (as Lighthouse's mobile profile). Each key is one interaction; its latency is
 * the longest Event Timing entry of that interaction (input delay + handlers + the next paint). INP is
 * the worst interaction, less one for every 50 (as the web-vitals library counts it).
 */
export async function measureTyping(/** @type {{ appUrl: string, cpuSlowdown?: number }} */ { appUrl, cpuSlowdown = 4 }) {
	const { chromium } = await import('playwright');
	const browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS.filter((f) => f !== '--headless=new') });
	try {
		const page = await browser.newPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
		await page.goto(`${appUrl}/styles/rue-straight/make`);
		await page.waitForLoadState('networkidle');
		const cdp = await page.context().newCDPSession(page);
		await cdp.send('Emulation.setCPUThrottlingRate', { rate: cpuSlowdown });
		await page.evaluate(() => {
			/** @type {any} */ (window).__latencies = new Map();
			new PerformanceObserver((list) => {
				for (const e of /** @type {any[]} */ (list.getEntries())) {
					if (!e.interactionId) continue;
					const m = /** @type {any} */ (window).__latencies;
					m.set(e.interactionId, Math.max(m.get(e.interactionId) ?? 0, e.duration));
				}
			}).observe(/** @type {any} */ ({ type: 'event', durationThreshold: 16, buffered: true }));
		});
		// Each measurement typed, a little wrong and corrected, then Next: a click, the keys, a click.
		const VALUES = [['Waist', '71.5'], ['Hip', '97'], ['Waist to hip', '21.5'], ['Skirt length', '62']];
		for (const [label, value] of VALUES) {
			const field = page.getByLabel(label, { exact: true });
			await field.click();
			await field.pressSequentially(`${value}9`, { delay: 120 });
			await field.press('Backspace', { delay: 120 });
			await field.pressSequentially('0', { delay: 120 });
			await field.press('Backspace', { delay: 120 });
			await page.getByRole('button', { name: 'Next' }).locator('visible=true').click();
			await page.waitForTimeout(300);
			// The optional waist-to-knee step sits before the length: she takes the house figure.
			if (label === 'Waist to hip') {
				await page.getByRole('button', { name: /^Skip: use/ }).click();
				await page.waitForTimeout(300);
			}
		}
		await page.waitForTimeout(1000);
		/** @type {number[]} */
		const latencies = await page.evaluate(() => [.../** @type {any} */ (window).__latencies.values()]);
		// Keys that took under the 16 ms threshold report no entry: they count as fast interactions.
		const keys = VALUES.reduce((n, [, v]) => n + v.length + 4, 0);
		const interactions = keys + 2 * VALUES.length + 1;
		const sorted = [...latencies].sort((a, b) => b - a);
		const inp = sorted[Math.min(sorted.length - 1, Math.floor(interactions / 50))] ?? 0;
		return { interactions, keys, slowOnes: latencies.length, inpMs: inp, worstMs: sorted[0] ?? 0, medianSlowMs: sorted.length ? sorted[Math.floor(sorted.length / 2)] : 0, cpuSlowdown };
	} finally {
		await browser.close();
	}
}

const isErr = (/** @type {any} */ r) => !r || typeof r !== 'object' || 'error' in r;

/** Rows for the bench table (the same shape as report.js makes). */
export function lighthouseRows(/** @type {any} */ lh, /** @type {any} */ typing) {
	const base = { p95: null, floor: null, floorWhat: '', ratio: null };
	/** @type {any[]} */
	const rows = [];
	if (isErr(lh)) rows.push({ ...base, id: 'lighthouse', measure: 'Lighthouse (mobile)', unit: '', median: `not measured: ${lh?.error ?? 'failed'}`, target: '—', met: null, notes: '' });
	else
		for (const [name, p] of Object.entries(lh.pages)) {
			const note = `Lighthouse ${lh.version}, ${p.formFactor}, ${p.throttling} throttling; ${p.path}`;
			rows.push({ ...base, id: `lighthouse.${name}.lcp`, measure: `Lighthouse ${name}: Largest Contentful Paint`, unit: 's', median: Math.round(p.lcpMs / 10) / 100, target: 'LCP ≤ 2.5 s (good)', met: p.lcpMs <= 2500, notes: `${note}; FCP ${Math.round(p.fcpMs)} ms; performance score ${p.performance}` });
			rows.push({ ...base, id: `lighthouse.${name}.tbt`, measure: `Lighthouse ${name}: Total Blocking Time`, unit: 'ms', median: Math.round(p.tbtMs), target: 'TBT ≤ 200 ms (Lighthouse green)', met: p.tbtMs <= 200, notes: note });
			rows.push({ ...base, id: `lighthouse.${name}.cls`, measure: `Lighthouse ${name}: Cumulative Layout Shift`, unit: '', median: Math.round(p.cls * 1000) / 1000, target: 'CLS ≤ 0.1 (good)', met: p.cls <= 0.1, notes: note });
			rows.push({ ...base, id: `lighthouse.${name}.a11y`, measure: `Lighthouse ${name}: accessibility score`, unit: '/100', median: p.accessibility, target: '100 (no failed audit)', met: p.accessibility === 100, notes: p.accessibilityFailed.length ? `failed: ${p.accessibilityFailed.join(', ')}` : 'no failed audit' });
		}
	if (isErr(typing)) rows.push({ ...base, id: 'inp.typing', measure: 'typing a measurement: INP', unit: 'ms', median: `not measured: ${typing?.error ?? 'failed'}`, target: 'INP ≤ 200 ms (good)', met: null, notes: '' });
	else
		rows.push({ ...base, id: 'inp.typing', measure: 'typing a measurement: INP (Event Timing)', unit: 'ms', median: Math.round(typing.inpMs), target: 'INP ≤ 200 ms (good)', met: typing.inpMs <= 200, notes: `${typing.interactions} interactions (${typing.keys} key presses, the rest clicks) at 390 × 844, CPU ${typing.cpuSlowdown}× slower; ${typing.slowOnes} over 16 ms, worst ${Math.round(typing.worstMs)} ms, median of those ${Math.round(typing.medianSlowMs)} ms` });
	return rows;
}

// Alone: a fresh system of its own, this section only, then the same table as npm run bench prints.
if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
	const { startStack } = await import('../../fakes/stack/stack.js');
	const { printTable } = await import('./report.js');
	const os = await import('node:os');
	const s = await startStack({ name: 'bench-lh' });
	let code = 0;
	try {
		const startedAt = new Date().toISOString();
		const before = os.loadavg();
		const lh = await measureLighthouse({ appUrl: s.testEnv.APP_URL }).catch((e) => ({ error: String(e?.message ?? e) }));
		const typing = await measureTyping({ appUrl: s.testEnv.APP_URL }).catch((e) => ({ error: String(e?.message ?? e) }));
		printTable(lighthouseRows(lh, typing), { startedAt, node: process.version, machine: { cpus: os.cpus().length, model: os.cpus()[0]?.model ?? '', loadavgBefore: before, loadavgAfter: os.loadavg() } });
		console.log(JSON.stringify({ lighthouse: lh, typing }));
		if (isErr(lh) || isErr(typing)) code = 1;
	} finally {
		await s.stop();
	}
	process.exit(code);
}
