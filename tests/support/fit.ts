// Test data for the fit loop: a delivered order of its own (placed straight in MariaDB, drafted by the
// real engine, with its stage events), and a measure card for a signed-in shopper.
import { createHmac } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { testEnv } from './env';
import type { Db } from '../../src/lib/server/db/client';
import { fabrics, houseRules, measurementProfiles, orderEvents, orderLines, orders, styles, users } from '../../src/lib/server/db/schema';
import { draftSkirt, estimateFabric, type StyleId } from '../../src/lib/drafting';
import type { OrderStage } from '../../src/lib/orders/stages';

const DAY = 86_400_000;

export type DeliveredInput = {
	email?: string;
	/** a demo account's e-mail: the order is hers (else a guest's) */
	account?: string;
	name?: string;
	deliveredDaysAgo?: number;
	style?: string;
	fabric?: string;
	measurements?: { waist: number; hip: number; length: number; waistToHip: number | null };
	/** leave it shipped (not yet delivered) */
	notDelivered?: boolean;
	/** save the measurements as her measure card too */
	card?: string;
};

export async function deliveredOrder(db: Db, input: DeliveredInput = {}) {
	const m = input.measurements ?? { waist: 72, hip: 98, length: 60, waistToHip: 20.5 };
	const [style] = await db.select().from(styles).where(eq(styles.slug, input.style ?? 'rue-straight'));
	const [fabric] = await db.select().from(fabrics).where(eq(fabrics.slug, input.fabric ?? 'harbour-wool-twill'));
	const [rules] = await db.select({ id: houseRules.id }).from(houseRules).orderBy(houseRules.id).limit(1);
	const user = input.account ? (await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, input.account)))[0] : null;
	const email = input.account ?? input.email ?? `fit-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.com`;
	const name = input.name ?? user?.name ?? 'Edda Lind';
	const choice = { style: style.kind as StyleId, stretch: fabric.stretch };
	const draft = draftSkirt(m.waistToHip === null ? { waist: m.waist, hip: m.hip, length: m.length } : { ...m, waistToHip: m.waistToHip }, choice);
	const fabricCm = estimateFabric(draft, { width: fabric.widthCm, nap: fabric.nap, shrinkage: fabric.shrinkagePct }).length;
	const delivered = new Date(Date.now() - (input.deliveredDaysAgo ?? 3) * DAY);
	const placed = new Date(delivered.getTime() - 14 * DAY);
	const total = 18_000;
	const [{ id }] = await db
		.insert(orders)
		.values({
			number: `tmp-${crypto.randomUUID().slice(0, 12)}`,
			userId: user?.id ?? null,
			email,
			shopperName: name,
			status: input.notDelivered ? 'shipped' : 'delivered',
			currency: 'EUR',
			subtotal: total,
			shipping: 0,
			total,
			promisedDate: placed.toISOString().slice(0, 10),
			shippingAddress: { name, line1: 'Strandvej 2', city: 'Aarhus', postcode: '8000', country: 'DK' },
			houseRulesId: rules.id,
			paidAt: placed,
			createdAt: placed
		})
		.$returningId();
	const number = `QL-${1000 + id}`;
	await db.update(orders).set({ number }).where(eq(orders.id, id));
	const [{ id: lineId }] = await db
		.insert(orderLines)
		.values({ orderId: id, styleId: style.id, fabricId: fabric.id, options: { ...choice }, measurements: m, figures: draft.figures, fabricCm, pricing: { fabric: 0, making: total, options: 0, total }, lineTotal: total })
		.$returningId();
	const path: OrderStage[] = ['paid', 'cutting', 'sewn', 'finished', 'shipped', ...(input.notDelivered ? [] : (['delivered'] as const))];
	for (const [i, to] of path.entries()) {
		const at = to === 'delivered' ? delivered : new Date(placed.getTime() + (i + 1) * DAY);
		await db.insert(orderEvents).values({ orderId: id, actorLabel: to === 'cutting' ? 'Tomasz Weller' : 'Workroom', kind: 'stage', fromStatus: i ? path[i - 1] : ('awaiting_payment' as const), toStatus: to, createdAt: at });
	}
	let cardId: number | null = null;
	if (input.card && user) {
		[{ id: cardId }] = await db.insert(measurementProfiles).values({ userId: user.id, name: input.card, waist: m.waist, hip: m.hip, length: m.length, waistToHip: m.waistToHip, consentAt: new Date() }).$returningId();
	}
	return { id, number, lineId, email, userId: user?.id ?? null, cardId };
}

/** The signed order link's token, made as the app makes it (an HMAC of the number under AUTH_SECRET). */
export function tokenFor(number: string) {
	return createHmac('sha256', `order-link:${process.env.AUTH_SECRET ?? ''}`).update(number).digest('base64url').slice(0, 32);
}

export type Photo = { name: string; type: string; bytes: Uint8Array };

/** Posts her fit report as the page's form does (multipart, as a browser without script). */
export function postReport(number: string, fields: Record<string, string>, opts: { token?: string; cookie?: string; photo?: Photo; action?: string } = {}) {
	const body = new FormData();
	for (const [k, v] of Object.entries(fields)) body.set(k, v);
	if (opts.photo) body.set('photo', new File([opts.photo.bytes as Uint8Array<ArrayBuffer>], opts.photo.name, { type: opts.photo.type }));
	const q = opts.token ? `&t=${encodeURIComponent(opts.token)}` : '';
	return fetch(`${testEnv.appUrl}/orders/${number}/fit?/${opts.action ?? 'report'}${q}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { origin: testEnv.appUrl, accept: 'text/html', ...(opts.cookie ? { cookie: opts.cookie } : {}) },
		body
	});
}

/** "Waist a little tight by 2 cm; the rest fine; a remake, please." */
export const TIGHT_WAIST = (lineId: number, wish: 'remake' | 'alteration' = 'remake') => ({
	line: String(lineId),
	units: 'cm',
	'feel.waist': '-1',
	'amount.waist': '2',
	'feel.hipSeat': '0',
	'feel.length': '0',
	wish
});

/** The owner (or an allowed cutter) decides a report as the workroom's form posts it. */
export function decide(reportId: number, fields: Record<string, string>, cookie: string) {
	return fetch(`${testEnv.appUrl}/workroom/fit-reports/${reportId}?/decide`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl, accept: 'text/html', cookie },
		body: new URLSearchParams(fields)
	});
}
