import { eq } from 'drizzle-orm';
import { failure, type Failure } from '$lib/failure';
import type { Db } from '../db/client';
import { orderEvents, orders } from '../db/schema';
import { canMove, STAGE_LABELS, type Mover, type OrderStage } from '$lib/orders/stages';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type Actor = { id: string | null; label: string };
type OrderRow = typeof orders.$inferSelect;

export type MoveResult =
	| { ok: true; order: OrderRow; mailIds: number[] }
	| Failure;

export class MoveRefused extends Error {
	constructor(
		public status: 404 | 409,
		message: string
	) {
		super(message);
	}
}

type MoveInput = {
	to: OrderStage;
	actor: Actor;
	note?: string | null;
	/** A person's move (the workroom's table of moves) or the payment provider's (paid, refunded). */
	by?: Mover;
	set?: Partial<Pick<OrderRow, 'carrier' | 'trackingNumber' | 'paidAt' | 'refundedTotal'>>;
	alongside?: (tx: Tx, order: OrderRow) => Promise<number[] | void>;
};

/**
 * Moves an order to another stage in one transaction: the order row is locked, the move checked
 * against the allowed ones, the stage and its audit event written together, and `alongside` runs in
 * the same transaction (stock, mail to queue). Two people moving the same order at once: the
 * second waits for the lock, then finds the stage changed and gets 409.
 */
export async function moveOrder(db: Db, input: MoveInput & { orderId: number }): Promise<MoveResult> {
	try {
		return await db.transaction(async (tx) => {
			const [order] = await tx.select().from(orders).where(eq(orders.id, input.orderId)).for('update');
			if (!order) throw new MoveRefused(404, 'No such order.');
			return { ok: true as const, ...(await moveLocked(tx, order, input)) };
		});
	} catch (err) {
		if (err instanceof MoveRefused) return failure(err.status, err.message);
		throw err;
	}
}

/**
 * The move itself, inside a transaction that already holds the order's row lock (the payment webhook
 * takes it first, with the payment row after it, in the order every path locks them). Throws
 * MoveRefused when the move is not one the mover may make.
 */
export async function moveLocked(tx: Tx, order: OrderRow, input: MoveInput): Promise<{ order: OrderRow; mailIds: number[] }> {
	if (!canMove(order.status, input.to, input.by)) {
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
	return { order: { ...order, status: input.to, ...input.set }, mailIds };
}

/** A note on the order's timeline, for the team. */
export async function addNote(db: Db, orderId: number, actor: Actor, note: string) {
	await db.insert(orderEvents).values({ orderId, actorId: actor.id, actorLabel: actor.label, kind: 'note', note });
}
