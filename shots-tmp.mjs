// Temporary (not committed): start a fresh system, render DXFs through LibreCAD, screenshot the job page.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
const ex = promisify(execFile);
const execFileSync = async (c, a, o = {}) => (await ex(c, a, { encoding: 'utf8', ...o })).stdout;
import { writeFileSync } from 'node:fs';
import { chromium } from 'playwright';
import mysql from 'mysql2/promise';
import { startStack } from './fakes/stack/stack.js';
import { DEMO_SIGN_INS } from './src/lib/server/seed/demo-accounts.js';
import { signInCookie } from './tests/bench/ticket.js';
import { measureDxfRoute, measureBatch } from './tests/bench/outputs.js';

const OUT = '/work/notes/i11';
const s = await startStack({ name: 'shots', appEnv: { JOBS_INTERVAL_MS: '300' } });
try {
	const app = s.testEnv.APP_URL;
	const db = await mysql.createConnection({ uri: s.testEnv.DATABASE_URL });
	const [rows] = await db.query('SELECT DISTINCT o.id, o.number FROM `order` o JOIN order_line l ON l.order_id = o.id ORDER BY o.id');
	const idOf = Object.fromEntries(rows.map((r) => [r.number, r.id]));
	const cutter = DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter').email;
	const cookie = await signInCookie(app, cutter);
	for (const [n, label] of [['QL-1001', 'straight'], ['QL-1005', 'gored'], ['QL-1007', 'full-circle']]) {
		const res = await fetch(`${app}/workroom/orders/${idOf[n]}/pattern.dxf`, { headers: { cookie } });
		const file = `/tmp/dxfp/${n}.dxf`;
		writeFileSync(file, Buffer.from(await res.arrayBuffer()));
		await execFileSync('xvfb-run', ['-a', 'librecad', 'dxf2pdf', '-o', `/tmp/dxfp/${n}.pdf`, file], { cwd: '/tmp/dxfp' });
		await execFileSync('pdftoppm', ['-r', '60', '-png', '-singlefile', `/tmp/dxfp/${n}.pdf`, `${OUT}/dxf-${label}-librecad`]);
		console.log(n, res.status, (await execFileSync('pdfinfo', [`/tmp/dxfp/${n}.pdf`])).match(/Page size:.*/)?.[0]);
	}
	const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'] });
	const [name, value] = cookie.split(/=(.*)/s);
	for (const [label, viewport] of [['desktop', { width: 1280, height: 900 }], ['390', { width: 390, height: 844 }]]) {
		const ctx = await browser.newContext({ viewport, deviceScaleFactor: label === '390' ? 2 : 1 });
		await ctx.addCookies([{ name, value, url: app }]);
		const page = await ctx.newPage();
		await page.goto(`${app}/workroom`);
		for (const box of await page.locator('[data-testid=queue-row] input[type=checkbox]').all()) await box.check();
		await page.screenshot({ path: `${OUT}/job-queue-${label}.png`, fullPage: true });
		await page.getByRole('button', { name: 'Prepare files for the selected orders' }).click();
		await page.waitForURL(/\/workroom\/jobs\/\d+$/);
		await page.screenshot({ path: `${OUT}/job-progress-${label}.png`, fullPage: true });
		await page.getByTestId('job-download').waitFor({ timeout: 120_000 });
		await page.screenshot({ path: `${OUT}/job-done-${label}.png`, fullPage: true });
		// A lay's orders and one order that fails (a retired style is simulated by a missing draft).
		await page.goto(`${app}/workroom/lays`);
		await page.screenshot({ path: `${OUT}/job-lays-${label}.png`, fullPage: true });
		await ctx.close();
	}
	// A job with a failing order: an order without skirts.
	await db.query("INSERT INTO `order` (number,email,shopper_name,status,subtotal,shipping,total,promised_date,shipping_address,house_rules_id) SELECT 'QL-9999','x@example.com','Test Empty','cancelled',0,0,0,promised_date,shipping_address,house_rules_id FROM `order` WHERE number='QL-1008'");
	const [[empty]] = await db.query("SELECT id FROM `order` WHERE number='QL-9999'");
	{
		const ctx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
		await ctx.addCookies([{ name, value, url: app }]);
		const page = await ctx.newPage();
		const body = new URLSearchParams([['ids', String(idOf['QL-1008'])], ['ids', String(empty.id)], ['kinds', 'dxf']]);
		const res = await fetch(`${app}/workroom/jobs?/prepare`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', origin: app, cookie, accept: 'text/html' }, body });
		await page.goto(`${app}${res.headers.get('location')}`);
		await page.getByTestId('job-download').waitFor({ timeout: 60_000 });
		await page.screenshot({ path: `${OUT}/job-failure-desktop.png`, fullPage: true });
		await page.goto(`${app}/workroom/jobs`);
		await page.screenshot({ path: `${OUT}/job-list-desktop.png`, fullPage: true });
		await ctx.close();
	}
	await browser.close();
	console.log('route', JSON.stringify(await measureDxfRoute({ appUrl: app, orderId: idOf['QL-1007'] })));
	console.log('batch', JSON.stringify(await measureBatch({ appUrl: app, appPid: s.children.at(-1).pid, orderIds: rows.map((r) => r.id) })));
	await db.end();
} finally {
	await s.stop();
}
