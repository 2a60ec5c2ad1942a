import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { moveFromForm } from '$lib/server/order/move-action';
import { orderForWorkroom } from '$lib/server/order/workroom-view';
import { paperChoiceOf } from '$lib/server/outputs/preference';
import { shopSettingsOf } from '$lib/server/house/rules';
import { remakeChanges } from '$lib/server/fit/remake-changes';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const found = await orderForWorkroom(db, Number(event.params.id));
	if (!found) error(404, 'No such order.');
	const user = event.locals.user;
	const [choice, settings] = await Promise.all([user ? paperChoiceOf(db, user.id) : null, shopSettingsOf(db)]);
	// The paper offered first: the one this person chose last, else the shop's paper size.
	const paper = choice?.paper ?? (settings.paperSize === 'Letter' ? 'letter' : 'a4');
	return { ...found, remake: await remakeChanges(db, found.order.id), output: { paper, rollWidthCm: choice?.rollWidthCm ?? settings.plotterWidthCm } };
};

export const actions: Actions = {
	move: (event) => moveFromForm(event, STAFF)
};
