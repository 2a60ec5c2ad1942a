import { SOURCE_NOTE_SHOPPER } from '$lib/drafting/figures-source';
import type { Db } from '../db/client';
import type { BagItem } from '$lib/forms/quote';
import { fillOf, garmentSvg } from '../outputs/garment';
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
			// Figures found without a tape: the bag says where they came from.
			warnings: item.figuresSource && item.figuresSource !== 'measured' ? [SOURCE_NOTE_SHOPPER[item.figuresSource], ...q.draft.warnings] : q.draft.warnings,
			drawing: q.fabric ? garmentSvg(q.draft, fillOf(q.fabric), `bag-${item.id}`, item.units) : null,
			measurements: item.measurements,
			units: item.units,
			options: item.options,
			shipBy: q.shipBy
		};
	});
	return { lines, subtotal: bag.subtotal, shipping: bag.shipping, total: bag.total, currency: bag.currency, shipBy: bag.shipBy, remakePolicy: bag.remakePolicy };
}
