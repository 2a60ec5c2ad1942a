// toSvg: the block, the pieces, or the lay on the fabric, as one self-contained SVG (no external
// references, viewBox in centimetres, width and height in cm so it prints to scale at 100 %).
import type { Draft } from './draft';
import { estimateFabric, type FabricEstimate, type FabricOptions } from './fabric';
import { P, type Point } from './geometry';
import { boundsOf } from './outline';
import { waistWithCaps, type Panel } from './panel';
import { INK, PENCIL, CHALK, THREAD, drawPiece, esc, foldBracket, grainArrow, n, pathD, polyline, scaleBar, text } from './svg-kit';
import { formatBuy, formatLength, type Units } from './units';

/** What to draw and in which units the figures are written. */
export interface SvgOptions {
	view: 'block' | 'pieces' | 'layout';
	units?: Units;
	/** For the layout view: the fabric to lay on (default 150 cm, no nap, no shrinkage)... */
	fabric?: FabricOptions;
	/** ...or an estimate already made. */
	estimate?: FabricEstimate;
}

const MARGIN = 4;

function frame(body: string, minX: number, minY: number, maxX: number, maxY: number, title: string, units: Units): string {
	const x0 = minX - MARGIN;
	const y0 = minY - MARGIN - 3;
	const w = maxX - minX + 2 * MARGIN;
	const h = maxY - minY + 2 * MARGIN + 6;
	const head = text(P(x0 + MARGIN, y0 + 1.8), title, 1.3, { anchor: 'start', weight: 600 });
	const bar = scaleBar(P(x0 + MARGIN, maxY + MARGIN), units);
	return (
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(x0)} ${n(y0)} ${n(w)} ${n(h)}" width="${n(w)}cm" height="${n(h)}cm" font-family="Lora, Georgia, serif" role="img">` +
		`<title>${esc(title)}</title>${head}${body}${bar}</svg>`
	);
}

/** One block panel as seam line (the back as drafted, the front mirrored to the right of it). */
function panelPath(p: Panel, length: number, f: (q: Point) => Point): string {
	const H = p.hipPoint;
	const segs = [
		...waistWithCaps(p),
		p.hipCurve,
		{ kind: 'line' as const, from: H, to: P(H.x, length), edge: 'side' as const },
		{ kind: 'line' as const, from: P(H.x, length), to: P(0, length), edge: 'hem' as const },
		{ kind: 'line' as const, from: P(0, length), to: p.centreHip, edge: 'centre' as const },
		{ kind: 'line' as const, from: p.centreHip, to: p.centreTop, edge: 'centre' as const }
	];
	let s = `<path d="${pathD(segs, f)}" fill="none" stroke="${INK}" stroke-width="0.12"/>`;
	for (const d of p.darts) {
		s += `<path d="${polyline([d.top1, d.point, d.top2], f)}" fill="none" stroke="${CHALK}" stroke-width="0.09"/>`;
		const c = f(d.point);
		s += `<circle cx="${n(c.x)}" cy="${n(c.y)}" r="0.18" fill="${CHALK}"/>`;
	}
	return s;
}

function blockView(draft: Draft, units: Units): string {
	const { back, front } = draft.block;
	const L = draft.block.length;
	const d = draft.block.hipDepth;
	const W = back.spec.hip + front.spec.hip;
	const id = (q: Point) => q;
	const mirror = (q: Point) => P(W - q.x, q.y);
	const dash = `stroke="${PENCIL}" stroke-width="0.06" stroke-dasharray="0.5 0.35" fill="none"`;
	let s = `<path d="M0 0H${n(W)}M0 ${n(d)}H${n(W)}M0 0V${n(L)}H${n(W)}V0" ${dash}/>`;
	s += `<path d="M${n(back.spec.hip)} ${n(d)}V${n(L)}" ${dash}/>`;
	s += panelPath(back, L, id) + panelPath(front, L, mirror);
	const fig = draft.figures;
	const small = 0.9;
	s += text(P(W / 2, d - 0.8), `Hip line, half the body: ${formatLength(fig.back.hipWidth + fig.front.hipWidth, units)}`, small, { fill: PENCIL });
	s += text(P(back.spec.hip / 2, d + 1.4), `Back ${formatLength(fig.back.hipWidth, units)}`, small);
	s += text(P(back.spec.hip + front.spec.hip / 2, d + 1.4), `Front ${formatLength(fig.front.hipWidth, units)}`, small);
	s += text(P(W / 2, -2.6), `Waist line · back mark ${formatLength(fig.back.waistWidth, units)} · front mark ${formatLength(fig.front.waistWidth, units)}`, small, { fill: PENCIL });
	s += text(P(-1.3, L / 2), 'Centre back', small, { angle: -90 });
	s += text(P(W + 1.3, L / 2), 'Centre front', small, { angle: 90 });
	s += text(P(back.spec.hip / 2, (d + L) / 2), 'BACK', 2, { weight: 600 });
	s += text(P(back.spec.hip + front.spec.hip / 2, (d + L) / 2), 'FRONT', 2, { weight: 600 });
	s += text(P(back.spec.hip / 2, (d + L) / 2 + 2.2), `waist seam ${formatLength(fig.check.waistSeam.back, units)}, darts closed`, small, { fill: PENCIL });
	s += text(P(back.spec.hip + front.spec.hip / 2, (d + L) / 2 + 2.2), `waist seam ${formatLength(fig.check.waistSeam.front, units)}, darts closed`, small, { fill: PENCIL });
	s += text(P(W / 2, L + 1.5), `Length ${formatLength(L, units)} · waist to hip ${formatLength(d, units)}${fig.hipDepthAssumed ? ' (assumed)' : ''}`, small, { fill: PENCIL });
	return frame(s, -3, -4, W + 3, L + 2.5, 'Skirt block (no allowances)', units);
}

function piecesView(draft: Draft, units: Units): string {
	const gap = 6;
	const maxRow = Math.max(160, ...draft.pieces.map((p) => p.bounds.maxX - p.bounds.minX));
	let x = 0;
	let y = 0;
	let rowH = 0;
	let right = 0;
	const parts: string[] = [];
	for (const p of draft.pieces) {
		const w = p.bounds.maxX - p.bounds.minX;
		const h = p.bounds.maxY - p.bounds.minY;
		if (x > 0 && x + w > maxRow) {
			x = 0;
			y += rowH + gap + 2;
			rowH = 0;
		}
		const dx = x - p.bounds.minX;
		const dy = y - p.bounds.minY;
		parts.push(drawPiece(p, (q) => P(q.x + dx, q.y + dy), units));
		x += w + gap;
		right = Math.max(right, x - gap);
		rowH = Math.max(rowH, h);
	}
	const names = [...new Set(draft.pieces.map((p) => (p.fabric === 'lining' ? 'lining' : 'skirt fabric')))].join(' and ');
	return frame(parts.join(''), 0, 0, right, y + rowH, `Pattern pieces · cut from ${names} · seam line black, cutting line red`, units);
}

function layoutView(draft: Draft, units: Units, est: FabricEstimate): string {
	const lay = est.layout;
	const lane = lay.laneWidth;
	const len = Math.max(lay.layLength, 1);
	// Lay coordinates (x across, y along) turned a quarter: the length runs left to right, the fold below.
	const f = (q: Point) => P(q.y, lane - q.x);
	let s = `<rect x="0" y="0" width="${n(len)}" height="${n(lane)}" fill="#FFFFFF" stroke="${PENCIL}" stroke-width="0.08"/>`;
	for (const pl of lay.pieces) {
		const piece = draft.pieces.find((p) => p.id === pl.pieceId);
		s += `<path d="${polyline(pl.outline, f)}Z" fill="#FFFFFF" stroke="${THREAD}" stroke-width="0.1"/>`;
		const b = boundsOf(pl.outline.map(f));
		const c = P((b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2);
		const size = Math.max(0.9, Math.min(2.2, (b.maxY - b.minY) / 7));
		s += grainArrow(P(c.x - (b.maxX - b.minX) * 0.3, c.y + size * 1.6), P(c.x + (b.maxX - b.minX) * 0.3, c.y + size * 1.6), 1);
		s += text(c, pl.name, size, { weight: 600 });
		const note = pl.layers === 1 && lay.folded ? 'one layer' : piece?.cut.onFold && lay.folded ? 'on the fold' : '';
		if (note) s += text(P(c.x, c.y - size * 1.2), note, size * 0.6, { fill: PENCIL, italic: true });
	}
	// The fold bracket sits just outside the fold edge, its arrows on the fold.
	if (lay.folded) s += foldBracket(P(0, lane), P(len, lane), P(0, 1), 1);
	s += text(P(len / 2, -1), lay.folded ? 'selvedges' : 'selvedge', 0.9, { fill: PENCIL, italic: true });
	if (!lay.folded) s += text(P(len / 2, lane + 1.2), 'selvedge', 0.9, { fill: PENCIL, italic: true });
	s += text(P(len / 2, lane + (lay.folded ? 5.6 : 3)), `Buy ${formatBuy(est.length, units)} of ${formatLength(lay.width, units)} wide fabric · lay ${formatLength(lay.layLength, units)}`, 1.1, { weight: 600 });
	lay.notes.forEach((t, i) => (s += text(P(0, lane + 7.4 + i * 1.4), t, 0.85, { anchor: 'start', fill: PENCIL })));
	return frame(s, 0, -2, len, lane + 7.4 + lay.notes.length * 1.4, `Lay on ${formatLength(lay.width, units)} fabric${lay.folded ? ', folded lengthwise' : ', opened out'}`, units);
}

/** Draws a draft as a self-contained SVG. */
export function toSvg(draft: Draft, options: SvgOptions): string {
	const units = options.units ?? 'cm';
	if (options.view === 'block') return blockView(draft, units);
	if (options.view === 'pieces') return piecesView(draft, units);
	const est = options.estimate ?? estimateFabric(draft, options.fabric ?? { width: 150, nap: false, shrinkage: 0 });
	return layoutView(draft, units, est);
}
