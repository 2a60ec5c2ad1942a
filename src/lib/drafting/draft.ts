// draftSkirt: measurements → checked → block → style → pieces with allowances → figures and warnings.
import { blockFigures, blockWarnings, draftBlock, type Block, type CheckPair, type Figures, type PanelFigures } from './block';
import { DraftInputError, lengthProblem } from './errors';
import { joinSides } from './asymmetric';
import { facing, pocketBag, waistband, withZipTrim } from './extras';
import { measurementWarnings, resolveMeasurements, validateMeasurements, type Measurements, type ResolvedMeasurements } from './measurements';
import { isCircle, resolveChoice, type ResolvedChoice, type SkirtChoiceInput, type StyleId } from './options';
import { hemGirth, toPiece, type Piece } from './pieces';
import { resolveRules, type HouseRules, type HouseRulesInput } from './rules';
import { largestHip, planBlock } from './suppression';
import { aLineStyle } from './styles/aline';
import { circleStyle } from './styles/circle';
import type { Outline, StyleContext, StyleResult } from './styles/common';
import { fittedStyle } from './styles/fitted';
import { goredStyle } from './styles/gored';
import { formatCm, toMm } from './units';

/** A drafted skirt: its figures, its pieces ready to cut, and what the shopper or cutter should know. */
export interface Draft {
	style: StyleId;
	/** The choice with every default filled in (zip length, hem depth, vent decided). */
	choice: ResolvedChoice;
	measurements: ResolvedMeasurements;
	rules: HouseRules;
	/** The block's figures, every length rounded to the millimetre (what a cutter reads and checks). */
	figures: Figures;
	/** The same figures at full precision. */
	exactFigures: Figures;
	/** The block the style was derived from (drawn by the 'block' view); the wearer's right half when
	 * her left is drafted apart (then `left` holds the left half's block and figures). */
	block: Block;
	left?: { block: Block; figures: Figures; exactFigures: Figures };
	pieces: Piece[];
	/** Plain sentences in the second person for the shopper or cutter. */
	warnings: string[];
}

function styleOf(ctx: StyleContext): StyleResult {
	switch (ctx.choice.style) {
		case 'straight':
			return fittedStyle(ctx, false);
		case 'pencil':
			return fittedStyle(ctx, true);
		case 'a-line':
			return aLineStyle(ctx);
		case 'half-circle':
			return circleStyle(ctx, false);
		case 'full-circle':
			return circleStyle(ctx, true);
		case 'gored':
			return goredStyle(ctx);
	}
}

/** Facings face the waist as the skirt has it: the style's own panels, or the block for a gored skirt. */
function facings(ctx: StyleContext, panels: Outline[]): Outline[] {
	if (ctx.choice.style === 'gored') {
		const backCut = panels.find((p) => p.id === 'centre-back')!.cut;
		return [facing('front', ctx.block.front.waistParts, ctx.block.front.darts, { count: 1, onFold: true }, ctx), facing('back', ctx.block.back.waistParts, ctx.block.back.darts, backCut, ctx)];
	}
	const front = panels.find((p) => p.id === 'front')!;
	const back = panels.find((p) => p.id === 'back')!;
	return [facing('front', front.waistParts, front.darts, front.cut, ctx), facing('back', back.waistParts, back.darts, back.cut, ctx)];
}

/** The figures with every length rounded to the millimetre. */
function rounded(f: Figures): Figures {
	const panel = <T extends PanelFigures>(p: T): T => ({
		...p,
		hipWidth: toMm(p.hipWidth),
		waistWidth: toMm(p.waistWidth),
		sideShaping: toMm(p.sideShaping),
		sideRaise: toMm(p.sideRaise),
		darts: p.darts.map((d) => ({ fromCentre: toMm(d.fromCentre), intake: toMm(d.intake), length: toMm(d.length) }))
	});
	const pair = (c: CheckPair): CheckPair => ({ front: toMm(c.front), back: toMm(c.back) });
	const out: Figures = {
		back: { ...panel(f.back), centreShaping: toMm(f.back.centreShaping), centreDrop: toMm(f.back.centreDrop) },
		front: { ...panel(f.front), centreDrop: toMm(f.front.centreDrop) },
		length: toMm(f.length),
		hipDepth: toMm(f.hipDepth),
		hipDepthAssumed: f.hipDepthAssumed,
		kneeDepth: toMm(f.kneeDepth),
		kneeAssumed: f.kneeAssumed,
		hemGirth: toMm(f.hemGirth),
		check: { waistSeam: pair(f.check.waistSeam), hipLine: pair(f.check.hipLine), sideSeam: pair(f.check.sideSeam), dartLegs: pair(f.check.dartLegs) }
	};
	if (f.waistRadius !== undefined) out.waistRadius = toMm(f.waistRadius);
	return out;
}

/** Drafts a skirt from the shopper's measurements (cm), her choice of style and options, and the house
 * rules (each one optional, merged over DEFAULT_RULES). Throws DraftInputError for input it cannot draft. */
export function draftSkirt(measurements: Measurements, choice?: SkirtChoiceInput, rules?: HouseRulesInput | HouseRules): Draft {
	const r = resolveRules(rules);
	const problems = validateMeasurements(measurements, r.defaultWaistToHip);
	if (problems.length) throw new DraftInputError(problems);
	const m = resolveMeasurements(measurements, r);
	const resolved = resolveChoice(choice, m, r);
	if (resolved.problems.length) throw new DraftInputError(resolved.problems);
	const c = resolved.choice;
	const backOnFold = c.closure.position === 'side' && c.vent === 'none';
	if (!m.confirmed && !isCircle(c.style)) {
		const over = [undefined, ...(m.fit.oneHip ? (['left', 'right'] as const) : [])].some((side) => planBlock(m, r, backOnFold, side).deepDarts);
		if (over) {
			const limit = largestHip(m, r, backOnFold);
			throw new DraftInputError([
				lengthProblem(
					{ field: 'hip', value: m.hip, limit, max: Math.floor(limit), confirmable: true },
					(w) => `Please check your hip: ${w.len(m.hip)} over a ${w.len(m.waist)} waist is more shaping than darts can take (up to about ${w.len(Math.floor(limit))} fits a block). If it is right, confirm it: we then draft it with the side seams taking the rest, and advise a fitting in calico.`
				)
			]);
		}
	}
	const one = m.fit.oneHip;
	const trim = (os: Outline[]) => (c.closure.position === 'side' ? os.map((o) => withZipTrim(o, r.allowances.seam, r.allowances.zipSeam)) : os);
	// The wearer's right is drafted first (her left too when the halves differ, and joined to it).
	const right = sideOutlines({ m, rules: r, choice: c, block: draftBlock(m, r, backOnFold, one ? 'right' : undefined), bodySide: one ? 'right' : undefined });
	const left = one ? sideOutlines({ m, rules: r, choice: c, block: draftBlock(m, r, backOnFold, 'left'), bodySide: 'left' }) : null;
	const { block, style } = right;
	const pieces = (left ? joinSides(trim(right.outlines), left.outlines) : trim(right.outlines)).map((o) => toPiece(o, c, r));
	const exactFigures: Figures = { ...blockFigures(block, m), hemGirth: hemGirth(pieces) };
	if (style.waistRadius !== undefined) exactFigures.waistRadius = style.waistRadius;
	const warnings = [...measurementWarnings(m), ...(isCircle(c.style) ? [] : blockWarnings(block, m)), ...resolved.warnings];
	const fitted = c.style === 'straight' || c.style === 'pencil';
	if (m.kneeAssumed && fitted && m.length > m.kneeDepth - r.vent.pencilAboveKnee - 5) {
		warnings.push(
			`You did not give your waist-to-knee length, so we used ${formatCm(m.kneeDepth)}, a usual figure: it decides how far your vent opens. For a closer fit, measure down your side from your waist to the middle of your knee.`
		);
	}
	const draft: Draft = { style: c.style, choice: c, measurements: m, rules: r, figures: rounded(exactFigures), exactFigures, block, pieces, warnings };
	if (left) {
		const leftExact: Figures = { ...blockFigures(left.block, m), hemGirth: exactFigures.hemGirth };
		if (left.style.waistRadius !== undefined) leftExact.waistRadius = left.style.waistRadius;
		draft.left = { block: left.block, figures: rounded(leftExact), exactFigures: leftExact };
		warnings.push(`Your ${one!.side} hip is drafted from its own figure, so the pattern is cut open: full pieces instead of on the fold, left and right pieces instead of pairs.`);
	}
	return draft;
}

/** One side's outlines: the style's panels, the waist finish, the lining and the pocket bag. */
function sideOutlines(ctx: StyleContext) {
	const { choice: c, m, rules: r } = ctx;
	const style = styleOf(ctx);
	const outlines: Outline[] = [...style.panels];
	outlines.push(...(c.waistband === 'band' ? [waistband(ctx)] : facings(ctx, style.panels)));
	if (c.lining) outlines.push(...style.lining(m.length - r.lining.shorter));
	if (c.pockets) {
		const front = style.panels.find((p) => p.side.length && p.id.includes('front'))!;
		outlines.push(pocketBag(front.side, ctx));
	}
	return { block: ctx.block, style, outlines };
}
