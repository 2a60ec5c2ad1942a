// Full-size pieces on large paper: an A0 sheet (more sheets when the pieces need them), a plotter roll
// of a given width, or the projector file (one page, light lines on a dark ground under a numbered 5 cm
// grid, to be projected onto the cloth on a cutting table).
import { PALETTE } from '../../drafting/drawing/model';
import { itemOf, narrowestStrip, packSheets, type StripPlan } from '../../drafting/drawing/tiles';
import { drawMarks, type Look } from '../ticket/draw-pdf';
import { MM, line } from '../ticket/text';
import { DARK, K, newDoc, stripMarks, testSquare, type Doc } from './doc';
import { OutputError } from './errors';
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

const items = (src: PatternSource) => src.pieces.map((sp, i) => itemOf(String(i), sp.piece));

/** The narrowest roll the pieces fit on, one piece turned to its narrower side (cm). */
export const narrowestRoll = (src: PatternSource) => narrowestStrip(items(src)) + 2 * EDGE;

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

function header(doc: Doc, src: PatternSource, kind: Kind, w: number, sheet: number, sheets: number, look: Look) {
	const ink = look.palette?.ink ?? PALETTE.ink;
	const x = EDGE * K;
	const what = kind === 'a0' ? 'on A0' : kind === 'roll' ? `on a ${w} cm roll` : 'for a projector';
	line(doc, `${src.number} · Full-size pattern ${what}${sheets > 1 ? ` · sheet ${sheet} of ${sheets}` : ''}`, x, EDGE * K + 22, { size: 22, weight: 600, color: ink });
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

/** The single-page (or A0 multi-sheet) PDF of an order's pieces at full size. */
export async function renderSheet(src: PatternSource, kind: Kind, rollWidth?: number): Promise<{ bytes: Uint8Array; pages: number }> {
	let pageW: number;
	let sheets: StripPlan[] | null;
	if (kind === 'a0') {
		// Upright or on its side, whichever takes fewer sheets.
		const up = packSheets(items(src), A0.w - 2 * EDGE, A0.h - 2 * EDGE - HEAD);
		const side = packSheets(items(src), A0.h - 2 * EDGE, A0.w - 2 * EDGE - HEAD);
		const best = [up, side].filter((s) => s !== null).sort((a, b) => a!.length - b!.length)[0] ?? null;
		if (!best) throw new OutputError(400, 'A piece is larger than an A0 sheet: choose the roll or a tiled print.');
		sheets = best;
		pageW = best === up ? A0.w : A0.h;
	} else {
		pageW = kind === 'roll' ? rollWidth! : Math.max(PROJECTOR_WIDTH, Math.ceil(narrowestRoll(src)));
		if (kind === 'roll') checkRollWidth(src, pageW);
		const one = packSheets(items(src), pageW - 2 * EDGE);
		if (!one) throw new OutputError(400, 'The pieces do not fit this width.');
		sheets = one;
	}
	const look = LOOKS[kind];
	const { doc, done } = newDoc(`Full-size pattern ${src.number} (${kind === 'a0' ? 'A0' : kind === 'roll' ? `${pageW} cm roll` : 'projector'})`, 'Full-size pattern', src.number);
	const words = kind === 'projector' ? 4 : undefined;
	sheets.forEach((plan, s) => {
		const pageH = kind === 'a0' ? (pageW === A0.w ? A0.h : A0.w) : Math.ceil(HEAD + plan.length + 2 * EDGE);
		doc.addPage({ size: [pageW * K, pageH * K], margin: 0 });
		if (look.palette) doc.rect(0, 0, pageW * K, pageH * K).fill(look.palette.paper);
		if (kind === 'projector') grid(doc, pageW, pageH);
		header(doc, src, kind, pageW, s + 1, sheets.length, look);
		// Only this sheet's pieces (the spots of the others' are holes).
		const here = src.pieces.map((sp, i) => (plan.spots[i] ? i : -1)).filter((i) => i >= 0);
		const marks = stripMarks(
			doc,
			here.map((i) => src.pieces[i]),
			{ ...plan, spots: here.map((i) => plan.spots[i]) },
			src.number,
			words
		);
		const map = { k: K, ox: EDGE * K, oy: (EDGE + HEAD) * K };
		for (const m of marks) drawMarks(doc, m, map, look);
		line(doc, `${src.number} · scale 1:1, centimetres${sheets.length > 1 ? ` · sheet ${s + 1} of ${sheets.length}` : ''}`, (pageW * K) / 2, pageH * K - 8 * MM, {
			size: 10,
			align: 'center',
			color: look.palette?.pencil ?? PALETTE.pencil
		});
	});
	doc.end();
	return { bytes: await done, pages: sheets.length };
}
