// The lay drawn as a marker: the fabric as it lies on the table (its length across), every piece where the
// lay put it, numbered as in the piece list, with its edges named, the grain, the lay's length and width,
// and a scale bar. Centimetres of cloth from the lay's top-left corner; words and symbols sized in points
// of paper (`u` cm each), so the same marker reads at 1:25 on a ticket or at full size.
import type { Layout } from '../fabric';
import { formatCm } from '../units';
import { ptPerCm, through, type Drawing, type Mark, type Measure } from './model';
import { arrowhead, scaleBar } from './symbols';

/** The band across the lay the pieces take (a piece may reach past the fold's edge when laid whole). */
export function laneOf(layout: Layout) {
	let [min, max] = [0, layout.laneWidth];
	for (const p of layout.pieces)
		for (const q of p.outline) {
			min = Math.min(min, q.x);
			max = Math.max(max, q.x);
		}
	return { min, max };
}

/** A labelled scale bar at `at`: five blocks over a round true length between about 15 and 45 mm on paper
 * (`u` cm of the drawing a point), its ends written under it. */
export function ruledBar(at: { x: number; y: number }, u: number): { mark: Mark; length: number } {
	const length = [10, 20, 50, 100, 200].find((c) => c / u >= 40) ?? 200;
	const ends = { left: '0', right: formatCm(length), size: 6.5 * u, below: 11 * u };
	return { mark: scaleBar(at, length, 5, 3.2 * u, 'white', ends), length };
}

/** Whether the marker carries the line that says what a dashed outline means. */
const needsLegend = (layout: Layout) => layout.folded && layout.pieces.some((p) => p.layers === 1);

// 1:25 sits between 1:20 and 1:50 on metric scale rules (common practice).
const MARKER_SCALES = [10, 20, 25, 50, 100] as const;
/** Room (points) the marker's words, grain arrow and scale bar take round the lay itself: markerMarks
 * draws the lay from (left, top) of a box. */
export const MARKER_PAD = { left: 16, top: 6, bottom: 32, right: 38 };

/** The scale (1:n) at which a lay and its words fit a box of w × h points. */
export function markerScale(layout: Layout, w: number, h: number): number {
	const lane = laneOf(layout);
	const P = MARKER_PAD;
	const room = { w: w - P.left - P.right, h: h - P.top - P.bottom - (needsLegend(layout) ? 10 : 0) };
	const fits = (n: number) => layout.layLength * ptPerCm(n) <= room.w && (lane.max - lane.min) * ptPerCm(n) <= room.h;
	return MARKER_SCALES.find(fits) ?? MARKER_SCALES[MARKER_SCALES.length - 1];
}

export function markerMarks(layout: Layout, scale: number, u: number, measure: Measure, numberOf: (pieceId: string) => number): Mark[] {
	const lane = laneOf(layout);
	const at = (p: { x: number; y: number }) => ({ x: p.y, y: p.x - lane.min });
	const [L, H] = [layout.layLength, lane.max - lane.min];
	const small = 6.5 * u;
	const word = (x: number, y: number, text: string, o: Partial<Extract<Mark, { kind: 'text' }>> = {}): Mark => ({
		kind: 'text',
		role: 'label',
		at: { x, y },
		text,
		size: small,
		baseline: 'alphabetic',
		...o
	});
	const marks: Mark[] = [
		{
			kind: 'path',
			role: 'cloth',
			parts: through([
				{ x: 0, y: 0 },
				{ x: L, y: 0 },
				{ x: L, y: H },
				{ x: 0, y: H }
			]),
			closed: true,
			fill: 'paper',
			noStroke: true
		},
		{
			kind: 'path',
			role: 'cloth',
			parts: through([
				{ x: 0, y: 0 },
				{ x: L, y: 0 }
			]),
			dashed: layout.folded
		},
		{
			kind: 'path',
			role: 'cloth',
			parts: through([
				{ x: 0, y: H },
				{ x: L, y: H }
			])
		},
		word(L + 3 * u, 0, layout.folded ? 'fold' : 'selvedge', { baseline: 'middle', anchor: 'start', tone: 'pencil' }),
		word(L + 3 * u, H, layout.folded ? 'selvedges' : 'selvedge', { baseline: 'middle', anchor: 'start', tone: 'pencil' })
	];
	const placed: Pt[] = [];
	const labelled = new Set<string>();
	for (const p of layout.pieces) {
		if (!p.outline.length) continue;
		marks.push({
			kind: 'path',
			role: 'cutting',
			parts: through([...p.outline, p.outline[0]].map(at)),
			closed: true,
			fill: 'white',
			dashed: p.layers === 1 && layout.folded
		});
		// A small piece laid many times (pocket bags, a pieced band) would stack its number on its
		// neighbours' at a small scale: once one copy is numbered, crowded copies go without.
		const size = 7 * u;
		const c = labelPoint(p.outline, placed, size);
		if (labelled.has(p.pieceId) && placed.some((o) => Math.hypot(o.x - c.x, o.y - c.y) < 1.5 * size)) continue;
		placed.push(c);
		labelled.add(p.pieceId);
		marks.push(word(at(c).x, at(c).y, String(numberOf(p.pieceId)), { size, weight: 600, baseline: 'middle' }));
	}
	// Grain runs along the selvedge: a double-headed arrow under the lay, then the scale and its bar.
	const gy = H + 18 * u;
	const [g1, g2] = [
		{ x: 0, y: gy },
		{ x: 50 * u, y: gy }
	];
	marks.push({ kind: 'path', role: 'grain', parts: through([g1, g2]) }, arrowhead(g2, { x: 1, y: 0 }, 4 * u), arrowhead(g1, { x: -1, y: 0 }, 4 * u));
	marks.push(word(g2.x + 4 * u, gy + 2.3 * u, 'grain', { anchor: 'start' }), word(L / 2, H + 8 * u, `lay ${formatCm(L)}`));
	marks.push(word(-4 * u, H / 2, `${formatCm(H)}${layout.folded ? ' folded' : ''}`, { baseline: 'middle', angle: 90 }));
	const sx = 92 * u;
	const ratio = `Scale 1:${scale}`;
	marks.push(word(sx, gy + 2.3 * u, ratio, { anchor: 'start', weight: 600 }));
	marks.push(ruledBar({ x: sx + measure(ratio, small, 600) + 8 * u, y: gy - 1.6 * u }, u).mark);
	if (needsLegend(layout)) marks.push(word(0, gy + 16 * u, 'Dashed outline: a piece needed from one layer only.', { anchor: 'start', tone: 'pencil' }));
	return marks;
}

type Pt = { x: number; y: number };

function inside(poly: Pt[], q: Pt) {
	let c = false;
	for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
		const [a, b] = [poly[i], poly[j]];
		if (a.y > q.y !== b.y > q.y && q.x < ((b.x - a.x) * (q.y - a.y)) / (b.y - a.y) + a.x) c = !c;
	}
	return c;
}

function edgeDistance(poly: Pt[], q: Pt) {
	let best = Infinity;
	for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
		const [a, b] = [poly[j], poly[i]];
		const [dx, dy] = [b.x - a.x, b.y - a.y];
		const t = Math.max(0, Math.min(1, ((q.x - a.x) * dx + (q.y - a.y) * dy) / (dx * dx + dy * dy || 1)));
		best = Math.min(best, Math.hypot(q.x - a.x - t * dx, q.y - a.y - t * dy));
	}
	return best;
}

/**
 * Where a piece's number goes in a nested lay: the point inside the outline farthest from its edges and
 * from the numbers already placed (pieces fitted into each other can share a middle, and a curved piece's
 * middle can lie outside it). A grid search is enough at the size of a number on the page.
 */
export function labelPoint(poly: Pt[], placed: Pt[], size: number): Pt {
	const xs = poly.map((q) => q.x);
	const ys = poly.map((q) => q.y);
	const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
	let best: Pt = { x: (x0 + x1) / 2, y: (y0 + y1) / 2 };
	let score = -Infinity;
	const N = 16;
	for (let i = 0; i <= N; i++)
		for (let j = 0; j <= N; j++) {
			const q = { x: x0 + ((x1 - x0) * (i + 0.5)) / (N + 1), y: y0 + ((y1 - y0) * (j + 0.5)) / (N + 1) };
			if (!inside(poly, q)) continue;
			const s = Math.min(edgeDistance(poly, q), ...placed.map((o) => Math.hypot(o.x - q.x, o.y - q.y) - size));
			if (s > score) [best, score] = [q, s];
		}
	return best;
}

/** The marker as a whole drawing (for the SVG back end): sized as if printed `widthPt` points wide, so its
 * words and the "Scale 1:n" line are true for a print of that size; a screen scales it to its column. */
export function markerDrawing(layout: Layout, title: string, numberOf: (pieceId: string) => number, measure: Measure, widthPt = 780): Drawing {
	const lane = laneOf(layout);
	const H = lane.max - lane.min;
	const heightPt = Math.max(160, (H / Math.max(layout.layLength, 1)) * widthPt + MARKER_PAD.top + MARKER_PAD.bottom + 30);
	const scale = markerScale(layout, widthPt, heightPt);
	const u = 1 / ptPerCm(scale);
	const P = MARKER_PAD;
	const x0 = -P.left * u;
	const y0 = -P.top * u;
	const x1 = Math.max(layout.layLength + P.right * u, 92 * u + 180 * u);
	const y1 = H + (P.bottom + (needsLegend(layout) ? 12 : 0)) * u;
	return { title, box: { x: x0, y: y0, w: x1 - x0, h: y1 - y0 }, marks: markerMarks(layout, scale, u, measure, numberOf) };
}
