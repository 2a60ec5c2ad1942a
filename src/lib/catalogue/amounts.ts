// Figures typed into the catalogue forms, read exactly: money into cents, lengths into tenths of a
// centimetre. A decimal comma is as good as a point (the atelier may type "24,50"); thousands
// separators are refused rather than guessed at.

/** "24,5" with 2 decimals → 2450; null when it is not a plain decimal with at most that many places. */
export function parseScaled(text: string, decimals: number): number | null {
	const m = /^(\d{1,9})(?:[.,](\d+))?$/.exec(text.trim());
	if (!m) return null;
	const frac = m[2] ?? '';
	if (frac.length > decimals) return null;
	return Number(m[1]) * 10 ** decimals + Number(frac.padEnd(decimals, '0') || '0');
}

/** Cents shown back in a form field: 8950 → "89.50", 8900 → "89". */
export function centsToText(cents: number) {
	return cents % 100 === 0 ? String(cents / 100) : (cents / 100).toFixed(2);
}

/** A number with at most `decimals` places, shown without trailing zeros: 150.0 → "150", 1.25 → "1.25". */
export function numberToText(value: number, decimals: number) {
	return String(Number(value.toFixed(decimals)));
}

export type AmountRule = { label: string; decimals: number; min: number; max: number; unit: string; example: string };

/** The message for a figure that does not pass, or null. */
export function amountProblem(text: string, r: AmountRule): string | null {
	if (text.trim() === '') return `Enter the ${r.label}.`;
	const scaled = parseScaled(text, r.decimals);
	if (scaled === null) {
		const places =
			r.decimals === 0 ? 'a whole number' : `a number with at most ${r.decimals} decimal${r.decimals === 1 ? '' : 's'}`;
		return `Write the ${r.label} as ${places}, such as ${r.example}.`;
	}
	const value = scaled / 10 ** r.decimals;
	if (value < r.min || value > r.max) return `The ${r.label} must be from ${r.min} to ${r.max} ${r.unit}.`;
	return null;
}

/** Lower-case words joined by hyphens, for the shop's web addresses: "Rue Straight" → "rue-straight". */
export function slugify(text: string) {
	return text
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, 80)
		.replace(/-+$/, '');
}
