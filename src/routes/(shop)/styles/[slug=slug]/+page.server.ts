import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { listFabrics, styleBySlug } from '$lib/server/catalogue/listing';
import { currentRules } from '$lib/server/house/rules';
import { sampleDrawing } from '$lib/server/quote/sample';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const style = await styleBySlug(db, params.slug);
	if (!style || style.retiredAt) error(404, 'We do not make that style.');
	const [{ id, rules }, fabrics] = await Promise.all([currentRules(db), listFabrics(db)]);
	return {
		style: { slug: style.slug, name: style.name, kind: style.kind, description: style.description, makingPrice: style.makingPrice, leadDays: style.leadDays, optionPrices: style.optionPrices },
		drawing: sampleDrawing(style.kind, rules, id),
		fabrics: fabrics.map((f) => ({ id: f.id, name: f.name, colour: f.colour, swatchHex: f.swatchHex, imageUrl: f.imageUploadId ? `/uploads/${f.imageUploadId}` : null, fibreContent: f.fibreContent, careText: f.careText, widthCm: f.widthCm, pricePerMetre: f.pricePerMetre, inStock: f.stockCm >= 100, nap: f.nap, stretch: f.stretch }))
	};
};
