// toSvg: the block, the pieces, or the lay on the fabric, as one self-contained SVG (no external
// references, viewBox in centimetres, width and height in cm so it prints to scale at 100 %). The
// drawing itself is the drawing model's (drawing/views.ts); this file only writes its marks as SVG.
import type { Draft } from './draft';
import { estimateFabric, type FabricEstimate, type FabricOptions } from './fabric';
import { estimateWidth, PALETTE, PENS, type Curve, type Drawing, type Mark } from './drawing/model';
import { blockView, layView, piecesView } from './drawing/views';
import type { Units } from './units';

/** What to draw and in which units the figures are written. */
export interface SvgOptions {
	view: 'block' | 'pieces' | 'layout';
	units?: Units;
	/** For the layout view: the fabric to lay on (default 150 cm, no nap, no shrinkage)... */
	fabric?: FabricOptions;
	/** ...or an estimate already made. */
	estimate?: FabricEstimate;
}

/** A number for SVG: at most three decimals, no trailing zeros. */
const n = (v: number) => {
	const r = Math.round(v * 1000) / 1000 + 0;
	return Number.isFinite(r) ? String(r) : '0';
};

/** Text made safe inside SVG markup. */
const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function pathD(parts: Curve[], closed?: boolean): string {
	let d = '';
	let at: Curve['to'] | null = null;
	for (const s of parts) {
		if (!at || Math.abs(at.x - s.from.x) > 1e-9 || Math.abs(at.y - s.from.y) > 1e-9) d += `M${n(s.from.x)} ${n(s.from.y)}`;
		d += s.c1 && s.c2 ? `C${n(s.c1.x)} ${n(s.c1.y)} ${n(s.c2.x)} ${n(s.c2.y)} ${n(s.to.x)} ${n(s.to.y)}` : `L${n(s.to.x)} ${n(s.to.y)}`;
		at = s.to;
	}
	return closed ? `${d}Z` : d;
}

/** One mark as SVG, with the screen pens. */
function svgOf(m: Mark): string {
	if (m.kind === 'group') return `<g aria-label="${esc(m.name)}">${m.marks.map(svgOf).join('')}</g>`;
	// SVG drawings carry no references (url(#…)), so paper under words is not clipped to the seam line:
	// the words are placed inside it, with the seam line drawn over the paper.
	if (m.kind === 'patch')
		return m.rects.map((r) => `<rect x="${n(r.x0)}" y="${n(r.y0)}" width="${n(r.x1 - r.x0)}" height="${n(r.y1 - r.y0)}" fill="#FFFFFF"/>`).join('');
	const pen = PENS[m.role];
	if (m.kind === 'dot') return `<circle cx="${n(m.at.x)}" cy="${n(m.at.y)}" r="${n(m.r)}" fill="${PALETTE[pen.tone]}"/>`;
	if (m.kind === 'text') {
		const rot = m.angle ? ` transform="rotate(${n(m.angle)} ${n(m.at.x)} ${n(m.at.y)})"` : '';
		const style = `${m.weight === 600 ? ' font-weight="600"' : ''}${m.italic ? ' font-style="italic"' : ''}`;
		const base = m.baseline === 'alphabetic' ? '' : ' dominant-baseline="middle"';
		return `<text x="${n(m.at.x)}" y="${n(m.at.y)}" font-size="${n(m.size)}" text-anchor="${m.anchor ?? 'middle'}"${base} fill="${PALETTE[m.tone ?? 'ink']}"${style}${rot}>${esc(m.text)}</text>`;
	}
	const fill = m.fill ? `fill="${PALETTE[m.fill]}"${m.fillOpacity !== undefined ? ` fill-opacity="${m.fillOpacity}"` : ''}` : 'fill="none"';
	if (m.noStroke) return `<path d="${pathD(m.parts, m.closed)}" ${fill}/>`;
	const dash = (m.dashed ?? pen.dashed) ? ` stroke-dasharray="${pen.dash.screen.map(n).join(' ')}"` : '';
	return `<path d="${pathD(m.parts, m.closed)}" ${fill} stroke="${PALETTE[pen.tone]}" stroke-width="${n(pen.width.screen)}"${dash}/>`;
}

/** A drawing model as a self-contained SVG, 1 unit = 1 cm. */
export function drawingToSvg(d: Drawing): string {
	const { x, y, w, h } = d.box;
	return (
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(x)} ${n(y)} ${n(w)} ${n(h)}" width="${n(w)}cm" height="${n(h)}cm" font-family="Lora, Georgia, serif" role="img">` +
		`<title>${esc(d.title)}</title>${d.marks.map(svgOf).join('')}</svg>`
	);
}

/** Draws a draft as a self-contained SVG. */
export function toSvg(draft: Draft, options: SvgOptions): string {
	const units = options.units ?? 'cm';
	if (options.view === 'block') return drawingToSvg(blockView(draft, units, estimateWidth));
	if (options.view === 'pieces') return drawingToSvg(piecesView(draft, units, estimateWidth));
	const est = options.estimate ?? estimateFabric(draft, options.fabric ?? { width: 150, nap: false, shrinkage: 0 });
	return drawingToSvg(layView(draft, units, est));
}
