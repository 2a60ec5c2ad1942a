// Seeds the invented demo atelier. Idempotent: every row has a natural key (e-mail, slug, order
// number) and is only inserted when missing, so a second run leaves the same rows.
import { eq } from 'drizzle-orm';
import { hashPassword } from '../auth/password';
import type { Db } from '../db/client';
import { fabrics, fitReports, houseRules, orderEvents, orderLines, orders, payments, shopSettings, styles, users } from '../db/schema';
import { DEFAULT_RULES, draftSkirt, estimateFabric, type StyleId } from '$lib/drafting';
import { priceLine, shippingCost } from '$lib/pricing';
import { STAGE_LABELS } from '$lib/orders/stages';
import { DEMO_SIGN_INS } from './demo-accounts.js';
import { DEMO_FABRICS, DEMO_OPTION_PRICES, DEMO_STYLES } from './catalogue';
import { DEMO_ORDERS, pathTo } from './orders';
import { clothOf } from '../order/cloth';

const DAY = 86_400_000;

export const DEFAULT_SETTINGS = {
	currency: 'EUR',
	paperSize: 'A4',
	units: 'cm',
	shipping: { flat: 950, freeFrom: 30_000 },
	ordersPerDay: 4,
	plotterWidthCm: 91.4,
	remakeWindowDays: 30,
	photoRetentionDays: 90,
	freeRemakesPerOrder: 1
};

export async function seedDemo(db: Db, now = new Date()) {
	const passwordHash = await hashPassword(DEMO_SIGN_INS.password);
	for (const a of DEMO_SIGN_INS.accounts) {
		const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, a.email)).limit(1);
		if (!existing) {
			await db.insert(users).values({ email: a.email, name: a.name, role: a.role as 'shopper' | 'cutter' | 'owner', passwordHash, emailVerified: now });
		}
	}
	for (const [key, value] of Object.entries(DEFAULT_SETTINGS)) {
		await db.insert(shopSettings).ignore().values({ key, value });
	}
	for (const s of DEMO_STYLES) {
		await db.insert(styles).ignore().values({ ...s, optionPrices: DEMO_OPTION_PRICES });
	}
	for (const f of DEMO_FABRICS) {
		await db.insert(fabrics).ignore().values({ ...f });
	}
	let [rules] = await db.select().from(houseRules).orderBy(houseRules.id).limit(1);
	if (!rules) {
		await db.insert(houseRules).values({ rules: DEFAULT_RULES, note: 'The atelier’s first drafting rules' });
		[rules] = await db.select().from(houseRules).orderBy(houseRules.id).limit(1);
	}

	const owner = await userByEmail(db, DEMO_SIGN_INS.accounts[0].email);
	const cutter = await userByEmail(db, DEMO_SIGN_INS.accounts[1].email);
	const styleRows = new Map((await db.select().from(styles)).map((r) => [r.slug, r]));
	const fabricRows = new Map((await db.select().from(fabrics)).map((r) => [r.slug, r]));

	for (const o of DEMO_ORDERS) {
		const [existing] = await db.select({ id: orders.id }).from(orders).where(eq(orders.number, o.number)).limit(1);
		if (existing) continue;
		const style = styleRows.get(o.style)!;
		const fabric = fabricRows.get(o.fabric)!;
		const { waistToHip, ...girths } = o.measurements;
		const choice = { style: style.kind as StyleId, ...o.options, stretch: fabric.stretch };
		const draft = draftSkirt(waistToHip === null ? girths : { ...girths, waistToHip }, choice, DEFAULT_RULES);
		const estimate = estimateFabric(draft, clothOf(fabric));
		const pricing = priceLine({ fabricCm: estimate.length, pricePerMetre: fabric.pricePerMetre, makingPrice: style.makingPrice, options: o.options, optionPrices: style.optionPrices });
		const shipping = shippingCost(pricing.total, DEFAULT_SETTINGS.shipping);
		const placed = new Date(now.getTime() - o.placedDaysAgo * DAY);
		const promised = new Date(placed.getTime() + (style.leadDays + 2) * DAY).toISOString().slice(0, 10);
		const shopper = await userByEmail(db, o.shopper);
		const path = pathTo(o.stage);
		const paid = path.includes('paid');

		await db.transaction(async (tx) => {
			const [{ id }] = await tx
				.insert(orders)
				.values({
					number: o.number,
					userId: shopper?.id ?? null,
					email: o.shopper,
					shopperName: o.name,
					status: o.stage,
					currency: 'EUR',
					subtotal: pricing.total,
					shipping,
					total: pricing.total + shipping,
					refundedTotal: o.stage === 'refunded' ? pricing.total + shipping : 0,
					promisedDate: promised,
					shippingAddress: { name: o.name, line1: o.line1, city: o.city, postcode: o.postcode, country: o.country },
					carrier: o.tracking ? 'Parcelkite' : null,
					trackingNumber: o.tracking ?? null,
					houseRulesId: rules.id,
					paidAt: paid ? new Date(placed.getTime() + 60_000) : null,
					createdAt: placed
				})
				.$returningId();
			await tx.insert(orderLines).values({
				orderId: id,
				styleId: style.id,
				fabricId: fabric.id,
				options: choice,
				measurements: o.measurements,
				figures: draft.figures,
				fabricCm: estimate.length,
				pricing,
				lineTotal: pricing.total,
				createdAt: placed
			});
			if (paid) {
				await tx.insert(payments).values({
					orderId: id,
					checkoutSessionId: `cs_demo_${o.number}`,
					paymentIntentId: `pi_demo_${o.number}`,
					amount: pricing.total + shipping,
					refundedAmount: o.stage === 'refunded' ? pricing.total + shipping : 0,
					currency: 'EUR',
					state: o.stage === 'refunded' ? 'refunded' : 'paid',
					createdAt: placed
				});
			}
			// One event per step, spaced through the order's life, so timelines read like real ones.
			const steps = path.slice(1);
			for (const [i, to] of steps.entries()) {
				const at = new Date(placed.getTime() + ((i + 1) / (steps.length + 1)) * o.placedDaysAgo * DAY + 60_000);
				const byShop = to === 'paid' || to === 'refunded';
				await tx.insert(orderEvents).values({
					orderId: id,
					actorId: byShop ? null : to === 'cancelled' ? owner?.id ?? null : cutter?.id ?? null,
					actorLabel: byShop ? 'Payment provider' : to === 'cancelled' ? 'Margit Solberg' : 'Tomasz Weller',
					kind: 'stage',
					fromStatus: path[i],
					toStatus: to,
					note: to === 'cancelled' ? 'Cancelled at the shopper’s request before cutting.' : to === 'shipped' ? `Sent with Parcelkite, tracking ${o.tracking}` : `Moved to ${STAGE_LABELS[to]}`,
					createdAt: at
				});
			}
		});
	}
	await seedFitReport(db, now);
}

// A fit report waiting on a delivered order, so the owner finds one on her first sign-in.
async function seedFitReport(db: Db, now: Date) {
	const [row] = await db.select({ orderId: orders.id, lineId: orderLines.id }).from(orders).innerJoin(orderLines, eq(orderLines.orderId, orders.id)).where(eq(orders.number, 'QL-1002')).limit(1);
	if (!row) return;
	await db
		.insert(fitReports)
		.ignore()
		.values({
			orderId: row.orderId,
			orderLineId: row.lineId,
			answers: { waist: { feel: 0 }, highHip: { feel: 0 }, hipSeat: { feel: -1, amountCm: 2 }, length: { feel: 0 }, hemWidth: { feel: -1 }, dartsBack: { feel: 0 } },
			marks: ['back-seat', 'front-side-left', 'front-side-right'],
			note: 'Lovely linen! It pulls across the seat when I sit, and the side seams swing forward a little.',
			units: 'cm',
			wish: 'alteration',
			createdAt: new Date(now.getTime() - 2 * DAY)
		});
}

async function userByEmail(db: Db, email: string) {
	const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
	return u ?? null;
}
