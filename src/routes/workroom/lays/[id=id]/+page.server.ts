import { error, fail } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { requireRole, STAFF } from '$lib/server/access';
import { loadLay, markLayCut } from '$lib/server/order/lays';
import { drawingToSvg } from '$lib/drafting/svg';
import { markerDrawing } from '$lib/drafting/drawing/marker';
import { estimateWidth } from '$lib/drafting/drawing/model';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, STAFF);
	const lay = await loadLay(db, Number(event.params.id));
	if (!lay) error(404, 'No such lay.');
	// Pieces are numbered by their order's place in the list (1 for the first order, …).
	const place = new Map(lay.orders.map((o, i) => [o.id, i + 1]));
	const groupOrder = new Map(lay.pieces.map((p, i) => [lay.layout.pieces[i].pieceId, place.get(p.orderId) ?? 0]));
	const svg = drawingToSvg(
		markerDrawing(lay.layout, `Combined lay ${lay.id}: ${lay.orders.map((o) => o.number).join(', ')}`, (pid) => groupOrder.get(pid) ?? 0, estimateWidth)
	);
	const { pieces: _pieces, layout: _layout, ...shown } = lay;
	return { lay: shown, svg, pieceCount: lay.pieces.length };
};

export const actions: Actions = {
	cut: async (event) => {
		const user = requireRole(event, STAFF);
		const form = await event.request.formData();
		const result = await markLayCut(db, {
			layId: Number(event.params.id),
			actor: { id: user.id, label: user.name, role: user.role },
			overrideStock: form.get('overrideStock') === 'on'
		});
		if (!result.ok) return fail(result.status, { message: result.message });
		return { cut: result.moved, takenCm: result.takenCm };
	}
};
