import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { moveFromForm } from '$lib/server/order/move-action';
import { orderForWorkroom } from '$lib/server/order/workroom-view';
import { paperChoiceOf } from '$lib/server/outputs/preference';
import { a0FitsOrder } from '$lib/server/outputs/sheet';
import { shopSettingsOf } from '$lib/server/house/rules';
import { remakeChanges } from '$lib/server/fit/remake-changes';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const found = await orderForWorkroom(db, Number(event.params.id));
	if (!found) error(404, 'No such order.');
	const user = event.locals.user;
	const [choice, settings, a0Fits] = await Promise.all([user ? paperChoiceOf(db, user.id) : null, shopSettingsOf(db), a0FitsOrder(db, found.order.id)]);
	// The paper offered first: the one this person chose last, else the shop's paper size; the roll when
	// her last choice was A0 and this order's pieces need more than one sheet.
	const remembered = choice?.paper === 'a0' && a0Fits === false ? 'roll' : choice?.paper;
	const paper = remembered ?? (settings.paperSize === 'Letter' ? 'letter' : 'a4');
	return { ...found, remake: await remakeChanges(db, found.order.id), output: { paper, rollWidthCm: choice?.rollWidthCm ?? settings.plotterWidthCm, a0Fits } };
};

export const actions: Actions = {
	move: (event) => moveFromForm(event, STAFF)
};
