import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { moveFromForm } from '$lib/server/order/move-action';
import { orderForWorkroom } from '$lib/server/order/workroom-view';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const found = await orderForWorkroom(db, Number(event.params.id));
	if (!found) error(404, 'No such order.');
	return found;
};

export const actions: Actions = {
	move: (event) => moveFromForm(event, STAFF)
};
