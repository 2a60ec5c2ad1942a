// Her finished skirt drawn for the pages and the mails that show an order line or a bag line: the garment
// view of the draft (drafting/drawing/garment.ts) in the line's cloth. Order lines are re-drafted from
// their snapshot with the house rules version the order was drafted with, as the cutting ticket is.
//
// In mail the drawing goes as a PNG attached inline (Content-ID) and named by an <img src="cid:…">: the
// common mail clients (web and desktop) do not show SVG in a message, and most block images fetched from
// the web until the reader allows them, while an inline attachment shows at once. sharp (already a
// dependency) rasterises the SVG; it is rendered when the message is sent, from the order itself.
import sharp from 'sharp';
import { asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fabrics, orderLines, orders } from '../db/schema';
import { draftSkirt, type Draft, type FitAdjustments, type Measurements, type SkirtChoiceInput } from '$lib/drafting';
import { garmentView, type GarmentCloth } from '$lib/drafting/drawing/garment';
import { drawingToSvg } from '$lib/drafting/svg';
import type { Units } from '$lib/drafting/units';
import { rulesVersion } from '../house/rules';

type FabricRow = { name: string; colour: string; swatchHex: string; imageUploadId: number | null };

/** A fabric as the drawing's cloth: its colour, and its swatch photo when the atelier uploaded one. */
export function fillOf(f: FabricRow, withImage = true): GarmentCloth {
	return { colour: f.swatchHex, image: withImage && f.imageUploadId ? `/uploads/${f.imageUploadId}` : null, name: `${f.name.toLowerCase()}, ${f.colour.toLowerCase()}` };
}

/** The garment view as SVG markup for a page (sized by the page). */
export function garmentSvg(draft: Draft, cloth: GarmentCloth, id: string, units: Units = 'cm') {
	return drawingToSvg(garmentView(draft, { cloth, units }), { id, size: false });
}

/** The garment view as a PNG (`px` wide): no swatch photo (the rasteriser reaches no URL), no words
 * (the mail says them, and the fonts of the machine that renders are not the shop's). */
export async function garmentPng(draft: Draft, cloth: GarmentCloth, px = 560): Promise<Buffer> {
	const svg = drawingToSvg(garmentView(draft, { cloth: { ...cloth, image: null }, labels: false }), { id: 'png', px });
	return sharp(Buffer.from(svg)).png({ compressionLevel: 9, palette: true }).toBuffer();
}

/** Re-drafts stored order lines; a line that no longer drafts (rules changed past it) has no drawing. */
async function draftsOfLines(db: Pick<Db, 'select'>, where: { orderId: number } | { orderNumber: string } | { lineIds: number[] }) {
	const rows = await db
		.select({
			id: orderLines.id,
			orderId: orderLines.orderId,
			measurements: orderLines.measurements,
			adjustments: orderLines.adjustments,
			options: orderLines.options,
			rulesId: orders.houseRulesId,
			fabric: { name: fabrics.name, colour: fabrics.colour, swatchHex: fabrics.swatchHex, imageUploadId: fabrics.imageUploadId, stretch: fabrics.stretch }
		})
		.from(orderLines)
		.innerJoin(orders, eq(orders.id, orderLines.orderId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where('orderId' in where ? eq(orderLines.orderId, where.orderId) : 'orderNumber' in where ? eq(orders.number, where.orderNumber) : inArray(orderLines.id, where.lineIds.length ? where.lineIds : [-1]))
		.orderBy(asc(orderLines.id));
	const out: { id: number; draft: Draft; fabric: FabricRow }[] = [];
	for (const r of rows) {
		const m = r.measurements;
		const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
		const measurements: Measurements = { waist: Number(m.waist), hip: Number(m.hip), length: Number(m.length), confirmed: true };
		if (num(m.waistToHip) !== undefined) measurements.waistToHip = num(m.waistToHip);
		if (num(m.waistToKnee) !== undefined) measurements.waistToKnee = num(m.waistToKnee);
		if (r.adjustments) measurements.adjustments = r.adjustments as FitAdjustments;
		try {
			const rules = await rulesVersion(db, r.rulesId);
			const draft = draftSkirt(measurements, { stretch: r.fabric.stretch, ...(r.options as SkirtChoiceInput) }, rules);
			out.push({ id: r.id, draft, fabric: r.fabric });
		} catch {
			// Drawn nowhere rather than failing the page or the mail: the ticket says what is wrong.
		}
	}
	return out;
}

/** Each line of an order (by its id or its number) as SVG markup, by line id. */
export async function orderLineDrawings(db: Db, order: number | string): Promise<Record<number, string>> {
	const lines = await draftsOfLines(db, typeof order === 'number' ? { orderId: order } : { orderNumber: order });
	return Object.fromEntries(lines.map((l) => [l.id, garmentSvg(l.draft, fillOf(l.fabric), `line-${l.id}`)]));
}

/** The Content-ID a mail names a line's drawing by. */
export const lineCid = (lineId: number) => `skirt-${lineId}@quarterline`;

/** The inline images a message's HTML names (cid:skirt-N@quarterline), rendered from the order lines. */
export async function mailImages(db: Pick<Db, 'select'>, html: string) {
	const ids = [...new Set([...html.matchAll(/cid:skirt-(\d+)@quarterline/g)].map((m) => Number(m[1])))];
	if (!ids.length) return [];
	const lines = await draftsOfLines(db, { lineIds: ids });
	return Promise.all(
		lines.map(async (l) => ({ cid: lineCid(l.id), filename: `skirt-${l.id}.png`, contentType: 'image/png', content: await garmentPng(l.draft, fillOf(l.fabric, false)) }))
	);
}
