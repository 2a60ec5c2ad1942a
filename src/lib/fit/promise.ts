// The remake promise in words, built from the shop's settings (the window and the free remakes), so
// every page and mail that states it says the same thing as the rule the fit report obeys.

export type PromiseSettings = { remakeWindowDays: number; freeRemakesPerOrder: number };

const days = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`;

/** "one remake of each order is free", "two remakes…", or that remakes are not free. */
export function freeRemakesWords(n: number): string {
	if (n <= 0) return 'remakes are not free; alterations are';
	const count = ['one', 'two', 'three'][n - 1] ?? String(n);
	return n === 1 ? 'one remake of each order is free' : `${count} remakes of each order are free`;
}

/** The promise shown at checkout, on every page's footer and in the payment mail. */
export function remakePromise(s: PromiseSettings): string {
	const what =
		s.freeRemakesPerOrder > 0
			? `we alter it or cut it again from your corrected measurements, free of charge (${freeRemakesWords(s.freeRemakesPerOrder)})`
			: 'we alter it, free of charge';
	return `If your skirt does not fit as drafted, tell us within ${days(s.remakeWindowDays)} of delivery: ${what}.`;
}
