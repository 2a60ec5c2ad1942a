// The part of autocannon 8's API the bench uses (the package ships no types).
declare module 'autocannon' {
	interface Instance {
		on(
			event: 'response',
			listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void
		): void;
	}
	interface Result {
		duration: number;
		errors: number;
		timeouts: number;
		non2xx: number;
		latency: Record<string, number>;
		requests: Record<string, number>;
	}
	function autocannon(options: Record<string, unknown>, done: (err: Error | null, result: Result) => void): Instance;
	export default autocannon;
}
