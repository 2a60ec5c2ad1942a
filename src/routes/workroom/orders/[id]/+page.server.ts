import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { moveFromForm } from '$lib/server/workroom/move-action';
import { staffOrder } from '$lib/server/workroom/order';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const found = await staffOrder(db, Number(params.id));
	if (!found) error(404, 'No such order.');
	return found;
};

export const actions: Actions = {
	move: moveFromForm
};
