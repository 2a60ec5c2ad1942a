// npm run bench prints this (or: npx tsx tests/bench/instances.ts): the shared strip-packing instances,
// each nested by `npm run nest` itself (a child process, so the figure is the command's) for 60 s, its lay
// checked independently (the JSON placements turned and moved as the format says, then Clipper's
// intersection at 0.1 mm, every piece inside the strip, every copy placed), beside the best density
// published for it (read from the instances' README). The machine is shared: when the run got less than
// nine tenths of a core (another process took the rest), the same instance is nested again with its limit
// read from CPU time (`--cpu`), the figure at equal work.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import { join, resolve } from 'node:path';
import { layFaults } from '../../src/lib/drafting/nest/check-lay';
import { itemArea, readInstance, rotated } from '../../src/lib/drafting/nest/instance';

const SECONDS = Number(process.env.QL_BENCH_NEST_SECONDS ?? 60);
const DIR = resolve(process.env.QL_NESTING_DIR ?? '../shared/nesting');

/** Best densities published, from the README's table (`| file.json | … | 89.82 % |`). */
function published(): Map<string, number> {
	const out = new Map<string, number>();
	const readme = join(DIR, 'README.md');
	if (!existsSync(readme)) return out;
	for (const line of readFileSync(readme, 'utf8').split('\n')) {
		const m = /^\|\s*([\w.-]+\.json)\s*\|.*\|\s*([\d.]+)\s*%\s*\|\s*$/.exec(line);
		if (m) out.set(m[1], Number(m[2]) / 100);
	}
	return out;
}

function nestOnce(file: string, out: string, cpu: boolean) {
	const loadBefore = os.loadavg()[0];
	const args = ['node_modules/tsx/dist/cli.mjs', 'tests/bench/nest.ts', file, '--seconds', String(SECONDS), '--out', out];
	if (cpu) args.push('--cpu');
	const t0 = performance.now();
	const r = spawnSync(process.execPath, args, { encoding: 'utf8', timeout: SECONDS * 10_000 });
	const wall = (performance.now() - t0) / 1000;
	if (r.status !== 0) throw new Error(`npm run nest ${file} exited ${r.status}: ${(r.stderr ?? '').slice(-500)}`);
	const lines = r.stdout.trim().split('\n');
	const last = /density: ([\d.]+) length: ([\d.]+)/.exec(lines.at(-1) ?? '');
	const info = /(\d+) lays tried and (\d+) compaction moves in ([\d.]+) s \(([\d.]+) s of CPU\)/.exec(r.stdout);
	if (!last) throw new Error(`npm run nest ${file} printed no density line: ${r.stdout.slice(-300)}`);
	return {
		density: Number(last[1]),
		length: Number(last[2]),
		lays: info ? Number(info[1]) : null,
		moves: info ? Number(info[2]) : null,
		seconds: info ? Number(info[3]) : +wall.toFixed(1),
		cpuSeconds: info ? Number(info[4]) : null,
		load: [+loadBefore.toFixed(2), +os.loadavg()[0].toFixed(2)]
	};
}

/** The lay written by the command, checked with other code than the nester's. */
function check(file: string, out: string) {
	const inst = readInstance(JSON.parse(readFileSync(file, 'utf8')));
	const lay = JSON.parse(readFileSync(out, 'utf8')) as {
		length: number;
		placements: { item: number | string; rotation: number; x: number; y: number }[];
	};
	const polys = lay.placements.map((p) => {
		const it = inst.items.find((i) => i.id === p.item);
		if (!it) throw new Error(`unknown item ${p.item}`);
		if (!it.rotations.includes(p.rotation)) throw new Error(`item ${p.item} turned ${p.rotation}°, not allowed`);
		return rotated(it.outline, p.rotation).map((q) => ({ x: q.x + p.x, y: q.y + p.y }));
	});
	const counts = new Map<string, number>();
	for (const p of lay.placements) counts.set(String(p.item), (counts.get(String(p.item)) ?? 0) + 1);
	const countsRight = inst.items.every((it) => (counts.get(String(it.id)) ?? 0) === it.demand);
	const right = Math.max(...polys.flat().map((q) => q.x));
	// 0.1 mm with the instance's units read as cm; albano's units are far larger (a strip 4900 high), so
	// there the tolerance is one unit, still 1/4900 of the strip.
	const tol = inst.height > 1000 ? 1 : 0.01;
	const faults = layFaults(polys, inst.height, lay.length, tol, inst.height > 1000 ? 10 : 1e4);
	return {
		faults: faults.length,
		countsRight,
		densityChecked: +(itemArea(inst) / (inst.height * right)).toFixed(4)
	};
}

const best = published();
const files = existsSync(DIR) ? [...best.keys()].filter((f) => existsSync(join(DIR, f))) : [];
if (!files.length) throw new Error(`no instances found in ${DIR} (set QL_NESTING_DIR)`);
const tmp = mkdtempSync(join(os.tmpdir(), 'ql-nest-'));
const rows = [];
try {
	for (const f of files) {
		const file = join(DIR, f);
		const out = join(tmp, f);
		const wall = nestOnce(file, out, false);
		const wallCheck = check(file, out);
		const stolen = wall.cpuSeconds !== null && wall.cpuSeconds < 0.9 * wall.seconds;
		let cpu = null;
		if (stolen) {
			const c = nestOnce(file, out, true);
			cpu = { ...c, ...check(file, out) };
		}
		const pub = best.get(f)!;
		rows.push({
			instance: f,
			seconds: SECONDS,
			density: wall.density,
			published: pub,
			gapPp: +((pub - wall.density) * 100).toFixed(2),
			...wallCheck,
			run: wall,
			atEqualCpu: cpu && { density: cpu.density, gapPp: +((pub - cpu.density) * 100).toFixed(2), faults: cpu.faults, countsRight: cpu.countsRight, run: cpu }
		});
	}
} finally {
	rmSync(tmp, { recursive: true, force: true });
}
console.log(JSON.stringify({ instances: rows, cpus: os.cpus().length }));
