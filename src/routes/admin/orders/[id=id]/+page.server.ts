import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { db } from '$lib/server/db';
import { addNote } from '$lib/server/order/stage';
import { requestRefund } from '$lib/server/order/refund';
import { stripe } from '$lib/server/order/payments/stripe';
import { moveFromForm } from '$lib/server/order/move-action';
import { orderForOwner } from '$lib/server/order/workroom-view';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const found = await orderForOwner(db, Number(event.params.id));
	if (!found) error(404, 'No such order.');
	// The refund form's own key, made as the page loads: the same form sent twice is one refund.
	return { ...found, refundKey: crypto.randomUUID() };
};

const refundSchema = z.object({
	amount: z.coerce.number({ error: 'Enter the amount to refund as a number, such as 12.50.' }).positive('Enter the amount to refund as a number, such as 12.50.').max(1_000_000),
	reason: z.string().trim().max(200).default(''),
	refundKey: z.string({ error: 'This refund form is out of date: reload the page and send it again.' }).regex(/^[A-Za-z0-9-]{16,64}$/, 'This refund form is out of date: reload the page and send it again.')
});

export const actions: Actions = {
	note: async (event) => {
		const user = requireRole(event, OWNER);
		const { params } = event;
		const note = String((await event.request.formData()).get('note') ?? '').trim();
		if (!note) return fail(400, { message: 'Write the note first.' });
		if (note.length > 2000) return fail(400, { message: 'Keep a note under 2000 characters.' });
		await addNote(db, Number(params.id), { id: user.id, label: user.name }, note);
		return { message: 'Note added.' };
	},
	refund: async (event) => {
		const user = requireRole(event, OWNER);
		const { params } = event;
		const parsed = refundSchema.safeParse(Object.fromEntries(await event.request.formData()));
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
		const r = await requestRefund(db, stripe(), Number(params.id), parsed.data.amount, { id: user.id, label: user.name }, parsed.data.reason, parsed.data.refundKey);
		if (!r.ok) return fail(400, { message: r.message });
		return { message: r.message };
	},
	move: (event) => moveFromForm(event, OWNER)
};
