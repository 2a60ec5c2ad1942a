// The skirt block: both quarter panels from the plan, darts placed and sized for the panel, side seams
// trued against each other, and the figures a pattern cutter checks.
import { segmentLength } from './geometry';
import type { ResolvedMeasurements } from './measurements';
import { dartLegs, draftPanel, type Panel, type PanelSpec } from './panel';
import type { HouseRules } from './rules';
import type { BodySide } from './fit';
import { planBlock, type BlockPlan, type PanelPlan } from './suppression';

/** Both panels of the block with the plan they came from. */
export interface Block {
	back: Panel;
	front: Panel;
	plan: BlockPlan;
	length: number;
	hipDepth: number;
}

/** Open positions (from the shaped centre, along the waist) of a panel's darts. Scaled on small or large
 * panels so the darts centre between 30 % and 60 % of the way to the side; several darts keep `spacing`
 * between them (less on a narrow panel) and stay within the middle 70 % of the seam. */
export function dartPositions(kind: 'front' | 'back', darts: number[], seam: number, rules: HouseRules): number[] {
	if (!darts.length) return [];
	const total = darts.reduce((a, b) => a + b, 0);
	const span = seam + total;
	const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
	const centre = clamp(rules.darts.fromCentre[kind], 0.3 * span, 0.6 * span);
	if (darts.length === 1) return [clamp(centre - darts[0] / 2, 0.25 * seam, 0.65 * seam) + darts[0] / 2];
	// Several darts: positions on the closed seam (u), then opened out by the intakes before each.
	const n = darts.length;
	let g = Math.min(rules.darts.spacing, (0.7 * seam) / (n - 1));
	let u1 = centre - total / 2 - (g * (n - 1)) / 2;
	if (u1 < 0.15 * seam) u1 = 0.15 * seam;
	if (u1 + g * (n - 1) > 0.85 * seam) {
		u1 = Math.max(0.15 * seam, 0.85 * seam - g * (n - 1));
		g = (0.85 * seam - u1) / (n - 1);
	}
	let before = 0;
	return darts.map((d, j) => {
		const at = u1 + j * g + before + d / 2;
		before += d;
		return at;
	});
}

function specOf(plan: PanelPlan, m: ResolvedMeasurements, rules: HouseRules): PanelSpec {
	const at = dartPositions(plan.kind, plan.darts, plan.seam, rules);
	return {
		kind: plan.kind,
		hip: plan.hip,
		hipDepth: m.hipDepth,
		centreShaping: plan.centre,
		centreDrop: plan.drop,
		raise: plan.raise,
		darts: plan.darts.map((intake, i) => ({ intake, fromCentre: at[i], length: plan.dartLength })),
		seam: plan.seam,
		highHip: m.fit.highHip / 4,
		pointLimit: m.hipDepth - rules.darts.clearAboveHip,
		maxAngle: rules.darts.maxAngle
	};
}

/** Side seam from waist to hem along the curve (the block hangs straight below the hip line). */
export const blockSideSeam = (p: Panel, length: number) => segmentLength(p.hipCurve) + (length - p.spec.hipDepth);

/** Drafts the block. Where the front and back side seams differ by more than the house easing, the longer
 * seam's waist point is lowered until they agree within it (never below the waist line, nor below a higher
 * hip's raise); where it cannot go lower, the shorter seam's waist point is raised instead. */
export function draftBlock(m: ResolvedMeasurements, rules: HouseRules, backOnFold = false, bodySide?: BodySide): Block {
	const plan = planBlock(m, rules, backOnFold, bodySide);
	let back = draftPanel(specOf(plan.back, m, rules));
	let front = draftPanel(specOf(plan.front, m, rules));
	for (let i = 0; i < 8; i++) {
		const diff = blockSideSeam(front, m.length) - blockSideSeam(back, m.length);
		// Aim a little inside the easing, so a step that falls short still lands within it.
		const excess = Math.abs(diff) - 0.9 * rules.side.easing;
		if (Math.abs(diff) - rules.side.easing <= 1e-6) break;
		const longerIsFront = diff > 0;
		const longer = longerIsFront ? front : back;
		const floor = (longerIsFront ? plan.front : plan.back).raiseFloor;
		if (longer.spec.raise > floor + 1e-9) {
			const next = draftPanel({ ...longer.spec, raise: Math.max(floor, longer.spec.raise - excess) });
			if (longerIsFront) front = next;
			else back = next;
		} else {
			const shorter = longerIsFront ? back : front;
			const next = draftPanel({ ...shorter.spec, raise: shorter.spec.raise + excess });
			if (longerIsFront) back = next;
			else front = next;
		}
	}
	return { back, front, plan, length: m.length, hipDepth: m.hipDepth };
}

/** One dart's figures: from the centre line (after shaping) to the dart's middle, measured square to the
 * centre line as a cutter marks it on the waist; its intake and its length. */
export interface DartFigure {
	fromCentre: number;
	intake: number;
	length: number;
}

/** Figures of one quarter panel (cm, no allowances). */
export interface PanelFigures {
	/** Centre line to side seam on the hip line. */
	hipWidth: number;
	/** Along the waist line (following its curve, each dart opening counted at its intake) from the centre
	 * line before any shaping to the side-seam waist point: the waist mark. */
	waistWidth: number;
	/** Taken in at the side seam: hip width minus waist width. */
	sideShaping: number;
	/** Side-seam waist point above the waist line. */
	sideRaise: number;
	darts: DartFigure[];
}

/** The back panel's figures, with the centre back take-in and the centre back waist below the waist line
 * (a hollow back lowers it; a prominent seat raises it, negative). */
export interface BackFigures extends PanelFigures {
	centreShaping: number;
	centreDrop: number;
}

/** The front panel's figures, with the centre front drop. */
export interface FrontFigures extends PanelFigures {
	centreDrop: number;
}

/** A check a pattern cutter makes, on the front and the back panel. */
export interface CheckPair {
	front: number;
	back: number;
}

/** The block's figures. In `Draft.figures` every length is rounded to the millimetre (as read from a rule);
 * `Draft.exactFigures` has the same fields at full precision. */
export interface Figures {
	back: BackFigures;
	front: FrontFigures;
	length: number;
	hipDepth: number;
	hipDepthAssumed: boolean;
	/** Waist to knee the draft used (the vent's reach, the pencil taper's end), and whether it was assumed. */
	kneeDepth: number;
	kneeAssumed: boolean;
	/** Circle styles: radius of the waist circle. */
	waistRadius?: number;
	/** Round the finished hem of the style (a full skirt's sweep). */
	hemGirth: number;
	check: {
		/** Waist seam along the curve with the darts closed. */
		waistSeam: CheckPair;
		/** Centre line to side seam on the hip line. */
		hipLine: CheckPair;
		/** Waist to hem along the side seam's curve. */
		sideSeam: CheckPair;
		/** Longest difference between a dart's two legs (0 when they are equal). */
		dartLegs: CheckPair;
	};
}

function panelFigures(p: Panel): PanelFigures {
	const darts: DartFigure[] = p.darts.map((d) => ({ fromCentre: (d.top1.x + d.top2.x) / 2 - p.centreTop.x, intake: d.intake, length: d.length }));
	const waistWidth = (p.spec.kind === 'back' ? p.spec.centreShaping : 0) + p.darts.reduce((s, d) => s + d.intake, 0) + p.waistSeam;
	const side = p.spec.hip - waistWidth;
	// Rounding noise of a straight-hanging panel is no shaping at all (never a flare of 1e-15 cm).
	return { hipWidth: p.spec.hip, waistWidth, sideShaping: Math.abs(side) < 1e-9 ? 0 : side, sideRaise: p.spec.raise, darts };
}

/** The block's figures at full precision (the style adds its radius and hem girth). */
export function blockFigures(b: Block, m: Pick<ResolvedMeasurements, 'hipDepthAssumed' | 'kneeDepth' | 'kneeAssumed'>): Omit<Figures, 'hemGirth'> {
	const legs = (p: Panel) => Math.max(0, ...p.darts.map((d) => Math.abs(dartLegs(d)[0] - dartLegs(d)[1])));
	return {
		back: { ...panelFigures(b.back), centreShaping: b.back.spec.centreShaping, centreDrop: b.back.spec.centreDrop },
		front: { ...panelFigures(b.front), centreDrop: b.front.spec.centreDrop },
		length: b.length,
		hipDepth: b.hipDepth,
		hipDepthAssumed: m.hipDepthAssumed,
		kneeDepth: m.kneeDepth,
		kneeAssumed: m.kneeAssumed,
		check: {
			waistSeam: { front: b.front.waistSeam, back: b.back.waistSeam },
			hipLine: { front: b.front.hipPoint.x - b.front.centreHip.x, back: b.back.hipPoint.x - b.back.centreHip.x },
			sideSeam: { front: blockSideSeam(b.front, b.length), back: blockSideSeam(b.back, b.length) },
			dartLegs: { front: legs(b.front), back: legs(b.back) }
		}
	};
}

/** Sentences about how the block was drafted for this figure (kind about bodies, second person). */
export function blockWarnings(b: Block, m: ResolvedMeasurements): string[] {
	const out: string[] = [];
	const { plan } = b;
	const noBack = plan.back.darts.length === 0;
	const noFront = plan.front.darts.length === 0;
	if (m.waist > m.hip) {
		out.push(
			`Your waist is larger than your hip: the back darts are left out${noFront ? ', and the front darts too' : ''}. That is common, and we draft for it${plan.widened ? ': the hip line is widened to clear your waist, so the skirt hangs straight from it' : ''}.`
		);
	} else if (noBack || noFront) {
		const which = noBack && noFront ? 'the darts are' : noBack ? 'the back darts are' : 'the front darts are';
		out.push(`Your waist and hip are close in size, so ${which} left out and the side seams take the shaping.`);
	}
	if (plan.deepDarts) {
		out.push(
			'There is a very large difference between your waist and hip, more than darts can take: the side seams take the rest. We advise a fitting in calico before your fabric is cut.'
		);
	} else if ([plan.back, plan.front].some((p) => p.darts.length > 2)) {
		out.push('There is a large difference between your waist and hip, so the shaping is shared between three darts a panel. We advise a fitting in calico before your fabric is cut.');
	}
	return out;
}
