// @ts-check
// Turns the raw measures into rows (each with median, p95, the floor measured in the same run, the
// ratio to it and the target beside it) and prints them as one aligned table.

/**
 * @typedef {{ id: string, measure: string, unit: string, median: number | string | null, p95: number | null,
 *   floor: number | null, floorWhat: string, ratio: number | null, target: string, met: boolean | null, notes: string }} Row
 */

const isErr = (/** @type {any} */ r) => !r || typeof r !== 'object' || 'error' in r;
const r1 = (/** @type {number} */ x) => Math.round(x * 10) / 10;
const r3 = (/** @type {number} */ x) => Math.round(x * 1000) / 1000;

/** @param {Partial<Row> & { id: string, measure: string }} r @returns {Row} */
const row = ({ id, measure, ...rest }) => ({
	id,
	measure,
	unit: '',
	median: null,
	p95: null,
	floor: null,
	floorWhat: '',
	ratio: null,
	target: '—',
	met: null,
	notes: '',
	...rest
});
const notMeasured = (
	/** @type {string} */ id,
	/** @type {string} */ measure,
	/** @type {string} */ why,
	target = '—'
) => row({ id, measure, median: `not measured: ${why}`, target });

/** @param {any} raw */
export function rowsFrom(raw) {
	/** @type {Row[]} */
	const rows = [];
	const { draft, dxf, outputs, batch, quote, ticket, checkout, pages, live } = raw;
	rows.push(...outputRows(outputs));

	if (isErr(draft)) rows.push(notMeasured('draft', 'draft: engine', draft?.error ?? 'failed', 'median < 1000 µs'));
	else {
		const s = draft.single;
		const fl = s.floor;
		const single = (/** @type {string} */ id, /** @type {string} */ what, /** @type {any} */ x) =>
			row({
				id,
				measure: what,
				unit: 'µs',
				median: Math.round(x.median),
				p95: Math.round(x.p95),
				floor: Math.round(fl.median),
				floorWhat: 'draftSkirt alone (median)',
				ratio: r3(x.median / fl.median),
				target: 'median < 1000 µs',
				met: x.median < 1000,
				notes: `${s.runs} runs; engine's bench.ts: ${Math.round(draft.engineBench.medianMicros)} µs`
			});
		rows.push(single('draft.estimate', 'draft: one draft + fabric estimate', s.noSvg));
		rows.push(single('draft.full', 'draft: + pieces drawing', s.full));
		const rnd = draft.random;
		rows.push(
			row({
				id: 'draft.random',
				measure: `draft: ${rnd.figures} random figures, all styles`,
				unit: 's total',
				median: r3(rnd.totalSeconds.full),
				p95: null,
				floor: r3(rnd.totalSeconds.floor),
				floorWhat: 'draftSkirt alone, same figures (total)',
				ratio: r3(rnd.totalSeconds.full / rnd.totalSeconds.floor),
				notes: `per figure median ${Math.round(rnd.full.median)} µs, p95 ${Math.round(rnd.full.p95)} µs; ${rnd.refused} refused as too wide for the fabric; seed ${rnd.seed}`
			})
		);
	}

	if (isErr(quote))
		rows.push(
			notMeasured('quote.latency', 'quote API: POST /api/quote', quote?.error ?? 'failed', 'p95 ≤ 1.5 × floor')
		);
	else {
		const f = quote.floor;
		const codes = (/** @type {any} */ x) =>
			Object.entries(x.statuses)
				.map(([k, v]) => `${k}×${v}`)
				.join(' ');
		rows.push(
			row({
				id: 'quote.latency',
				measure: 'quote API: latency (p50 / p95)',
				unit: 'ms',
				median: r1(quote.p50),
				p95: r1(quote.p95),
				floor: r1(f.p95),
				floorWhat: 'GET /healthz same load (p95)',
				ratio: r3(quote.p95 / f.p95),
				target: 'p95 ≤ 1.5 × floor',
				met: quote.non2xx === 0 && quote.p95 <= 1.5 * f.p95,
				notes: `${quote.connections} conns, ${quote.seconds} s, ${quote.requests} requests: ${codes(quote)}; non-2xx ${quote.non2xx}, errors ${quote.errors}, timeouts ${quote.timeouts}`
			})
		);
		rows.push(
			row({
				id: 'quote.throughput',
				measure: 'quote API: throughput',
				unit: 'req/s',
				median: Math.round(quote.reqPerSec),
				floor: Math.round(f.reqPerSec),
				floorWhat: 'GET /healthz same load',
				ratio: r3(quote.reqPerSec / f.reqPerSec),
				notes: `floor: ${f.requests} requests, p50 ${r1(f.p50)} ms, ${codes(f)}; non-2xx ${f.non2xx}`
			})
		);
	}

	if (isErr(dxf)) rows.push(notMeasured('dxf', 'DXF: one order, in process', dxf?.error ?? 'failed', '< 50 ms'));
	else
		for (const [number, o] of Object.entries(dxf.orders)) {
			const x = /** @type {any} */ (o);
			rows.push(
				row({
					id: `dxf.${x.style}`,
					measure: `DXF: one order, ${x.style} (draft + write)`,
					unit: 'ms',
					median: r1(x.total.median),
					p95: r1(x.total.p95),
					floor: r1(x.floor.median),
					floorWhat: 'draftSkirt alone (median)',
					ratio: r3(x.total.median / x.floor.median),
					target: '< 50 ms',
					met: x.total.median < 50,
					notes: `${number}: ${x.pieces} pieces, ${Math.round(x.bytes / 1024)} KB; ${dxf.runs} runs, fastest ${r1(x.total.min)} ms`
				})
			);
		}
	if (isErr(batch)) rows.push(notMeasured('outputs', 'outputs: DXF route and 20-order batch', batch?.error ?? 'failed'));
	else {
		const { route, batch: job } = batch;
		rows.push(
			row({
				id: 'dxf.route',
				measure: 'DXF: GET pattern.dxf as the cutter',
				unit: 'ms',
				median: r1(route.median),
				p95: r1(route.p95),
				floor: r1(route.floor.median),
				floorWhat: 'GET /healthz (median)',
				ratio: r3(route.median / route.floor.median),
				target: '< 50 ms',
				met: route.median < 50,
				notes: `order ${route.number}, ${route.n} GETs one at a time, ${Math.round(route.bytes / 1024)} KB; first waited ${(batch.waitedForLaysSeconds ?? []).join(' s and ')} s for the background cutter's lays of paid orders`
			})
		);
		rows.push(
			row({
				id: 'jobs.batch20',
				measure: `jobs: ${job.orders}-order batch (ticket, DXF, tiled A4, lay), app peak RSS`,
				unit: 'MB',
				median: r1(job.peakMb),
				floor: r1(job.rssBeforeMb),
				floorWhat: 'app RSS before the job',
				ratio: r3(job.peakMb / job.rssBeforeMb),
				notes: `${job.peakFrom}; sampled peak ${r1(job.sampledPeakMb)} MB; ${r1(job.seconds)} s to done, zip ${Math.round(job.zipBytes / 1024)} KB, ${job.failures} orders not made`
			})
		);
	}

	const ticketTarget = '≤ 3 × floor and < 150 ms';
	if (isErr(ticket))
		rows.push(notMeasured('ticket', 'ticket PDF: GET as the cutter', ticket?.error ?? 'failed', ticketTarget));
	else if (!ticket.measured)
		rows.push(
			row({
				...notMeasured('ticket', 'ticket PDF: GET as the cutter', ticket.reason, ticketTarget),
				unit: 'ms',
				floor: r1(ticket.floor.median),
				floorWhat: 'one-page pdfkit doc, same Lora (median)'
			})
		);
	else
		rows.push(
			row({
				id: 'ticket',
				measure: 'ticket PDF: GET as the cutter',
				unit: 'ms',
				median: r1(ticket.median),
				p95: r1(ticket.p95),
				floor: r1(ticket.floor.median),
				floorWhat: 'one-page pdfkit doc, same Lora (median)',
				ratio: r3(ticket.median / ticket.floor.median),
				target: ticketTarget,
				met: ticket.failed === 0 && ticket.median <= 3 * ticket.floor.median && ticket.median < 150,
				notes: `order ${ticket.number}, ${ticket.n} GETs one at a time, ${ticket.failed} failed, ${ticket.pages} pages, ${Math.round(ticket.bytes / 1024)} KB; floor p95 ${r1(ticket.floor.p95)} ms; the floor from the raw .woff (fontkit inflating per document): ${r1(ticket.floor.fromRawWoff.median)} ms`
			})
		);

	if (isErr(checkout))
		rows.push(
			notMeasured(
				'checkout',
				'checkout: 500 orders, 50 clients',
				checkout?.error ?? 'failed',
				'paid 500 / lost 0 / dup 0'
			)
		);
	else {
		const c = checkout;
		rows.push(
			row({
				id: 'checkout.order',
				measure: 'checkout: one order (quote+order+pay)',
				unit: 'ms',
				median: r1(c.perOrderMs.median),
				p95: r1(c.perOrderMs.p95),
				floor: r1(c.floor.perOrderMs.median),
				floorWhat: '3 bare health round trips (median)',
				ratio: r3(c.perOrderMs.median / c.floor.perOrderMs.median),
				notes: `client side, ${c.clients} clients; failures: ${
					Object.entries(c.failures)
						.map(([k, v]) => `${k}×${v}`)
						.join(' ') || 'none'
				}`
			})
		);
		rows.push(
			row({
				id: 'checkout.throughput',
				measure: 'checkout: throughput to paid',
				unit: 'orders/s',
				median: r1(c.ordersPerSecond),
				floor: r1(c.floor.ordersPerSecond),
				floorWhat: '3 bare health round trips',
				ratio: r3(c.ordersPerSecond / c.floor.ordersPerSecond),
				notes: `clients done in ${r1(c.clientSeconds)} s, all paid seen at ${r1(c.allPaidSeconds)} s (first order row to last paid: ${r1(c.dbSpanSeconds)} s)`
			})
		);
		rows.push(
			row({
				id: 'checkout.counts',
				measure: 'checkout: paid / lost / duplicated',
				unit: 'orders',
				median: `${c.paid} / ${c.lost} / ${c.duplicated}`,
				target: `${c.orders} / 0 / 0`,
				met: c.paid === c.orders && c.lost === 0 && c.duplicated === 0,
				notes: `placed ${c.placed}, 201s ${c.answered201}; orders with >1 paid event ${c.duplicatedPaidEvents}, >1 paid payment ${c.duplicatedPaidPayments}`
			})
		);
	}

	if (isErr(pages))
		rows.push(notMeasured('pages', 'pages: JS per route', pages?.error ?? 'failed', 'configure ≤ 100 KB JS'));
	else {
		const f = pages.floor;
		const agree = Object.entries(pages.htmlCheck ?? {}).map(
			([p, c]) => `${p} ${/** @type {any} */ (c).agree ? 'agrees' : 'DISAGREES'}`
		);
		rows.push(
			row({
				id: 'pages.floor',
				measure: 'pages: root layout only (the floor)',
				unit: 'KB gz JS',
				median: r1(f.jsKB),
				floor: r1(f.jsKB),
				floorWhat: 'entries + root layout',
				ratio: 1,
				notes: `CSS ${r1(f.cssKB)} KB; HTML check: ${agree.join(', ') || 'not run'}`
			})
		);
		for (const [id, r] of Object.entries(pages.routes)) {
			const configure = id === '/styles/[slug=slug]/make';
			if (r.missing) {
				rows.push(notMeasured(`pages.${id}`, `pages: ${id}`, 'route missing', configure ? 'JS ≤ 100 KB' : '—'));
				continue;
			}
			rows.push(
				row({
					id: `pages.${id}`,
					measure: `pages: ${id}${configure ? ' (configure)' : ''}`,
					unit: 'KB gz JS',
					median: r1(r.jsKB),
					floor: r1(f.jsKB),
					floorWhat: 'entries + root layout',
					ratio: r3(r.jsKB / f.jsKB),
					target: configure ? 'JS ≤ 100 KB' : '—',
					met: configure ? r.jsKB <= 100 : null,
					notes: `CSS ${r1(r.cssKB)} KB (floor ${r1(f.cssKB)}); ${r.jsFiles} JS files, ${r.cssFiles} CSS`
				})
			);
		}
	}
	if (isErr(live)) {
		rows.push(notMeasured('live.draw', 'configure: draft + drawing per change (Chromium)', live?.error ?? 'failed', 'median ≤ 16 ms'));
	} else {
		const d = live.drawMs;
		rows.push(
			row({
				id: 'live.draw',
				measure: 'configure: draft + drawing per change (Chromium)',
				unit: 'ms',
				median: r1(d.median),
				p95: r1(d.p95),
				floor: 16.7,
				floorWhat: 'one frame at 60 Hz',
				ratio: r3(d.median / 16.7),
				target: 'median ≤ 16 ms',
				met: d.median <= 16,
				notes: `${live.changes} changes typed on ${live.path}; max ${r1(d.max)} ms`
			})
		);
		rows.push(
			row({
				id: 'live.firstJs',
				measure: 'configure: first JS (before load), engine apart',
				unit: 'KB gz JS',
				median: r1(live.firstJsKB),
				target: 'JS ≤ 100 KB',
				met: live.firstJsKB <= 100,
				notes: `${live.firstJsFiles} files requested by the load event; first contentful paint ${live.firstPaintMs === null ? '—' : r1(live.firstPaintMs) + ' ms'}`
			})
		);
		rows.push(
			row({
				id: 'live.engine',
				measure: 'configure: engine chunk (after first paint)',
				unit: 'KB gz JS',
				median: r1(live.engineKB),
				notes: live.engineFiles.join(', ')
			})
		);
	}
	return rows;
}

/** @param {Row[]} rows @param {any} report */
export function printTable(rows, report) {
	const fmt = (/** @type {unknown} */ v) =>
		v === null || v === undefined ? '—' : typeof v === 'number' ? String(v) : String(v);
	const head = ['measure', 'unit', 'median', 'p95', 'floor', 'ratio', 'target', 'result', 'notes'];
	const cells = rows.map((r) => [
		r.measure,
		r.unit,
		fmt(r.median),
		fmt(r.p95),
		fmt(r.floor),
		r.ratio === null ? '—' : `${r.ratio.toFixed(2)}×`,
		r.target,
		r.met === null ? '' : r.met ? 'met' : 'MISSED',
		r.notes
	]);
	const numeric = new Set([2, 3, 4, 5]);
	const widths = head.map((h, i) => (i === head.length - 1 ? 0 : Math.max(h.length, ...cells.map((c) => c[i].length))));
	const line = (/** @type {string[]} */ c) =>
		c.map((x, i) => (i === c.length - 1 ? x : numeric.has(i) ? x.padStart(widths[i]) : x.padEnd(widths[i]))).join('  ');
	const m = report.machine;
	console.log(
		`\nQuarterline bench · ${report.startedAt} · Node ${report.node} · ${m.cpus} CPUs (${m.model}) · load average before ${m.loadavgBefore.map((/** @type {number} */ x) => x.toFixed(1)).join(' ')}, after ${m.loadavgAfter.map((/** @type {number} */ x) => x.toFixed(1)).join(' ')}\n`
	);
	console.log(line(head));
	console.log(line(widths.map((w, i) => '─'.repeat(i === head.length - 1 ? 5 : w))));
	for (const c of cells) console.log(line(c));
	console.log('\nratio = figure ÷ floor (for req/s and orders/s, below 1 means slower than the floor). Floors:');
	const seen = new Set();
	for (const r of rows)
		if (r.floorWhat && !seen.has(r.floorWhat)) seen.add(r.floorWhat) && console.log(`  ${r.measure}: ${r.floorWhat}`);
}

/** The full-size pattern files (tests/bench/outputs.ts). @param {any} o @returns {Row[]} */
function outputRows(o) {
	if (isErr(o)) return [notMeasured('outputs', 'outputs: full-size PDFs', o?.error ?? 'failed', 'tiled ≤ 3× bare pdfkit')];
	const ms = (/** @type {any} */ x) => r1(x.median);
	return [
		row({
			id: 'outputs.tiled-a4',
			measure: `outputs: tiled A4 PDF, full-circle skirt (${o.pages} pages)`,
			unit: 'ms',
			median: ms(o.tiled),
			p95: r1(o.tiled.p95),
			floor: ms(o.floor),
			floorWhat: `bare pdfkit: ${o.pages} pages, the same words on each (${o.floorChars} letters), same Lora faces`,
			ratio: r3(o.tiled.median / o.floor.median),
			target: '≤ 3× floor',
			met: o.tiled.median <= 3 * o.floor.median,
			notes: `${o.pages} pages, ${Math.round(o.bytes / 1024)} KiB (floor ${Math.round(o.floorBytes / 1024)} KiB); ${o.tiled.n} runs, each timed in turn with the floor; run by run ratio median ${r3(o.ratio.median)}; CPU time ${r1(o.cpu.tiled.median)} ms vs ${r1(o.cpu.floor.median)} ms = ${r3(o.cpu.tiled.median / o.cpu.floor.median)}×`
		}),
		row({ id: 'outputs.a0', measure: `outputs: A0 PDF, pencil skirt (${o.a0Pages} page${o.a0Pages === 1 ? '' : 's'})`, unit: 'ms', median: ms(o.a0), p95: r1(o.a0.p95), floor: ms(o.floor), floorWhat: 'bare pdfkit (as above)', ratio: r3(o.a0.median / o.floor.median) }),
		row({ id: 'outputs.roll', measure: 'outputs: roll PDF (91.4 cm), full-circle skirt', unit: 'ms', median: ms(o.roll), p95: r1(o.roll.p95), floor: ms(o.floor), floorWhat: 'bare pdfkit (as above)', ratio: r3(o.roll.median / o.floor.median) }),
		row({ id: 'outputs.projector', measure: 'outputs: projector PDF, full-circle skirt', unit: 'ms', median: ms(o.projector), p95: r1(o.projector.p95), floor: ms(o.floor), floorWhat: 'bare pdfkit (as above)', ratio: r3(o.projector.median / o.floor.median) }),
		row({
			id: 'outputs.lay',
			measure: `outputs: lay PDF at full size, drawing only (${o.layPages} page${o.layPages === 1 ? '' : 's'})`,
			unit: 'ms',
			median: ms(o.layDraw),
			p95: r1(o.layDraw.p95),
			floor: ms(o.floor),
			floorWhat: 'bare pdfkit (as above)',
			ratio: r3(o.layDraw.median / o.floor.median),
			notes: `the engine's lay search before it: median ${ms(o.laySearch)} ms; lay PDF with its search ${r1(o.layDraw.median + o.laySearch.median)} ms`
		})
	];
}
