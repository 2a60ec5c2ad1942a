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

/** How marks are written in one drawing: the pen scale and the id of its cloth pattern. */
type Ctx = { pen: number; cloth: string | null };

/** One mark as SVG, with the screen pens. */
function svgOf(m: Mark, ctx: Ctx): string {
	if (m.kind === 'group') return `<g aria-label="${esc(m.name)}">${m.marks.map((x) => svgOf(x, ctx)).join('')}</g>`;
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
	const opacity = m.fillOpacity !== undefined ? ` fill-opacity="${m.fillOpacity}"` : '';
	const fill = m.fillCloth && ctx.cloth ? `fill="${ctx.cloth}"${opacity}` : m.fill ? `fill="${PALETTE[m.fill]}"${opacity}` : 'fill="none"';
	if (m.noStroke) return `<path d="${pathD(m.parts, m.closed)}" ${fill}/>`;
	const w = pen.width.screen * ctx.pen * (m.weight ?? 1);
	const dash = (m.dashed ?? pen.dashed) ? ` stroke-dasharray="${pen.dash.screen.map((v) => n(v * ctx.pen * Math.sqrt(m.weight ?? 1))).join(' ')}"` : '';
	const joins = ctx.pen !== 1 ? ' stroke-linejoin="round" stroke-linecap="round"' : '';
	return `<path d="${pathD(m.parts, m.closed)}" ${fill} stroke="${PALETTE[m.tone ?? pen.tone]}" stroke-width="${n(w)}"${dash}${joins}/>`;
}

/** Only #RRGGBB colours and same-site or data image addresses go into the markup. */
const safeColour = (c: string) => (/^#[0-9a-fA-F]{6}$/.test(c) ? c : '#E8DFCC');
const safeImage = (u: string) => (/^\/[A-Za-z0-9/_.-]*$/.test(u) || /^data:image\/(png|jpeg|webp);base64,[A-Za-z0-9+/=]+$/.test(u) ? u : null);

/** The cloth as an SVG fill: its colour, or a pattern tiling its swatch image over the colour (so the colour
 * shows until the image arrives, and where it cannot load). The one reference an SVG of ours carries. */
function clothDefs(d: Drawing, id: string): { defs: string; fill: string | null } {
	if (!d.cloth) return { defs: '', fill: null };
	const colour = safeColour(d.cloth.colour);
	const image = d.cloth.image ? safeImage(d.cloth.image) : null;
	if (!image) return { defs: '', fill: colour };
	const t = n(d.cloth.tile ?? 12);
	return {
		defs: `<defs><pattern id="${id}" patternUnits="userSpaceOnUse" width="${t}" height="${t}"><rect width="${t}" height="${t}" fill="${colour}"/><image href="${esc(image)}" width="${t}" height="${t}" preserveAspectRatio="xMidYMid slice"/></pattern></defs>`,
		fill: `url(#${id})`
	};
}

/** A drawing model as a self-contained SVG, 1 unit = 1 cm. `id` names the cloth pattern, unique on a page
 * that shows several drawings; `size: false` leaves out the printed size (a garment view is not to scale). */
export function drawingToSvg(d: Drawing, o: { id?: string; size?: boolean; px?: number } = {}): string {
	const { x, y, w, h } = d.box;
	const id = `cloth-${(o.id ?? 'd').replace(/[^A-Za-z0-9_-]/g, '')}`;
	const cloth = clothDefs(d, id);
	const ctx: Ctx = { pen: d.penScale ?? 1, cloth: cloth.fill };
	// `px` sizes it in pixels for a rasteriser (an image in a mail).
	const size = o.px ? ` width="${Math.round(o.px)}" height="${Math.round((o.px * h) / w)}"` : o.size === false ? '' : ` width="${n(w)}cm" height="${n(h)}cm"`;
	const data = Object.entries(d.data ?? {})
		.map(([k, v]) => ` data-${k.replace(/[^a-z0-9-]/g, '')}="${esc(typeof v === 'number' ? n(v) : v)}"`)
		.join('');
	const desc = d.description ? `<desc>${esc(d.description)}</desc>` : '';
	return (
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(x)} ${n(y)} ${n(w)} ${n(h)}"${size} font-family="Lora, Georgia, serif" role="img"${data}>` +
		`<title>${esc(d.title)}</title>${desc}${cloth.defs}${d.marks.map((m) => svgOf(m, ctx)).join('')}</svg>`
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
