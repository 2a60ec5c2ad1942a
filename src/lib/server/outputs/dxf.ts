// The open DXF of one order: every piece of every skirt on the order, as the pure writer in
// src/lib/drafting/drawing/dxf.ts lays it out (ASTM D6673 layers, millimetres).
import { piecesToDxf } from '$lib/drafting/drawing/dxf';
import type { Db } from '../db/client';
import { loadOrderDrafts } from './order-drafts';
import { safeName } from './problem';
import type { OutputFile } from './types';

export async function produceDxf(db: Db, orderId: number): Promise<OutputFile> {
	const order = await loadOrderDrafts(db, orderId);
	const many = order.lines.length > 1;
	const text = piecesToDxf({
		orderNumber: order.number,
		styleName: [...new Set(order.lines.map((l) => l.styleName))].join(', '),
		pieces: order.lines.flatMap((l) => l.draft.pieces.map((piece) => ({ piece, ...(many ? { line: l.index } : {}) })))
	});
	return { name: `${safeName(order.number)}-pattern.dxf`, mime: 'application/dxf', bytes: new TextEncoder().encode(text) };
}
