// @ts-check
// Order statistics shared by the bench's measures (nearest-rank percentiles, no interpolation).

/** @param {number[]} sorted ascending @param {number} p 0..100 */
export function percentile(sorted, p) {
	if (!sorted.length) return NaN;
	const rank = Math.ceil((p / 100) * sorted.length);
	return sorted[Math.min(sorted.length - 1, Math.max(0, rank - 1))];
}

/** @param {number[]} values */
export function summarise(values) {
	const s = [...values].sort((a, b) => a - b);
	const mean = s.reduce((a, b) => a + b, 0) / (s.length || 1);
	return {
		n: s.length,
		median: percentile(s, 50),
		p95: percentile(s, 95),
		min: s[0] ?? NaN,
		max: s[s.length - 1] ?? NaN,
		mean
	};
}
