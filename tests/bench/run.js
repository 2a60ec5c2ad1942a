// @ts-check
// `npm run bench`: a benchmark, not a test. It starts a system of its own (fresh MariaDB, the fakes,
// a fresh build of the app on free ports), runs each measure after a warm-up, prints one table and
// writes bench.json. Every figure sits beside a floor measured in the same run on the same machine,
// so the ratio says more than the raw number on a busy computer. It never fails on speed: the exit
// code is non-zero only when the bench itself could not run.
import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { ensureDebianPackages, ensurePackages, onShutdown, step, done, ROOT } from '../../fakes/stack/bootstrap.js';
import { printTable, rowsFrom } from './report.js';
import { printLays } from './lay-report.js';

/** @type {null | { stop: (o?: { keep?: boolean }) => Promise<void> }} */
let stack = null;
let stopped = false;
async function stopStack() {
	if (stack && !stopped) {
		stopped = true;
		step('Stopping the bench system');
		await stack.stop();
		done();
	}
}
onShutdown(stopStack);

/** Runs in-process measures in a child (TypeScript through tsx) and parses its JSON line. */
function draftBench(script = 'tests/bench/draft.ts', timeoutMs = 400_000) {
	return new Promise((resolve, reject) => {
		const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', script], {
			cwd: ROOT,
			stdio: ['ignore', 'pipe', 'pipe']
		});
		let out = '';
		let err = '';
		child.stdout.on('data', (c) => (out += c));
		child.stderr.on('data', (c) => (err += c));
		const timer = setTimeout(() => child.kill('SIGTERM'), timeoutMs);
		child.on('close', (code) => {
			clearTimeout(timer);
			const line = out.trim().split('\n').at(-1) ?? '';
			if (code !== 0) return reject(new Error(`${script} exited ${code}: ${err.slice(-2000)}`));
			try {
				resolve(JSON.parse(line));
			} catch {
				reject(new Error(`${script} printed no JSON: ${out.slice(-500)}`));
			}
		});
	});
}

// `npm run bench -- outputs dxf jobs` runs only those sections (any of SECTIONS); none named runs all.
// The in-process sections (draft, outputs, dxf, lays) need no running system, so alone they start none.
const SECTIONS = ['draft', 'outputs', 'dxf', 'lays', 'instances', 'pages', 'live', 'lighthouse', 'typing', 'quote', 'ticket', 'checkout', 'jobs'];
const IN_PROCESS = new Set(['draft', 'outputs', 'dxf', 'lays', 'instances']);
const named = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const unknown = named.filter((a) => !SECTIONS.includes(a));
if (unknown.length) {
	console.error(`npm run bench: no section ${unknown.join(', ')}; the sections are ${SECTIONS.join(', ')}.`);
	process.exit(2);
}
const chosen = new Set(named.length ? named : SECTIONS);
/** What a section not chosen reports: left out of the table. */
const NOT_CHOSEN = 'not chosen in this run';

/** @param {string} name @param {() => Promise<any>} fn @param {string} [section] */
async function measure(name, fn, section) {
	if (section && !chosen.has(section)) return { error: NOT_CHOSEN };
	step(name);
	try {
		const r = await fn();
		done();
		return r;
	} catch (e) {
		console.log(`  not measured: ${e instanceof Error ? e.message : e}`);
		return { error: e instanceof Error ? e.message : String(e) };
	}
}

async function main() {
	const startedAt = new Date();
	const loadBefore = os.loadavg();
	ensurePackages();
	ensureDebianPackages({ mariadbd: ['mariadb-server'], mariadb: ['mariadb-client'], chromium: ['chromium'] });
	// npm packages only after ensurePackages has put them in place.
	const { startStack } = await import('../../fakes/stack/stack.js');
	const { measureQuote } = await import('./http.js');
	const { measureTicket, TICKET_ROUTE } = await import('./ticket.js');
	const { measureCheckout } = await import('./checkout.js');
	const { measureDxfRoute, measureBatch } = await import('./jobs.js');
	const { measurePages, compareWithHtml } = await import('./pages.js');
	const { measureLive } = await import('./live.js');
	const mysql = (await import('mysql2/promise')).default;

	// The checkout figure is many orders from one client: lift the per-client order limit for this stack only.
	const needStack = [...chosen].some((c) => !IN_PROCESS.has(c));
	const s = needStack ? await startStack({ name: 'bench', appEnv: { ORDER_LIMIT_PER_CLIENT: '1000000' } }) : null;
	stack = s;
	const env = s?.testEnv ?? /** @type {any} */ ({});

	// The engine alone first, while the app sits idle.
	const draft = await measure('draft: in-process engine timings (tsx)', () => draftBench(), 'draft');
	const outputs = await measure('outputs: full-size pattern PDFs, in process (tsx)', () => draftBench('tests/bench/outputs.ts'), 'outputs');
	const dxf = await measure('DXF: one order drafted and written, in process (tsx)', () => draftBench('tests/bench/dxf.ts'), 'dxf');
	// The skirts' lays before (row lays) and after (quote, cutter), and the seeded queue laid together.
	const lays = await measure('lays: the three skirts and the seeded queue laid together (tsx)', () => draftBench('tests/bench/lays.ts'), 'lays');
	if (chosen.has('lays')) console.log(`  lays: ${JSON.stringify(lays)}`);
	// The shared nesting instances, each through `npm run nest` for 60 s (again by CPU time when the machine
	// took part of the core); up to six minutes.
	const instances = await measure(
		'instances: the shared nesting instances, 60 s each (npm run nest)',
		() => draftBench('tests/bench/instances.ts', 1_200_000),
		'instances'
	);

	const pages = await measure('pages: JavaScript and CSS per route from the build output', async () => {
		const p = await measurePages(env.QL_BUILD_DIR);
		// Cross-check on two public pages: the files their HTML names are exactly the ones counted.
		/** @type {Record<string, unknown>} */
		const htmlCheck = {};
		for (const [route, path] of [
			['/', '/'],
			['/styles/[slug=slug]/make', '/styles/rue-straight/make']
		]) {
			const r = p.routes[route];
			if (!r || 'missing' in r) continue;
			const res = await fetch(`${env.APP_URL}${path}`);
			htmlCheck[path] = res.ok
				? compareWithHtml(await res.text(), res.headers.get('link') ?? '', r.files)
				: { agree: false, status: res.status };
		}
		return { ...p, htmlCheck };
	}, 'pages');

	const live = await measure('configure page in Chromium: draft + drawing per change (200 changes), first JS, engine chunk', () =>
		measureLive({ appUrl: env.APP_URL, buildDir: env.QL_BUILD_DIR }), 'live'
	);
	// In the browser while the app is otherwise idle: Lighthouse's mobile profile, then typing delay.
	const { measureLighthouse, measureTyping, lighthouseRows } = await import('./lighthouse.js');
	const lighthouse = await measure('Lighthouse (mobile profile, Debian Chromium): home, style and configure pages', () => measureLighthouse({ appUrl: env.APP_URL }), 'lighthouse');
	const typing = await measure('typing delay: INP while typing the measurements (Event Timing, CPU 4× slower)', () => measureTyping({ appUrl: env.APP_URL }), 'typing');

	const quote = await measure('quote API: POST /api/quote vs GET /healthz, 32 connections, 10 s each', () =>
		measureQuote({ appUrl: env.APP_URL }), 'quote'
	);

	const ticket = await measure('ticket PDF: GET as the cutter vs a one-page pdfkit document', async () => {
		const db = await mysql.createConnection({ uri: env.DATABASE_URL });
		try {
			const [rows] = /** @type {any} */ (
				await db.query(
					"SELECT id, number FROM `order` WHERE status IN ('cutting', 'paid') ORDER BY status = 'cutting' DESC, id LIMIT 1"
				)
			);
			if (!rows.length) throw new Error('no paid or cutting order in the seed');
			const routeMissing = 'routeIds' in pages ? !pages.routeIds.includes(TICKET_ROUTE) : pages.error !== NOT_CHOSEN;
			return {
				number: rows[0].number,
				...(await measureTicket({ appUrl: env.APP_URL, orderId: rows[0].id, routeMissing }))
			};
		} finally {
			await db.end();
		}
	}, 'ticket');

	// The open DXF over HTTP and a 20-order batch, with the app otherwise idle: a paid order's cutter's lay
	// is searched in the background (some 3 s of work each), so the measures wait for that to be done
	// first, and come before the checkout's 500 orders (their lays keep the app busy for many minutes).
	const batch = await measure('outputs: GET pattern.dxf; a 20-order batch job (ticket, DXF, tiled A4, lay) and the app\'s peak memory', async () => {
		const db = await mysql.createConnection({ uri: env.DATABASE_URL });
		/** Waits (at most 3 min) until no paid or cutting line waits for its cutter's lay; the seconds waited. */
		const laysDone = async () => {
			const t = performance.now();
			for (;;) {
				const [[{ n }]] = /** @type {any} */ (
					await db.query("SELECT COUNT(*) AS n FROM order_line l JOIN `order` o ON o.id = l.order_id WHERE o.status IN ('paid', 'cutting') AND l.cutter_lay IS NULL")
				);
				if (Number(n) === 0 || performance.now() - t > 180_000) return Math.round((performance.now() - t) / 100) / 10;
				await new Promise((r) => setTimeout(r, 1000));
			}
		};
		try {
			const waited = [await laysDone()];
			const circle = /** @type {any} */ (await db.query("SELECT id FROM `order` WHERE number = 'QL-1007'"))[0][0];
			const route = { number: 'QL-1007', ...(await measureDxfRoute({ appUrl: env.APP_URL, orderId: circle.id })) };
			// The seed's dozen orders are too few: 20 more are placed and paid the way the checkout places
			// them (a few clients, not timed).
			const [[{ n }]] = /** @type {any} */ (await db.query('SELECT COUNT(DISTINCT order_id) AS n FROM order_line'));
			if (Number(n) < 20) {
				await measureCheckout({ appUrl: env.APP_URL, paymentsUrl: env.PAYMENTS_URL, databaseUrl: env.DATABASE_URL, runTag: `jobs${Date.now().toString(36)}`, orders: 20, clients: 4 });
				waited.push(await laysDone());
			}
			const [rows] = /** @type {any} */ (
				await db.query('SELECT DISTINCT o.id, o.number FROM `order` o JOIN order_line l ON l.order_id = o.id ORDER BY o.id LIMIT 20')
			);
			const app = s?.children.at(-1);
			if (!app?.pid) throw new Error('the app process is not known');
			return {
				route,
				batch: await measureBatch({ appUrl: env.APP_URL, appPid: app.pid, orderIds: rows.map((/** @type {any} */ r) => r.id) }),
				waitedForLaysSeconds: waited
			};
		} finally {
			await db.end();
		}
	}, 'jobs');

	const checkout = await measure('checkout: 500 orders by 50 clients, quote → order → pay → webhook', () =>
		measureCheckout({
			appUrl: env.APP_URL,
			paymentsUrl: env.PAYMENTS_URL,
			databaseUrl: env.DATABASE_URL,
			runTag: Date.now().toString(36)
		}), 'checkout'
	);

	const raw = { draft, dxf, outputs, batch, quote, ticket, checkout, pages, live, lighthouse, typing, lays, instances };
	const rows = [...rowsFrom(raw), ...lighthouseRows(lighthouse, typing)].filter((r) => !String(r.median).includes(NOT_CHOSEN));
	const report = {
		startedAt: startedAt.toISOString(),
		finishedAt: new Date().toISOString(),
		node: process.version,
		machine: {
			cpus: os.cpus().length,
			model: os.cpus()[0]?.model ?? '',
			loadavgBefore: loadBefore,
			loadavgAfter: os.loadavg()
		},
		rows,
		raw: {
			...raw,
			pages:
				'error' in pages
					? pages
					: {
							...pages,
							routes: Object.fromEntries(Object.entries(pages.routes).map(([k, v]) => [k, { ...v, files: undefined }])),
							floor: { ...pages.floor, files: undefined }
						}
		}
	};
	writeFileSync(join(ROOT, 'bench.json'), `${JSON.stringify(report, null, 2)}\n`);
	printTable(rows, report);
	if (chosen.has('lays') || chosen.has('instances')) printLays(instances, lays);
	console.log(`\nbench.json written (${rows.length} rows). A benchmark, not a test: figures are never asserted.`);
	return Object.values(raw).some((r) => r && typeof r === 'object' && 'error' in r && r.error !== NOT_CHOSEN) ? 1 : 0;
}

let code = 0;
try {
	code = await main();
} catch (err) {
	console.error(`\nnpm run bench could not run: ${err instanceof Error ? err.message : err}`);
	code = 1;
} finally {
	await stopStack();
}
process.exit(code);
