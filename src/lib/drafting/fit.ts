// Fit adjustments: the corrections a made-to-measure workroom makes to the block for a figure, beyond
// the four girths. Plain data, each amount in cm as the cutter moves the line on the pattern, each with
// its range; amounts are typical starting points (TRADE.md "Figure adjustments", common practice).
import { lengthProblem, type FieldProblem } from './errors';

/** A side of the wearer's body. */
export type BodySide = 'left' | 'right';

/** The adjustments a shopper's measure card may carry (every one optional; absent means none). */
export interface FitAdjustments {
	/** Hollow (sway) back: centre back waist lowered by this much, tapering to nothing at the side. */
	hollowBack?: number;
	/** Rounded abdomen: centre front waist raised by this much (instead of dropped); each front quarter's
	 * darts take half of it less (the side seam takes it) and are this much shorter. */
	roundedAbdomen?: number;
	/** Prominent seat: each back quarter's hip line and darts take half of it more, the back darts are this
	 * much longer, and the centre back waist is raised by half of it (more length over the seat). */
	prominentSeat?: number;
	/** High hip: girth at the high hip (about 9 cm below the waist) beyond what the block's side curve
	 * gives, round the body; each side curve is a quarter of it fuller there. */
	highHip?: number;
	/** One hip higher or fuller: that side is drafted from its own figure, and the pattern is cut open. */
	oneHip?: {
		side: BodySide;
		/** The side waist point on that side raised by this much (front and back). */
		higher?: number;
		/** That half of the body is this much larger round the hip than the other half. */
		fuller?: number;
	};
	/** Personal ease round the whole body, added to the house ease (may be negative: a closer fit). */
	ease?: { waist?: number; hip?: number };
}

/** The adjustments with every amount filled in (0 for none). */
export interface ResolvedFit {
	hollowBack: number;
	roundedAbdomen: number;
	prominentSeat: number;
	highHip: number;
	oneHip: { side: BodySide; higher: number; fuller: number } | null;
	ease: { waist: number; hip: number };
}

/** No adjustment at all. */
export const NO_FIT: ResolvedFit = { hollowBack: 0, roundedAbdomen: 0, prominentSeat: 0, highHip: 0, oneHip: null, ease: { waist: 0, hip: 0 } };

/** The range of each amount (cm). Hollow back and rounded abdomen: 1–2 cm typical (TRADE.md), room to 3;
 * the others are the atelier's own limits (common practice). */
export const FIT_LIMITS = {
	hollowBack: { min: 0, max: 3 },
	roundedAbdomen: { min: 0, max: 3 },
	prominentSeat: { min: 0, max: 3 },
	highHip: { min: 0, max: 8 },
	'oneHip.higher': { min: 0, max: 4 },
	'oneHip.fuller': { min: 0, max: 8 },
	'ease.waist': { min: -2, max: 6 },
	'ease.hip': { min: -4, max: 12 }
} as const;

const WORDS: Record<keyof typeof FIT_LIMITS, string> = {
	hollowBack: 'hollow back',
	roundedAbdomen: 'rounded abdomen',
	prominentSeat: 'prominent seat',
	highHip: 'high hip',
	'oneHip.higher': 'higher hip',
	'oneHip.fuller': 'fuller hip',
	'ease.waist': 'personal waist ease',
	'ease.hip': 'personal hip ease'
};

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Checks adjustments and fills in the absent ones; problems name each bad field (`adjustments.…`). */
export function resolveFit(input: unknown): { fit: ResolvedFit; problems: FieldProblem[] } {
	const problems: FieldProblem[] = [];
	if (input === undefined || input === null) return { fit: NO_FIT, problems };
	if (!isObj(input)) return { fit: NO_FIT, problems: [{ field: 'adjustments', message: 'The fit adjustments must be a group of values.' }] };
	const amount = (key: keyof typeof FIT_LIMITS, v: unknown): number => {
		if (v === undefined || v === null) return 0;
		const { min, max } = FIT_LIMITS[key];
		if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max) {
			problems.push(lengthProblem({ field: `adjustments.${key}`, min, max, ...(typeof v === 'number' && Number.isFinite(v) ? { value: v, limit: v < min ? min : max } : {}) }, (w) => `The ${WORDS[key]} must be ${w.range(min, max)}.`));
			return 0;
		}
		// Amounts are taken to the tenth of a millimetre, finer than any tape or hand reads: a figure a
		// hair below a limit (3.9999999 for 4) otherwise leaves a sliver of an edge that crosses itself.
		return Math.round(v * 100) / 100;
	};
	const ease = isObj(input.ease) ? input.ease : {};
	let oneHip: ResolvedFit['oneHip'] = null;
	if (input.oneHip !== undefined && input.oneHip !== null) {
		const o = isObj(input.oneHip) ? input.oneHip : {};
		if (o.side !== 'left' && o.side !== 'right') problems.push({ field: 'adjustments.oneHip.side', message: 'Say which hip is higher or fuller: left or right.' });
		const higher = amount('oneHip.higher', o.higher);
		const fuller = amount('oneHip.fuller', o.fuller);
		if ((o.side === 'left' || o.side === 'right') && (higher > 0 || fuller > 0)) oneHip = { side: o.side, higher, fuller };
	}
	const fit: ResolvedFit = {
		hollowBack: amount('hollowBack', input.hollowBack),
		roundedAbdomen: amount('roundedAbdomen', input.roundedAbdomen),
		prominentSeat: amount('prominentSeat', input.prominentSeat),
		highHip: amount('highHip', input.highHip),
		oneHip,
		ease: { waist: amount('ease.waist', ease.waist), hip: amount('ease.hip', ease.hip) }
	};
	return { fit, problems };
}

/** Whether any adjustment changes the draft. */
export const hasFit = (f: ResolvedFit) =>
	f.hollowBack > 0 || f.roundedAbdomen > 0 || f.prominentSeat > 0 || f.highHip > 0 || f.oneHip !== null || f.ease.waist !== 0 || f.ease.hip !== 0;

/** The adjustments in words for the cutter (one line each), e.g. "Hollow back: centre back lowered 1.5 cm". */
export function fitWords(f: ResolvedFit, fmt: (cm: number) => string): string[] {
	const out: string[] = [];
	if (f.hollowBack) out.push(`Hollow back: centre back waist lowered ${fmt(f.hollowBack)}`);
	if (f.roundedAbdomen) out.push(`Rounded abdomen: centre front waist raised ${fmt(f.roundedAbdomen)}, front darts smaller and shorter`);
	if (f.prominentSeat) out.push(`Prominent seat: back darts deeper and longer, back hip ${fmt(f.prominentSeat / 2)} wider a quarter, centre back raised ${fmt(f.prominentSeat / 2)}`);
	if (f.highHip) out.push(`High hip: side curve ${fmt(f.highHip / 4)} fuller at the high hip`);
	if (f.oneHip) {
		const parts = [f.oneHip.higher ? `${fmt(f.oneHip.higher)} higher` : '', f.oneHip.fuller ? `${fmt(f.oneHip.fuller)} fuller` : ''].filter(Boolean).join(' and ');
		out.push(`${f.oneHip.side === 'left' ? 'Left' : 'Right'} hip ${parts}: left and right drafted apart, pieces cut open`);
	}
	if (f.ease.waist) out.push(`Personal waist ease ${f.ease.waist > 0 ? '+' : '−'}${fmt(Math.abs(f.ease.waist))} round the body`);
	if (f.ease.hip) out.push(`Personal hip ease ${f.ease.hip > 0 ? '+' : '−'}${fmt(Math.abs(f.ease.hip))} round the body`);
	return out;
}
