// Timing of the engine's main job, for `npm run bench`: one full draft plus its fabric estimate.
import { draftSkirt } from './draft';
import { estimateFabric } from './fabric';
import { validateMeasurements } from './measurements';
import { STYLES } from './options';

/** What the bench reports: median and fastest time of one straight-skirt draft + estimate (µs), and the
 * seconds taken by a fixed sweep of figures through every style. */
export interface BenchResult {
	medianMicros: number;
	floorMicros: number;
	randomTotalSeconds: number;
	runs: number;
}

const now = () => (typeof performance !== 'undefined' ? performance.now() : Date.now());

/** Runs the bench. Figures are a fixed sweep (no randomness), so two runs do the same work. */
export function benchDraft(runs = 400): BenchResult {
	const m = { waist: 68, hip: 94, length: 58.5, waistToHip: 20.6 };
	for (let i = 0; i < 50; i++) estimateFabric(draftSkirt(m), { width: 150, nap: false, shrinkage: 3 });
	const times: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t = now();
		estimateFabric(draftSkirt(m), { width: 150, nap: false, shrinkage: 3 });
		times.push((now() - t) * 1000);
	}
	times.sort((a, b) => a - b);
	const start = now();
	let k = 0;
	for (let waist = 55; waist <= 190; waist += 15) {
		for (let hip = 75; hip <= 195; hip += 20) {
			const m = { waist, hip, length: 70, waistToHip: 21, confirmed: true };
			if (validateMeasurements(m).length) continue;
			const style = STYLES[k++ % STYLES.length].id;
			const d = draftSkirt(m, { style });
			estimateFabric(d, { width: 140, nap: k % 2 === 0, shrinkage: 4 });
		}
	}
	return { medianMicros: times[Math.floor(times.length / 2)], floorMicros: times[0], randomTotalSeconds: (now() - start) / 1000, runs };
}
