import { fail } from '@sveltejs/kit';
import { and, desc, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { measurementProfiles, orders } from '$lib/server/db/schema';
import { deleteMeasurements } from '$lib/server/account/personal-data';
import { currentRules } from '$lib/server/house/rules';
import { checkCardFit, readCardFit } from '$lib/forms/card';
import type { Actions, PageServerLoad } from './$types';
import { requireRole, SIGNED_IN } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	const userId = requireRole(event, SIGNED_IN).id;
	const [cards, myOrders] = await Promise.all([
		db
			.select({ id: measurementProfiles.id, name: measurementProfiles.name, units: measurementProfiles.units, waist: measurementProfiles.waist, hip: measurementProfiles.hip, length: measurementProfiles.length, waistToHip: measurementProfiles.waistToHip, waistToKnee: measurementProfiles.waistToKnee, adjustments: measurementProfiles.adjustments })
			.from(measurementProfiles).where(eq(measurementProfiles.userId, userId)).orderBy(desc(measurementProfiles.updatedAt)),
		db
			.select({ number: orders.number, status: orders.status, total: orders.total, currency: orders.currency, createdAt: orders.createdAt, promisedDate: orders.promisedDate })
			.from(orders)
			.where(eq(orders.userId, userId))
			.orderBy(desc(orders.createdAt))
			.limit(5)
	]);
	return { cards, orders: myOrders, defaultKnee: (await currentRules(db)).rules.kneeDepth };
};

export const actions: Actions = {
	// The knee length and the fit adjustments of one of her cards; nothing changes unless all are right.
	saveFit: async (event) => {
		const user = requireRole(event, SIGNED_IN);
		const data = await event.request.formData();
		const id = Number(data.get('id'));
		const none = 'We found no measure card of yours with that number, so nothing was changed.';
		if (!Number.isSafeInteger(id) || id <= 0) return fail(404, { message: none });
		const [card] = await db.select().from(measurementProfiles).where(and(eq(measurementProfiles.id, id), eq(measurementProfiles.userId, user.id)));
		if (!card) return fail(404, { message: none });
		const { values, errors } = readCardFit(data);
		const checked = checkCardFit(card, values, errors);
		if (!checked.ok) return fail(400, { cardId: id, values, errors: checked.errors, message: 'Some values need a second look: nothing was changed.' });
		await db.update(measurementProfiles).set({ waistToKnee: checked.waistToKnee, adjustments: checked.adjustments }).where(and(eq(measurementProfiles.id, id), eq(measurementProfiles.userId, user.id)));
		return { cardId: id, message: `Measure card “${card.name}” saved.` };
	},
	deleteCard: async (event) => {
		const user = requireRole(event, SIGNED_IN);
		const id = Number((await event.request.formData()).get('id'));
		const none = 'We found no measure card of yours with that number, so nothing was deleted.';
		if (!Number.isSafeInteger(id) || id <= 0) return fail(404, { message: none });
		// Only her own card: the user id is part of the condition, and the count says whether there was one.
		const [{ affectedRows }] = await db.delete(measurementProfiles).where(and(eq(measurementProfiles.id, id), eq(measurementProfiles.userId, user.id)));
		if (affectedRows === 0) return fail(404, { message: none });
		return { message: 'Measure card deleted.' };
	},
	deleteMeasurements: async (event) => {
		const r = await deleteMeasurements(db, requireRole(event, SIGNED_IN).id);
		return {
			message: `Deleted ${r.cards} measure card${r.cards === 1 ? '' : 's'} and the measurements of ${r.cleared} finished order${r.cleared === 1 ? '' : 's'}.${r.kept ? ` We keep them for ${r.kept} order${r.kept === 1 ? '' : 's'} still being made, and delete them when you ask again after it ships.` : ''}`
		};
	}
};
