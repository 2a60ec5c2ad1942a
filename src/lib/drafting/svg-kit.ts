// Drawing pieces for the SVG views, in the house drawing conventions: seam line solid ink, cutting line
// thread red, construction lines pencil grey dashed, darts chalk blue, grain line a long double-headed
// arrow, fold edge a bracket and the word "fold", notches short ticks, labels in Lora, a scale bar.
import { add, mul, normalOf, sub, unit, type Point, type Segment } from './geometry';
import { allowanceText, type Piece } from './pieces';
import { formatLength, type Units } from './units';

// The house palette (DESIGN.md): ink, thread red, pencil grey, chalk blue, paper.
export const INK = '#1E2230';
export const THREAD = '#A8323E';
export const PENCIL = '#6B6F7A';
export const CHALK = '#35598A';
export const PAPER = '#F6F1E7';

/** A number for SVG: at most three decimals, no trailing zeros. */
export const n = (v: number) => {
	const r = Math.round(v * 1000) / 1000 + 0;
	return Number.isFinite(r) ? String(r) : '0';
};

/** Text made safe inside SVG markup. */
export const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** A point map: piece coordinates to drawing coordinates. */
export type Map2 = (p: Point) => Point;

/** SVG path data for a run of segments through a point map. */
export function pathD(segs: Segment[], f: Map2, close = true): string {
	if (!segs.length) return '';
	const s0 = f(segs[0].from);
	let d = `M${n(s0.x)} ${n(s0.y)}`;
	for (const s of segs) {
		const t = f(s.to);
		if (s.kind === 'line') d += `L${n(t.x)} ${n(t.y)}`;
		else {
			const a = f(s.c1);
			const b = f(s.c2);
			d += `C${n(a.x)} ${n(a.y)} ${n(b.x)} ${n(b.y)} ${n(t.x)} ${n(t.y)}`;
		}
	}
	return close ? `${d}Z` : d;
}

/** SVG path data for a polyline. */
export const polyline = (pts: Point[], f: Map2) => pts.map((p, i) => `${i ? 'L' : 'M'}${n(f(p).x)} ${n(f(p).y)}`).join('');

/** A Lora label (the font is set once on the drawing). */
export function text(at: Point, s: string, size: number, opts: { angle?: number; anchor?: 'start' | 'middle' | 'end'; fill?: string; weight?: number; italic?: boolean } = {}): string {
	const rot = opts.angle ? ` transform="rotate(${n(opts.angle)} ${n(at.x)} ${n(at.y)})"` : '';
	const style = `${opts.weight ? ` font-weight="${opts.weight}"` : ''}${opts.italic ? ' font-style="italic"' : ''}`;
	return `<text x="${n(at.x)}" y="${n(at.y)}" font-size="${n(size)}" text-anchor="${opts.anchor ?? 'middle'}" dominant-baseline="middle" fill="${opts.fill ?? INK}"${style}${rot}>${esc(s)}</text>`;
}

/** A filled arrowhead at `tip`, pointing along `dir`. */
export function arrowhead(tip: Point, dir: Point, size: number, fill = INK): string {
	const d = unit(dir);
	const back = sub(tip, mul(d, size));
	const side = mul(normalOf(d), size * 0.38);
	const a = add(back, side);
	const b = sub(back, side);
	return `<path d="M${n(tip.x)} ${n(tip.y)}L${n(a.x)} ${n(a.y)}L${n(b.x)} ${n(b.y)}Z" fill="${fill}"/>`;
}

/** The grain line: a long double-headed arrow. */
export function grainArrow(from: Point, to: Point, head = 1.2): string {
	const d = sub(to, from);
	return `<path d="M${n(from.x)} ${n(from.y)}L${n(to.x)} ${n(to.y)}" stroke="${INK}" stroke-width="0.08" fill="none"/>${arrowhead(to, d, head)}${arrowhead(from, mul(d, -1), head)}`;
}

/** Fold bracket: parallel to the fold edge inside the piece, its ends turned to the fold with arrowheads. */
export function foldBracket(from: Point, to: Point, inward: Point, size: number): string {
	const along = sub(to, from);
	const a = add(from, mul(along, 0.2));
	const b = add(from, mul(along, 0.8));
	const off = mul(unit(inward), 2);
	const a2 = add(a, off);
	const b2 = add(b, off);
	const mid = add(add(from, mul(along, 0.5)), mul(unit(inward), 2 + size * 0.9));
	const angle = (Math.atan2(along.y, along.x) * 180) / Math.PI;
	const upright = angle > 90 || angle < -90 ? angle + 180 : angle;
	const inv = mul(off, -1);
	return (
		`<path d="M${n(a.x)} ${n(a.y)}L${n(a2.x)} ${n(a2.y)}L${n(b2.x)} ${n(b2.y)}L${n(b.x)} ${n(b.y)}" stroke="${INK}" stroke-width="0.08" fill="none"/>` +
		arrowhead(a, inv, 0.8) +
		arrowhead(b, inv, 0.8) +
		text(mid, 'fold', size, { angle: upright, italic: true })
	);
}

/** Scale bar: 10 cm in 1 cm blocks, or 4 inches in half-inch blocks, with its length written in words. */
export function scaleBar(origin: Point, units: Units): string {
	const step = units === 'in' ? 1.27 : 1;
	const count = units === 'in' ? 8 : 10;
	let s = '';
	for (let i = 0; i < count; i++) {
		s += `<rect x="${n(origin.x + i * step)}" y="${n(origin.y)}" width="${n(step)}" height="0.5" fill="${i % 2 ? PAPER : INK}" stroke="${INK}" stroke-width="0.04"/>`;
	}
	const total = step * count;
	s += text({ x: origin.x, y: origin.y + 1.2 }, '0', 0.8, { anchor: 'middle' });
	s += text({ x: origin.x + total, y: origin.y + 1.2 }, formatLength(total, units), 0.8, { anchor: 'middle' });
	s += text({ x: origin.x + total + 1.2, y: origin.y + 0.25 }, 'scale: 1:1 printed at 100 %', 0.7, { anchor: 'start', fill: PENCIL });
	return `<g aria-label="scale bar">${s}</g>`;
}

/** One piece, drawn through a point map (for the pieces view, the identity plus a move). */
export function drawPiece(p: Piece, f: Map2, units: Units): string {
	const out: string[] = [];
	out.push(`<path d="${pathD(p.cutting.segments, f)}" fill="#FFFFFF" fill-opacity="0.55" stroke="${THREAD}" stroke-width="0.1"/>`);
	out.push(`<path d="${pathD(p.seam.segments, f)}" fill="none" stroke="${INK}" stroke-width="0.12"/>`);
	for (const l of p.lines) out.push(`<path d="${polyline(l.points, f)}" fill="none" stroke="${PENCIL}" stroke-width="0.06" stroke-dasharray="0.5 0.35"/>`);
	for (const d of p.darts) {
		const [a, b, c] = [f(d.top1), f(d.point), f(d.top2)];
		out.push(`<path d="M${n(a.x)} ${n(a.y)}L${n(b.x)} ${n(b.y)}L${n(c.x)} ${n(c.y)}" fill="none" stroke="${CHALK}" stroke-width="0.09"/>`);
		out.push(`<circle cx="${n(b.x)}" cy="${n(b.y)}" r="0.18" fill="${CHALK}"/>`);
	}
	for (const k of p.notches) {
		const tang = normalOf(k.inward);
		const offsets = k.double ? [-0.35, 0.35] : [0];
		for (const o of offsets) {
			const a = f(add(k.at, mul(tang, o)));
			const b = f(add(add(k.at, mul(tang, o)), mul(k.inward, k.depth)));
			out.push(`<path d="M${n(a.x)} ${n(a.y)}L${n(b.x)} ${n(b.y)}" stroke="${INK}" stroke-width="0.08"/>`);
		}
		if (k.label) out.push(text(f(add(k.at, mul(k.inward, k.depth + 1.1))), k.label, 0.65, { fill: PENCIL }));
	}
	out.push(grainArrow(f(p.grain.from), f(p.grain.to)));
	if (p.fold) {
		const inward = { x: 1, y: 0 };
		const a = f(p.fold.from);
		const b = f(p.fold.to);
		const i2 = sub(f(add(p.fold.from, inward)), a);
		out.push(foldBracket(a, b, i2, 0.9));
	}
	for (const l of p.labels) {
		const words = l.kind === 'allowances' ? allowanceText(p.allowances, units) : l.text;
		out.push(text(f(l.at), words, l.size, { angle: l.angle, weight: l.kind === 'name' ? 600 : undefined, fill: l.kind === 'note' || l.kind === 'allowances' ? PENCIL : INK }));
	}
	return `<g aria-label="${esc(p.name)}">${out.join('')}</g>`;
}
