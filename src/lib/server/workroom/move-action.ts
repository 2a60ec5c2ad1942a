import { fail, type RequestEvent } from '@sveltejs/kit';
import { stageSchema } from '../../forms/stage';
import { db } from '../db';
import { deliverQueued } from '../mail';
import { workroomMove } from './moves';

/** The `move` form action the workroom's and the back office's order pages share. */
export async function moveFromForm({ params, request, locals }: Pick<RequestEvent<{ id: string }>, 'params' | 'request' | 'locals'>) {
	const form = Object.fromEntries(await request.formData());
	const parsed = stageSchema.safeParse({ ...form, overrideStock: form.overrideStock === 'on' });
	if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
	const user = locals.user!;
	const result = await workroomMove(db, { orderId: Number(params.id), ...parsed.data, actor: { id: user.id, label: user.name, role: user.role } });
	if (!result.ok) return fail(result.status, { message: result.message });
	void deliverQueued(result.mailIds);
	return { moved: result.order.status };
}
