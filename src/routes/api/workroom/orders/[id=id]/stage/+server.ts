import { json } from '@sveltejs/kit';
import type { FailureAnswer, StageMovedAnswer } from '$lib/api/answers';
import { fieldErrors } from '$lib/forms/errors';
import { stageSchema } from '$lib/forms/stage';
import { requireRole, STAFF } from '$lib/server/access';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { workroomMove } from '$lib/server/order/moves';
import type { RequestHandler } from './$types';

// POST { to, note?, carrier?, tracking?, overrideStock? }: 200 with the new stage, 409 when the
// move is not allowed from the order's stage (or another cutter got there first).
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, STAFF);
	const id = Number(event.params.id);
	const body = await event.request.json().catch(() => null);
	const parsed = stageSchema.safeParse(body);
	if (!parsed.success) return json({ message: 'Some values need a second look.', fields: fieldErrors(parsed.error) } satisfies FailureAnswer, { status: 400 });
	const result = await workroomMove(db, { orderId: id, ...parsed.data, actor: { id: user.id, label: user.name, role: user.role } });
	if (!result.ok) return json({ message: result.message } satisfies FailureAnswer, { status: result.status });
	void deliverQueued(result.mailIds);
	return json({ id, status: result.order.status } satisfies StageMovedAnswer);
};
