// Combined lays: paid orders of one cloth laid together on one spread. The view suggests groups (one
// cloth, promised in the same week); the cutter picks orders, the engine lays all their pieces, and the
// lay is stored so it can be reopened, drawn at full scale (loadLay) and marked cut once: every order in
// it moves to cutting with its event, and the whole lay's length comes off the shelf once, in one
// transaction with the lay, the orders and the fabric row locked.
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import {
	combinedLayOrders,
	combinedLays,
	fabrics,
	houseRules,
	orderEvents,
	orderLines,
	orders,
	styles,
	type CombinedLayLine,
	type Role
} from '../db/schema';
import { moveLocked, MoveRefused, type Actor } from './stage';
import { redraftLine } from '../outputs/ticket';
import { combinedLayInSlices, DraftInputError, type LayOrder, type Layout } from '$lib/drafting';
import { canMove, STAGE_LABELS } from '$lib/orders/stages';
import { formatMetres } from '$lib/format';
import { clothOf, cutterLayFits } from './cloth';

/** Most orders one combined lay takes (a six-order lay searches for about four seconds). */
export const MAX_LAY_ORDERS = 8;

export type LayCandidate = { id: number; number: string; promisedDate: string; firstName: string; styles: string[]; cm: number; openLay: number | null };
export type LayGroup = { week: string; orders: LayCandidate[] };
export type ClothGroups = {
	fabricId: number;
	fabric: string;
	colour: string;
	widthCm: number;
	stockCm: number;
	groups: LayGroup[];
	/** Orders of this cloth that also need another cloth: cut from their own page. */
	mixed: { id: number; number: string }[];
};

/** Monday of the week a date (YYYY-MM-DD) falls in. */
function weekOf(date: string): string {
	const d = new Date(`${date}T00:00:00Z`);
	d.setUTCDate(d.getUTCDate() - ((d.getUTCDay() + 6) % 7));
	return d.toISOString().slice(0, 10);
}

/** Paid orders by cloth, each cloth's orders grouped by the week they are promised in, soonest first. */
export async function layGroups(db: Db): Promise<ClothGroups[]> {
	const rows = await db
		.select({
			id: orders.id,
			number: orders.number,
			promisedDate: orders.promisedDate,
			name: orders.shopperName,
			fabricId: orderLines.fabricId,
			cm: orderLines.fabricCm,
			options: orderLines.options,
			fabric: { name: fabrics.name, colour: fabrics.colour, widthCm: fabrics.widthCm, stockCm: fabrics.stockCm }
		})
		.from(orders)
		.innerJoin(orderLines, eq(orderLines.orderId, orders.id))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(eq(orders.status, 'paid'))
		.orderBy(asc(orders.promisedDate), asc(orders.id), asc(orderLines.id));
	const open = rows.length
		? await db
				.select({ orderId: combinedLayOrders.orderId, layId: combinedLays.id })
				.from(combinedLayOrders)
				.innerJoin(combinedLays, eq(combinedLays.id, combinedLayOrders.layId))
				.where(and(eq(combinedLays.status, 'open'), inArray(combinedLayOrders.orderId, [...new Set(rows.map((r) => r.id))])))
				.orderBy(desc(combinedLays.id))
		: [];
	const styleNames = await styleNamesOf(db, rows.map((r) => r.id));
	const clothsOf = new Map<number, Set<number>>();
	for (const r of rows) clothsOf.set(r.id, (clothsOf.get(r.id) ?? new Set()).add(r.fabricId));
	const out = new Map<number, ClothGroups>();
	for (const r of rows) {
		let c = out.get(r.fabricId);
		if (!c) out.set(r.fabricId, (c = { fabricId: r.fabricId, fabric: r.fabric.name, colour: r.fabric.colour, widthCm: r.fabric.widthCm, stockCm: r.fabric.stockCm, groups: [], mixed: [] }));
		if (clothsOf.get(r.id)!.size > 1) {
			if (!c.mixed.some((m) => m.id === r.id)) c.mixed.push({ id: r.id, number: r.number });
			continue;
		}
		const week = weekOf(r.promisedDate);
		let g = c.groups.find((x) => x.week === week);
		if (!g) c.groups.push((g = { week, orders: [] }));
		const known = g.orders.find((o) => o.id === r.id);
		if (known) known.cm += r.cm;
		else
			g.orders.push({
				id: r.id,
				number: r.number,
				promisedDate: r.promisedDate,
				firstName: r.name.split(/\s+/)[0],
				styles: styleNames.get(r.id) ?? [],
				cm: r.cm,
				openLay: open.find((l) => l.orderId === r.id)?.layId ?? null
			});
	}
	return [...out.values()].filter((c) => c.groups.length || c.mixed.length);
}

async function styleNamesOf(db: Db, ids: number[]) {
	const m = new Map<number, string[]>();
	if (!ids.length) return m;
	const rows = await db
		.select({ orderId: orderLines.orderId, name: styles.name })
		.from(orderLines)
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.where(inArray(orderLines.orderId, [...new Set(ids)]));
	for (const r of rows) m.set(r.orderId, [...(m.get(r.orderId) ?? []), r.name]);
	return m;
}

export class LayRefused extends Error {
	constructor(
		public status: 400 | 404 | 409,
		message: string
	) {
		super(message);
	}
}

/** Yields to the event loop between slices of the search, so other requests are answered meanwhile. */
const pause = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Lays the chosen paid orders of one cloth together and stores the lay; returns its id. */
export async function makeLay(
	db: Db,
	input: { fabricId: number; orderIds: number[]; actor: Actor },
	search: { seconds?: number; seed?: number } = {}
): Promise<number> {
	const ids = [...new Set(input.orderIds)];
	if (ids.length < 2) throw new LayRefused(400, 'Tick at least two orders to lay together.');
	if (ids.length > MAX_LAY_ORDERS) throw new LayRefused(400, `Lay at most ${MAX_LAY_ORDERS} orders together.`);
	const [fabric] = await db.select().from(fabrics).where(eq(fabrics.id, input.fabricId));
	if (!fabric) throw new LayRefused(404, 'No such fabric.');
	const found = await db
		.select({ id: orders.id, number: orders.number, status: orders.status, rules: houseRules.rules })
		.from(orders)
		.innerJoin(houseRules, eq(houseRules.id, orders.houseRulesId))
		.where(inArray(orders.id, ids))
		.orderBy(asc(orders.promisedDate), asc(orders.id));
	if (found.length !== ids.length) throw new LayRefused(404, 'One of those orders no longer exists.');
	const lines = await db.select().from(orderLines).where(inArray(orderLines.orderId, ids)).orderBy(asc(orderLines.id));
	for (const o of found) {
		if (o.status !== 'paid') throw new LayRefused(409, `${o.number} is ${STAGE_LABELS[o.status]}: only paid orders are laid. Refresh the list.`);
		if (lines.some((l) => l.orderId === o.id && l.fabricId !== fabric.id))
			throw new LayRefused(400, `${o.number} needs another cloth as well: cut it from its own page.`);
	}
	const cloth = clothOf(fabric);
	const layOrders: LayOrder[] = [];
	const meta: CombinedLayLine[] = [];
	for (const o of found)
		for (const l of lines.filter((x) => x.orderId === o.id)) {
			let draft;
			try {
				draft = redraftLine({ rules: o.rules, line: l, fabric });
			} catch (e) {
				if (e instanceof DraftInputError) throw new LayRefused(409, `${o.number} no longer drafts from its stored figures: open its ticket.`);
				throw e;
			}
			meta.push({ lineId: l.id, orderId: o.id, number: o.number, group: layOrders.length, aloneCm: 0 });
			layOrders.push({ id: l.id, draft, aloneLength: cutterLayFits(l.cutterLay, fabric) ? l.cutterLay.length : undefined });
		}
	let lay;
	try {
		lay = await combinedLayInSlices(layOrders, cloth, { seconds: search.seconds ?? Math.min(8, 1 + 0.5 * layOrders.length), seed: search.seed ?? 1 }, pause);
	} catch (e) {
		if (e instanceof DraftInputError) throw new LayRefused(400, e.message);
		throw e;
	}
	lay.alone.forEach((a, i) => (meta[i].aloneCm = a.length));
	return db.transaction(async (tx) => {
		const [res] = await tx
			.insert(combinedLays)
			.values({
			fabricId: fabric.id,
			lengthCm: round1(lay.length),
			layCm: round1(lay.layout.layLength),
			savedCm: round1(lay.saved),
			utilisation: Math.round(lay.utilisation * 1e4) / 1e4,
			layout: lay.layout,
			lines: meta,
			createdBy: input.actor.id,
			createdByLabel: input.actor.label
			})
			.$returningId();
		await tx.insert(combinedLayOrders).values(ids.map((orderId) => ({ layId: res.id, orderId })));
		return res.id;
	});
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/** One piece of a stored lay in centimetres: x along the cloth from the lay's start, y across from the
 * fold (folded) or the near selvedge (open); the outline is the cutting line as laid. */
export type LaidPiece = { orderId: number; number: string; pieceId: string; name: string; layers: 1 | 2; orientation: string; outline: { x: number; y: number }[] };

export type StoredLay = {
	id: number;
	status: 'open' | 'cut';
	fabric: { id: number; name: string; colour: string; widthCm: number; stockCm: number };
	/** Fabric to take (cm, rounded to the sale step), the lay on the table, what it saves. */
	lengthCm: number;
	layCm: number;
	savedCm: number;
	utilisation: number;
	folded: boolean;
	/** Width the pieces lie across: half the shrunk width when folded, else all of it (cm). */
	laneCm: number;
	usableCm: number;
	notes: string[];
	orders: { id: number; number: string; status: string; aloneCm: number }[];
	pieces: LaidPiece[];
	/** The layout as the drawing model takes it (piece ids made unique per order). */
	layout: Layout;
	createdByLabel: string;
	createdAt: Date;
	cutByLabel: string | null;
	cutAt: Date | null;
};

/** A stored combined lay with its placements in cm (for the lays view and the full-scale lay output). */
export async function loadLay(db: Db, id: number): Promise<StoredLay | null> {
	if (!Number.isSafeInteger(id) || id <= 0) return null;
	const [row] = await db.select().from(combinedLays).where(eq(combinedLays.id, id));
	if (!row) return null;
	const [f] = await db.select().from(fabrics).where(eq(fabrics.id, row.fabricId));
	const orderIds = [...new Set(row.lines.map((l) => l.orderId))];
	const states = orderIds.length ? await db.select({ id: orders.id, status: orders.status }).from(orders).where(inArray(orders.id, orderIds)) : [];
	const byGroup = new Map(row.lines.map((l) => [l.group, l]));
	const pieces: LaidPiece[] = row.layout.pieces.map((p) => {
		const l = byGroup.get(p.group ?? 0);
		// Layout coordinates are x across, y along; the lay output wants x along the cloth, y across.
		return {
			orderId: l?.orderId ?? 0,
			number: l?.number ?? '',
			pieceId: p.pieceId,
			name: p.name,
			layers: p.layers,
			orientation: p.orientation,
			outline: p.outline.map((q) => ({ x: q.y, y: q.x }))
		};
	});
	return {
		id: row.id,
		status: row.status,
		fabric: { id: f.id, name: f.name, colour: f.colour, widthCm: f.widthCm, stockCm: f.stockCm },
		lengthCm: row.lengthCm,
		layCm: row.layCm,
		savedCm: row.savedCm,
		utilisation: row.utilisation,
		folded: row.layout.folded,
		laneCm: row.layout.laneWidth,
		usableCm: row.layout.usableWidth,
		notes: row.layout.notes,
		orders: orderIds.map((oid) => {
			const ls = row.lines.filter((l) => l.orderId === oid);
			return { id: oid, number: ls[0].number, status: states.find((s) => s.id === oid)?.status ?? 'cancelled', aloneCm: round1(ls.reduce((a, l) => a + l.aloneCm, 0)) };
		}),
		pieces,
		layout: { ...row.layout, pieces: row.layout.pieces.map((p) => ({ ...p, pieceId: `${p.group ?? 0}:${p.pieceId}` })) },
		createdByLabel: row.createdByLabel,
		createdAt: row.createdAt,
		cutByLabel: row.cutByLabel,
		cutAt: row.cutAt
	};
}

/** Stored lays, newest first (the view's list to reopen). */
export async function recentLays(db: Db, limit = 20) {
	return db
		.select({ id: combinedLays.id, status: combinedLays.status, lengthCm: combinedLays.lengthCm, savedCm: combinedLays.savedCm, utilisation: combinedLays.utilisation, lines: combinedLays.lines, fabric: fabrics.name, colour: fabrics.colour, createdAt: combinedLays.createdAt })
		.from(combinedLays)
		.innerJoin(fabrics, eq(fabrics.id, combinedLays.fabricId))
		.orderBy(desc(combinedLays.id))
		.limit(limit)
		.then((rows) => rows.map(({ lines, ...r }) => ({ ...r, numbers: [...new Set(lines.map((l) => l.number))] })));
}

export type CutResult = { ok: true; moved: string[]; takenCm: number } | { ok: false; status: 404 | 409; message: string };

/**
 * Marks a stored lay cut, all in one transaction: the lay row is locked first (a second cutter marking
 * the same lay waits here, then finds it cut and gets 409), then its orders in id order (the same order
 * every path locks them, so two lays sharing an order cannot deadlock), then the fabric row. Every order
 * must still be paid; each moves to cutting with its own event; the lay's length comes off stock once.
 */
export async function markLayCut(db: Db, input: { layId: number; actor: Actor & { role: Role }; overrideStock?: boolean }): Promise<CutResult> {
	try {
		return await db.transaction(async (tx) => {
			const [lay] = await tx.select().from(combinedLays).where(eq(combinedLays.id, input.layId)).for('update');
			if (!lay) throw new MoveRefused(404, 'No such lay.');
			if (lay.status === 'cut') {
				const when = lay.cutAt ? ` at ${lay.cutAt.toISOString().slice(11, 16)} UTC on ${lay.cutAt.toISOString().slice(0, 10)}` : '';
				throw new MoveRefused(409, `This lay was already marked cut by ${lay.cutByLabel ?? 'someone'}${when}. Nothing was changed: the cloth was taken off once.`);
			}
			const ids = (await tx.select({ orderId: combinedLayOrders.orderId }).from(combinedLayOrders).where(eq(combinedLayOrders.layId, lay.id))).map((r) => r.orderId);
			const rows = ids.length ? await tx.select().from(orders).where(inArray(orders.id, ids)).orderBy(asc(orders.id)).for('update') : [];
			if (!rows.length) throw new MoveRefused(409, 'This lay has no orders left to cut.');
			for (const o of rows)
				if (!canMove(o.status, 'cutting'))
					throw new MoveRefused(409, `${o.number} is ${STAGE_LABELS[o.status]} now, so this lay cannot be cut as it stands: make a new lay without it. Nothing was changed.`);
			const [f] = await tx.select().from(fabrics).where(eq(fabrics.id, lay.fabricId)).for('update');
			if (f.stockCm < lay.lengthCm && !(input.overrideStock && input.actor.role === 'owner'))
				throw new MoveRefused(409, `Not enough ${f.name} (${f.colour}) on the shelf: ${formatMetres(f.stockCm)} left, this lay needs ${formatMetres(lay.lengthCm)}. Count the bolt again, or ask the owner to override.`);
			await tx.update(fabrics).set({ stockCm: round1(f.stockCm - lay.lengthCm) }).where(eq(fabrics.id, f.id));
			const numbers = rows.map((o) => o.number);
			// Each order through the one stage move (its lock is held already), with its own event.
			for (const o of rows)
				await moveLocked(tx, o, {
					to: 'cutting',
					actor: input.actor,
					note: `Cut on lay ${lay.id} with ${numbers.filter((n) => n !== o.number).join(', ')}: ${formatMetres(lay.lengthCm)} of ${f.name} taken off once for the whole lay.`
				});
			await tx.update(combinedLays).set({ status: 'cut', cutBy: input.actor.id, cutByLabel: input.actor.label, cutAt: new Date() }).where(eq(combinedLays.id, lay.id));
			return { ok: true as const, moved: numbers, takenCm: lay.lengthCm };
		});
	} catch (err) {
		if (err instanceof MoveRefused) return { ok: false, status: err.status, message: err.message };
		throw err;
	}
}
