// Between the catalogue forms (text, amounts in the shop's currency, metres) and the database rows (minor units, centimetres).
import { and, asc, eq, isNotNull, isNull, like, ne, or } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { fabrics, styles, type StyleOptionPrices } from '$lib/server/db/schema';
import { centsToText, numberToText, parseScaled, slugify } from '$lib/catalogue/amounts';
import type { FabricForm, StyleForm } from '$lib/forms/catalogue';

// Only called on a valid form, where every figure has been checked by amountProblem.
const scaled = (text: string, decimals: number) => parseScaled(text, decimals)!;

export function styleValues(f: StyleForm) {
	const optionPrices: StyleOptionPrices = {
		lining: scaled(f.priceLining, 2),
		pockets: scaled(f.pricePockets, 2),
		band: scaled(f.priceBand, 2),
		facing: scaled(f.priceFacing, 2),
		'invisible-zip': scaled(f.priceInvisibleZip, 2)
	};
	return {
		name: f.name,
		slug: f.slug,
		kind: f.kind,
		description: f.description,
		makingPrice: scaled(f.makingPrice, 2),
		optionPrices,
		leadDays: scaled(f.leadDays, 0),
		sortOrder: scaled(f.sortOrder, 0)
	};
}

export function styleFormData(row: typeof styles.$inferSelect): StyleForm {
	const p = row.optionPrices ?? {};
	return {
		name: row.name,
		slug: row.slug,
		kind: row.kind as StyleForm['kind'],
		description: row.description,
		makingPrice: centsToText(row.makingPrice),
		priceLining: centsToText(p.lining ?? 0),
		pricePockets: centsToText(p.pockets ?? 0),
		priceBand: centsToText(p.band ?? 0),
		priceFacing: centsToText(p.facing ?? 0),
		priceInvisibleZip: centsToText(p['invisible-zip'] ?? 0),
		leadDays: String(row.leadDays),
		sortOrder: String(row.sortOrder)
	};
}

export function fabricValues(f: FabricForm) {
	return {
		name: f.name,
		colour: f.colour,
		swatchHex: f.swatchHex.toLowerCase(),
		fibreContent: f.fibreContent,
		careText: f.careText,
		widthCm: scaled(f.widthCm, 1) / 10,
		pricePerMetre: scaled(f.pricePerMetre, 2),
		// Typed in metres to the millimetre; kept in centimetres with one decimal.
		stockCm: scaled(f.stockMetres, 3) / 10,
		nap: f.nap,
		stretch: f.stretch,
		shrinkagePct: scaled(f.shrinkagePct, 1) / 10,
		shrinkageAcrossPct: f.shrinkageAcrossPct === '' ? null : scaled(f.shrinkageAcrossPct, 1) / 10
	};
}

export function fabricFormData(row: typeof fabrics.$inferSelect): FabricForm {
	return {
		name: row.name,
		colour: row.colour,
		swatchHex: row.swatchHex,
		fibreContent: row.fibreContent,
		careText: row.careText,
		widthCm: numberToText(row.widthCm, 1),
		pricePerMetre: centsToText(row.pricePerMetre),
		stockMetres: numberToText(row.stockCm / 100, 3),
		nap: row.nap,
		stretch: row.stretch,
		shrinkagePct: numberToText(row.shrinkagePct, 1),
		shrinkageAcrossPct: row.shrinkageAcrossPct === null ? '' : numberToText(row.shrinkageAcrossPct, 1),
		image: undefined,
		removeImage: false
	};
}

export async function styleSlugTaken(slug: string, exceptId?: number) {
	const [row] = await db
		.select({ id: styles.id })
		.from(styles)
		.where(exceptId ? and(eq(styles.slug, slug), ne(styles.id, exceptId)) : eq(styles.slug, slug))
		.limit(1);
	return Boolean(row);
}

/** Fabrics have no address of their own in the shop; their slug is made from name and colour. */
export async function newFabricSlug(name: string, colour: string) {
	const base = slugify(`${colour} ${name}`).slice(0, 70) || 'fabric';
	const taken = new Set(
		(
			await db
				.select({ slug: fabrics.slug })
				.from(fabrics)
				.where(or(eq(fabrics.slug, base), like(fabrics.slug, `${base}-%`)))
		).map((r) => r.slug)
	);
	if (!taken.has(base)) return base;
	for (let n = 2; ; n++) if (!taken.has(`${base}-${n}`)) return `${base}-${n}`;
}

export async function catalogueLists() {
	const [live, retired, liveFabrics, retiredFabrics] = await Promise.all([
		db.select().from(styles).where(isNull(styles.retiredAt)).orderBy(asc(styles.sortOrder), asc(styles.name)),
		db.select().from(styles).where(isNotNull(styles.retiredAt)).orderBy(asc(styles.name)),
		db.select().from(fabrics).where(isNull(fabrics.retiredAt)).orderBy(asc(fabrics.name), asc(fabrics.colour)),
		db.select().from(fabrics).where(isNotNull(fabrics.retiredAt)).orderBy(asc(fabrics.name), asc(fabrics.colour))
	]);
	const style = (s: typeof styles.$inferSelect) => ({
		id: s.id,
		name: s.name,
		slug: s.slug,
		kind: s.kind,
		makingPrice: s.makingPrice,
		leadDays: s.leadDays,
		retiredAt: s.retiredAt
	});
	const fabric = (f: typeof fabrics.$inferSelect) => ({
		id: f.id,
		name: f.name,
		colour: f.colour,
		swatchHex: f.swatchHex,
		imageUrl: f.imageUploadId ? `/uploads/${f.imageUploadId}` : null,
		fibreContent: f.fibreContent,
		pricePerMetre: f.pricePerMetre,
		stockCm: f.stockCm,
		widthCm: f.widthCm,
		retiredAt: f.retiredAt
	});
	return {
		styles: live.map(style),
		retiredStyles: retired.map(style),
		fabrics: liveFabrics.map(fabric),
		retiredFabrics: retiredFabrics.map(fabric)
	};
}

/** The id in the address, or null for anything that is not a plain positive number. */
export function idParam(text: string) {
	return /^[1-9]\d{0,9}$/.test(text) && Number(text) <= 2_147_483_647 ? Number(text) : null;
}
