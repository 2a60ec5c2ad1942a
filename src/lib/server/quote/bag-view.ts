import type { Db } from '../db/client';
import type { BagItem } from '$lib/forms/quote';
import { shippingCost } from '$lib/pricing';
import { quoteSkirt } from './quote';
import { shopSettingsOf } from '../house/rules';

/** The bag as the shopper sees it, every line priced again from the database. */
export async function viewBag(db: Db, items: BagItem[]) {
	const lines = [];
	for (const item of items) {
		const q = await quoteSkirt(db, item, { drawing: true });
		lines.push(
			q.ok
				? { id: item.id, ok: true as const, style: q.quote.style.name, fabric: q.quote.fabric, price: q.quote.price, warnings: q.quote.warnings, drawing: q.quote.drawing, measurements: item.measurements, units: item.units, options: item.options, shipBy: q.quote.shipBy }
				: { id: item.id, ok: false as const, message: q.problem.message }
		);
	}
	const settings = await shopSettingsOf(db);
	const subtotal = lines.reduce((s, l) => s + (l.ok && l.price ? l.price.total - l.price.shipping : 0), 0);
	const shipping = subtotal > 0 ? shippingCost(subtotal, settings.shipping) : 0;
	const shipBy = lines.map((l) => (l.ok ? l.shipBy : '')).sort().at(-1) ?? null;
	return { lines, subtotal, shipping, total: subtotal + shipping, currency: settings.currency, shipBy, remakePolicy: settings.remakePolicy };
}
