// In-process timing of the open DXF of one order for `npm run bench` (run through tsx by run.js, which
// parses the one JSON line this prints): the work GET /workroom/orders/[id]/pattern.dxf does after its
// two database reads, i.e. draftSkirt for the order line + piecesToDxf. The floor is draftSkirt alone,
// timed inside the same call. Three demo skirts: a straight skirt with lining (the most pieces of a
// plain style), six gores with lining and pockets (the most pieces), a full circle (the longest curves).
import { draftSkirt } from '../../src/lib/drafting';
import { piecesToDxf } from '../../src/lib/drafting/drawing/dxf';
import { summarise } from './stats.js';

const RUNS = Number(process.env.QL_BENCH_DXF_RUNS ?? 300);
const ORDERS = [
	{ number: 'QL-1001', m: { waist: 72, hip: 98, length: 60, waistToHip: 20.5 }, choice: { style: 'straight' as const, lining: true } },
	{ number: 'QL-1005', m: { waist: 72, hip: 98, length: 70, waistToHip: 20.5 }, choice: { style: 'gored' as const, lining: true, pockets: true } },
	{ number: 'QL-1007', m: { waist: 64, hip: 88, length: 55, waistToHip: 18 }, choice: { style: 'full-circle' as const } }
];

let sink = 0;
const out: Record<string, unknown> = {};
for (const o of ORDERS) {
	const total: number[] = [];
	const floor: number[] = [];
	let bytes = 0;
	let pieces = 0;
	for (let i = 0; i < RUNS + 30; i++) {
		const t0 = performance.now();
		const d = draftSkirt(o.m, o.choice);
		const t1 = performance.now();
		const text = piecesToDxf({ orderNumber: o.number, styleName: o.choice.style, pieces: d.pieces.map((piece) => ({ piece })) });
		const t2 = performance.now();
		sink += text.length;
		if (i < 30) continue; // warm-up
		total.push(t2 - t0);
		floor.push(t1 - t0);
		bytes = text.length;
		pieces = d.pieces.length;
	}
	out[o.number] = { style: o.choice.style, pieces, bytes, total: summarise(total), floor: summarise(floor) };
}
console.log(JSON.stringify({ runs: RUNS, orders: out, sink: sink > 0 }));
