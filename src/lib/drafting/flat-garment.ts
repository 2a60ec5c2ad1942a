// A way in without a tape measure on her body: a skirt that already fits her, laid flat and measured
// across. Laid flat, a skirt shows half of each girth, so each width is doubled; that girth is the
// garment's, body plus the ease it was made with. We do not know that skirt's ease, so we take off our
// own house ease (the ease our draft will add back), and the order says the figures were found this way.
import { lengthProblem, type FieldProblem } from './errors';
import { DEFAULT_RULES, type HouseRules } from './rules';
import { toMm } from './units';

/** What she measures on the skirt laid flat, smoothed, zip closed (cm). */
export interface FlatGarment {
	/** Straight across the top edge of the waist, fold to fold. */
	waistAcross: number;
	/** Straight across at `hipDepth` below the top edge, fold to fold. */
	hipAcross: number;
	/** Down from the top edge to where she measured `hipAcross` (the marked depth). */
	hipDepth: number;
	/** Down the side, top edge to hem. */
	length: number;
}

/** The depth we mark on the drawing and suggest: the house's usual waist-to-hip depth. */
export const FLAT_MARKED_DEPTH = DEFAULT_RULES.defaultWaistToHip;

/** Plausible widths of a skirt laid flat (cm): half the body ranges the engine drafts, with room for ease. */
export const FLAT_LIMITS = {
	waistAcross: { min: 22, max: 105 },
	hipAcross: { min: 32, max: 110 },
	hipDepth: { min: 10, max: 35 },
	length: { min: 25, max: 130 }
} as const;

const LABEL = { waistAcross: 'waist across', hipAcross: 'hip across', hipDepth: 'depth of the hip line', length: 'length' } as const;

/** The whole-body ease a draft adds: each quarter's ease, four quarters (waist: two fronts, two backs). */
export function houseEase(rules: Pick<HouseRules, 'ease'> = DEFAULT_RULES) {
	return { waist: 2 * (rules.ease.waist.front + rules.ease.waist.back), hip: 4 * rules.ease.hip };
}

/** Every problem with the widths as typed (an empty list means they convert). */
export function validateFlat(input: Partial<Record<keyof FlatGarment, unknown>>): FieldProblem[] {
	const out: FieldProblem[] = [];
	for (const k of Object.keys(FLAT_LIMITS) as (keyof FlatGarment)[]) {
		const v = input[k];
		const { min, max } = FLAT_LIMITS[k];
		if (typeof v !== 'number' || !Number.isFinite(v)) out.push(lengthProblem({ field: k, min, max }, (w) => `Enter the ${LABEL[k]} in ${w.unitName}, as a number.`));
		else if (v < min || v > max) out.push(lengthProblem({ field: k, min, max }, (w) => `The ${LABEL[k]} of a skirt laid flat is ${w.range(min, max)}: please measure again.`));
	}
	if (!out.length && (input.hipDepth as number) >= (input.length as number)) {
		out.push({ field: 'hipDepth', message: 'Measure the hip across above the hem: the depth must be shorter than the length.' });
	}
	return out;
}

/** Body figures from the skirt laid flat: girth = 2 × across − house ease; depth and length as measured. */
export function flatToBody(g: FlatGarment, rules: Pick<HouseRules, 'ease'> = DEFAULT_RULES) {
	const ease = houseEase(rules);
	return {
		waist: toMm(2 * g.waistAcross - ease.waist),
		hip: toMm(2 * g.hipAcross - ease.hip),
		waistToHip: toMm(g.hipDepth),
		length: toMm(g.length),
		ease
	};
}

/** The sentence the order and the ticket carry about such figures. */
export const FLAT_GARMENT_NOTE = 'from a skirt that fits her, laid flat: each width doubled, the house ease taken off';
