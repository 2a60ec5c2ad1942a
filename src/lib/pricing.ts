// Prices for a skirt, in minor units (cents). Plain functions shared by the quote API, the checkout
// (which recomputes every price from the database) and the seed, so a price is never computed twice
// in two ways.

/** What the style charges for each option when chosen, in minor units. */
export type OptionPrices = Partial<Record<'lining' | 'pockets' | 'band' | 'facing' | 'invisible-zip', number>>;

export type LinePricing = { fabric: number; making: number; options: number; total: number };

export type PricedOptions = { lining?: boolean; pockets?: boolean; waistband?: 'band' | 'facing'; closure?: { kind?: string } };

/** Fabric is sold by the 10 cm; the length passed in is already rounded to the sale step. */
export function fabricCost(fabricCm: number, pricePerMetre: number) {
	return Math.round((fabricCm * pricePerMetre) / 100);
}

export function optionsCost(options: PricedOptions, prices: OptionPrices) {
	let sum = 0;
	if (options.lining) sum += prices.lining ?? 0;
	if (options.pockets) sum += prices.pockets ?? 0;
	if (options.waistband === 'band') sum += prices.band ?? 0;
	if (options.waistband === 'facing') sum += prices.facing ?? 0;
	if (options.closure?.kind === 'invisible-zip') sum += prices['invisible-zip'] ?? 0;
	return sum;
}

export function priceLine(input: { fabricCm: number; pricePerMetre: number; makingPrice: number; options: PricedOptions; optionPrices: OptionPrices }): LinePricing {
	const fabric = fabricCost(input.fabricCm, input.pricePerMetre);
	const options = optionsCost(input.options, input.optionPrices);
	return { fabric, making: input.makingPrice, options, total: fabric + input.makingPrice + options };
}

export type ShippingRule = { flat: number; freeFrom: number };
export const DEFAULT_SHIPPING: ShippingRule = { flat: 950, freeFrom: 30_000 };

export function shippingCost(subtotal: number, rule: ShippingRule = DEFAULT_SHIPPING) {
	return subtotal >= rule.freeFrom ? 0 : rule.flat;
}

/**
 * The date we promise to ship: the style's lead time, plus a day for every `perDay` orders already
 * waiting in the workroom, counted in working days (Monday to Friday).
 */
export function promisedShipDate(from: Date, leadDays: number, ordersWaiting: number, perDay = 4) {
	let working = leadDays + Math.floor(ordersWaiting / perDay);
	const d = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate()));
	while (working > 0) {
		d.setUTCDate(d.getUTCDate() + 1);
		const day = d.getUTCDay();
		if (day !== 0 && day !== 6) working--;
	}
	return d.toISOString().slice(0, 10);
}
