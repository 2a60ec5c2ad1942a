// Full-size pieces on large paper, always one page: an A0 sheet, a plotter roll of a given width, or the
// projector file (light lines on a dark ground under a numbered 5 cm grid, to be projected onto the cloth
// on a cutting table). Pieces that do not all fit one A0 sheet are refused with the way out (the roll, or
// a tiled print): a copy shop prints a file page by page, and a second sheet would be a second pattern to
// line up by eye with no alignment marks.
import { PALETTE } from '$lib/drafting/drawing/model';
import type { Piece } from '$lib/drafting';
import { itemOf, narrowestStrip, packSheets, type StripPlan } from '$lib/drafting/drawing/tiles';
import { drawMarks, type Look } from '../ticket/draw-pdf';
import { MM, line } from '../ticket/text';
import { DARK, K, newDoc, stripMarks, testSquare, type Doc } from './doc';
import type { Db } from '../db/client';
import { OutputError } from './errors';
import { loadOrderDrafts } from './order-drafts';
import type { PatternSource } from './source';

/** A0, 841 × 1189 mm (ISO 216). */
export const A0 = { w: 84.1, h: 118.9 };
/** Plotters lose 5–15 mm at the edges (common practice): pieces keep 2 cm clear. */
const EDGE = 2;
/** The band across the top for the title and the test square, cm. */
const HEAD = 16;
/** The widest roll the shop prints on (a 300 cm plotter is already rare). */
export const MAX_ROLL_CM = 300;
/** The projector's page: as wide as a large cutting mat (120 cm, common practice), as long as needed. */
export const PROJECTOR_WIDTH = 120;

const items = (pieces: Pick<Piece, 'bounds'>[]) => pieces.map((p, i) => itemOf(String(i), p));
const piecesOf = (src: PatternSource) => src.pieces.map((sp) => sp.piece);

/** The pieces on one A0 sheet, upright when they fit so, else on its side; null when they do not all fit
 * one sheet either way. */
export function a0Plan(pieces: Pick<Piece, 'bounds'>[]): { plan: StripPlan; landscape: boolean } | null {
	const one = (w: number, h: number) => {
		const sheets = packSheets(items(pieces), w - 2 * EDGE, h - 2 * EDGE - HEAD);
		return sheets && sheets.length === 1 ? sheets[0] : null;
	};
	const up = one(A0.w, A0.h);
	if (up) return { plan: up, landscape: false };
	const side = one(A0.h, A0.w);
	return side ? { plan: side, landscape: true } : null;
}

/** The narrowest roll the pieces fit on, one piece turned to its narrower side (cm). */
export const narrowestRoll = (src: PatternSource) => narrowestStrip(items(piecesOf(src))) + 2 * EDGE;

/** The piece that sets the narrowest roll, by name. */
function widestPiece(src: PatternSource): string {
	let best = src.pieces[0].piece;
	const across = (p: typeof best) => Math.min(p.bounds.maxX - p.bounds.minX, p.bounds.maxY - p.bounds.minY);
	for (const sp of src.pieces) if (across(sp.piece) > across(best)) best = sp.piece;
	return best.name;
}

/** Checks a roll width (cm) against the pieces and the plotter's limit. */
export function checkRollWidth(src: PatternSource, width: number) {
	if (!Number.isFinite(width) || width > MAX_ROLL_CM) throw new OutputError(400, `A roll is at most ${MAX_ROLL_CM} cm wide; you asked for ${width} cm.`);
	const need = Math.ceil(narrowestRoll(src) * 10) / 10;
	if (width < need)
		throw new OutputError(400, `The ${widestPiece(src)} needs a roll at least ${need} cm wide (its narrower side plus ${EDGE} cm each edge); you asked for ${width} cm.`);
}

type Kind = 'a0' | 'roll' | 'projector';

function header(doc: Doc, src: PatternSource, kind: Kind, w: number, look: Look) {
	const ink = look.palette?.ink ?? PALETTE.ink;
	const x = EDGE * K;
	const what = kind === 'a0' ? 'on A0' : kind === 'roll' ? `on a ${w} cm roll` : 'for a projector';
	line(doc, `${src.number} · Full-size pattern ${what}`, x, EDGE * K + 22, { size: 22, weight: 600, color: ink });
	line(doc, 'Scale 1:1, centimetres. Print or project at 100 %, no scaling; measure the square first.', x, EDGE * K + 44, { size: 12, color: ink });
	const pieces = src.pieces.map((sp) => `${sp.piece.name}: ${sp.piece.cutText}`).join(' · ');
	line(doc, pieces, x, EDGE * K + 62, { size: 10, color: ink, maxWidth: (w - 2 * EDGE - 14) * K });
	if (kind === 'projector')
		line(doc, 'Grid lines every 5 cm, numbered in cm from the top-left corner: check the projection against a rule anywhere on the mat.', x, EDGE * K + 78, {
			size: 10,
			color: ink,
			maxWidth: (w - 2 * EDGE - 14) * K
		});
	// The test square in the band's right-hand corner.
	testSquare(doc, (w - EDGE - 12) * K, EDGE * K, false, { ink, paper: look.palette?.paper ?? PALETTE.white });
}

/** The 5 cm grid across the whole page, every line numbered at both edges and every 50 cm inside. */
function grid(doc: Doc, w: number, h: number) {
	doc.save();
	for (let x = 0; x <= w + 1e-9; x += 5) {
		const major = Math.round(x) % 50 === 0;
		doc.moveTo(x * K, 0).lineTo(x * K, h * K).lineWidth(major ? 1.2 : 0.5).strokeColor(major ? '#5D6579' : '#394054').stroke();
	}
	for (let y = 0; y <= h + 1e-9; y += 5) {
		const major = Math.round(y) % 50 === 0;
		doc.moveTo(0, y * K).lineTo(w * K, y * K).lineWidth(major ? 1.2 : 0.5).strokeColor(major ? '#5D6579' : '#394054').stroke();
	}
	doc.restore();
	const num = (s: string, x: number, y: number, align: 'left' | 'center' | 'right') => line(doc, s, x, y, { size: 9, color: '#8C93A6', align });
	for (let x = 5; x < w - 1e-9; x += 5) {
		num(String(x), x * K, 10, 'center');
		num(String(x), x * K, h * K - 4, 'center');
	}
	for (let y = 5; y < h - 1e-9; y += 5) {
		num(String(y), 3, y * K - 2, 'left');
		num(String(y), w * K - 3, y * K - 2, 'right');
	}
	// Inside the page, every 50 cm crossing says where it is, so any part of the projection can be checked.
	for (let x = 50; x < w; x += 50) for (let y = 50; y < h; y += 50) num(`${x} | ${y}`, x * K + 3, y * K - 3, 'left');
}

const LOOKS: Record<Kind, Look> = {
	a0: {},
	roll: {},
	// Thick cutting lines to cut along under a projector's soft edge; seam and marks a little heavier too.
	projector: { palette: DARK, widen: { cutting: 4, seam: 2, grain: 2, notch: 2.5, dart: 2, fold: 2 } }
};

/** The one-page PDF of an order's pieces at full size. */
export async function renderSheet(src: PatternSource, kind: Kind, rollWidth?: number): Promise<{ bytes: Uint8Array; pages: number }> {
	let pageW: number;
	let pageH: number;
	let plan: StripPlan;
	if (kind === 'a0') {
		const a0 = a0Plan(piecesOf(src));
		if (!a0)
			throw new OutputError(
				400,
				`The pieces of ${src.number} do not all fit on one A0 sheet (84.1 × 118.9 cm) at full size: print them on the plotter roll (one page as long as they need) or tiled on A4 or Letter.`
			);
		plan = a0.plan;
		[pageW, pageH] = a0.landscape ? [A0.h, A0.w] : [A0.w, A0.h];
	} else {
		pageW = kind === 'roll' ? rollWidth! : Math.max(PROJECTOR_WIDTH, Math.ceil(narrowestRoll(src)));
		if (kind === 'roll') checkRollWidth(src, pageW);
		const one = packSheets(items(piecesOf(src)), pageW - 2 * EDGE);
		if (!one) throw new OutputError(400, 'The pieces do not fit this width.');
		plan = one[0];
		pageH = Math.ceil(HEAD + plan.length + 2 * EDGE);
	}
	const look = LOOKS[kind];
	const { doc, done } = newDoc(`Full-size pattern ${src.number} (${kind === 'a0' ? 'A0' : kind === 'roll' ? `${pageW} cm roll` : 'projector'})`, 'Full-size pattern', src.number);
	doc.addPage({ size: [pageW * K, pageH * K], margin: 0 });
	if (look.palette) doc.rect(0, 0, pageW * K, pageH * K).fill(look.palette.paper);
	if (kind === 'projector') grid(doc, pageW, pageH);
	header(doc, src, kind, pageW, look);
	const marks = stripMarks(doc, src.pieces, plan, src.number, kind === 'projector' ? 4 : undefined);
	const map = { k: K, ox: EDGE * K, oy: (EDGE + HEAD) * K };
	for (const m of marks) drawMarks(doc, m, map, look);
	line(doc, `${src.number} · scale 1:1, centimetres`, (pageW * K) / 2, pageH * K - 8 * MM, {
		size: 10,
		align: 'center',
		color: look.palette?.pencil ?? PALETTE.pencil
	});
	doc.end();
	return { bytes: await done, pages: 1 };
}

/** Whether an order's pieces all fit one A0 sheet, for the order page to say so before a download;
 * null when the order cannot be drafted (the download then says why). */
export async function a0FitsOrder(db: Db, orderId: number): Promise<boolean | null> {
	try {
		const order = await loadOrderDrafts(db, orderId);
		return a0Plan(order.lines.flatMap((l) => l.draft.pieces)) !== null;
	} catch {
		return null;
	}
}
