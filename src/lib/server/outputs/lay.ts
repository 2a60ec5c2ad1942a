// The lay at full size: a marker printed on a roll as wide as the cloth (or as the folded cloth) to lay on
// top of it and cut through. The cloth runs down the page: x across the cloth from the fold (or the
// near selvedge), y along it from the start of the lay. One page per skirt of the order.
import { labelPoint, laneOf } from '$lib/drafting/drawing/marker';
import { PALETTE, through, type Mark } from '$lib/drafting/drawing/model';
import { arrowhead } from '$lib/drafting/drawing/symbols';
import type { Layout } from '$lib/drafting/fabric';
import { formatCm } from '$lib/drafting/units';
import { drawMarks } from '../ticket/draw-pdf';
import { line } from '../ticket/text';
import { K, newDoc, testSquare, type Doc } from './doc';
import type { PatternSource, SourceLay } from './source';

/** Room left of the cloth for the ruler, right of it for the edge's name, cm. */
const LEFT = 6;
const RIGHT = 4;
/** The band above the lay for its title and the test square, and below it for the end, cm. */
const HEAD = 16;
const FOOT = 6;

/** The lay's marks in cm with the cloth's corner at (0, 0). */
export function layMarks(layout: Layout): Mark[] {
	const lane = laneOf(layout);
	const W = lane.max - lane.min;
	const L = layout.layLength;
	const at = (q: { x: number; y: number }) => ({ x: q.x - lane.min, y: q.y });
	const text = (x: number, y: number, s: string, size: number, o: Partial<Extract<Mark, { kind: 'text' }>> = {}): Mark => ({ kind: 'text', role: 'label', at: { x, y }, text: s, size, ...o });
	const edge = layout.folded ? 'fold' : 'selvedge';
	const far = layout.folded ? 'selvedges' : 'selvedge';
	const marks: Mark[] = [
		{ kind: 'path', role: 'cloth', parts: through([{ x: 0, y: 0 }, { x: W, y: 0 }, { x: W, y: L }, { x: 0, y: L }]), closed: true, fill: 'paper', noStroke: true },
		// The near edge (the fold, dashed, when folded) and the far edge, drawn the whole length.
		{ kind: 'path', role: 'cloth', parts: through([{ x: 0, y: 0 }, { x: 0, y: L }]), dashed: layout.folded },
		{ kind: 'path', role: 'cloth', parts: through([{ x: W, y: 0 }, { x: W, y: L }]) }
	];
	// The edges named every 50 cm down the lay, so a name is in sight wherever the roll is cut.
	for (let y = 25; y < L; y += 50) {
		marks.push(text(0.8, y, edge, 0.9, { angle: 90, tone: 'pencil', italic: true }));
		marks.push(text(W + 1.5, y, far, 0.9, { angle: 90, tone: 'pencil', italic: true }));
	}
	const placed: { x: number; y: number }[] = [];
	for (const p of layout.pieces) {
		if (!p.outline.length) continue;
		const poly = p.outline.map(at);
		marks.push({ kind: 'path', role: 'cutting', parts: through([...poly, poly[0]]), closed: true, fill: 'white', dashed: p.layers === 1 && layout.folded });
		const c = labelPoint(poly, placed, 6);
		placed.push(c);
		const ys = poly.map((q) => q.y);
		const span = Math.max(...ys) - Math.min(...ys);
		// Grain runs along the selvedge, down the page: an arrow through the piece's label point.
		const half = Math.min(20, span * 0.22);
		const gy = Math.min(Math.max(c.y, Math.min(...ys) + half + 2), Math.max(...ys) - half - 2);
		const [g1, g2] = [{ x: c.x - 2.5, y: gy - half }, { x: c.x - 2.5, y: gy + half }];
		marks.push({ kind: 'path', role: 'grain', parts: through([g1, g2]) }, arrowhead(g2, { x: 0, y: 1 }, 1.2), arrowhead(g1, { x: 0, y: -1 }, 1.2));
		const size = Math.max(0.8, Math.min(1.6, span / 12));
		const note = layout.folded ? (p.layers === 1 ? 'one layer only' : 'both layers') : 'one layer';
		marks.push(text(c.x, c.y, p.name, size, { angle: 90, weight: 600 }), text(c.x + size * 1.3, c.y, note, size * 0.6, { angle: 90, tone: 'pencil' }));
	}
	// The ruler down the near edge: a tick every centimetre, longer at 5, numbered every 10 cm.
	const ticks: { from: { x: number; y: number }; to: { x: number; y: number } }[] = [];
	for (let y = 0; y <= L + 1e-9; y += 1) {
		const long = Math.round(y) % 10 === 0 ? 2 : Math.round(y) % 5 === 0 ? 1.3 : 0.7;
		ticks.push({ from: { x: -0.5, y }, to: { x: -0.5 - long, y } });
		if (Math.round(y) % 10 === 0) marks.push(text(-3.2, y, String(Math.round(y)), 0.6, { anchor: 'end' }));
	}
	marks.push({ kind: 'path', role: 'scale-bar', parts: [{ from: { x: -0.5, y: 0 }, to: { x: -0.5, y: L } }, ...ticks] });
	// The end of the lay, and its length.
	marks.push({ kind: 'path', role: 'dimension', parts: through([{ x: -3, y: L }, { x: W + 3, y: L }]) });
	marks.push(text(W / 2, L + 1.6, `end of the lay · lay length ${formatCm(L)}`, 1, { weight: 600 }));
	return marks;
}

function layPage(doc: Doc, src: PatternSource, lay: SourceLay, index: number, of: number) {
	const layout = lay.layout;
	const lane = laneOf(layout);
	const W = lane.max - lane.min;
	const pageW = LEFT + W + RIGHT;
	const pageH = HEAD + layout.layLength + FOOT;
	doc.addPage({ size: [pageW * K, pageH * K], margin: 0 });
	const t = lay.ticket;
	const x = LEFT * K;
	const skirt = of > 1 ? ` · skirt ${index} of ${of}` : '';
	line(doc, `${src.number} · Lay at full size${skirt}`, x, 2 * K, { size: 20, weight: 600, maxWidth: Math.max(60, (W - 14) * K) });
	const cloth = `${t.fabric.name}, ${formatCm(layout.width)} wide${layout.folded ? `, folded lengthwise to ${formatCm(layout.laneWidth)}` : ', opened out'}`;
	const facts = [
		cloth,
		`Lay length ${formatCm(layout.layLength)} · scale 1:1, centimetres · ruler every 10 cm down the ${layout.folded ? 'fold' : 'near selvedge'}`,
		'Lay the paper on the cloth, edges on the edges; cut through on the red lines.',
		...layout.notes
	];
	facts.forEach((f, i) => line(doc, f, x, 2 * K + 20 + i * 13, { size: 10, color: i ? PALETTE.pencil : PALETTE.ink, maxWidth: Math.max(60, (W - 14) * K) }));
	testSquare(doc, (pageW - RIGHT - 11) * K, 1.5 * K, false);
	drawMarks(doc, layMarks(layout), { k: K, ox: LEFT * K, oy: HEAD * K });
}

/** The lay PDF of an order: one page a skirt. */
export async function renderLay(src: PatternSource, lays: SourceLay[]): Promise<{ bytes: Uint8Array; pages: number }> {
	const { doc, done } = newDoc(`Lay at full size ${src.number}`, 'Full-size lay', src.number);
	lays.forEach((l, i) => layPage(doc, src, l, i + 1, lays.length));
	doc.end();
	return { bytes: await done, pages: lays.length };
}
