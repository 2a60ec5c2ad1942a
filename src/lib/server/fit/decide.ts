// The workroom decides a fit report: an alteration (the order takes the alteration path), a remake (a
// new order, no payment, straight into the queue), or a decline with a reason she reads. Each decision
// is one transaction with the report and the order locked; deciding twice finds the first decision.
import { and, count, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fitReports, orderEvents, orderLines, orders, styles, type FitCorrection } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { decisionMail } from '../mail/fit';
import { moveOrder, MoveRefused, type Actor, type Tx } from '../order/stage';
import { quoteSkirt } from '../quote/quote';
import { shopSettingsOf } from '../house/rules';
import { formatDate } from '$lib/format';
import { formatCm } from '$lib/drafting/units';
import type { ShopOptions } from '$lib/forms/quote';
import { changeWords, type CorrectableField } from '$lib/fit/report';
import { applyChanges, correctCard, type Figures } from './card';
import { draftInputOf, isErased } from '../order/lines';
import { fitLink } from './links';

export type Decision = {
	reportId: number;
	decision: 'alteration' | 'remake' | 'decline';
	reason: string;
	changes: Partial<Record<CorrectableField, number>>;
	actor: Actor;
	now?: Date;
};

export type DecideResult = { ok: true; remakeOrderId: number | null; remakeNumber: string | null; mailIds: number[] } | { ok: false; status: 400 | 404 | 409; message: string };

class Refused extends Error {
	constructor(
		public status: 400 | 404 | 409,
		message: string
	) {
		super(message);
	}
}

async function lockReport(tx: Tx, id: number) {
	const [report] = await tx.select().from(fitReports).where(eq(fitReports.id, id)).for('update');
	if (!report) throw new Refused(404, 'No such fit report.');
	if (report.status === 'decided') throw new Refused(409, 'This report has been decided already.');
	return report;
}

/** The first order of a chain of remakes: the free remakes are counted against it. */
const rootOf = (o: { id: number; remakeOfId: number | null }) => o.remakeOfId ?? o.id;

export async function remakesUsed(db: Pick<Db, 'select'>, rootId: number) {
	const [row] = await db.select({ n: count() }).from(orders).where(and(eq(orders.kind, 'remake'), eq(orders.remakeOfId, rootId)));
	return Number(row?.n ?? 0);
}

export async function decideReport(db: Db, d: Decision): Promise<DecideResult> {
	const reason = d.reason.trim().slice(0, 2000);
	if (d.decision === 'decline' && reason.length < 5) return { ok: false, status: 400, message: 'Say in a sentence why: she reads this reason in her mail and on her order page.' };
	const [head] = await db
		.select({ report: fitReports, order: orders, line: orderLines, styleSlug: styles.slug })
		.from(fitReports)
		.innerJoin(orders, eq(orders.id, fitReports.orderId))
		.innerJoin(orderLines, eq(orderLines.id, fitReports.orderLineId))
		.innerJoin(styles, eq(styles.id, orderLines.styleId))
		.where(eq(fitReports.id, d.reportId));
	if (!head) return { ok: false, status: 404, message: 'No such fit report.' };
	const { order, line } = head;
	// Erased at her request (her data page): nothing to correct or draft again from.
	if (isErased(line.measurements)) return { ok: false, status: 409, message: 'Her measurements for this order were erased at her request: ask her for them again before altering or remaking.' };
	const changes = d.decision === 'decline' ? {} : d.changes;
	// What changes against the first cut: the line's own figures, moved by the workroom's corrections.
	const first: Figures = { measurements: { ...line.measurements }, adjustments: line.adjustments ?? null };
	const { figures, list } = applyChanges(first, changes);
	const corrections: FitCorrection[] = list.map((c) => ({ field: c.field, from: c.from, to: c.to }));
	const words = corrections.map((c) => changeWords(c, formatCm));
	const why = reason || (d.decision === 'remake' ? 'We cut it again with the corrections below.' : 'We alter it with the corrections below.');
	const link = fitLink(order.number, '/fit');

	try {
		if (d.decision === 'decline') {
			const mailIds = await db.transaction(async (tx) => {
				await lockReport(tx, d.reportId);
				await tx.update(fitReports).set({ status: 'decided', decision: 'decline', reason: why, corrections: [], decidedBy: d.actor.id, decidedAt: d.now ?? new Date() }).where(eq(fitReports.id, d.reportId));
				await tx.insert(orderEvents).values({ orderId: order.id, actorId: d.actor.id, actorLabel: d.actor.label, kind: 'note', note: `Fit report declined: ${why}` });
				return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...decisionMail({ number: order.number, shopperName: order.shopperName, link, decision: 'decline', reason: why, changes: [] }) })];
			});
			return { ok: true, remakeOrderId: null, remakeNumber: null, mailIds };
		}

		if (d.decision === 'alteration') {
			const moved = await moveOrder(db, {
				orderId: order.id,
				to: 'awaiting_return',
				// A decision, not a hand move: the stage table offers no button for it.
				by: 'fit-decision',
				actor: d.actor,
				note: `Alteration after her fit report${words.length ? `: ${words.join('; ')}` : ''}`,
				alongside: async (tx, locked) => {
					await lockReport(tx, d.reportId);
					await correctCard(tx, { userId: order.userId, lineMeasurements: first.measurements, changes, reason: why, reportId: d.reportId, orderId: order.id, by: d.actor.id });
					await tx.update(fitReports).set({ status: 'decided', decision: 'alteration', reason: why, corrections, decidedBy: d.actor.id, decidedAt: d.now ?? new Date() }).where(eq(fitReports.id, d.reportId));
					return [await enqueueMail(tx, { to: order.email, orderId: order.id, ...decisionMail({ number: order.number, shopperName: order.shopperName, link, decision: 'alteration', reason: why, changes: words }) })];
				}
			});
			if (!moved.ok) return { ok: false, status: moved.status === 404 ? 404 : 409, message: moved.message };
			return { ok: true, remakeOrderId: null, remakeNumber: null, mailIds: moved.mailIds };
		}

		// Remake: drafted now with the corrected figures, from the house rules of today.
		const corrected = draftInputOf({ measurements: figures.measurements, options: line.options, adjustments: figures.adjustments });
		if (!corrected) return { ok: false, status: 409, message: 'Her measurements for this order were erased at her request: ask her for them again before remaking.' };
		const { style: _s, stretch: _st, ...options } = line.options as Record<string, unknown>;
		const q = await quoteSkirt(
			db,
			{ measurements: corrected.measurements, style: head.styleSlug, options: options as ShopOptions, fabricId: line.fabricId, units: 'cm' },
			{ now: d.now }
		);
		if (!q.ok) return { ok: false, status: q.status === 404 ? 409 : 400, message: `The remake cannot be drafted with these corrections: ${q.message}` };
		const settings = await shopSettingsOf(db, true);
		const result = await db.transaction(async (tx) => {
			const [locked] = await tx.select().from(orders).where(eq(orders.id, rootOf(order))).for('update');
			await lockReport(tx, d.reportId);
			const used = await remakesUsed(tx, locked.id);
			if (settings.freeRemakesPerOrder === 0) throw new Refused(409, 'The shop offers no free remakes (back office, Settings): choose an alteration, or decline with a reason.');
			if (used >= settings.freeRemakesPerOrder) {
				throw new Refused(409, `Order ${locked.number} has had its free remake${settings.freeRemakesPerOrder === 1 ? '' : 's'} already (${used} of ${settings.freeRemakesPerOrder}). Choose an alteration, or decline with a reason.`);
			}
			const [{ id }] = await tx
				.insert(orders)
				.values({
					number: `tmp-${crypto.randomUUID().slice(0, 12)}`,
					userId: order.userId,
					email: order.email,
					shopperName: order.shopperName,
					// Straight into the queue: a remake is never paid for, so it never waits for a payment and
					// its totals are zero (never takings). paidAt stays empty for the same reason.
					status: 'paid',
					currency: order.currency,
					subtotal: 0,
					shipping: 0,
					total: 0,
					promisedDate: q.quote.shipBy,
					shippingAddress: order.shippingAddress,
					houseRulesId: q.rulesId,
					kind: 'remake',
					remakeOfId: locked.id
				})
				.$returningId();
			const number = `QL-${1000 + id}`;
			await tx.update(orders).set({ number }).where(eq(orders.id, id));
			await tx.insert(orderLines).values({
				orderId: id,
				styleId: line.styleId,
				fabricId: line.fabricId,
				options: line.options,
				measurements: figures.measurements,
				adjustments: figures.adjustments,
				figuresSource: line.figuresSource,
				figures: q.line.draft.figures,
				fabricCm: q.quote.fabric!.lengthCm,
				pricing: { fabric: 0, making: 0, options: 0, total: 0 },
				lineTotal: 0
			});
			await tx.insert(orderEvents).values({ orderId: id, actorId: d.actor.id, actorLabel: d.actor.label, kind: 'stage', fromStatus: null, toStatus: 'paid', note: `Remake of ${order.number}, no payment` });
			await tx.insert(orderEvents).values({ orderId: order.id, actorId: d.actor.id, actorLabel: d.actor.label, kind: 'note', note: `Remake ordered as ${number}${words.length ? `: ${words.join('; ')}` : ''}` });
			await correctCard(tx, { userId: order.userId, lineMeasurements: first.measurements, changes, reason: why, reportId: d.reportId, orderId: order.id, by: d.actor.id });
			await tx.update(fitReports).set({ status: 'decided', decision: 'remake', reason: why, corrections, decidedBy: d.actor.id, decidedAt: d.now ?? new Date(), remakeOrderId: id }).where(eq(fitReports.id, d.reportId));
			const mailId = await enqueueMail(tx, { to: order.email, orderId: order.id, ...decisionMail({ number: order.number, shopperName: order.shopperName, link, decision: 'remake', reason: why, changes: words, remakeNumber: number, promisedDate: formatDate(q.quote.shipBy) }) });
			return { id, number, mailIds: [mailId] };
		});
		return { ok: true, remakeOrderId: result.id, remakeNumber: result.number, mailIds: result.mailIds };
	} catch (err) {
		if (err instanceof Refused) return { ok: false, status: err.status, message: err.message };
		throw err;
	}
}

/** Reads the workroom's change fields ("change.waist" = "+2") into changes in cm; problems by field. */
export function readChanges(form: FormData, fields: readonly { field: CorrectableField; label: string }[]) {
	const changes: Partial<Record<CorrectableField, number>> = {};
	const errors: Record<string, string> = {};
	for (const { field, label } of fields) {
		const raw = String(form.get(`change.${field}`) ?? '').trim().replace(',', '.');
		if (!raw || raw === '0') continue;
		const n = Number(raw);
		if (!Number.isFinite(n) || Math.abs(n) > 20) errors[`change.${field}`] = `${label}: give the change in cm, from −20 to +20 (e.g. +2 or -1.5).`;
		else if (n !== 0) changes[field] = Math.round(n * 10) / 10;
	}
	return { changes, errors };
}
