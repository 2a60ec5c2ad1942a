// Cutting tickets as one PDF: for each order line a first page (order, figures, piece list, fabric and
// lay, sign-off, caution) and a pieces page drawn to scale. Fonts are embedded from the shipped Lora
// package and the QR code is drawn as vectors, so rendering needs no network.
import PDFDocument from 'pdfkit';
import { blockFigures, pieceList } from './figures';
import type { Piece } from '$lib/drafting';
import { DIM_ROOM, captionRoom } from '$lib/drafting/drawing/piece';
import { registerLora } from '../fonts/lora';
import { GAP, placeOf, planPieces, type Area, type PieceMap, type Placed } from '$lib/drafting/drawing/sheets';
import { markerScale } from '$lib/drafting/drawing/marker';
import { SIGN_OFF_HEIGHT, caution, fabric, footer, layDrawing, markerBox, signOff } from './lower';
import { banners, facts, fitAdjustments, header, type Frame } from './page-one';
import { piecesArea, piecesPage, ticketStyle } from './pieces-page';
import { remakeChanges, remakeHeight, remakeMark } from './remake';
import { MM, heading } from './text';
import type { Ticket } from '../outputs/ticket';

export type Paper = 'A4' | 'Letter';

export interface RenderOptions {
	paper: Paper;
	/** The app's origin, for the QR code's link to the order's workroom page. */
	origin: string;
}

/** Page sizes in points: A4 is 210 × 297 mm (ISO 216), US Letter 8½ × 11 in (ANSI/ASME Y14.1). */
export const PAPER_SIZES: Record<Paper, [number, number]> = { A4: [210 * MM, 297 * MM], Letter: [8.5 * 72, 11 * 72] };

/** Scales tried for the pieces, largest first: 1:5 where every piece fits one page. */
export const PIECE_SCALES = [5, 10, 20] as const;

/** 12 mm keeps every mark inside what office printers can print (most lose 4–6 mm at an edge). */
const MARGIN = 12 * MM;

function frameOf(paper: Paper, landscape: boolean): Frame {
	const [w, h] = PAPER_SIZES[paper];
	const [pw, ph] = landscape ? [h, w] : [w, h];
	return { left: MARGIN, right: pw - MARGIN, top: MARGIN, bottom: ph - MARGIN };
}

/** What the fabric section's words need under its heading (points): measured on the fullest first
 * page, a lined six-gore skirt with pockets on Letter. */
const FABRIC_TEXT = 120;

/** Free room under the pieces on a pieces page, for the lay drawing when the first page is short of it. */
function roomUnder(placed: Placed[], area: Area): Area | null {
	const bottom = Math.max(area.y, ...placed.map((p) => p.box.y + p.box.h)) + GAP + 6;
	const h = area.y + area.h - bottom - 17;
	return h > 80 ? { x: area.x, y: bottom + 17, w: area.w, h } : null;
}

function renderOne(doc: PDFKit.PDFDocument, t: Ticket, o: RenderOptions) {
	// Whether a piece's labels fit inside it depends only on the scale and its turn: worked out once each.
	const fit = new Map<string, number>();
	const caption = (p: Piece, m: PieceMap, n: number) => {
		const key = `${p.id}:${m.k}:${m.turned}`;
		if (!fit.has(key)) {
			const w = (m.turned ? p.bounds.maxY - p.bounds.minY : p.bounds.maxX - p.bounds.minX) * m.k + DIM_ROOM;
			fit.set(key, captionRoom(p, placeOf(m), ticketStyle(doc, t, p, m, n), w));
		}
		return fit.get(key)!;
	};
	const plan = planPieces(
		t.draft.pieces,
		(landscape) => piecesArea(frameOf(o.paper, landscape)),
		PIECE_SCALES,
		caption
	);
	const pages = 1 + plan.pages.length;
	doc.addPage({ size: PAPER_SIZES[o.paper], margin: 0 });
	const f = frameOf(o.paper, false);
	let y = header(doc, t, f, o.origin);
	y = banners(doc, t, f, y);
	y = facts(doc, t, f, y);
	y = fitAdjustments(doc, t, f, y);
	y = blockFigures(doc, t, f, y);
	y = pieceList(doc, t, f, y);
	footer(doc, t, f, 1, pages);
	const cautionTop = caution(doc, f, f.bottom - 16);
	const signTop = cautionTop - 8 - SIGN_OFF_HEIGHT;
	signOff(doc, f, signTop);
	// The lay moves under the pieces when the first page could only show it at 1:50 or smaller and
	// the pieces page has room for it at a larger scale.
	const lastArea = piecesArea(frameOf(o.paper, plan.landscape));
	let spare = plan.pages.length ? roomUnder(plan.pages[plan.pages.length - 1], lastArea) : null;
	// A remake's changes go above the fabric when the fabric's words still fit under them; on a full
	// first page (a lined six-gore skirt on Letter) they go under the pieces, and the header says so.
	const remakeH = remakeHeight(t.remake);
	const remakeLater = remakeH > 0 && signTop - 10 - y - remakeH < FABRIC_TEXT && !!spare && spare.h >= remakeH + 17;
	const laterTop = spare ? spare.y - 17 : 0;
	if (remakeLater && spare) spare = spare.h - remakeH > 80 ? { ...spare, y: spare.y + remakeH, h: spare.h - remakeH } : null;
	else y = remakeChanges(doc, t.remake, f, y);
	remakeMark(doc, t, f, remakeLater ? pages : null);
	const here = markerBox(f, y, signTop - 10);
	let move = false;
	if (t.estimate && spare) {
		const s1 = here.h > 40 ? markerScale(t.estimate.layout, here.w, here.h) : Infinity;
		move = s1 >= 50 && markerScale(t.estimate.layout, spare.w, spare.h) < s1;
	}
	fabric(doc, t, f, y, signTop - 10, move ? `The lay is drawn on page ${pages}, under the pieces.` : undefined);
	plan.pages.forEach((placed, i) => {
		doc.addPage({ size: PAPER_SIZES[o.paper], layout: plan.landscape ? 'landscape' : 'portrait', margin: 0 });
		const pf = frameOf(o.paper, plan.landscape);
		piecesPage(doc, t, pf, placed, plan.scale, { index: i + 1, of: plan.pages.length });
		if (remakeLater && i === plan.pages.length - 1) remakeChanges(doc, t.remake, { left: lastArea.x, right: lastArea.x + lastArea.w }, laterTop);
		if (move && spare && i === plan.pages.length - 1) {
			heading(doc, 'Lay on the fabric (its own scale)', spare.x, spare.y - 17, spare.w);
			layDrawing(doc, t, spare);
		}
		footer(doc, t, pf, i + 2, pages);
	});
}

/** Renders the tickets (one per order line, in the order given) as one PDF. */
export async function renderTickets(tickets: Ticket[], options: RenderOptions): Promise<Buffer> {
	if (!tickets.length) throw new Error('No tickets to render.');
	const numbers = [...new Set(tickets.map((t) => t.number))];
	const doc = new PDFDocument({
		autoFirstPage: false,
		margin: 0,
		// No default Helvetica: every letter on the ticket is Lora, embedded.
		font: null as unknown as string,
		displayTitle: true,
		lang: 'en',
		info: {
			Title: numbers.length === 1 ? `Cutting ticket ${numbers[0]}` : `Cutting tickets ${numbers.join(', ')}`,
			Subject: 'Cutting ticket',
			Keywords: numbers.join(' '),
			Author: 'Quarterline workroom',
			Creator: 'Quarterline',
			Producer: 'Quarterline',
			CreationDate: new Date()
		}
	});
	const chunks: Buffer[] = [];
	const done = new Promise<Buffer>((resolve, reject) => {
		doc.on('data', (c: Buffer) => chunks.push(c));
		doc.on('end', () => resolve(Buffer.concat(chunks)));
		doc.on('error', reject);
	});
	registerLora(doc);
	for (const t of tickets) renderOne(doc, t, options);
	doc.end();
	return done;
}
