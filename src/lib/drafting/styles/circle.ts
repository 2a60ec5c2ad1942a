// Circle skirts: the waist is an arc of radius r = waist seam / θ (θ = π for a half circle, 2π for a full
// one), the hem an arc of radius r + length. Each pattern piece is a quarter of the skirt's angle: the
// front on the fold at centre front, the back a pair with a centre back seam (or on the fold with a side zip).
import { P, line, type Point, type Segment } from '../geometry';
import { arc } from '../outline';
import { backCut, panelNotches, type Outline, type StyleContext, type StyleResult } from './common';

/** Waist radius for a waist seam and a skirt angle θ in radians (r = W / θ). */
export const circleWaistRadius = (waistSeam: number, angle: number): number => waistSeam / angle;

/** A point at radius ρ and angle ψ from the centre line (ψ = 0 runs straight down it). */
const polar = (rho: number, psi: number): Point => P(rho * Math.sin(psi), rho * Math.cos(psi));

function sector(ctx: StyleContext, kind: 'front' | 'back', r: number, length: number, phi: number, lining: boolean): Outline {
	const R = r + length;
	const cut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, false);
	const centreEdge = cut.onFold ? 'fold' : 'centre';
	// Arc angles measured the usual way (from +x toward +y): ψ from the centre line is π/2 − a.
	const waist = arc(P(0, 0), r, Math.PI / 2, Math.PI / 2 - phi, 'waist');
	const sideSeg = line(polar(r, phi), polar(R, phi), 'side');
	const hem = arc(P(0, 0), R, Math.PI / 2 - phi, Math.PI / 2, 'hem');
	const centre = line(polar(R, 0), polar(r, 0), centreEdge);
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
