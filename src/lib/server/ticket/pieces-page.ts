// The pieces page: every piece drawn to one stated scale, a scale bar whose true length a cutter can
// check with a rule (print scaling is the usual way a drawing stops being to scale), and a legend.
import type { Piece } from '../../drafting';
import { arrowhead } from './draw';
import { drawPiece } from './piece';
import type { Area, Placed } from './layout';
import { scaleBar } from './marker';
import type { Frame } from './page-one';
import { CHALK, INK, MM, PENCIL, THREAD, line, ptPerCm } from './text';
import type { Ticket } from './ticket';

type Doc = PDFKit.PDFDocument;

/** A circle skirt's waist radius, for its skirt and lining pieces (they are cut from it). */
export const radiusOf = (t: Ticket, p: Piece) =>
	t.draft.figures.waistRadius !== undefined && (p.role === 'panel' || p.role === 'lining')
		? t.draft.figures.waistRadius
		: undefined;

/** Height of the pieces page's header, points. */
export const PIECES_HEADER = 74;

/** The drawing area of a pieces page inside its frame. */
export const piecesArea = (f: Frame): Area => ({
	x: f.left,
	y: f.top + PIECES_HEADER,
	w: f.right - f.left,
	h: f.bottom - 14 - (f.top + PIECES_HEADER)
});

/** What the page says about its scale (the tests read it back): the ratio, then how to check the print. */
export function scaleWords(scale: number): [string, string] {
	const bar = [10, 20, 50, 100, 200].find((c) => c * ptPerCm(scale) >= 40) ?? 200;
	const mm = (bar * 10) / scale;
	return [
		`Scale 1:${scale}: 1 cm on the page is ${scale} cm of cloth.`,
		`Print at actual size (100 %), not fitted to the page. Check: the ${bar} cm bar measures ${Number(mm.toFixed(1))} mm.`
	];
}

function legend(doc: Doc, x: number, y: number) {
	const items: [string, (x: number) => void][] = [
		[
			'seam line',
			(x) =>
				doc
					.save()
					.moveTo(x, y)
					.lineTo(x + 16, y)
					.lineWidth(0.6)
					.strokeColor(INK)
					.stroke()
					.restore()
		],
		[
			'cutting line',
			(x) =>
				doc
					.save()
					.moveTo(x, y)
					.lineTo(x + 16, y)
					.lineWidth(0.9)
					.strokeColor(THREAD)
					.stroke()
					.restore()
		],
		[
			'dart',
			(x) =>
				doc
					.save()
					.moveTo(x, y - 3)
					.lineTo(x + 8, y + 3)
					.lineTo(x + 16, y - 3)
					.lineWidth(0.7)
					.strokeColor(CHALK)
					.stroke()
					.restore()
		],
		[
			'construction line',
			(x) =>
				doc
					.save()
					.moveTo(x, y)
					.lineTo(x + 16, y)
					.lineWidth(0.4)
					.strokeColor(PENCIL)
					.dash(2.4, { space: 1.6 })
					.stroke()
					.undash()
					.restore()
		],
		[
			'grain line',
			(x) => {
				doc
					.save()
					.moveTo(x, y)
					.lineTo(x + 16, y)
					.lineWidth(0.6)
					.strokeColor(INK)
					.stroke()
					.restore();
				arrowhead(doc, { x: x + 16, y }, { x: 1, y: 0 }, 4);
				arrowhead(doc, { x, y }, { x: -1, y: 0 }, 4);
			}
		],
		[
			'notch',
			(x) => {
				doc
					.save()
					.moveTo(x + 4, y - 4)
					.lineTo(x + 4, y + 4)
					.lineWidth(0.9)
					.strokeColor(THREAD)
					.stroke()
					.restore();
				doc
					.save()
					.moveTo(x + 4, y - 4)
					.lineTo(x + 4, y + 0.5)
					.lineWidth(0.8)
					.strokeColor(INK)
					.stroke()
					.restore();
			}
		]
	];
	let cx = x;
	for (const [label, sample] of items) {
		sample(cx);
		cx += 20;
		cx += line(doc, label, cx, y + 2.5, { size: 7, color: INK }) + 12;
	}
	return cx;
}

/** Draws one pieces page. */
export function piecesPage(
	doc: Doc,
	t: Ticket,
	f: Frame,
	placed: Placed[],
	scale: number,
	part: { index: number; of: number }
) {
	const more = part.of > 1 ? ` (${part.index} of ${part.of})` : '';
	const tw = line(doc, `${t.number} · Pieces${more}`, f.left, f.top + 14, { size: 14, weight: 600 });
	line(doc, `${t.styleName} for ${t.firstName}`, f.left + tw + 10, f.top + 14, {
		size: 9,
		color: PENCIL,
		maxWidth: f.right - f.left - tw - 10
	});
	// The bar's true length is stated beside it, so the printed bar can be measured against a rule.
	const [ratio, check] = scaleWords(scale);
	line(doc, ratio, f.left, f.top + 29, { size: 9, weight: 600, maxWidth: f.right - f.left - 150 });
	line(doc, check, f.left, f.top + 40, { size: 7.5, maxWidth: f.right - f.left - 150 });
	const barW = scaleBar(doc, f.right - 120, f.top + 22, scale);
	line(doc, `${Number((barW / MM).toFixed(1))} mm on the page`, f.right - 120 + barW + 6, f.top + 26, {
		size: 6.5,
		color: PENCIL
	});
	legend(doc, f.left, f.top + 53);
	line(doc, 'Dimensions on the seam line (cm). Allowances lie outside it: see the piece list.', f.left, f.top + 66, {
		size: 7,
		color: PENCIL
	});
	for (const p of placed) drawPiece(doc, p.piece, p.map, p.number, p.box, radiusOf(t, p.piece));
}
