// Straight and pencil skirts: the block as it is below the hip line (straight), or taken in at the side
// seams toward the hem (pencil). A back vent or kick pleat where the style and length need one.
import { P, line, segmentLength, sub, unit, type Segment } from '../geometry';
import { waistWithCaps, type Panel } from '../panel';
import { backCentre, backCut, grainClearOfDarts, hemToCentre, panelNotches, sideBelowHip, type Outline, type StyleContext, type StyleResult } from './common';

interface Variant {
	length: number;
	lining: boolean;
}

function ventOf(ctx: StyleContext, v: Variant) {
	const kind = v.lining ? 'none' : ctx.choice.vent;
	const rule = kind === 'kick-pleat' ? ctx.rules.kickPleat : ctx.rules.vent;
	return { kind, length: ctx.choice.ventLength, extension: rule.extension } as const;
}

/** One fitted panel as a piece outline. */
export function fittedPanel(panel: Panel, ctx: StyleContext, v: Variant, taper: number): Outline {
	const { length } = v;
	const kind = panel.spec.kind;
	const d = panel.spec.hipDepth;
	const H = panel.hipPoint;
	// The taper stops at the knee (TRADE.md): below it the side seam runs straight down.
	const knee = Math.min(length, ctx.m.kneeDepth);
	const kneeAt = sideBelowHip(H, knee - d, -taper * (knee - d), 1);
	const corner = knee < length ? P(kneeAt.x, length) : kneeAt;
	const bend = knee < length && taper > 0;
	const side: Segment[] = [panel.hipCurve, ...(bend ? [line(H, kneeAt, 'side'), line(kneeAt, corner, 'side')] : [line(H, corner, 'side')])];
	const centreHem = P(0, length);
	const hem = taper > 0 && knee >= length ? hemToCentre(corner, unit(sub(corner, H)), centreHem) : line(corner, centreHem, 'hem');
	const vent = kind === 'back' ? ventOf(ctx, v) : null;
	const centre = kind === 'back' && vent ? backCentre(panel, length, vent) : [line(centreHem, panel.centreTop, 'fold')];
	// The lining's back is cut like the skirt's: with a centre seam wherever the skirt has a vent, so its
	// slit can open above the vent.
	const shellVent = ctx.choice.vent !== 'none';
	const cut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, v.lining ? shellVent : vent?.kind !== 'none');
	if (kind === 'back' && cut.onFold) centre.splice(0, centre.length, line(centreHem, panel.centreTop, 'fold'));
	const waist = waistWithCaps(panel);
	const centreDown: Segment[] = centre.map((s) => line(s.to, s.from, s.edge)).reverse();
	const notches = panelNotches(kind, side, segmentLength(panel.hipCurve), panel.darts, ctx, cut.onFold ? undefined : centreDown);
	const notes: string[] = [];
	if (vent && vent.kind !== 'none') {
		notes.push(vent.kind === 'vent' ? 'Vent: fold the extension back on the centre back line' : 'Kick pleat: stitch the extensions together, press to one side');
	}
	// A lining split above the vent, so it never holds the vent shut (TRADE.md).
	if (kind === 'back' && v.lining && shellVent && !cut.onFold) {
		const slitTop = Math.max(d + 2, ctx.m.length - ctx.choice.ventLength - ctx.rules.lining.slitAbove);
		notches.push({ at: P(0, Math.min(slitTop, length - 1)), label: 'slit' });
		notes.push('Leave the centre back seam open below the slit notch');
	}
	const lining = v.lining;
	const name = `${kind === 'front' ? 'Front' : 'Back'}${lining ? ' lining' : ''}`;
	return {
		id: `${kind}${lining ? '-lining' : ''}`,
		name,
		fabric: lining ? 'lining' : 'shell',
		role: lining ? 'lining' : 'panel',
		cut,
		segments: [...waist, ...side, hem, ...centre],
		darts: panel.darts,
		waistParts: panel.waistParts,
		side,
		notches,
		lines: [
			{ kind: 'hip-line', points: [panel.centreHip, H] },
			...(vent && vent.kind !== 'none' && !cut.onFold ? [{ kind: 'vent-line' as const, points: [P(0, length - vent.length), P(0, length)] }] : [])
		],
		notes,
		grainX: grainClearOfDarts(panel.spec.hip, panel.darts, 0.3)
	};
}

/** Straight skirt (taper 0) or pencil skirt (taper from the house rules). */
export function fittedStyle(ctx: StyleContext, pencil: boolean): StyleResult {
	const taper = pencil ? ctx.rules.styles.pencilTaper : 0;
	const build = (v: Variant) => [fittedPanel(ctx.block.front, ctx, v, taper), fittedPanel(ctx.block.back, ctx, v, taper)];
	return {
		panels: build({ length: ctx.m.length, lining: false }),
		lining: (length) => build({ length, lining: true })
	};
}
