import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { orderEvents, orders } from '../db/schema';
import { canMove, STAGE_LABELS, type OrderStage } from '$lib/orders/stages';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type Actor = { id: string | null; label: string };
type OrderRow = typeof orders.$inferSelect;

export type MoveResult =
	| { ok: true; order: OrderRow; mailIds: number[] }
	| { ok: false; status: 404 | 409; message: string };

export class MoveRefused extends Error {
	constructor(
		public status: 404 | 409,
		message: string
	) {
		super(message);
	}
}

/**
 * Moves an order to another stage in one transaction: the order row is locked, the move checked
 * against the allowed ones, the stage and its audit event written together, and `alongside` runs in
 * the same transaction (stock, mail to queue). Two people moving the same order at once: the
 * second waits for the lock, then finds the stage changed and gets 409.
 */
export async function moveOrder(
	db: Db,
	input: {
		orderId: number;
		to: OrderStage;
		actor: Actor;
		note?: string | null;
		/** moves the payment provider makes (paid, refunded) skip the hand-move table */
		system?: boolean;
		set?: Partial<Pick<OrderRow, 'carrier' | 'trackingNumber' | 'paidAt' | 'refundedTotal'>>;
		alongside?: (tx: Tx, order: OrderRow) => Promise<number[] | void>;
	}
): Promise<MoveResult> {
	try {
		return await db.transaction(async (tx) => {
			const [order] = await tx.select().from(orders).where(eq(orders.id, input.orderId)).for('update');
			if (!order) throw new MoveRefused(404, 'No such order.');
			if (!input.system && !canMove(order.status, input.to)) {
				throw new MoveRefused(409, `This order is ${STAGE_LABELS[order.status]}: it cannot be moved to ${STAGE_LABELS[input.to]}.`);
			}
			const mailIds = (await input.alongside?.(tx, order)) ?? [];
			await tx.update(orders).set({ status: input.to, ...input.set }).where(eq(orders.id, order.id));
			await tx.insert(orderEvents).values({
				orderId: order.id,
				actorId: input.actor.id,
				actorLabel: input.actor.label,
				kind: 'stage',
				fromStatus: order.status,
				toStatus: input.to,
				note: input.note ?? null
			});
			return { ok: true as const, order: { ...order, status: input.to, ...input.set }, mailIds };
		});
	} catch (err) {
		if (err instanceof MoveRefused) return { ok: false, status: err.status, message: err.message };
		throw err;
	}
}
