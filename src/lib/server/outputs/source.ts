// What the full-scale files of one order are drawn from: every order line re-drafted exactly as its
// cutting ticket is (same house rules version, same stored measurements), so the ticket, the tiled print,
// the roll, the projector file and the lay all show the same pieces.
import { eq } from 'drizzle-orm';
import { DraftInputError, type Piece } from '$lib/drafting';
import type { Layout } from '$lib/drafting/fabric';
import { cutterLay } from '$lib/drafting/nest/cutter';
import type { Db } from '../db/client';
import { orderLines, orders, styles } from '../db/schema';
import { loadTickets } from './ticket-load';
import type { Ticket } from './ticket';
import { OutputError } from './errors';

/** One piece to print, with the order line it belongs to. */
export interface SourcePiece {
	piece: Piece;
	/** 1-based order line, shown when an order has more than one skirt. */
	line: number;
	lines: number;
}

export interface PatternSource {
	orderId: number;
	number: string;
	tickets: Ticket[];
	pieces: SourcePiece[];
}

/** The pieces of every order line, in the ticket's order. */
export function sourceOf(tickets: Ticket[]): PatternSource {
	if (!tickets.length) throw new OutputError(404, 'This order has no skirt drafted.');
	return {
		orderId: tickets[0].orderId,
		number: tickets[0].number,
		tickets,
		pieces: tickets.flatMap((t) => t.draft.pieces.map((piece) => ({ piece, line: t.line.index, lines: t.line.count })))
	};
}

/** Loads and re-drafts an order, or says why its pattern cannot be printed. */
export async function loadPatternSource(db: Db, orderId: number): Promise<PatternSource> {
	const rows = await db
		.select({ style: styles.name, retiredAt: styles.retiredAt })
		.from(orders)
		.leftJoin(orderLines, eq(orderLines.orderId, orders.id))
		.leftJoin(styles, eq(styles.id, orderLines.styleId))
		.where(eq(orders.id, orderId));
	if (!rows.length) throw new OutputError(404, `There is no order ${orderId}.`);
	const retired = rows.find((r) => r.retiredAt);
	// A retired style's block is no longer kept up to date with the house rules: its full-scale pattern
	// is not issued again (the ticket, already printed, still says what was cut).
	if (retired) throw new OutputError(404, `The style “${retired.style}” is retired: its full-scale pattern is no longer issued.`);
	let found;
	try {
		[found] = await loadTickets(db, [orderId]);
	} catch (e) {
		if (e instanceof DraftInputError) throw new OutputError(422, `This order cannot be drafted again: ${e.message}`);
		throw e;
	}
	if (!found || !found.tickets.length) throw new OutputError(404, 'This order has no skirt drafted.');
	return sourceOf(found.tickets);
}

/** A skirt's lay for its full-scale marker: the fabric each piece is cut from, on its own lay. */
export interface SourceLay {
	ticket: Ticket;
	fabric: 'shell' | 'lining';
	layout: Layout;
}

/** Bound on the cutter's search: the same lay every time it is asked for (the seed fixes the rest). */
const LAY_EVALUATIONS = 300;

/**
 * The lay of each order line as the engine lays it on the order's cloth: the one place the lay PDF asks
 * the engine, so a stored or combined lay can take its place without the drawing changing. The cutter's
 * search, bounded by a count of lays tried rather than by time, so every download shows the same lay.
 */
export function laysOf(src: PatternSource): SourceLay[] {
	const out: SourceLay[] = [];
	for (const t of src.tickets) {
		const fabric = { width: t.fabric.widthCm, nap: t.fabric.nap, shrinkage: t.fabric.shrinkagePct };
		try {
			out.push({ ticket: t, fabric: 'shell', layout: cutterLay(t.draft, fabric, { evaluations: LAY_EVALUATIONS, seed: 1 }).layout });
		} catch (e) {
			throw new OutputError(422, `Skirt ${t.line.index} of order ${t.number} cannot be laid on its cloth: ${e instanceof Error ? e.message : String(e)}`);
		}
	}
	return out;
}
