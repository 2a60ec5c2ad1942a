import { and, count, eq, inArray, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orders, styles } from '../db/schema';
import { clothOf } from '../workroom/cloth';
import { DraftInputError, draftSkirt, estimateFabric, toSvg, type StyleId } from '../../drafting';
import type { MeasurementsCm, ShopOptions } from '../../forms/quote';
import { OPEN_WORK_STAGES } from '../../orders/stages';
import { priceLine, promisedShipDate, shippingCost } from '../../pricing';
import { currentRules, shopSettingsOf } from './rules';

export type QuoteInput = { measurements: MeasurementsCm; style: string; options: ShopOptions; fabricId?: number; units: 'cm' | 'in' };

export type QuoteProblem = { status: 400 | 404 | 409; message: string; fields?: Record<string, string[]> };

/**
 * Drafts, estimates and prices one skirt from the database's current styles, fabrics and house
 * rules. The quote API, the bag and the checkout all call this, so the shopper sees the price she pays.
 */
export async function quoteSkirt(db: Db, input: QuoteInput, opts: { drawing?: boolean; now?: Date } = {}) {
	// One round trip: the lookups go out together.
	const [[style], [fabric], { id: rulesId, rules }, settings, [{ waiting }]] = await Promise.all([
		db.select().from(styles).where(and(eq(styles.slug, input.style), isNull(styles.retiredAt))).limit(1),
		input.fabricId === undefined ? Promise.resolve([undefined]) : db.select().from(fabrics).where(and(eq(fabrics.id, input.fabricId), isNull(fabrics.retiredAt))).limit(1),
		currentRules(db),
		shopSettingsOf(db),
		db.select({ waiting: count() }).from(orders).where(inArray(orders.status, [...OPEN_WORK_STAGES]))
	]);
	if (!style) return { ok: false as const, problem: { status: 404, message: 'We do not make that style (any more).', fields: { style: ['Choose one of our styles.'] } } satisfies QuoteProblem };
	if (input.fabricId !== undefined && !fabric) {
		return { ok: false as const, problem: { status: 404, message: 'That fabric is not in our catalogue.', fields: { fabricId: ['Choose one of our fabrics.'] } } satisfies QuoteProblem };
	}

	let draft;
	try {
		draft = draftSkirt(input.measurements, { style: style.kind as StyleId, ...input.options, stretch: fabric?.stretch ?? false }, rules);
	} catch (err) {
		if (err instanceof DraftInputError) {
			const fields: Record<string, string[]> = {};
			for (const f of err.fields) (fields[`measurements.${f.field}`] ??= []).push(f.message);
			return { ok: false as const, problem: { status: 400, message: err.message, fields } satisfies QuoteProblem };
		}
		throw err;
	}

	const estimate = fabric ? estimateFabric(draft, clothOf(fabric)) : null;
	const price = estimate && fabric ? priceLine({ fabricCm: estimate.length, pricePerMetre: fabric.pricePerMetre, makingPrice: style.makingPrice, options: input.options, optionPrices: style.optionPrices }) : null;
	const shipping = price ? shippingCost(price.total, settings.shipping) : null;
	return {
		ok: true as const,
		draft,
		rulesId,
		style,
		fabric: fabric ?? null,
		quote: {
			style: { slug: style.slug, name: style.name, kind: style.kind },
			figures: draft.figures,
			warnings: draft.warnings,
			pieces: draft.pieces.map((p) => ({ name: p.name, cut: p.cut })),
			drawing: opts.drawing === false ? null : toSvg(draft, { view: 'pieces', units: input.units }),
			fabric: fabric && estimate ? { id: fabric.id, name: fabric.name, widthCm: fabric.widthCm, lengthCm: estimate.length, inStock: fabric.stockCm >= estimate.length } : null,
			price: price && shipping !== null ? { ...price, shipping, total: price.total + shipping, currency: settings.currency } : null,
			shipBy: promisedShipDate(opts.now ?? new Date(), style.leadDays, waiting, settings.ordersPerDay)
		}
	};
}

export type Quote = Extract<Awaited<ReturnType<typeof quoteSkirt>>, { ok: true }>['quote'];
