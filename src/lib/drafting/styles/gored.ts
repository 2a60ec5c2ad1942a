// Six-gore skirt from the block: each quarter panel is parted on a line through its (first) dart, the dart
// becoming the shaped top of the panel seam, and every panel seam and side seam flares below the hip.
// Centre front panel on the fold, two side front, two side back, and the centre back panel (a pair with
// a centre back seam for the zip, or on the fold when the zip is at the side).
import { P, add, cubic, line, mul, normalOf, pointAt, segmentLength, split, sub, unit, hermite, type CubicSegment, type Point, type Segment } from '../geometry';
import { waistWithCaps, type DartGeom, type Panel } from '../panel';
import { dartPositions } from '../block';
import { backCentre, backCut, grainClearOfDarts, hemToCentre, panelNotches, sideBelowHip, type Outline, type StyleContext, type StyleResult } from './common';

/** The waist of a dartless panel split where the panel seam meets it. */
function splitWaistAt(part: CubicSegment, x: number): [CubicSegment, CubicSegment] {
	let lo = 0;
	let hi = 1;
	for (let i = 0; i < 50; i++) {
		const m = (lo + hi) / 2;
		if (pointAt(part, m).x < x) lo = m;
		else hi = m;
	}
	return split(part, (lo + hi) / 2) as [CubicSegment, CubicSegment];
}

function gores(panel: Panel, ctx: StyleContext, length: number, lining: boolean): Outline[] {
	const { spec } = panel;
	const kind = spec.kind;
	const d = spec.hipDepth;
	const below = length - d;
	const flare = ctx.rules.styles.goreFlare * below;
	const back = kind === 'back';
	let centreWaist: Segment[];
	let sideWaistParts: CubicSegment[][];
	let sideDarts: DartGeom[];
	let edgeL: Segment;
	let edgeR: Segment;
	let gx: number;
	if (panel.darts.length) {
		const dart = panel.darts[0];
		gx = dart.point.x;
		const G = P(gx, d);
		const lead = sub(G, P(0, 0.5 * (d - dart.point.y)));
		// Through the dart point, then straight into the hip line: the two edges are mirror images.
		edgeL = cubic(dart.top1, dart.point, lead, G, 'gore');
		edgeR = cubic(G, lead, dart.point, dart.top2, 'gore');
		centreWaist = [...panel.waistParts[0]];
		sideWaistParts = panel.waistParts.slice(1);
		sideDarts = panel.darts.slice(1);
	} else {
		const span = spec.seam;
		gx = panel.centreTop.x + dartPositions(kind, [0], span, ctx.rules)[0];
		const [a, b] = splitWaistAt(panel.waistParts[0][0], gx);
		edgeL = line(a.to, P(gx, d), 'gore');
		edgeR = line(P(gx, d), a.to, 'gore');
		centreWaist = [a];
		sideWaistParts = [[b]];
		sideDarts = [];
	}
	const G = P(gx, d);
	const gc = sideBelowHip(G, below, flare, 1);
	const gs = sideBelowHip(G, below, flare, -1);
	const H = panel.hipPoint;
	const sc = sideBelowHip(H, below, flare, 1);
	const centreHem = P(0, length);
	const centreCut = kind === 'front' ? { count: 1, onFold: true } : backCut(ctx, false);
	const centreEdge = back && !centreCut.onFold ? backCentre(panel, length, { kind: 'none', length: 0, extension: 0 }) : [line(centreHem, panel.centreTop, 'fold')];
	const hemC = hemToCentre(gc, unit(sub(gc, G)), centreHem);
	const tSide = normalOf(unit(sub(sc, H)));
	const tGore = normalOf(unit(sub(gs, G)));
	const hemS = hermite(sc, tSide.x < 0 ? tSide : mul(tSide, -1), gs, tGore.x < 0 ? tGore : mul(tGore, -1), 'hem');
	const suffix = lining ? ' lining' : '';
	const where = kind === 'front' ? 'front' : 'back';
	const fabric = lining ? ('lining' as const) : ('shell' as const);
	const role = lining ? ('lining' as const) : ('panel' as const);
	const hipNotch = { at: G, double: back, label: 'hip' };
	const centreDown = centreEdge.map((s) => line(s.to, s.from, s.edge)).reverse();
	const centreNotches = back && !centreCut.onFold && ctx.choice.closure.position === 'centre-back' ? [{ at: pointOnCentre(centreDown, ctx.choice.closure.length), label: 'zip' }] : [];
	const side: Segment[] = [panel.hipCurve, line(H, sc, 'side')];
	const centre: Outline = {
		id: `centre-${where}${lining ? '-lining' : ''}`,
		name: `Centre ${where} panel${suffix}`,
		fabric,
		role,
		cut: centreCut,
		segments: [...centreWaist, edgeL, line(G, gc, 'gore'), hemC, ...centreEdge],
		darts: [],
		waistParts: [centreWaist],
		side: [],
		notches: [hipNotch, ...centreNotches],
		lines: [{ kind: 'hip-line', points: [panel.centreHip, G] }],
		notes: [],
		grainX: 0.5 * gx
	};
	const sidePiece: Outline = {
		id: `side-${where}${lining ? '-lining' : ''}`,
		name: `Side ${where} panel${suffix}`,
		fabric,
		role,
		cut: { count: 2, onFold: false },
		segments: [...waistWithCaps({ waistParts: sideWaistParts, darts: sideDarts }), ...side, hemS, line(gs, G, 'gore'), edgeR],
		darts: sideDarts,
		waistParts: sideWaistParts,
		side,
		notches: [hipNotch, ...panelNotches(kind, side, segmentLength(panel.hipCurve), sideDarts, ctx)],
		lines: [{ kind: 'hip-line', points: [G, H] }],
		notes: [],
		grainX: grainClearOfDarts(spec.hip, sideDarts, 0.5, gx)
	};
	return [centre, sidePiece];
}

const pointOnCentre = (segs: Segment[], d: number): Point => {
	let left = d;
	for (const s of segs) {
		const l = segmentLength(s);
		if (left <= l) return add(s.from, mul(sub(s.to, s.from), left / l));
		left -= l;
	}
	return segs[segs.length - 1].to;
};

/** The six-gore style. */
export function goredStyle(ctx: StyleContext): StyleResult {
	const build = (length: number, lining: boolean) => [...gores(ctx.block.front, ctx, length, lining), ...gores(ctx.block.back, ctx, length, lining)];
	return { panels: build(ctx.m.length, false), lining: (length) => build(length, true) };
}
