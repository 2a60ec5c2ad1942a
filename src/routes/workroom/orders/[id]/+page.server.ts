import { error, fail } from '@sveltejs/kit';
import { stageSchema } from '$lib/forms/stage';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { workroomMove } from '$lib/server/workroom/moves';
import { staffOrder } from '$lib/server/workroom/order';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const found = await staffOrder(db, Number(params.id));
	if (!found) error(404, 'No such order.');
	return found;
};

export const actions: Actions = {
	move: async ({ params, request, locals }) => {
		const form = Object.fromEntries(await request.formData());
		const parsed = stageSchema.safeParse({ ...form, overrideStock: form.overrideStock === 'on' });
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
		const user = locals.user!;
		const result = await workroomMove(db, { orderId: Number(params.id), ...parsed.data, actor: { id: user.id, label: user.name, role: user.role } });
		if (!result.ok) return fail(result.status, { message: result.message });
		void deliverQueued(result.mailIds);
		return { moved: result.order.status };
	}
};
