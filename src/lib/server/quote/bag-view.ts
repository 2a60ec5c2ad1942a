import type { Db } from '../db/client';
import type { BagItem } from '$lib/forms/quote';
import { toSvg } from '$lib/drafting';
import { quoteBag } from './quote';

/** The bag as the shopper sees it, every line priced again from the database in one quote. */
export async function viewBag(db: Db, items: BagItem[]) {
	const bag = await quoteBag(db, items);
	const lines = items.map((item, i) => {
		const q = bag.lines[i];
		if (!q.ok) return { id: item.id, ok: false as const, message: q.message };
		const fabric = q.fabric && q.fabricCm !== null ? { id: q.fabric.id, name: q.fabric.name, widthCm: q.fabric.widthCm, lengthCm: q.fabricCm, inStock: q.fabric.stockCm >= q.fabricCm } : null;
		return {
			id: item.id,
			ok: true as const,
			style: q.style.name,
			fabric,
			price: q.pricing,
			warnings: q.draft.warnings,
			drawing: toSvg(q.draft, { view: 'pieces', units: item.units }),
			measurements: item.measurements,
			units: item.units,
			options: item.options,
			shipBy: q.shipBy
		};
	});
	return { lines, subtotal: bag.subtotal, shipping: bag.shipping, total: bag.total, currency: bag.currency, shipBy: bag.shipBy, remakePolicy: bag.remakePolicy };
}
