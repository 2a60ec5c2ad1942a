import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { lays } from '$lib/server/order/queue';
import { layGroups, LayRefused, makeLay, MAX_LAY_ORDERS, recentLays } from '$lib/server/order/lays';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const [byCloth, cloths, recent] = await Promise.all([lays(db), layGroups(db), recentLays(db)]);
	return { lays: byCloth, cloths, recent, max: MAX_LAY_ORDERS };
};

const id = z.coerce.number().int().positive().max(2_147_483_647);
const laySchema = z.object({
	fabricId: id,
	ids: z.array(id, { error: 'Tick the orders to lay together.' }).min(2, 'Tick at least two orders to lay together.').max(MAX_LAY_ORDERS, `Lay at most ${MAX_LAY_ORDERS} orders together.`)
});

export const actions: Actions = {
	lay: async (event) => {
		const user = requireRole(event, STAFF);
		const form = await event.request.formData();
		const parsed = laySchema.safeParse({ fabricId: form.get('fabricId'), ids: form.getAll('ids') });
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message, fabricId: Number(form.get('fabricId')) || null });
		let layId: number;
		try {
			layId = await makeLay(db, { fabricId: parsed.data.fabricId, orderIds: parsed.data.ids, actor: { id: user.id, label: user.name } });
		} catch (e) {
			if (e instanceof LayRefused) return fail(e.status, { message: e.message, fabricId: parsed.data.fabricId });
			throw e;
		}
		redirect(303, `/workroom/lays/${layId}`);
	}
};
