import { fail } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { cardOf, cardsOf, deleteCard, setCardFit } from '$lib/server/account/cards';
import { ordersOfShopper } from '$lib/server/order/view';
import { deleteMeasurements } from '$lib/server/account/personal-data';
import { currentRules } from '$lib/server/house/rules';
import { checkCardFit, readCardFit } from '$lib/forms/card';
import { cardHistory } from '$lib/server/fit/card';
import type { Actions, PageServerLoad } from './$types';
import { requireRole, SIGNED_IN } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	const userId = requireRole(event, SIGNED_IN).id;
	const [cards, myOrders, history] = await Promise.all([
		cardsOf(db, userId),
		ordersOfShopper(db, userId, 5),
		cardHistory(db, userId)
	]);
	return {
		// Only what the page shows of each card.
		cards: cards.map((c) => ({ id: c.id, name: c.name, units: c.units, waist: c.waist, hip: c.hip, length: c.length, waistToHip: c.waistToHip, source: c.source, waistToKnee: c.waistToKnee, adjustments: c.adjustments })),
		orders: myOrders, defaultKnee: (await currentRules(db)).rules.kneeDepth, history: history.map((h) => ({ ...h, at: h.at.toISOString() })) };
};

export const actions: Actions = {
	// The knee length and the fit adjustments of one of her cards; nothing changes unless all are right.
	saveFit: async (event) => {
		const user = requireRole(event, SIGNED_IN);
		const data = await event.request.formData();
		const id = Number(data.get('id'));
		const none = 'We found no measure card of yours with that number, so nothing was changed.';
		if (!Number.isSafeInteger(id) || id <= 0) return fail(404, { message: none });
		const card = await cardOf(db, user.id, id);
		if (!card) return fail(404, { message: none });
		const { values, errors } = readCardFit(data);
		const checked = checkCardFit(card, values, errors);
		if (!checked.ok) return fail(400, { cardId: id, values, errors: checked.errors, message: 'Some values need a second look: nothing was changed.' });
		await setCardFit(db, user.id, id, { waistToKnee: checked.waistToKnee, adjustments: checked.adjustments });
		return { cardId: id, message: `Measure card “${card.name}” saved.` };
	},
	deleteCard: async (event) => {
		const user = requireRole(event, SIGNED_IN);
		const id = Number((await event.request.formData()).get('id'));
		const none = 'We found no measure card of yours with that number, so nothing was deleted.';
		if (!Number.isSafeInteger(id) || id <= 0) return fail(404, { message: none });
		if (!(await deleteCard(db, user.id, id))) return fail(404, { message: none });
		return { message: 'Measure card deleted.' };
	},
	deleteMeasurements: async (event) => {
		const r = await deleteMeasurements(db, requireRole(event, SIGNED_IN).id);
		return {
			message: `Deleted ${r.cards} measure card${r.cards === 1 ? '' : 's'} and the measurements of ${r.cleared} finished order${r.cleared === 1 ? '' : 's'}.${r.kept ? ` We keep them for ${r.kept} order${r.kept === 1 ? '' : 's'} still being made, and delete them when you ask again after it ships.` : ''}`
		};
	}
};
