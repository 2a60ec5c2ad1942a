// Fibre content as the shop shows it before a purchase. EU Regulation 1007/2011 (textile fibre
// names and labelling): Art. 7 keeps "100 %", "pure" and "all" for products of one fibre only;
// Art. 9 wants a blend's fibres named with their percentage by weight, in descending order
// [Art. 9 wording from memory]. Local law may ask more; the form says so beside the field.

export type FibrePart = { share: number | null; fibre: string };

const SEPARATOR = /\s*(?:,|;|\/|\+|&|\band\b)\s*/i;
const SHARE = /(\d{1,3}(?:[.,]\d{1,2})?)\s*%/;

export function fibreParts(text: string): FibrePart[] {
	return text
		.split(SEPARATOR)
		.map((p) => p.trim())
		.filter(Boolean)
		.map((p) => {
			const m = SHARE.exec(p);
			return { share: m ? Number(m[1].replace(',', '.')) : null, fibre: p.replace(SHARE, '').trim() };
		});
}

const fmt = (n: number) => String(Math.round(n * 100) / 100);

/** The first thing wrong with a fibre content text, or null when it reads as the regulation asks. */
export function fibreProblem(text: string): string | null {
	const parts = fibreParts(text);
	if (parts.length === 0) return 'Enter the fibre content, such as “100 % wool”.';
	if (parts.some((p) => !/\p{L}{3,}/u.test(p.fibre)))
		return 'Name the fibre after each share, such as “98 % cotton, 2 % elastane”.';
	const claimsPure = /\b100\s*%|\bpure\b|\ball\b/i.test(text);
	if (parts.length === 1) {
		const share = parts[0].share;
		if (share !== null && share !== 100)
			return `A single fibre at ${fmt(share)} % leaves the rest unnamed: list every fibre with its share.`;
		return null;
	}
	if (claimsPure)
		return '“100 %”, “pure” and “all” are only for cloth of one fibre alone (EU Regulation 1007/2011). For a blend, list each fibre with its share, such as “98 % cotton, 2 % elastane”.';
	if (parts.some((p) => p.share === null))
		return 'Give each fibre of a blend its share by weight, such as “70 % wool, 30 % polyamide”.';
	const sum = parts.reduce((s, p) => s + (p.share ?? 0), 0);
	if (Math.abs(sum - 100) > 0.001) return `The shares add up to ${fmt(sum)} %: they must make 100 %.`;
	for (let i = 1; i < parts.length; i++) {
		if ((parts[i].share ?? 0) > (parts[i - 1].share ?? 0))
			return 'List the fibres from the largest share to the smallest, such as “80 % viscose, 20 % linen”.';
	}
	return null;
}
