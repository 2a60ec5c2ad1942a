import { error, fail, redirect } from '@sveltejs/kit';
import { desc, eq } from 'drizzle-orm';
import { setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { bagItemFrom, makeFormSchema } from '$lib/forms/make';
import { db } from '$lib/server/db';
import { measurementProfiles } from '$lib/server/db/schema';
import { listFabrics, styleBySlug } from '$lib/server/catalogue/listing';
import { MAX_ITEMS, readBag, writeBag } from '$lib/server/quote/bag';
import { quoteSkirt } from '$lib/server/quote/quote';
import { currentRules } from '$lib/server/house/rules';
import { DEFAULT_RULES } from '$lib/drafting';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, locals }) => {
	const style = await styleBySlug(db, params.slug);
	if (!style || style.retiredAt) error(404, 'We do not make that style.');
	const [fabrics, cards, { rules }] = await Promise.all([
		listFabrics(db),
		locals.user ? db.select().from(measurementProfiles).where(eq(measurementProfiles.userId, locals.user.id)).orderBy(desc(measurementProfiles.updatedAt)) : [],
		currentRules(db)
	]);
	const form = await superValidate(zod4(makeFormSchema), { errors: false });
	return {
		form,
		style: { slug: style.slug, name: style.name, kind: style.kind, makingPrice: style.makingPrice, optionPrices: style.optionPrices },
		fabrics: fabrics.map((f) => ({ id: f.id, name: f.name, colour: f.colour, swatchHex: f.swatchHex, imageUrl: f.imageUploadId ? `/uploads/${f.imageUploadId}` : null, fibreContent: f.fibreContent, careText: f.careText, widthCm: f.widthCm, pricePerMetre: f.pricePerMetre, inStock: f.stockCm >= 100, nap: f.nap, stretch: f.stretch })),
		cards: cards.map((c) => ({ id: c.id, name: c.name, units: c.units, waist: c.waist, hip: c.hip, length: c.length, waistToHip: c.waistToHip, waistToKnee: c.waistToKnee, adjustments: c.adjustments ?? null })),
		defaultDepth: DEFAULT_RULES.defaultWaistToHip,
		defaultKnee: rules.kneeDepth,
		signedIn: Boolean(locals.user)
	};
};

export const actions: Actions = {
	add: async ({ request, params, cookies, locals }) => {
		const form = await superValidate(request, zod4(makeFormSchema));
		if (!form.valid) return fail(400, { form });
		const item = bagItemFrom(params.slug, form.data);
		// Drafted and priced on the server before it goes in the bag: an unknown style, fabric or an
		// undraftable figure is refused here, beside the form.
		const q = await quoteSkirt(db, item, { drawing: false });
		if (!q.ok) {
			// A figure she may confirm: the message goes beside the confirm box, which she ticks to go on.
			if (q.confirm) return setError(form, 'confirmed', q.confirm.suggestion === null ? q.confirm.message : `${q.confirm.message} Did you mean ${q.confirm.suggestion} ${form.data.units}?`);
			return setError(form, q.fields?.fabricId ? 'fabricId' : '', q.message);
		}
		if (!q.quote.fabric?.inStock) return setError(form, 'fabricId', 'There is not enough of this fabric left for your skirt: please choose another.');
		const bag = readBag(cookies);
		if (bag.length >= MAX_ITEMS) return setError(form, '', `Your bag holds ${MAX_ITEMS} skirts at most: check out first, then start another order.`);
		if (form.data.saveCard && locals.user) {
			const m = item.measurements;
			await db.insert(measurementProfiles).values({ userId: locals.user.id, name: form.data.cardName, waist: m.waist, hip: m.hip, length: m.length, waistToHip: m.waistToHip ?? null, waistToKnee: m.waistToKnee ?? null, adjustments: m.adjustments ?? null, units: item.units, consentAt: new Date() });
		}
		writeBag(cookies, [...bag, item]);
		redirect(303, '/bag');
	}
};
