// npm run nest -- FILE.json --seconds N [--out lay.svg|lay.json] [--seed S]
// Nests a strip-packing instance (the shared JSON form) within N seconds on one core and prints, as its
// last line, `density: 0.XXXX length: L` (density = item area ÷ (strip height × length)).
// --cpu reads the N seconds from this process's CPU time instead of the wall clock: on a machine shared with
// other work the wall clock lets the others' load eat the budget; CPU time gives the figure at equal work.
import { readFileSync, writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import { bandFor, nest, NestInputError } from '../../src/lib/drafting/nest/engine';
import {
	InstanceError,
	itemArea,
	laySvg,
	placementsJson,
	problemOf,
	readInstance
} from '../../src/lib/drafting/nest/instance';

function fail(message: string): never {
	console.error(message);
	process.exit(2);
}

const args = process.argv.slice(2);
let file: string | undefined;
let seconds = 10;
let out: string | undefined;
let seed = 1;
let cpu = false;
for (let i = 0; i < args.length; i++) {
	const a = args[i];
	if (a === '--seconds') seconds = Number(args[++i]);
	else if (a === '--out') out = args[++i];
	else if (a === '--seed') seed = Number(args[++i]);
	else if (a === '--cpu') cpu = true;
	else if (a.startsWith('--'))
		fail(`Unknown option ${a}. Usage: npm run nest -- FILE.json --seconds N [--out lay.svg|lay.json] [--seed S] [--cpu]`);
	else file = a;
}
if (!file) fail('Usage: npm run nest -- FILE.json --seconds N [--out lay.svg|lay.json] [--seed S] [--cpu]');
if (!(seconds > 0) || !Number.isFinite(seconds)) fail('--seconds must be a positive number.');
if (!Number.isInteger(seed)) fail('--seed must be a whole number.');
if (out && !/\.(svg|json)$/i.test(out)) fail('--out must name a .svg or a .json file.');

let text: string;
try {
	text = readFileSync(file, 'utf8');
} catch (e) {
	fail(`Cannot read ${file}: ${(e as Error).message}`);
}
let parsed: unknown;
try {
	parsed = JSON.parse(text);
} catch (e) {
	fail(`${file} is not valid JSON: ${(e as Error).message}`);
}
try {
	const inst = readInstance(parsed);
	if (inst.items.some((it) => it.rotations.length === 4 && it.rotations.every((r, k) => r === k * 90)))
		console.log('Note: items without allowed_orientations are tried at every quarter turn only.');
	// Three quarters of the time with bands of 1/250 of the height (many lays tried), the rest from the best
	// order found with bands of 1/1000 (finer places across, thinner slivers beside slanted edges).
	const problem = problemOf(inst, bandFor(inst.height, 1000));
	const cpuMs = () => {
		const u = process.cpuUsage();
		return (u.user + u.system) / 1000;
	};
	const started = performance.now();
	const cpuStarted = cpuMs();
	// A little under the limit: reading the answer back out takes time too. The order search gets a fifth
	// of the time, compaction the rest (see compact.ts for why).
	const result = nest(problem, {
		seconds: seconds * 0.97,
		seed,
		coarseBand: bandFor(inst.height, 250),
		coarseShare: 0.75,
		compaction: 0.8,
		clock: cpu ? cpuMs : undefined
	});
	const took = (performance.now() - started) / 1000;
	const tookCpu = (cpuMs() - cpuStarted) / 1000;
	const density = itemArea(inst) / (inst.height * result.length);
	console.log(
		`${basename(file)}: ${problem.items.length} pieces, strip height ${inst.height}, ${result.evaluations} lays tried and ${result.moves} compaction moves in ${took.toFixed(1)} s (${tookCpu.toFixed(1)} s of CPU)`
	);
	if (out) {
		if (/\.json$/i.test(out)) writeFileSync(out, JSON.stringify(placementsJson(inst, result)) + '\n');
		else
			writeFileSync(
				out,
				laySvg(result, `${inst.name}: density ${density.toFixed(4)}, length ${+result.length.toFixed(4)}`)
			);
		console.log(`Lay written to ${out}`);
	}
	console.log(`density: ${density.toFixed(4)} length: ${+result.length.toFixed(4)}`);
} catch (e) {
	if (e instanceof InstanceError || e instanceof NestInputError) fail(`${file}: ${e.message}`);
	throw e;
}
