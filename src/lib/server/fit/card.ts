// Her measure card learns: the workroom's corrections change its figures, each change kept with its
// reason and the report it came from. A guest has no card: her corrections are kept against the order.
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import type { Tx } from '../order/stage';
import { measureCardChanges, measurementProfiles, orders, fitReports } from '../db/schema';
import type { FitAdjustments } from '$lib/drafting/fit';
import { CORRECTABLE, type CorrectableField } from '$lib/fit/report';
import type { StoredMeasurements } from '../order/lines';

type Reader = Pick<Db, 'select'>;
export type Figures = { measurements: StoredMeasurements; adjustments: FitAdjustments | null };

type MeasureField = 'waist' | 'hip' | 'length' | 'waistToHip';
const MEASUREMENT_FIELDS = new Set<string>(['waist', 'hip', 'length', 'waistToHip']);
const isMeasure = (field: string): field is MeasureField => MEASUREMENT_FIELDS.has(field);
const round1 = (n: number) => Math.round(n * 10) / 10;

/** A figure by its correction field name: a measurement, or an adjustment ("ease.waist"). */
export function figureOf(f: Figures, field: string): number | null {
	if (isMeasure(field)) return f.measurements[field] ?? null;
	const a = (f.adjustments ?? {}) as Record<string, unknown>;
	if (field.startsWith('ease.')) return ((a.ease as Record<string, number> | undefined)?.[field.slice(5)] ?? null) as number | null;
	return (a[field] as number | undefined) ?? null;
}

/** The figures with one field set (a copy). */
export function withFigure(f: Figures, field: string, value: number): Figures {
	if (isMeasure(field)) return { ...f, measurements: { ...f.measurements, [field]: value } };
	const a = structuredClone(f.adjustments ?? {}) as Record<string, unknown>;
	if (field.startsWith('ease.')) a.ease = { ...((a.ease as object) ?? {}), [field.slice(5)]: value };
	else a[field] = value;
	return { ...f, adjustments: a as FitAdjustments };
}

/** The changes applied to the figures: each field's from and to (from may be none). */
export function applyChanges(f: Figures, changes: Partial<Record<CorrectableField, number>>) {
	let out = f;
	const list: { field: CorrectableField; from: number | null; to: number }[] = [];
	for (const { field } of CORRECTABLE) {
		const d = changes[field];
		if (!d) continue;
		const from = figureOf(out, field);
		// A measurement the card never had (the waist-to-hip depth when assumed) has no base to move from.
		if (from === null && MEASUREMENT_FIELDS.has(field)) continue;
		const to = round1((from ?? 0) + d);
		out = withFigure(out, field, to);
		list.push({ field, from, to });
	}
	return { figures: out, list };
}

/**
 * Her card an order was drafted from: the signed-in shopper's card with the line's waist, hip and length,
 * or her most recently changed card. Null for a guest or a shopper without a card.
 */
export async function cardFor(db: Reader, userId: string | null, m: { waist?: number | null; hip?: number | null; length?: number | null }) {
	if (!userId) return null;
	const cards = await db.select().from(measurementProfiles).where(eq(measurementProfiles.userId, userId)).orderBy(desc(measurementProfiles.updatedAt));
	return cards.find((c) => c.waist === m.waist && c.hip === m.hip && c.length === m.length) ?? cards[0] ?? null;
}

/** Writes the corrections on her card (row locked) and one history row each. */
export async function correctCard(
	tx: Tx,
	input: { userId: string | null; lineMeasurements: StoredMeasurements; changes: Partial<Record<CorrectableField, number>>; reason: string; reportId: number; orderId: number; by: string | null }
) {
	const card = await cardFor(tx, input.userId, input.lineMeasurements);
	if (card) await tx.select({ id: measurementProfiles.id }).from(measurementProfiles).where(eq(measurementProfiles.id, card.id)).for('update');
	const base: Figures = card
		? { measurements: { waist: card.waist, hip: card.hip, length: card.length, waistToHip: card.waistToHip }, adjustments: card.adjustments ?? null }
		: { measurements: input.lineMeasurements, adjustments: null };
	const { figures, list } = applyChanges(base, input.changes);
	if (card && list.length) {
		await tx
			.update(measurementProfiles)
			.set({ waist: figures.measurements.waist, hip: figures.measurements.hip, length: figures.measurements.length, waistToHip: figures.measurements.waistToHip ?? null, adjustments: figures.adjustments })
			.where(eq(measurementProfiles.id, card.id));
	}
	for (const c of list) {
		await tx.insert(measureCardChanges).values({ profileId: card?.id ?? null, userId: input.userId, field: c.field, fromCm: c.from, toCm: c.to, reason: input.reason, reportId: input.reportId, orderId: input.orderId, changedBy: input.by });
	}
	return { cardId: card?.id ?? null, cardName: card?.name ?? null, list };
}

/** Her cards' history, newest first, with the order each change came from. */
export async function cardHistory(db: Db, userId: string) {
	return db
		.select({
			id: measureCardChanges.id,
			profileId: measureCardChanges.profileId,
			field: measureCardChanges.field,
			from: measureCardChanges.fromCm,
			to: measureCardChanges.toCm,
			reason: measureCardChanges.reason,
			at: measureCardChanges.createdAt,
			order: orders.number,
			decision: fitReports.decision
		})
		.from(measureCardChanges)
		.leftJoin(orders, eq(orders.id, measureCardChanges.orderId))
		.leftJoin(fitReports, eq(fitReports.id, measureCardChanges.reportId))
		.where(and(eq(measureCardChanges.userId, userId)))
		.orderBy(desc(measureCardChanges.createdAt), desc(measureCardChanges.id));
}
