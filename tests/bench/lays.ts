// npm run bench prints this too (or: npx tsx tests/bench/lays.ts): the three skirts of the lay targets,
// the quote's lay against the cutter's longer search (before: the row lays' 330, 410 and 400 cm), and a
// combined lay of the seeded queue's paid orders that share a cloth (utilisation and metres saved).
import { combinedLay, cutterLay, draftSkirt, estimateFabric, type StyleId } from '../../src/lib/drafting';
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
console.log(JSON.stringify({ skirts: rows, combined }));
