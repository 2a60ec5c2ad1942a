// Her fit report: who may open it, whether the remake window is open, and writing it with its photos.
import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fitReports, orderEvents, orderLines, orders, styles, fabrics } from '../db/schema';
import { checkOrderToken } from '../order/link';
import { enqueueMail } from '../mail/outbox';
import { reportReceivedMail } from '../mail/fit';
import { mailSettings } from '../mail';
import { shopSettingsOf } from '../house/rules';
import { FIT_AREAS, FEELS, ZONES, type FitAnswers, type Feel } from '$lib/fit/report';
import { keepPhoto, photosOf, PHOTO_LIMITS, type PreparedPhoto } from './photos';

export type Viewer = App.Locals['user'];
type OrderRow = typeof orders.$inferSelect;

/** The atelier's address for anything the pages cannot do (the sender of its mail). */
export function atelierAddress() {
	const from = mailSettings().from;
	return from.match(/<([^>]+)>/)?.[1] ?? from;
}

/**
 * The order as its shopper opens it for a fit report: the signed-in shopper who placed it, or whoever
 * holds the signed link from her mail. Anyone else (another shopper, another order's link) finds
 * nothing, exactly as for a missing order. The owner may read it too.
 */
export async function orderForFit(db: Db, number: string, viewer: Viewer, token: string | null) {
	const [order] = await db.select().from(orders).where(eq(orders.number, number)).limit(1);
	if (!order) return null;
	const mine = !!viewer && order.userId === viewer.id;
	const linked = checkOrderToken(order.number, token);
	if (!mine && !linked && viewer?.role !== 'owner') return null;
	return { order, canWrite: mine || linked };
}

/** When the order was first delivered (the alteration path may deliver it again later). */
export async function deliveredAt(db: Pick<Db, 'select'>, orderId: number) {
	const [row] = await db
		.select({ at: orderEvents.createdAt })
		.from(orderEvents)
		.where(and(eq(orderEvents.orderId, orderId), eq(orderEvents.toStatus, 'delivered')))
		.orderBy(asc(orderEvents.createdAt))
		.limit(1);
	return row?.at ?? null;
}

export type Window = { open: true; closes: Date } | { open: false; message: string };

/** Whether she may still report how it fits: a delivered order, within the remake window. */
export function fitWindow(order: Pick<OrderRow, 'status'>, delivered: Date | null, days: number, now = new Date()): Window {
	const reach = `Write to us at ${atelierAddress()} with your order number, and we will look at it with you.`;
	if (!delivered || ['awaiting_payment', 'paid', 'cutting', 'sewn', 'finished', 'shipped', 'cancelled', 'refunded'].includes(order.status)) {
		return { open: false, message: `You can tell us how it fits once your skirt has been delivered. ${reach}` };
	}
	const closes = new Date(delivered.getTime() + days * 86_400_000);
	if (now > closes) return { open: false, message: `Fit reports are taken within ${days} days of delivery, and that time has passed for this order. ${reach}` };
	return { open: true, closes };
}

/** Whether her order page offers "Tell us how it fits": its window, read from the shop's settings. */
export async function fitOffer(db: Db, order: Pick<OrderRow, 'id' | 'status'>, now = new Date()) {
	const [settings, delivered] = await Promise.all([shopSettingsOf(db), deliveredAt(db, order.id)]);
	const window = fitWindow(order, delivered, settings.remakeWindowDays, now);
	return window.open ? { closes: window.closes.toISOString() } : null;
}

/**
 * What her order page says of the fit loop: a report already sent, or "Tell us how it fits" while the
 * window is open (until `closes`), and the order this one remakes.
 */
export async function fitStateOfOrder(db: Db, number: string, now = new Date()) {
	const [row] = await db.select({ id: orders.id, status: orders.status, remakeOfId: orders.remakeOfId }).from(orders).where(eq(orders.number, number));
	if (!row) return null;
	const [[first], [report]] = await Promise.all([
		row.remakeOfId ? db.select({ number: orders.number }).from(orders).where(eq(orders.id, row.remakeOfId)) : Promise.resolve([]),
		db.select({ id: fitReports.id }).from(fitReports).where(eq(fitReports.orderId, row.id)).limit(1)
	]);
	const offer = report ? null : await fitOffer(db, row, now);
	return { fit: report ? ('sent' as const) : offer ? ('open' as const) : null, closes: offer?.closes ?? null, remakeOf: first?.number ?? null };
}

/** Everything her fit page shows: the skirts of the order, each with its report if she made one. */
export async function fitPageData(db: Db, order: OrderRow, now = new Date()) {
	const settings = await shopSettingsOf(db);
	const [delivered, lines, reports] = await Promise.all([
		deliveredAt(db, order.id),
		db
			.select({ id: orderLines.id, style: styles.name, styleKind: styles.kind, fabric: fabrics.name, colour: fabrics.colour, measurements: orderLines.measurements })
			.from(orderLines)
			.innerJoin(styles, eq(styles.id, orderLines.styleId))
			.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
			.where(eq(orderLines.orderId, order.id))
			.orderBy(asc(orderLines.id)),
		db.select().from(fitReports).where(eq(fitReports.orderId, order.id))
	]);
	const window = fitWindow(order, delivered, settings.remakeWindowDays, now);
	const remakeIds = reports.map((r) => r.remakeOrderId).filter((id): id is number => id !== null);
	const remakes = remakeIds.length ? await db.select({ id: orders.id, number: orders.number, promisedDate: orders.promisedDate }).from(orders).where(inArray(orders.id, remakeIds)) : [];
	const withPhotos = await Promise.all(
		reports.map(async (r) => ({
			id: r.id,
			lineId: r.orderLineId,
			answers: r.answers,
			marks: r.marks,
			note: r.note,
			wish: r.wish,
			units: r.units,
			status: r.status,
			decision: r.decision,
			reason: r.reason,
			corrections: r.corrections,
			remake: remakes.find((o) => o.id === r.remakeOrderId) ?? null,
			createdAt: r.createdAt.toISOString(),
			photos: (await photosOf(db, r.id)).map((p) => ({ id: p.id, width: p.width, height: p.height }))
		}))
	);
	return { window: window.open ? { open: true as const, closes: window.closes.toISOString() } : window, lines, reports: withPhotos, photoRetentionDays: settings.photoRetentionDays, freeRemakesPerOrder: settings.freeRemakesPerOrder };
}

export type ReportInput = {
	lineId: number;
	answers: FitAnswers;
	marks: string[];
	note: string | null;
	wish: 'alteration' | 'remake';
	units: 'cm' | 'in';
	photos: PreparedPhoto[];
	photoConsent: boolean;
};

const ZONE_IDS = new Set<string>(ZONES.map((z) => z.id));

/** Reads the form: answers per area, amounts in her units (turned to cm), marks, wish. Problems by field. */
export function readReportForm(form: FormData): { ok: true; value: Omit<ReportInput, 'photos' | 'photoConsent'> } | { ok: false; errors: Record<string, string> } {
	const errors: Record<string, string> = {};
	const units = form.get('units') === 'in' ? 'in' : 'cm';
	const lineId = Number(form.get('line'));
	if (!Number.isSafeInteger(lineId) || lineId <= 0) errors.line = 'Choose the skirt you are telling us about.';
	const answers: FitAnswers = {};
	let anyAnswer = false;
	for (const area of FIT_AREAS) {
		const raw = form.get(`feel.${area}`);
		if (raw === null || raw === '') continue;
		const feel = Number(raw) as Feel;
		if (!FEELS.includes(feel)) {
			errors[`feel.${area}`] = 'Choose one of the answers.';
			continue;
		}
		anyAnswer = true;
		const amountRaw = String(form.get(`amount.${area}`) ?? '').trim().replace(',', '.');
		let amountCm: number | null = null;
		if (amountRaw) {
			const n = Number(amountRaw);
			const max = units === 'in' ? 8 : 20;
			if (!Number.isFinite(n) || n <= 0 || n > max) errors[`amount.${area}`] = `Give the amount as a number from 0.1 to ${max} ${units}, or leave it empty.`;
			else amountCm = Math.round((units === 'in' ? n * 2.54 : n) * 10) / 10;
		}
		answers[area] = { feel, amountCm: feel === 0 ? null : amountCm };
	}
	if (!anyAnswer) errors.answers = 'Tell us how at least one part feels (choose "Fine" where it fits).';
	const marks = [...new Set(form.getAll('mark').map(String))].filter((m) => ZONE_IDS.has(m));
	const wish = form.get('wish');
	if (wish !== 'alteration' && wish !== 'remake') errors.wish = 'Say whether you would like it altered or made again.';
	const note = String(form.get('note') ?? '').trim().slice(0, 2000) || null;
	if (Object.keys(errors).length) return { ok: false, errors };
	return { ok: true, value: { lineId, answers, marks, note, wish: wish as 'alteration' | 'remake', units } };
}

export type SubmitResult = { ok: true; reportId: number; mailIds: number[] } | { ok: false; status: 400 | 404 | 409; message: string };

/**
 * Writes her report in one transaction with the order row locked (a double submit finds the report the
 * first one wrote), then keeps its photos. The window is checked again here, not trusted from the page.
 */
export async function submitReport(db: Db, orderId: number, input: ReportInput, link: string, now = new Date()): Promise<SubmitResult> {
	if (input.photos.length > PHOTO_LIMITS.perReport) return { ok: false, status: 400, message: `Up to ${PHOTO_LIMITS.perReport} photos, please.` };
	if (input.photos.length && !input.photoConsent) return { ok: false, status: 400, message: 'Tick the consent for your photos, or send the report without them.' };
	const settings = await shopSettingsOf(db);
	const result = await db.transaction(async (tx) => {
		const [order] = await tx.select().from(orders).where(eq(orders.id, orderId)).for('update');
		if (!order) return { ok: false as const, status: 404 as const, message: 'No such order.' };
		const window = fitWindow(order, await deliveredAt(tx, order.id), settings.remakeWindowDays, now);
		if (!window.open) return { ok: false as const, status: 409 as const, message: window.message };
		const [line] = await tx.select({ id: orderLines.id }).from(orderLines).where(and(eq(orderLines.id, input.lineId), eq(orderLines.orderId, order.id)));
		if (!line) return { ok: false as const, status: 400 as const, message: 'Choose one of the skirts of this order.' };
		const [earlier] = await tx.select({ id: fitReports.id }).from(fitReports).where(eq(fitReports.orderLineId, line.id));
		if (earlier) return { ok: false as const, status: 409 as const, message: `We have your report on this skirt already. To add to it, write to us at ${atelierAddress()}.` };
		const [{ id }] = await tx
			.insert(fitReports)
			.values({ orderId: order.id, orderLineId: line.id, answers: input.answers, marks: input.marks, note: input.note, wish: input.wish, units: input.units })
			.$returningId();
		const mailId = await enqueueMail(tx, { to: order.email, orderId: order.id, ...reportReceivedMail({ number: order.number, shopperName: order.shopperName, link, wish: input.wish, photoRetentionDays: settings.photoRetentionDays }) });
		return { ok: true as const, reportId: id, mailIds: [mailId] };
	});
	if (!result.ok) return result;
	for (const p of input.photos) await keepPhoto(db, result.reportId, p, now);
	return result;
}

/** The report of one order that a photo belongs to, for the access check on the photo's address. */
export async function reportsOfOrder(db: Db, orderId: number) {
	return (await db.select({ id: fitReports.id }).from(fitReports).where(eq(fitReports.orderId, orderId))).map((r) => r.id);
}

export async function orderOfReport(db: Db, reportIds: number[]) {
	if (!reportIds.length) return [];
	return db.select({ reportId: fitReports.id, orderId: fitReports.orderId, number: orders.number, userId: orders.userId }).from(fitReports).innerJoin(orders, eq(orders.id, fitReports.orderId)).where(inArray(fitReports.id, reportIds));
}
