// @ts-check
// `npm test`: the same bootstrapping as npm start, but with a fresh MariaDB of its own, its own
// build folder and free ports, so it runs beside a running npm start. Then svelte-check, vitest
// (unit and integration) and Playwright; the last line sums every runner: "N passed, N failed".
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureDebianPackages, ensurePackages, step, ROOT } from '../fakes/stack/bootstrap.js';
import { startStack } from '../fakes/stack/stack.js';

/** @type {Awaited<ReturnType<typeof startStack>> | null} */
let stack = null;
const tally = { passed: 0, failed: 0, skipped: 0 };
// `npm test -- unit e2e` runs only those parts; QL_TEST_FILES narrows vitest and Playwright to
// matching files (e.g. QL_TEST_FILES=ticket npm test -- integration).
const only = process.argv.slice(2);
const fileFilter = (process.env.QL_TEST_FILES ?? '').split(/[ ,]+/).filter(Boolean);
const wants = (/** @type {string} */ part) => only.length === 0 || only.includes(part);

async function main() {
	ensurePackages();
	ensureDebianPackages({ mariadbd: ['mariadb-server'], mariadb: ['mariadb-client'], chromium: ['chromium'], pdftoppm: ['poppler-utils'], ezdxf: ['python3-ezdxf'], librecad: ['librecad'], 'xvfb-run': ['xvfb', 'xauth'] });
	// svelte-check first: it needs no running system and fails fastest.
	if (wants('check')) {
		step('svelte-check');
		const r = spawnSync('npm', ['run', '--silent', 'check'], { cwd: ROOT, stdio: 'inherit' });
		count('svelte-check', r.status === 0 ? 1 : 0, r.status === 0 ? 0 : 1);
	}
	if (!['unit', 'integration', 'e2e'].some(wants)) return;
	// Unit tests need no running system; the others get a whole one of their own.
	// Mail retries fast in tests, so an outage test does not wait minutes.
	if (wants('integration') || wants('e2e')) stack = await startStack({ name: 'test', quiet: !process.env.QL_TEST_APP_LOG, appEnv: { OUTBOX_INTERVAL_MS: '500', OUTBOX_RETRY_SCALE: '0.02', JOBS_INTERVAL_MS: '300', CUTTER_LAY_SECONDS: '0.5' } });
	const work = stack?.work ?? mkdtempSync(join(tmpdir(), 'quarterline-unit-'));
	const testEnv = { ...stack?.testEnv, QL_TEST: '1' };

	const projects = ['unit', 'integration'].filter(wants);
	if (projects.length) {
		step(`vitest (${projects.join(' + ')})`);
		const out = join(work, 'vitest.json');
		spawnSync('npx', ['vitest', 'run', ...projects.flatMap((p) => ['--project', p]), ...fileFilter, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`], {
			cwd: ROOT,
			stdio: 'inherit',
			env: { ...process.env, ...testEnv }
		});
		const report = existsSync(out) ? JSON.parse(readFileSync(out, 'utf8')) : null;
		if (!report) count('vitest', 0, 1);
		else count('vitest', report.numPassedTests, report.numFailedTests + (report.success || report.numFailedTests ? 0 : 1), report.numPendingTests + report.numTodoTests);
	}

	if (wants('e2e')) {
		step('Playwright in Chromium');
		const out = join(work, 'playwright.json');
		spawnSync('npx', ['playwright', 'test', '-c', 'tests/playwright.config.ts', ...fileFilter], {
			cwd: ROOT,
			stdio: 'inherit',
			env: { ...process.env, ...testEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: out }
		});
		const report = existsSync(out) ? JSON.parse(readFileSync(out, 'utf8')) : null;
		if (!report) count('playwright', 0, 1);
		else count('playwright', report.stats.expected + report.stats.flaky, report.stats.unexpected + (report.errors?.length ?? 0), report.stats.skipped);
	}
}

/** @param {string} runner @param {number} passed @param {number} failed @param {number} [skipped] */
function count(runner, passed, failed, skipped = 0) {
	tally.passed += passed;
	tally.failed += failed;
	tally.skipped += skipped;
	console.log(`  ${runner}: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
}

async function cleanup() {
	if (stack) await stack.stop({ keep: Boolean(process.env.QL_KEEP_TEST_DATA) });
}

let exitCode = 0;
try {
	await main();
} catch (err) {
	console.error(`\nnpm test could not run: ${err instanceof Error ? err.message : err}`);
	tally.failed += 1;
} finally {
	await cleanup();
	exitCode = tally.failed > 0 ? 1 : 0;
	console.log(`${tally.passed} passed, ${tally.failed} failed${tally.skipped ? `, ${tally.skipped} skipped` : ''}`);
	process.exit(exitCode);
}
