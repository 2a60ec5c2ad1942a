import { error, fail, redirect } from '@sveltejs/kit';
import { setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { bagItemFrom, makeFormSchema } from '$lib/forms/make';
import { db } from '$lib/server/db';
import { cardsOf, saveCard } from '$lib/server/account/cards';
import { listFabrics, styleBySlug } from '$lib/server/catalogue/listing';
import { MAX_ITEMS, readBag, writeBag } from '$lib/server/quote/bag';
import { quoteSkirt } from '$lib/server/quote/quote';
import { currentRules } from '$lib/server/house/rules';
import { formatCm } from '$lib/drafting/units';
import { changeWords } from '$lib/fit/report';
import { cardHistory } from '$lib/server/fit/card';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, locals }) => {
	const style = await styleBySlug(db, params.slug);
	if (!style || style.retiredAt) error(404, 'We do not make that style.');
	const [fabrics, cards, { rules }, history] = await Promise.all([
		listFabrics(db),
		locals.user ? cardsOf(db, locals.user.id) : [],
		currentRules(db),
		locals.user ? cardHistory(db, locals.user.id) : []
	]);
	// The atelier's corrections on each card, in words, newest first ("Waist 70 → 72 cm after order QL-1001").
	const corrections = (id: number) => history.filter((h) => h.profileId === id).map((h) => `${changeWords(h, formatCm)}${h.order ? ` after order ${h.order}` : ''}`);
	const form = await superValidate(zod4(makeFormSchema), { errors: false });
	return {
		form,
		style: { slug: style.slug, name: style.name, kind: style.kind, makingPrice: style.makingPrice, optionPrices: style.optionPrices },
		fabrics: fabrics.map((f) => ({ id: f.id, name: f.name, colour: f.colour, swatchHex: f.swatchHex, imageUrl: f.imageUploadId ? `/uploads/${f.imageUploadId}` : null, fibreContent: f.fibreContent, careText: f.careText, widthCm: f.widthCm, pricePerMetre: f.pricePerMetre, inStock: f.stockCm >= 100, nap: f.nap, stretch: f.stretch })),
		cards: cards.map((c) => ({ id: c.id, name: c.name, units: c.units, waist: c.waist, hip: c.hip, length: c.length, waistToHip: c.waistToHip, waistToKnee: c.waistToKnee, adjustments: c.adjustments ?? null, corrections: corrections(c.id), source: c.source })),
		// The house rules the browser drafts her skirt with, so its drawing is the one the workroom cuts.
		rules,
		defaultDepth: rules.defaultWaistToHip,
		defaultKnee: rules.kneeDepth,
		// The ease the draft adds, taken off the widths of a skirt laid flat (the no-tape way in).
		ease: rules.ease,
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
		const q = await quoteSkirt(db, item);
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
			const card = { name: form.data.cardName, waist: m.waist, hip: m.hip, length: m.length, waistToHip: m.waistToHip ?? null, waistToKnee: m.waistToKnee ?? null, adjustments: m.adjustments ?? null, units: item.units, source: item.figuresSource, consentAt: new Date() };
			// A new card, or over one of her own (chart or flat-garment figures replaced by measured ones).
			if (!(await saveCard(db, locals.user.id, card, form.data.replaceCardId)))
				return setError(form, 'replaceCardId', 'We found no measure card of yours with that number: choose one of yours, or save a new card.');
		}
		writeBag(cookies, [...bag, item]);
		redirect(303, '/bag');
	}
};
