// @ts-check
// HTTP load with autocannon: a fixed number of connections on loopback for a fixed time. Latencies
// are collected from every response (autocannon's own histogram reports p90 and p97.5, not p95), and
// every status code is counted, so a run that answered 4xx or 5xx shows it instead of looking fast.
import autocannon from 'autocannon';
import { summarise } from './stats.js';

/**
 * @param {{ url: string, connections: number, seconds: number, requests?: object[], method?: string, headers?: Record<string, string>, body?: string }} o
 */
export function load(o) {
	/** @type {number[]} */
	const latencies = [];
	/** @type {Record<string, number>} */
	const statuses = {};
	return new Promise((resolve, reject) => {
		const instance = autocannon(
			{
				url: o.url,
				connections: o.connections,
				duration: o.seconds,
				pipelining: 1,
				timeout: 10,
				...(o.requests
					? { requests: o.requests }
					: { method: /** @type {any} */ (o.method ?? 'GET'), headers: o.headers, body: o.body })
			},
			(err, result) => {
				if (err) return reject(err);
				const non2xx = Object.entries(statuses)
					.filter(([s]) => !s.startsWith('2'))
					.reduce((a, [, n]) => a + n, 0);
				const lat = summarise(latencies);
				resolve({
					url: o.url,
					connections: o.connections,
					seconds: o.seconds,
					requests: latencies.length,
					reqPerSec: latencies.length / (result.duration || o.seconds),
					p50: lat.median,
					p95: lat.p95,
					p99: [...latencies].sort((a, b) => a - b)[Math.max(0, Math.ceil(latencies.length * 0.99) - 1)] ?? NaN,
					mean: lat.mean,
					max: lat.max,
					statuses,
					non2xx,
					errors: result.errors,
					timeouts: result.timeouts,
					// autocannon's own figures, for comparison with ours
					autocannon: {
						p50: result.latency.p50,
						p90: result.latency.p90,
						p97_5: result.latency.p97_5,
						reqPerSecAvg: result.requests.average,
						non2xx: result.non2xx
					}
				});
			}
		);
		instance.on('response', (_client, statusCode, _bytes, responseTime) => {
			latencies.push(responseTime);
			statuses[statusCode] = (statuses[statusCode] ?? 0) + 1;
		});
	});
}

/** The quote bodies the load cycles through: every demo style in turn, on the 150 cm wool twill. */
export function quoteBodies() {
	const styles = [
		'rue-straight',
		'quill-pencil',
		'meadow-a-line',
		'swing-half-circle',
		'carousel-full-circle',
		'promenade-six-gore'
	];
	return styles.map((style, i) => ({
		measurements: { waist: 66 + i * 2, hip: 92 + i * 2, length: 58 + i, waistToHip: 20.5 },
		style,
		fabricId: 1
	}));
}

/**
 * The quote API against the health check of the same server, same load, each after a warm-up.
 * @param {{ appUrl: string, connections?: number, seconds?: number, warmupSeconds?: number }} o
 */
export async function measureQuote(o) {
	const connections = o.connections ?? 32;
	const seconds = o.seconds ?? 10;
	const warm = o.warmupSeconds ?? 2;
	const bodies = quoteBodies();
	// One real answer first: a benchmark of refusals would be worthless.
	for (const b of bodies) {
		const res = await fetch(`${o.appUrl}/api/quote`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify(b)
		});
		const json = await res.json().catch(() => null);
		if (res.status !== 200 || !json?.price?.total)
			throw new Error(`POST /api/quote for ${b.style} answered ${res.status}: ${JSON.stringify(json).slice(0, 300)}`);
		// The browser drafts and draws; the quote answers only what the server alone knows.
		if (json.drawing !== undefined) throw new Error(`POST /api/quote for ${b.style} still sends a drawing`);
	}
	const requests = bodies.map((b) => ({
		method: /** @type {const} */ ('POST'),
		path: '/api/quote',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(b)
	}));
	const quote = { url: `${o.appUrl}/api/quote`, connections, requests };
	const health = { url: `${o.appUrl}/healthz`, connections };
	await load({ ...quote, seconds: warm });
	await load({ ...health, seconds: warm });
	const floor = await load({ ...health, seconds });
	const result = await load({ ...quote, seconds });
	return { ...result, styles: bodies.map((b) => b.style), floor };
}
