// Circle skirts: the waist is an arc of radius r = waist seam / θ (θ = π for a half circle, 2π for a full
// one), the hem an arc of radius r + length. Each pattern piece is a quarter of the skirt's angle: the
// front on the fold at centre front, the back a pair with a centre back seam (or on the fold with a side zip).
import { P, hermite, line, type Point, type Segment } from '../geometry';
import { arc } from '../outline';
import { backCut, panelNotches, type Outline, type StyleContext, type StyleResult } from './common';

/** Waist radius for a waist seam and a skirt angle θ in radians (r = W / θ). */
export const circleWaistRadius = (waistSeam: number, angle: number): number => waistSeam / angle;

/** A point at radius ρ and angle ψ from the centre line (ψ = 0 runs straight down it). */
const polar = (rho: number, psi: number): Point => P(rho * Math.sin(psi), rho * Math.cos(psi));

/** The waist from the centre (ψ = 0) to the side (ψ = φ) at radius r + dc (1 − s) − ds s, s the smooth
 * step 3t² − 2t³ of t = ψ/φ: square to the centre line and to the side seam, as the plain arc is. */
function shapedWaist(r: number, dc: number, ds: number, phi: number): Segment[] {
	const rho = (t: number) => r + dc * (1 - (3 * t * t - 2 * t * t * t)) - ds * (3 * t * t - 2 * t * t * t);
	const drho = (t: number) => ((-dc - ds) * (6 * t - 6 * t * t)) / phi;
	const at = (t: number) => polar(rho(t), t * phi);
	const dir = (t: number) => {
		const psi = t * phi;
		return P(drho(t) * Math.sin(psi) + rho(t) * Math.cos(psi), drho(t) * Math.cos(psi) - rho(t) * Math.sin(psi));
	};
	const n = Math.max(2, Math.ceil(phi / (Math.PI / 8)));
	const out: Segment[] = [];
	for (let i = 0; i < n; i++) {
		const [t0, t1] = [i / n, (i + 1) / n];
		const h = (phi / n / 3) * Math.hypot(dir(t0).x, dir(t0).y);
		const h1 = (phi / n / 3) * Math.hypot(dir(t1).x, dir(t1).y);
		out.push(hermite(at(t0), dir(t0), at(t1), dir(t1), 'waist', h, h1));
	}
	return out;
}

function sector(ctx: StyleContext, kind: 'front' | 'back', r: number, length: number, phi: number, lining: boolean): Outline {
	const R = r + length;
	const cut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, false);
	const centreEdge = cut.onFold ? 'fold' : 'centre';
	// Arc angles measured the usual way (from +x toward +y): ψ from the centre line is π/2 − a.
	// Fit adjustments move the waist, not the hem (which stays level on the body): a centre waist lowered by
	// δc is cut δc further out, a higher hip's side waist point `ds` further in, blending smoothly between.
	const fit = ctx.m.fit;
	const dc = kind === 'front' ? -fit.roundedAbdomen : fit.hollowBack - fit.prominentSeat / 2;
	const ds = fit.oneHip && ctx.bodySide === fit.oneHip.side ? fit.oneHip.higher : 0;
	const waist = dc === 0 && ds === 0 ? arc(P(0, 0), r, Math.PI / 2, Math.PI / 2 - phi, 'waist') : shapedWaist(r, dc, ds, phi);
	const sideSeg = line(polar(r - ds, phi), polar(R, phi), 'side');
	const hem = arc(P(0, 0), R, Math.PI / 2 - phi, Math.PI / 2, 'hem');
	const centre = line(polar(R, 0), polar(r + dc, 0), centreEdge);
	const side: Segment[] = [sideSeg];
	const notches = panelNotches(kind, side, Math.min(ctx.m.hipDepth, length - 1), [], ctx);
	if (kind === 'back' && !cut.onFold && ctx.choice.closure.position === 'centre-back') notches.push({ at: polar(r + ctx.choice.closure.length, 0), label: 'zip' });
	const name = kind === 'front' ? 'Front' : 'Back';
	return {
		id: `${kind}${lining ? '-lining' : ''}`,
		name: `${name}${lining ? ' lining' : ''}`,
		fabric: lining ? 'lining' : 'shell',
		role: lining ? 'lining' : 'panel',
		cut,
		segments: [...waist, sideSeg, ...hem, centre],
		darts: [],
		waistParts: [waist],
		side,
		notches,
		lines: [],
		notes: ['Let the skirt hang for a day before levelling the hem: the bias drops.'],
		grainX: Math.min(0.5 * (r + 0.15 * length) * Math.sin(phi), 0.25 * R * Math.sin(phi))
	};
}

/** Half-circle (θ = π) or full-circle (θ = 2π) style. The waist seam is the whole block waist with ease
 * (W + 2 × front and back waist ease, i.e. W + 4 × the waist ease when front and back are alike). */
export function circleStyle(ctx: StyleContext, full: boolean): StyleResult {
	const theta = full ? 2 * Math.PI : Math.PI;
	const seam = 2 * (ctx.block.front.waistSeam + ctx.block.back.waistSeam);
	const r = circleWaistRadius(seam, theta);
	const phi = theta / 4;
	const build = (length: number, lining: boolean) => [sector(ctx, 'front', r, length, phi, lining), sector(ctx, 'back', r, length, phi, lining)];
	return { panels: build(ctx.m.length, false), waistRadius: r, lining: (length) => build(length, true) };
}
