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
	const corner = sideBelowHip(H, length - d, -taper * (length - d), 1);
	const side: Segment[] = [panel.hipCurve, line(H, corner, 'side')];
	const centreHem = P(0, length);
	const hem = taper > 0 ? hemToCentre(corner, unit(sub(corner, H)), centreHem) : line(corner, centreHem, 'hem');
	const vent = kind === 'back' ? ventOf(ctx, v) : null;
	const centre = kind === 'back' && vent ? backCentre(panel, length, vent) : [line(centreHem, panel.centreTop, 'fold')];
	const cut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, vent?.kind !== 'none');
	if (kind === 'back' && cut.onFold) centre.splice(0, centre.length, line(centreHem, panel.centreTop, 'fold'));
	const waist = waistWithCaps(panel);
	const centreDown: Segment[] = centre.map((s) => line(s.to, s.from, s.edge)).reverse();
	const notches = panelNotches(kind, side, segmentLength(panel.hipCurve), panel.darts, ctx, cut.onFold ? undefined : centreDown);
	const notes: string[] = [];
	if (vent && vent.kind !== 'none') {
		notes.push(vent.kind === 'vent' ? 'Vent: fold the extension back on the centre back line' : 'Kick pleat: stitch the extensions together, press to one side');
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
