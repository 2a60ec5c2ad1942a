// The quote: drafts, lays and prices skirts from the database's current styles, fabrics and house
// rules. A bag is quoted once: one rules version and one reading of the shop's settings for every line,
// shipping counted once for the bag. The configure page, the quote API, the bag, the checkout and the
// order API all come through here, so the shopper pays the price she was shown.
import { and, count, eq, inArray, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orders, styles } from '../db/schema';
import { DraftInputError, draftSkirt, problemIn, estimateFabric, type Draft, type HouseRules } from '$lib/drafting';
import { failure, type Failure } from '$lib/failure';
import type { MeasurementsCm, ShopOptions } from '$lib/forms/quote';
import { confirmAsk } from '$lib/forms/confirm';
import { OPEN_WORK_STAGES } from '$lib/orders/stages';
import { priceLine, promisedShipDate, shippingCost, type LinePricing } from '$lib/pricing';
import { currentRules, shopSettingsOf, type ShopSettings } from '../house/rules';
import { clothOf } from '../order/cloth';
import { remakePromise } from '$lib/fit/promise';
import { SOURCE_NOTE_SHOPPER, type FigureSource } from '$lib/drafting/figures-source';

export type QuoteInput = { measurements: MeasurementsCm; style: string; options: ShopOptions; fabricId?: number; units: 'cm' | 'in'; figuresSource?: FigureSource };

type StyleRow = typeof styles.$inferSelect;
type FabricRow = typeof fabrics.$inferSelect;

/** What every line of one quote shares: read once. */
interface QuoteContext {
	rulesId: number;
	rules: HouseRules;
	settings: ShopSettings;
	waiting: number;
	now: Date;
}

/** One quoted line: the draft, the rows it came from, and what the shopper is shown. */
export interface QuotedLine {
	ok: true;
	draft: Draft;
	style: StyleRow;
	fabric: FabricRow | null;
	/** The cloth to buy (cm, rounded up to the sale step), when a fabric was chosen. */
	fabricCm: number | null;
	/** The line's price without shipping, when a fabric was chosen. */
	pricing: LinePricing | null;
	shipBy: string;
}

async function quoteContext(db: Db, now: Date): Promise<QuoteContext> {
	const [{ id: rulesId, rules }, settings, [{ waiting }]] = await Promise.all([
		currentRules(db),
		shopSettingsOf(db),
		db.select({ waiting: count() }).from(orders).where(inArray(orders.status, [...OPEN_WORK_STAGES]))
	]);
	return { rulesId, rules, settings, waiting, now };
}

function quoteLine(ctx: QuoteContext, input: QuoteInput, style: StyleRow | undefined, fabric: FabricRow | undefined): QuotedLine | Failure {
	if (!style) return failure(404, 'We do not make that style (any more).', { fields: { style: ['Choose one of our styles.'] } });
	if (input.fabricId !== undefined && !fabric) return failure(404, 'That fabric is not in our catalogue.', { fields: { fabricId: ['Choose one of our fabrics.'] } });
	let draft;
	try {
		draft = draftSkirt(input.measurements, { style: style.kind, ...input.options, stretch: fabric?.stretch ?? false }, ctx.rules);
	} catch (err) {
		if (!(err instanceof DraftInputError)) throw err;
		// The engine says each problem in her units from its numbers. A figure she may confirm is asked about.
		const fields: Record<string, string[]> = {};
		for (const f of err.fields) (fields[`measurements.${f.field}`] ??= []).push(problemIn(f, input.units));
		const m = input.measurements;
		const typed = (cm: number) => (input.units === 'in' ? Math.round((cm / 2.54) * 8) / 8 : cm);
		const confirm = confirmAsk(err.fields, { waist: typed(m.waist), hip: typed(m.hip) }, m, input.units) ?? undefined;
		return failure(400, err.fields.map((f) => problemIn(f, input.units)).join(' '), { fields, confirm });
	}
	const estimate = fabric ? estimateFabric(draft, clothOf(fabric)) : null;
	const pricing = estimate && fabric ? priceLine({ fabricCm: estimate.length, pricePerMetre: fabric.pricePerMetre, makingPrice: style.makingPrice, options: input.options, optionPrices: style.optionPrices }) : null;
	const shipBy = promisedShipDate(ctx.now, style.leadDays, ctx.waiting, ctx.settings.ordersPerDay);
	return { ok: true, draft, style, fabric: fabric ?? null, fabricCm: estimate?.length ?? null, pricing, shipBy };
}

/** The styles and fabrics the inputs name, each read once. */
async function rowsFor(db: Db, inputs: QuoteInput[]) {
	const slugs = [...new Set(inputs.map((i) => i.style))];
	const fabricIds = [...new Set(inputs.flatMap((i) => (i.fabricId === undefined ? [] : [i.fabricId])))];
	const [styleRows, fabricRows] = await Promise.all([
		slugs.length ? db.select().from(styles).where(and(inArray(styles.slug, slugs), isNull(styles.retiredAt))) : Promise.resolve([]),
		fabricIds.length ? db.select().from(fabrics).where(and(inArray(fabrics.id, fabricIds), isNull(fabrics.retiredAt))) : Promise.resolve([])
	]);
	return { style: new Map(styleRows.map((s) => [s.slug, s])), fabric: new Map(fabricRows.map((f) => [f.id, f])) };
}

/** A quoted bag: every line, the subtotal, shipping once, and the rules version they were all drafted with. */
export interface QuotedBag {
	rulesId: number;
	currency: string;
	remakePolicy: string;
	lines: (QuotedLine | Failure)[];
	/** The lines that quoted, without shipping. */
	subtotal: number;
	shipping: number;
	total: number;
	/** The latest ship date of the lines: the order ships together. */
	shipBy: string | null;
}

/** Quotes every line of a bag with one reading of the rules and settings. */
export async function quoteBag(db: Db, inputs: QuoteInput[], opts: { now?: Date } = {}): Promise<QuotedBag> {
	const [ctx, rows] = await Promise.all([quoteContext(db, opts.now ?? new Date()), rowsFor(db, inputs)]);
	const lines = inputs.map((input) => quoteLine(ctx, input, rows.style.get(input.style), input.fabricId === undefined ? undefined : rows.fabric.get(input.fabricId)));
	const subtotal = lines.reduce((s, l) => s + (l.ok && l.pricing ? l.pricing.total : 0), 0);
	const shipping = subtotal > 0 ? shippingCost(subtotal, ctx.settings.shipping) : 0;
	const shipBy = lines.flatMap((l) => (l.ok ? [l.shipBy] : [])).sort().at(-1) ?? null;
	return { rulesId: ctx.rulesId, currency: ctx.settings.currency, remakePolicy: remakePromise(ctx.settings), lines, subtotal, shipping, total: subtotal + shipping, shipBy };
}

/**
 * One skirt as the configure page and the quote API show it: the bag of one, with the shipping that
 * bag would pay. It draws nothing: the configure page drafts and draws in the browser, and the pages that
 * show a skirt draw it from the draft themselves.
 */
export async function quoteSkirt(db: Db, input: QuoteInput, opts: { now?: Date } = {}) {
	const bag = await quoteBag(db, [input], opts);
	const line = bag.lines[0];
	if (!line.ok) return line;
	const { draft, style, fabric, pricing, fabricCm } = line;
	return {
		ok: true as const,
		line,
		rulesId: bag.rulesId,
		quote: {
			style: { slug: style.slug, name: style.name, kind: style.kind },
			figures: draft.figures,
			// Figures found without a tape are drafted as given, and the quote says where they came from.
			figuresSource: input.figuresSource ?? 'measured',
			warnings: input.figuresSource && input.figuresSource !== 'measured' ? [SOURCE_NOTE_SHOPPER[input.figuresSource], ...draft.warnings] : draft.warnings,
			pieces: draft.pieces.map((p) => ({ name: p.name, cut: p.cut })),
			fabric: fabric && fabricCm !== null ? { id: fabric.id, name: fabric.name, widthCm: fabric.widthCm, lengthCm: fabricCm, inStock: fabric.stockCm >= fabricCm } : null,
			price: pricing ? { ...pricing, shipping: bag.shipping, total: pricing.total + bag.shipping, currency: bag.currency } : null,
			shipBy: line.shipBy
		}
	};
}

export type Quote = Extract<Awaited<ReturnType<typeof quoteSkirt>>, { ok: true }>['quote'];
