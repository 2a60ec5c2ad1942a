// @ts-check
// The lay tables of `npm run bench`: the shared instances against the published best, the three skirts of
// issue 12's targets, the quote's lay time, the cutter's and the combined lays. Figures beside targets,
// never asserted.

const isErr = (/** @type {any} */ r) => !r || typeof r !== 'object' || 'error' in r;
const pct = (/** @type {number} */ x) => `${(x * 100).toFixed(2)} %`;

/** @param {string[][]} rows */
function table(rows) {
	const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
	for (const [k, r] of rows.entries()) {
		console.log('  ' + r.map((c, i) => c.padEnd(widths[i])).join('  '));
		if (k === 0) console.log('  ' + widths.map((w) => '─'.repeat(w)).join('  '));
	}
}

/** @param {any} instances @param {any} lays */
export function printLays(instances, lays) {
	console.log('\nLays');
	if (isErr(instances)) console.log(`  instances: not measured: ${instances?.error ?? 'failed'}`);
	else {
		console.log(`\n  Shared instances (npm run nest, ${instances.instances[0]?.seconds ?? '?'} s each, one core; target: within 5 pp of the best published)`);
		table([
			['instance', 'ours', 'best published', 'gap', 'target', 'check', 'CPU s / wall s', 'load (1 min) before → after', 'at equal CPU time'],
			...instances.instances.map((/** @type {any} */ r) => [
				r.instance,
				pct(r.density),
				pct(r.published),
				`${r.gapPp.toFixed(2)} pp`,
				r.gapPp <= 5 ? 'met' : 'MISSED',
				r.faults === 0 && r.countsRight ? 'no overlaps, counts right' : `${r.faults} faults${r.countsRight ? '' : ', counts wrong'}`,
				`${r.run.cpuSeconds ?? '?'} / ${r.run.seconds}`,
				`${r.run.load[0]} → ${r.run.load[1]}`,
				r.atEqualCpu
					? `${pct(r.atEqualCpu.density)} (gap ${r.atEqualCpu.gapPp.toFixed(2)} pp${r.atEqualCpu.faults ? `, ${r.atEqualCpu.faults} faults` : ''})`
					: 'not needed (a whole core)'
			])
		]);
	}
	if (isErr(lays)) {
		console.log(`  skirts and combined lays: not measured: ${lays?.error ?? 'failed'}`);
		return;
	}
	console.log('\n  The three skirts (fabric to buy, cm)');
	table([
		['skirt', 'before', 'quote', 'cutter', 'target', 'result', 'cutter s'],
		...lays.skirts.map((/** @type {any} */ s) => [
			s.skirt,
			String(s.beforeCm),
			String(s.quoteCm),
			String(s.cutterCm),
			`≤ ${s.targetCm}`,
			s.quoteCm <= s.targetCm && s.cutterCm <= s.quoteCm ? 'met' : 'MISSED',
			String(s.cutterSeconds)
		])
	]);
	const q = lays.quoteLay;
	console.log(`\n  Quote's lay: ${q.orders} seeded orders × ${q.styles} styles × ${q.rounds} rounds`);
	table([
		['', 'median ms', 'p95 ms', 'max ms', 'target', 'result'],
		['uncached (a new figure)', String(q.uncachedMs.median), String(q.uncachedMs.p95), String(q.uncachedMs.max), 'median ≤ 30, p95 ≤ 80', q.uncachedMs.median <= 30 && q.uncachedMs.p95 <= 80 ? 'met' : 'MISSED'],
		['cached (the same again)', String(q.cachedMs.median), String(q.cachedMs.p95), String(q.cachedMs.max), 'median ≤ 30, p95 ≤ 80', q.cachedMs.median <= 30 && q.cachedMs.p95 <= 80 ? 'met' : 'MISSED']
	]);
	const cutterMax = Math.max(...lays.skirts.map((/** @type {any} */ s) => s.cutterSeconds));
	console.log(`\n  Cutter's lay: longest of the three skirts ${cutterMax} s (target ≤ 5 s) ${cutterMax <= 5 ? 'met' : 'MISSED'}`);
	const six = lays.six;
	console.log(
		`  Combined lay of six orders (${six.orders.join(', ')} on ${six.cloth}): ${six.seconds} s (target ≤ 10 s) ${six.seconds <= 10 ? 'met' : 'MISSED'}; ${six.combinedCm} cm against ${six.aloneCm} cm cut one by one, ${six.utilisation} % used`
	);
	console.log('\n  The seeded queue laid together, per cloth');
	table([
		['cloth', 'orders', 'alone, cm', 'together, cm', 'saved', 'utilisation', 's'],
		...lays.combined.map((/** @type {any} */ c) => [
			c.cloth,
			c.orders.join(', '),
			c.aloneCm.join(' + '),
			String(c.combinedCm),
			`${(c.savedCm / 100).toFixed(2)} m`,
			`${c.utilisation} %`,
			String(c.seconds)
		])
	]);
}
