// In-process timing of the drafting engine for `npm run bench` (run through tsx by run.js, which
// parses the one JSON line this prints). Each call is timed in its parts on the same draft:
//   floor = draftSkirt alone (drawing and layout turned off);
//   noSvg = draftSkirt + estimateFabric (the "one full draft + fabric estimate");
//   full  = draftSkirt + estimateFabric + the pieces drawing, which is what POST /api/quote computes.
// Timing the parts of one call, rather than three separate calls, halves the work on a shared machine
// and puts the floor under exactly the same warm-up, GC and CPU conditions as the full call.
// The reference figure is the engine author's (src/lib/drafting/bench.ts); then 10 000 random valid
// figures across every style and option, from a seeded PRNG so two runs do the same work.
import {
	DraftInputError,
	STYLES,
	draftSkirt,
	estimateFabric,
	toSvg,
	validateMeasurements,
	type FabricOptions,
	type Measurements,
	type SkirtChoiceInput
} from '../../src/lib/drafting';
import { benchDraft } from '../../src/lib/drafting/bench';
import { clearLayCache } from '../../src/lib/drafting/fabric';
import { seeded } from '../../src/lib/drafting/nest/random';
import { DEMO_FABRICS } from '../../src/lib/server/seed/catalogue';
import { summarise } from './stats.js';

const SINGLE_RUNS = Number(process.env.QL_BENCH_DRAFT_RUNS ?? 2000);
// Each figure now nests its lay (about 15 ms), so 2 000 keep this part near half a minute.
const RANDOM_FIGURES = Number(process.env.QL_BENCH_RANDOM_FIGURES ?? 2_000);
const SEED = 0x5eed_2024;


type Job = { m: Measurements; choice: SkirtChoiceInput; fabric: FabricOptions };
type Parts = { draft: number; estimate: number; svg: number; refused: boolean };

let sink = 0;
/** One quote's engine work, timed in its three parts (µs). A fabric narrower than a piece is a refusal
 * the shop shows (DraftInputError): counted, with the time it took; anything else is a bug and throws. */
function timed(j: Job, cold = true): Parts {
	// The quote keeps recent lays: a cold lay (cleared first) is what a new figure costs.
	if (cold) clearLayCache();
	const t0 = performance.now();
	const d = draftSkirt(j.m, j.choice);
	const t1 = performance.now();
	let refused = false;
	try {
		sink += estimateFabric(d, j.fabric).length;
	} catch (e) {
		if (!(e instanceof DraftInputError)) throw e;
		refused = true;
	}
	const t2 = performance.now();
	sink += toSvg(d, { view: 'pieces', units: 'cm' }).length;
	const t3 = performance.now();
	return { draft: (t1 - t0) * 1000, estimate: (t2 - t1) * 1000, svg: (t3 - t2) * 1000, refused };
}

function collect(parts: Parts[]) {
	return {
		full: summarise(parts.map((p) => p.draft + p.estimate + p.svg)),
		noSvg: summarise(parts.map((p) => p.draft + p.estimate)),
		floor: summarise(parts.map((p) => p.draft)),
		refused: parts.filter((p) => p.refused).length
	};
}

// The reference figure and fabric of src/lib/drafting/bench.ts, so both benches time the same skirt.
const reference: Job = {
	m: { waist: 68, hip: 94, length: 58.5, waistToHip: 20.6 },
	choice: {},
	fabric: { width: 150, nap: false, shrinkage: 3 }
};

function single() {
	for (let i = 0; i < 300; i++) timed(reference);
	const parts: Parts[] = [];
	for (let i = 0; i < SINGLE_RUNS; i++) parts.push(timed(reference));
	return collect(parts);
}

/** A random figure the engine accepts: drawn inside MEASUREMENT_LIMITS and kept only if it validates. */
function randomJobs(n: number): { jobs: Job[]; rejected: number } {
	const rnd = seeded(SEED);
	const between = (lo: number, hi: number) => Math.round((lo + rnd() * (hi - lo)) * 10) / 10;
	const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)];
	const jobs: Job[] = [];
	let rejected = 0;
	for (let guard = 0; jobs.length < n && guard < n * 20; guard++) {
		const waist = between(50, 200);
		const knownDepth = rnd() < 0.8;
		const depth = knownDepth ? between(10, 35) : 22;
		const hip = between(Math.max(70, waist - 10), Math.min(200, waist + 4.8 * depth));
		const length = between(Math.ceil(depth + 5), 130);
		// Confirmed: figures past what a block usually fits are drafted once the shopper confirms them.
		const m: Measurements = { waist, hip, length, confirmed: true, ...(knownDepth ? { waistToHip: depth } : {}) };
		if (validateMeasurements(m).length) {
			rejected++;
			continue;
		}
		const f = pick(DEMO_FABRICS);
		const choice: SkirtChoiceInput = {
			style: STYLES[jobs.length % STYLES.length].id,
			waistband: pick(['band', 'facing'] as const),
			closure: { kind: pick(['zip', 'invisible-zip'] as const), position: pick(['centre-back', 'side'] as const) },
			lining: rnd() < 0.3,
			pockets: rnd() < 0.3,
			vent: pick(['auto', 'vent', 'kick-pleat', 'none'] as const),
			stretch: f.stretch
		};
		jobs.push({ m, choice, fabric: { width: f.widthCm, nap: f.nap, shrinkage: f.shrinkagePct } });
	}
	return { jobs, rejected };
}

const s = single();
// The same figure again (a page reloaded, the order placed after its quote): the lay comes from the cache.
const warm = (() => {
	timed(reference);
	const parts: Parts[] = [];
	for (let i = 0; i < SINGLE_RUNS; i++) parts.push(timed(reference, false));
	return collect(parts);
})();
const { jobs, rejected } = randomJobs(RANDOM_FIGURES);
// Warm the random path briefly (every style, every fabric) before the timed sweep.
for (const j of jobs.slice(0, 300)) timed(j);
const t0 = performance.now();
const randomParts = jobs.map((j) => timed(j));
const wallSeconds = (performance.now() - t0) / 1000;
const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / 1e6;
// The engine author's own bench, for reference beside ours (same reference figure, draft + estimate).
const engine = benchDraft(400);

console.log(
	JSON.stringify({
		single: { runs: SINGLE_RUNS, ...s },
		singleCached: { runs: SINGLE_RUNS, ...warm },
		random: {
			figures: jobs.length,
			seed: SEED,
			generatedRejected: rejected,
			styles: STYLES.map((x) => x.id),
			wallSeconds,
			totalSeconds: {
				full: sum(randomParts.map((p) => p.draft + p.estimate + p.svg)),
				noSvg: sum(randomParts.map((p) => p.draft + p.estimate)),
				floor: sum(randomParts.map((p) => p.draft))
			},
			...collect(randomParts)
		},
		engineBench: engine,
		node: process.version,
		sink
	})
);
