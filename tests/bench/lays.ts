// npm run bench prints this too (or: npx tsx tests/bench/lays.ts): the three skirts of the lay targets,
// the quote's lay against the cutter's longer search (before: the row lays' 330, 410 and 400 cm); the
// quote's lay time over every seeded order in every style, uncached (what a new figure costs) and from the
// cache (the same figure again); a combined lay of six orders; and a combined lay of the seeded queue's paid
// orders that share a cloth (utilisation and metres saved).
import { combinedLay, cutterLay, draftSkirt, estimateFabric, type Draft, type FabricOptions, type StyleId } from '../../src/lib/drafting';
import { clearLayCache } from '../../src/lib/drafting/fabric';
import { summarise } from './stats.js';
import { DEMO_FABRICS, DEMO_STYLES } from '../../src/lib/server/seed/catalogue';
import { DEMO_ORDERS } from '../../src/lib/server/seed/orders';

const CUTTER_SECONDS = Number(process.env.QL_BENCH_CUTTER_SECONDS ?? 3);

const skirts = [
	{ name: 'full circle W100 H128 L60 on 150', m: { waist: 100, hip: 128, length: 60 }, style: 'full-circle' as const, width: 150, before: 330, target: 290 },
	{ name: 'half circle W68 L90 on 150', m: { waist: 68, hip: 94, length: 90 }, style: 'half-circle' as const, width: 150, before: 410, target: 330 },
	{ name: 'straight W140 H160 L75 on 90', m: { waist: 140, hip: 160, length: 75 }, style: 'straight' as const, width: 90, before: 400, target: 300 }
];
const rows = skirts.map((s) => {
	const d = draftSkirt(s.m, { style: s.style }, {});
	const cloth = { width: s.width, nap: false, shrinkage: 0 };
	const quote = estimateFabric(d, cloth).length;
	const t0 = performance.now();
	const cut = cutterLay(d, cloth, { seconds: CUTTER_SECONDS });
	return { skirt: s.name, beforeCm: s.before, quoteCm: quote, cutterCm: cut.length, targetCm: s.target, cutterSeconds: +((performance.now() - t0) / 1000).toFixed(1) };
});

// The seeded queue: paid orders grouped by cloth; every cloth with two or more is laid together.
const byCloth = new Map<string, typeof DEMO_ORDERS>();
for (const o of DEMO_ORDERS.filter((o) => o.stage === 'paid')) byCloth.set(o.fabric, [...(byCloth.get(o.fabric) ?? []), o]);
const combined = [...byCloth].filter(([, os]) => os.length > 1).map(([slug, os]) => {
	const f = DEMO_FABRICS.find((x) => x.slug === slug)!;
	const cloth = { width: f.widthCm, nap: f.nap, shrinkage: f.shrinkagePct, ...('shrinkageAcrossPct' in f ? { shrinkageAcross: f.shrinkageAcrossPct as number } : {}) };
	const orders = os.map((o) => {
		const kind = DEMO_STYLES.find((s) => s.slug === o.style)!.kind as StyleId;
		const { waistToHip, ...girths } = o.measurements;
		return { id: o.number, draft: draftSkirt(waistToHip === null ? girths : { ...girths, waistToHip }, { style: kind, ...o.options, stretch: f.stretch }, {}) };
	});
	const t0 = performance.now();
	const lay = combinedLay(orders, cloth);
	return {
		cloth: slug,
		orders: os.map((o) => o.number),
		aloneCm: lay.alone.map((a) => a.length),
		combinedCm: lay.length,
		savedCm: lay.saved,
		utilisation: +(lay.utilisation * 100).toFixed(1),
		seconds: +((performance.now() - t0) / 1000).toFixed(1)
	};
});
// The quote's lay: every seeded order's figure in every style, on the order's own cloth. Uncached: the
// cache cleared before each (a new figure); cached: the same estimate asked again.
const ROUNDS = Number(process.env.QL_BENCH_QUOTE_ROUNDS ?? 5);
const jobs: { draft: Draft; cloth: FabricOptions }[] = [];
for (const o of DEMO_ORDERS)
	for (const st of DEMO_STYLES) {
		const f = DEMO_FABRICS.find((x) => x.slug === o.fabric)!;
		const { waistToHip, ...girths } = o.measurements;
		jobs.push({
			draft: draftSkirt(waistToHip === null ? girths : { ...girths, waistToHip }, { style: st.kind as StyleId, ...o.options, stretch: f.stretch }, {}),
			cloth: { width: f.widthCm, nap: f.nap, shrinkage: f.shrinkagePct, ...('shrinkageAcrossPct' in f ? { shrinkageAcross: f.shrinkageAcrossPct as number } : {}) }
		});
	}
const uncached: number[] = [];
const cached: number[] = [];
for (const j of jobs) estimateFabric(j.draft, j.cloth); // warm-up
for (let r = 0; r < ROUNDS; r++)
	for (const j of jobs) {
		clearLayCache();
		let t0 = performance.now();
		estimateFabric(j.draft, j.cloth);
		uncached.push(performance.now() - t0);
		t0 = performance.now();
		estimateFabric(j.draft, j.cloth);
		cached.push(performance.now() - t0);
	}
const ms = (x: ReturnType<typeof summarise>) => ({ n: x.n, median: +x.median.toFixed(2), p95: +x.p95.toFixed(2), max: +x.max.toFixed(2) });
const quoteLay = { orders: DEMO_ORDERS.length, styles: DEMO_STYLES.length, rounds: ROUNDS, uncachedMs: ms(summarise(uncached)), cachedMs: ms(summarise(cached)) };

// Six orders laid together: the first six seeded figures in their own styles, all on one cloth.
const six = (() => {
	const f = DEMO_FABRICS.find((x) => x.slug === 'harbour-wool-twill')!;
	const cloth = { width: f.widthCm, nap: f.nap, shrinkage: f.shrinkagePct };
	const orders = DEMO_ORDERS.slice(0, 6).map((o) => {
		const kind = DEMO_STYLES.find((s) => s.slug === o.style)!.kind as StyleId;
		const { waistToHip, ...girths } = o.measurements;
		return { id: o.number, draft: draftSkirt(waistToHip === null ? girths : { ...girths, waistToHip }, { style: kind, ...o.options, stretch: f.stretch }, {}) };
	});
	const t0 = performance.now();
	const lay = combinedLay(orders, cloth);
	return {
		cloth: f.slug,
		orders: orders.map((o) => o.id),
		seconds: +((performance.now() - t0) / 1000).toFixed(1),
		combinedCm: lay.length,
		aloneCm: lay.alone.reduce((a, o) => a + o.length, 0),
		savedCm: lay.saved,
		utilisation: +(lay.utilisation * 100).toFixed(1)
	};
})();
console.log(JSON.stringify({ skirts: rows, combined, quoteLay, six }));
