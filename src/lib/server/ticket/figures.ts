// The drafted block's figures for each panel, the checks a pattern cutter makes, and the piece list.
import type { DartFigure, Piece } from '$lib/drafting';
import { formatCm } from '$lib/drafting';
import type { Frame } from './page-one';
import { INK, PENCIL, heading, line, table, widthOf } from './text';
import type { Ticket } from '../outputs/ticket';
import { allowanceWords, cutSize } from './words';

type Doc = PDFKit.PDFDocument;

const ROW = 10.5;

function row(
	doc: Doc,
	cells: { text: string; x: number; align?: 'left' | 'right'; color?: string; weight?: 400 | 600; maxWidth?: number }[],
	y: number,
	size = 8
) {
	for (const c of cells)
		line(doc, c.text, c.x, y, {
			size,
			align: c.align ?? 'left',
			color: c.color ?? INK,
			weight: c.weight,
			maxWidth: c.maxWidth
		});
}

const dartCell = (darts: DartFigure[], i: number, key: keyof DartFigure) => (darts[i] ? formatCm(darts[i][key]) : '—');

/** Block figures (left) and checks (right); returns the y below. */
export function blockFigures(doc: Doc, t: Ticket, f: Frame, top: number): number {
	const W = f.right - f.left;
	const wl = W * 0.58;
	const x = f.left;
	const fig = t.draft.figures;
	const pair = (b: number, fr: number) => [formatCm(b), formatCm(fr)];
	const rows: string[][] = [
		['Hip width (centre line to side seam, on the hip line)', ...pair(fig.back.hipWidth, fig.front.hipWidth)],
		['Waist width (to the waist mark, darts open)', ...pair(fig.back.waistWidth, fig.front.waistWidth)],
		['Side shaping (hip width − waist width)', ...pair(fig.back.sideShaping, fig.front.sideShaping)],
		['Side raise (side waist point above the waist line)', ...pair(fig.back.sideRaise, fig.front.sideRaise)],
		['Centre back shaping / centre front drop', ...pair(fig.back.centreShaping, fig.front.centreDrop)]
	];
	const n = Math.max(fig.back.darts.length, fig.front.darts.length);
	if (n === 0) rows.push(['Darts', 'none', 'none']);
	for (let i = 0; i < n; i++) {
		const [b, fr] = [fig.back.darts, fig.front.darts];
		rows.push([
			`Dart ${i + 1}: position, centre line to its middle`,
			dartCell(b, i, 'fromCentre'),
			dartCell(fr, i, 'fromCentre')
		]);
		rows.push([`Dart ${i + 1}: intake`, dartCell(b, i, 'intake'), dartCell(fr, i, 'intake')]);
		rows.push([`Dart ${i + 1}: length`, dartCell(b, i, 'length'), dartCell(fr, i, 'length')]);
	}
	const half = t.draft.left ? ', her right half' : '';
	let y = heading(doc, `Block figures, each panel${half} (on the seam line, no allowances)`, x, top, wl);
	y = table(doc, x, y, [x + wl * 0.78, x + wl], rows, { label: wl * 0.64, step: ROW, head: ['Back', 'Front'] });
	const style = t.draft.style;
	const note =
		style === 'half-circle' || style === 'full-circle'
			? 'A circle skirt is cut from its waist radius and has no darts: the block is for reference.'
			: style === 'gored'
				? 'The six panels take this dart shaping into their seams.'
				: style === 'a-line'
					? 'The A-line closes the dart nearest the side into flare at the hem.'
					: '';
	if (note) {
		line(doc, note, x, y + 8, { size: 6.8, color: PENCIL, maxWidth: wl });
		y += ROW;
	}
	// Checks, beside the figures.
	const xr = f.left + wl + 18;
	const wr = f.right - xr;
	const c = fig.check;
	let yr = heading(doc, 'Checks', xr, top, wr);
	const checks = [
		['Waist seam, darts closed', ...pair(c.waistSeam.back, c.waistSeam.front)],
		['Hip line', ...pair(c.hipLine.back, c.hipLine.front)],
		['Side seam, waist to hem', ...pair(c.sideSeam.back, c.sideSeam.front)],
		['Dart legs differ by', ...pair(c.dartLegs.back, c.dartLegs.front)]
	];
	yr = table(doc, xr, yr, [xr + wr * 0.78, xr + wr], checks, { label: wr * 0.55, step: ROW, head: ['Back', 'Front'] });
	const totals = [['Hem girth, finished', formatCm(fig.hemGirth)]];
	if (fig.waistRadius !== undefined) totals.push(['Waist radius', formatCm(fig.waistRadius)]);
	yr = table(doc, xr, yr, [xr + wr], totals, { step: ROW });
	line(doc, 'Side seams sewn together agree within the house easing.', xr, yr + 8, {
		size: 6.5,
		color: PENCIL,
		maxWidth: wr
	});
	yr += ROW;
	return Math.max(y, yr) + 6;
}

/** How many pieces a cut instruction makes. */
export const pieceCount = (p: Piece) => (p.cut.onFold ? 1 : p.cut.count);

/** The piece list; returns the y below. */
export function pieceList(doc: Doc, t: Ticket, f: Frame, top: number): number {
	const x = f.left;
	const W = f.right - f.left;
	let y = heading(doc, 'Piece list', x, top, W);
	const cols = { n: x, piece: x + 14, fabric: x + W * 0.25, cut: x + W * 0.35, allow: x + W * 0.52, size: f.right };
	row(
		doc,
		[
			{ text: '#', x: cols.n, color: PENCIL },
			{ text: 'Piece', x: cols.piece, color: PENCIL },
			{ text: 'Fabric', x: cols.fabric, color: PENCIL },
			{ text: 'Cut', x: cols.cut, color: PENCIL },
			{ text: 'Allowances (cm)', x: cols.allow, color: PENCIL },
			{ text: 'Cut size (cm)', x: cols.size, align: 'right', color: PENCIL }
		],
		y + 7,
		7
	);
	y += ROW - 1;
	t.draft.pieces.forEach((p, i) => {
		// Allowances wrap at their separators rather than being cut short.
		const room = cols.size - cols.allow - 58;
		const parts = allowanceWords(p).split(' · ');
		const lines: string[] = [];
		for (const part of parts) {
			const last = lines[lines.length - 1];
			if (last !== undefined && widthOf(doc, `${last} · ${part}`, 8) <= room)
				lines[lines.length - 1] = `${last} · ${part}`;
			else lines.push(part);
		}
		row(
			doc,
			[
				{ text: String(i + 1), x: cols.n, weight: 600 },
				{ text: p.name, x: cols.piece, weight: 600, maxWidth: cols.fabric - cols.piece - 6 },
				{ text: p.fabric === 'lining' ? 'Lining' : 'Skirt fabric', x: cols.fabric },
				{ text: p.cutText, x: cols.cut, maxWidth: cols.allow - cols.cut - 6 },
				{ text: lines[0] ?? '', x: cols.allow, maxWidth: room },
				{ text: cutSize(p), x: cols.size, align: 'right' }
			],
			y + 8
		);
		for (const more of lines.slice(1)) {
			y += ROW - 1.5;
			row(doc, [{ text: more, x: cols.allow, maxWidth: room }], y + 8);
		}
		y += ROW;
	});
	const shell = t.draft.pieces.filter((p) => p.fabric === 'shell').reduce((a, p) => a + pieceCount(p), 0);
	const lining = t.draft.pieces.filter((p) => p.fabric === 'lining').reduce((a, p) => a + pieceCount(p), 0);
	const total = `In all: ${shell} piece${shell === 1 ? '' : 's'} of skirt fabric${lining ? `, ${lining} of lining` : ''}. Allowances are included in the cut size; a fold edge has none.`;
	line(doc, total, x, y + 8, { size: 6.8, color: PENCIL, maxWidth: W });
	return y + ROW + 6;
}
