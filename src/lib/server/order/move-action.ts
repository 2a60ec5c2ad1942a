import { fail, type RequestEvent } from '@sveltejs/kit';
import { stageSchema } from '$lib/forms/stage';
import type { Role } from '../db/schema';
import { requireRole } from '../access';
import { db } from '../db';
import { deliverQueued } from '../mail';
import { workroomMove } from './moves';

/** The `move` form action the workroom's and the back office's order pages share; each page says who may use it. */
export async function moveFromForm(event: RequestEvent<{ id: string }>, roles: readonly Role[]) {
	const user = requireRole(event, roles);
	const form = Object.fromEntries(await event.request.formData());
	const parsed = stageSchema.safeParse({ ...form, overrideStock: form.overrideStock === 'on' });
	if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
	const result = await workroomMove(db, { orderId: Number(event.params.id), ...parsed.data, actor: { id: user.id, label: user.name, role: user.role } });
	if (!result.ok) return fail(result.status, { message: result.message });
	void deliverQueued(result.mailIds);
	return { moved: result.order.status };
}
