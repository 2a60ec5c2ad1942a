// The tiled print: the pieces at 1:1 on A4 or Letter pages to tape together. Page 1 carries the test
// square, a map of the whole sheet with its page numbers and the page count; every other page is one
// cell of the sheet's grid (row letter, column number), showing a strip of the neighbouring cells past
// its trim line, so a page trimmed on its left and top edges laps over its neighbours with the circles
// on the trim lines matching.
import { PALETTE, type Rect } from '$lib/drafting/drawing/model';
import { cellName, planTiles, spotMap, type Cell, type TilePlan } from '$lib/drafting/drawing/tiles';
import { flatten } from '$lib/drafting/outline';
import { drawMarks } from '../ticket/draw-pdf';
import { MM, line } from '../ticket/text';
import { K, boxed, newDoc, stripMarks, testSquare, type BoxedMark, type Doc } from './doc';
import { OutputError } from './errors';
import type { PatternSource } from './source';

export type TilePaper = 'a4' | 'letter';

/** Sheet sizes in points: A4 210 × 297 mm (ISO 216), Letter 8½ × 11 in (ANSI/ASME Y14.1). */
export const TILE_PAPER: Record<TilePaper, { w: number; h: number; name: string; inches: boolean }> = {
	a4: { w: 210 * MM, h: 297 * MM, name: 'A4', inches: false },
	letter: { w: 8.5 * 72, h: 11 * 72, name: 'Letter', inches: true }
};

/** 10 mm keeps every mark inside what office printers reach (most lose 4–6 mm at an edge). */
export const TILE_MARGIN = 10 * MM;
/** The band at the top of a page for its name and page number. */
export const TILE_HEADER = 9 * MM;
/** How far a page shows past its trim line into its neighbours: the overlap to tape over. */
export const TILE_OVERLAP = 8 * MM;

/** A cell's size (cm) on a page of this paper, upright or on its side. */
export function cellSize(paper: TilePaper, landscape: boolean): { w: number; h: number } {
	const p = TILE_PAPER[paper];
	const [pw, ph] = landscape ? [p.h, p.w] : [p.w, p.h];
	return { w: (pw - 2 * TILE_MARGIN - 2 * TILE_OVERLAP) / K, h: (ph - 2 * TILE_MARGIN - TILE_HEADER - 2 * TILE_OVERLAP) / K };
}

/** The tile plan with the fewest pages, upright pages first. */
export function tilePlanFor(src: PatternSource, paper: TilePaper): { plan: TilePlan; landscape: boolean } {
	let best: { plan: TilePlan; landscape: boolean } | null = null;
	for (const landscape of [false, true]) {
		const c = cellSize(paper, landscape);
		const plan = planTiles(
			src.pieces.map((s) => s.piece),
			c.w,
			c.h
		);
		if (plan && (!best || plan.cells.length < best.plan.cells.length)) best = { plan, landscape };
	}
	if (!best) throw new OutputError(400, 'These pieces cannot be tiled on this paper.');
	return best;
}

const pageName = (paper: TilePaper, landscape: boolean): [number, number] => {
	const p = TILE_PAPER[paper];
	return landscape ? [p.h, p.w] : [p.w, p.h];
};

/** Page 1: what this is, the test square, the map of the sheet and how to put it together. */
function coverPage(doc: Doc, src: PatternSource, paper: TilePaper, plan: TilePlan, landscape: boolean) {
	const p = TILE_PAPER[paper];
	doc.addPage({ size: [p.w, p.h], margin: 0 });
	const [L, R] = [TILE_MARGIN, p.w - TILE_MARGIN];
	let y = TILE_MARGIN + 14;
	const pages = plan.cells.length + 1;
	line(doc, `${src.number} · Full-size pattern, tiled on ${p.name}`, L, y, { size: 15, weight: 600, maxWidth: R - L });
	y += 16;
	line(doc, `${pages} pages: this page and ${plan.cells.length} of the pattern (${landscape ? 'landscape' : 'portrait'}). Scale 1:1, centimetres.`, L, y, {
		size: 9,
		maxWidth: R - L
	});
	y += 14;
	const sq = testSquare(doc, L, y, p.inches);
	// Beside the square: the pieces and the way to assemble.
	const tx = L + (p.inches ? 4 * 2.54 : 10) * K + 14;
	let ty = y + 8;
	const say = (s: string, o: { size?: number; weight?: 400 | 600; color?: string } = {}) => {
		line(doc, s, tx, ty, { size: o.size ?? 8, weight: o.weight, color: o.color, maxWidth: R - tx });
		ty += (o.size ?? 8) + 4;
	};
	say('Pieces', { size: 10, weight: 600 });
	for (const sp of src.pieces) say(`${sp.lines > 1 ? `Skirt ${sp.line}: ` : ''}${sp.piece.name} · ${sp.piece.cutText}`);
	ty += 6;
	say('Putting it together', { size: 10, weight: 600 });
	for (const s of [
		'1. Measure the square first. If it is not 10 cm, print again',
		'    at actual size (100 %), never "fit to page".',
		'2. Lay the pages out as the map shows.',
		'3. Trim each page on its grey line at the left and top.',
		'4. Lap it over its neighbour: the trimmed edge on the',
		'    neighbour\'s grey line, the circles matching. Tape.',
		'5. Cut on the red cutting line. Black is the seam line.'
	])
		say(s);
	y = Math.max(y + sq, ty) + 10;
	// The map: the sheet's grid at a small scale, every printed cell with its page number and name.
	line(doc, 'Map of the sheet', L, y, { size: 10, weight: 600 });
	y += 8;
	const areaW = R - L;
	const areaH = p.h - TILE_MARGIN - 20 - y;
	const sheetW = plan.cols * plan.cellW;
	const sheetH = plan.rows * plan.cellH;
	const s = Math.min(areaW / sheetW, areaH / sheetH);
	const at = (x: number, yy: number) => [L + x * s, y + yy * s] as const;
	doc.save();
	for (let row = 0; row < plan.rows; row++)
		for (let col = 0; col < plan.cols; col++) {
			const [x0, y0] = at(col * plan.cellW, row * plan.cellH);
			doc.rect(x0, y0, plan.cellW * s, plan.cellH * s).lineWidth(0.4).strokeColor(PALETTE.pencil).dash(2, { space: 2 }).stroke().undash();
		}
	const pieces = src.pieces.map((sp) => sp.piece);
	pieces.forEach((pc, i) => {
		const pts = flatten(pc.cutting.segments, 1).map(spotMap(pc, plan.strip.spots[i]));
		doc.moveTo(...at(pts[0].x, pts[0].y));
		for (const q of pts.slice(1)) doc.lineTo(...at(q.x, q.y));
		doc.closePath().lineWidth(0.6).strokeColor(PALETTE.thread).stroke();
	});
	plan.cells.forEach((c, i) => {
		const [x0, y0] = at(c.x, c.y);
		doc.rect(x0, y0, plan.cellW * s, plan.cellH * s).lineWidth(0.8).strokeColor(PALETTE.ink).stroke();
		line(doc, String(i + 2), x0 + (plan.cellW * s) / 2, y0 + (plan.cellH * s) / 2 - 3, { size: Math.min(14, plan.cellW * s * 0.35), weight: 600, align: 'center' });
		line(doc, cellName(c), x0 + (plan.cellW * s) / 2, y0 + (plan.cellH * s) / 2 + 9, { size: 7, align: 'center', color: PALETTE.pencil });
	});
	doc.restore();
	footer(doc, src, p.w, p.h, 1, pages);
}

function footer(doc: Doc, src: PatternSource, w: number, h: number, page: number, of: number) {
	line(doc, `${src.number} · full-size pattern · scale 1:1, centimetres · page ${page} of ${of}`, w / 2, h - 4.5 * MM, {
		size: 6.5,
		align: 'center',
		color: PALETTE.pencil
	});
}

/** Radius of an alignment circle; its cross reaches 1.6 times as far. */
const TARGET_R = 3 * MM;

/** pdfkit's own number form in content streams: at most six decimals. */
const num = (v: number) => String(Math.round(v * 1e6) / 1e6);

/**
 * The alignment circle with its cross, written once per document as a PDF form (ISO 32000-1, 8.10) and
 * placed on each page by its centre. Every page has up to eight, and drawn out each time they were
 * most of a page's path data, which the document then compresses. pdfkit has no call for a form, so
 * its few operators are written here: the circle as pdfkit draws one (four Bézier quarters, k = 0.5523),
 * the pen as `targets` used to set it.
 */
function targetForm(doc: Doc): PDFKit.PDFKitReference {
	const known = forms.get(doc);
	if (known) return known;
	const r = TARGET_R;
	const o = r * (4 * ((Math.SQRT2 - 1) / 3));
	const [red, green, blue] = [1, 3, 5].map((i) => parseInt(PALETTE.ink.slice(i, i + 2), 16) / 255);
	const ops = [
		'0.5 w',
		'/DeviceRGB CS',
		`${red} ${green} ${blue} SCN`,
		`${num(-r)} 0 m`,
		`${num(-r)} ${num(-o)} ${num(-o)} ${num(-r)} 0 ${num(-r)} c`,
		`${num(o)} ${num(-r)} ${num(r)} ${num(-o)} ${num(r)} 0 c`,
		`${num(r)} ${num(o)} ${num(o)} ${num(r)} 0 ${num(r)} c`,
		`${num(-o)} ${num(r)} ${num(-r)} ${num(o)} ${num(-r)} 0 c`,
		'h',
		'S',
		`${num(-1.6 * r)} 0 m`,
		`${num(1.6 * r)} 0 l`,
		`0 ${num(-1.6 * r)} m`,
		`0 ${num(1.6 * r)} l`,
		'S'
	];
	const reach = 1.6 * r + 1;
	const form = doc.ref({ Type: 'XObject', Subtype: 'Form', BBox: [-reach, -reach, reach, reach], Resources: {} });
	form.end(ops.join('\n'));
	forms.set(doc, form);
	return form;
}
const forms = new WeakMap<Doc, PDFKit.PDFKitReference>();

/** Alignment circles with a cross, centred on the trim lines. */
function targets(doc: Doc, at: [number, number][]) {
	if (!at.length) return;
	const page = (doc as unknown as { page: { xobjects: Record<string, PDFKit.PDFKitReference> } }).page;
	page.xobjects.QLTarget = targetForm(doc);
	for (const [x, y] of at) doc.addContent(`q 1 0 0 1 ${num(x)} ${num(y)} cm /QLTarget Do Q`);
}

function tilePage(doc: Doc, src: PatternSource, paper: TilePaper, plan: TilePlan, landscape: boolean, marks: BoxedMark[], printed: Map<string, number>, index: number) {
	const c = plan.cells[index];
	const [pw, ph] = pageName(paper, landscape);
	doc.addPage({ size: [pw, ph], margin: 0 });
	const [cw, ch] = [plan.cellW * K, plan.cellH * K];
	const left = TILE_MARGIN + TILE_OVERLAP;
	const top = TILE_MARGIN + TILE_HEADER + TILE_OVERLAP;
	const pages = plan.cells.length + 1;
	// The header: the cell's name large, where it sits, how to join it.
	const name = cellName(c);
	line(doc, name, TILE_MARGIN, TILE_MARGIN + 14, { size: 18, weight: 600 });
	line(doc, `page ${index + 2} of ${pages} · cell ${name} · ${src.number} · 1:1, cm`, TILE_MARGIN + 38, TILE_MARGIN + 8, { size: 8, weight: 600 });
	line(doc, 'Trim on the grey line at left and top; lap over the neighbour, circles matching.', TILE_MARGIN + 38, TILE_MARGIN + 18, {
		size: 7,
		color: PALETTE.pencil,
		maxWidth: pw - 2 * TILE_MARGIN - 38
	});
	// The pieces, clipped to the cell and its overlap.
	const view = { x0: c.x - TILE_OVERLAP / K, y0: c.y - TILE_OVERLAP / K, x1: c.x + plan.cellW + TILE_OVERLAP / K, y1: c.y + plan.cellH + TILE_OVERLAP / K };
	doc.save();
	doc.rect(left - TILE_OVERLAP, top - TILE_OVERLAP, cw + 2 * TILE_OVERLAP, ch + 2 * TILE_OVERLAP).clip();
	const map = { k: K, ox: left - c.x * K, oy: top - c.y * K };
	// Only the marks this page shows: a piece spans many pages, and letters cost the most to set.
	const shown = marks.filter(({ box: b }) => b.x0 <= view.x1 && b.x1 >= view.x0 && b.y0 <= view.y1 && b.y1 >= view.y0);
	drawMarks(doc, shown.map((b) => b.mark), map);
	doc.restore();
	// The trim line round the cell: drawn over the pieces so it is whole (the scale test finds it).
	doc.save().rect(left, top, cw, ch).lineWidth(1).strokeColor(PALETTE.pencil).stroke().restore();
	// Circles on every edge shared with another printed page, and that page's name beside them.
	const near = (dr: number, dc: number) => printed.get(`${c.row + dr}:${c.col + dc}`);
	const note = (s: string, x: number, y: number, align: 'left' | 'center' | 'right') =>
		line(doc, s, x, y, { size: 6.5, align, color: PALETTE.pencil });
	const circles: [number, number][] = [];
	for (const [dr, dc] of [
		[0, -1],
		[0, 1],
		[-1, 0],
		[1, 0]
	] as const) {
		const j = near(dr, dc);
		if (j === undefined) continue;
		const other = `${cellName(plan.cells[j])} (p. ${j + 2})`;
		if (dc !== 0) {
			const x = dc < 0 ? left : left + cw;
			for (const f of [0.25, 0.75]) circles.push([x, top + ch * f]);
			note(`joins ${other}`, dc < 0 ? x + 12 : x - 12, top + ch * 0.5, dc < 0 ? 'left' : 'right');
		} else {
			const y = dr < 0 ? top : top + ch;
			for (const f of [0.25, 0.75]) circles.push([left + cw * f, y]);
			note(`joins ${other}`, left + cw * 0.5, dr < 0 ? y + 14 : y - 8, 'center');
		}
	}
	targets(doc, circles);
	footer(doc, src, pw, ph, index + 2, pages);
}

/** How far (cm) either side of a page edge the piece names keep clear when they can: the trim line, its
 * circles (4.8 mm) and the page's "joins" notes lie there, and a name split over two pages reads badly. */
const EDGE_BAND = 1.2;

/** The bands round the edges between the sheet's cells, in strip cm. */
function pageEdges(plan: TilePlan): Rect[] {
	const [w, h] = [plan.cols * plan.cellW, plan.rows * plan.cellH];
	const out: Rect[] = [];
	for (let c = 1; c < plan.cols; c++) out.push({ x0: c * plan.cellW - EDGE_BAND, y0: 0, x1: c * plan.cellW + EDGE_BAND, y1: h });
	for (let r = 1; r < plan.rows; r++) out.push({ x0: 0, y0: r * plan.cellH - EDGE_BAND, x1: w, y1: r * plan.cellH + EDGE_BAND });
	return out;
}

/** Every piece's marks on the tiled sheet, in strip cm, its words kept off the page edges when they can. */
export const tiledMarks = (doc: Doc, src: PatternSource, plan: TilePlan) =>
	stripMarks(doc, src.pieces, plan.strip, src.number, undefined, { edges: pageEdges(plan), wrap: Math.min(plan.cellW, plan.cellH) - 2 * EDGE_BAND - 1 });

/** The tiled PDF of an order's pieces. */
export async function renderTiled(src: PatternSource, paper: TilePaper): Promise<{ bytes: Uint8Array; pages: number; plan: TilePlan; landscape: boolean }> {
	const { plan, landscape } = tilePlanFor(src, paper);
	const { doc, done } = newDoc(`Full-size pattern ${src.number} (${TILE_PAPER[paper].name}, tiled)`, 'Full-size pattern', src.number);
	coverPage(doc, src, paper, plan, landscape);
	const marks = boxed(tiledMarks(doc, src, plan).flat());
	// Which cell is printed on which page, to name a page's neighbours.
	const printed = new Map(plan.cells.map((q, i) => [`${q.row}:${q.col}`, i]));
	plan.cells.forEach((_, i) => tilePage(doc, src, paper, plan, landscape, marks, printed, i));
	doc.end();
	return { bytes: await done, pages: plan.cells.length + 1, plan, landscape };
}

export type { Cell };
