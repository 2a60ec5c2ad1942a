// The fit loop in plain data: the areas she answers for, the words for how each feels, the zones of
// the drawing she can touch, the corrections her answers point to, and the house-rule change that
// many reports of one style point to. Shared by her form, the workroom's page and the owner's fit page.

export const FIT_AREAS = ['waist', 'highHip', 'hipSeat', 'length', 'hemWidth', 'dartsBack'] as const;
export type FitArea = (typeof FIT_AREAS)[number];
export type Feel = -2 | -1 | 0 | 1 | 2;
export type FitAnswer = { feel: Feel; amountCm?: number | null };
export type FitAnswers = Partial<Record<FitArea, FitAnswer>>;

export const AREA_LABELS: Record<FitArea, string> = {
	waist: 'Waist',
	highHip: 'High hip',
	hipSeat: 'Hip and seat',
	length: 'Length',
	hemWidth: 'Hem width',
	dartsBack: 'The darts and the back'
};

/** Where to measure what she feels, in the words of the measuring steps. */
export const AREA_HELP: Record<FitArea, string> = {
	waist: 'With the skirt on, how much more (or less) room would feel right round the waistband.',
	highHip: 'About 9 cm (3½ in) below the waist, over the top of the hip bones.',
	hipSeat: 'Round the fullest part of the seat.',
	length: 'At the side seam, how much longer or shorter you would like the hem.',
	hemWidth: 'Round the hem: does it let you walk and sit, or stand away?',
	dartsBack: 'Do the darts point to the fullest part, and does the back lie flat below the waist?'
};

const TIGHT_WORDS: Record<Feel, string> = { [-2]: 'Much too tight', [-1]: 'A little tight', 0: 'Fine', 1: 'A little loose', 2: 'Much too loose' };
const LENGTH_WORDS: Record<Feel, string> = { [-2]: 'Much too short', [-1]: 'A little short', 0: 'Fine', 1: 'A little long', 2: 'Much too long' };
const DART_WORDS: Record<Feel, string> = { [-2]: 'Pulls a lot', [-1]: 'Pulls a little', 0: 'Fine', 1: 'Stands away a little', 2: 'Stands away a lot' };

export const FEELS: readonly Feel[] = [-2, -1, 0, 1, 2];

export function feelWord(area: FitArea, feel: Feel): string {
	return (area === 'length' ? LENGTH_WORDS : area === 'dartsBack' ? DART_WORDS : TIGHT_WORDS)[feel];
}

/** "Waist: much too tight, by 2 cm" */
export function answerWords(area: FitArea, a: FitAnswer, fmt: (cm: number) => string): string {
	const by = a.amountCm ? `, by ${fmt(a.amountCm)}` : '';
	return `${AREA_LABELS[area]}: ${feelWord(area, a.feel).toLowerCase()}${a.feel === 0 ? '' : by}`;
}

// Zones of the drawing of her skirt (front and back views); ids are stored with her report.
export const ZONES = [
	{ id: 'front-waist', view: 'front', label: 'Front waist' },
	{ id: 'front-hip', view: 'front', label: 'Front hip' },
	{ id: 'front-darts', view: 'front', label: 'Front darts' },
	{ id: 'front-side-left', view: 'front', label: 'Left side seam' },
	{ id: 'front-side-right', view: 'front', label: 'Right side seam' },
	{ id: 'front-hem', view: 'front', label: 'Front hem' },
	{ id: 'back-waist', view: 'back', label: 'Back waist' },
	{ id: 'back-seat', view: 'back', label: 'Seat' },
	{ id: 'back-darts', view: 'back', label: 'Back darts' },
	{ id: 'back-below-waist', view: 'back', label: 'Below the back waist' },
	{ id: 'back-hem', view: 'back', label: 'Back hem' }
] as const;
export type ZoneId = (typeof ZONES)[number]['id'];
export const ZONE_LABEL: Record<string, string> = Object.fromEntries(ZONES.map((z) => [z.id, z.label]));

// What the workroom may correct on her card: her measurements and the fit adjustments, each in cm.
// Limits follow the engine's (measurements.ts MEASUREMENT_LIMITS, fit.ts FIT_LIMITS); a change is
// checked again by the engine when the remake is drafted.
export const CORRECTABLE = [
	{ field: 'waist', label: 'Waist', kind: 'measurement' },
	{ field: 'hip', label: 'Hip', kind: 'measurement' },
	{ field: 'length', label: 'Skirt length', kind: 'measurement' },
	{ field: 'waistToHip', label: 'Waist to hip', kind: 'measurement' },
	{ field: 'ease.waist', label: 'Personal waist ease', kind: 'adjustment' },
	{ field: 'ease.hip', label: 'Personal hip ease', kind: 'adjustment' },
	{ field: 'highHip', label: 'High hip', kind: 'adjustment' },
	{ field: 'hollowBack', label: 'Hollow back', kind: 'adjustment' },
	{ field: 'prominentSeat', label: 'Prominent seat', kind: 'adjustment' },
	{ field: 'roundedAbdomen', label: 'Rounded abdomen', kind: 'adjustment' }
] as const;
export type CorrectableField = (typeof CORRECTABLE)[number]['field'];
export const FIELD_LABEL: Record<string, string> = Object.fromEntries(CORRECTABLE.map((c) => [c.field, c.label]));

/** A card change in words: "Waist 70 → 72 cm". */
export function changeWords(c: { field: string; from: number | null; to: number | null }, fmt: (cm: number) => string) {
	const label = FIELD_LABEL[c.field] ?? c.field;
	return `${label} ${c.from === null ? 'none' : fmt(c.from)} → ${c.to === null ? 'none' : fmt(c.to)}`;
}

// When she gives no amount, the workroom starts from these (common practice: a "little" is about a
// centimetre round the body, "much" about two).
const DEFAULT_AMOUNT: Record<Feel, number> = { [-2]: 2, [-1]: 1, 0: 0, 1: 1, 2: 2 };

/**
 * The corrections her answers point to, as changes in cm: a tight waist or hip is let out by what she
 * says (the girth the pattern is drafted for grows), a short skirt is lengthened, a tight high hip
 * fills the side curve. Hem width and the darts need the workroom's eye: no figure is guessed for them.
 */
export function suggestedChanges(answers: FitAnswers): Partial<Record<CorrectableField, number>> {
	const out: Partial<Record<CorrectableField, number>> = {};
	const amount = (a: FitAnswer) => Math.abs(a.amountCm ?? 0) || DEFAULT_AMOUNT[a.feel];
	const signed = (a: FitAnswer, tightIsPlus: boolean) => (a.feel === 0 ? 0 : (a.feel < 0 === tightIsPlus ? 1 : -1) * amount(a));
	if (answers.waist?.feel) out.waist = signed(answers.waist, true);
	if (answers.hipSeat?.feel) out.hip = signed(answers.hipSeat, true);
	if (answers.length?.feel) out.length = signed(answers.length, true);
	if (answers.highHip && answers.highHip.feel < 0) out.highHip = amount(answers.highHip);
	return out;
}

// ---- What many reports of one style say (the owner's fit page).

/** A correction is suggested as a house rule when at least this many reports of a style were made and
 * more than this share of them say the same (the atelier's own threshold, common practice: one body is
 * a person, a run of them is the block). */
export const SUGGEST_MIN_REPORTS = 3;
export const SUGGEST_SHARE = 0.5;

export type RuleSuggestion = {
	style: string;
	area: 'waist' | 'hipSeat';
	matching: number;
	reports: number;
	/** Median amount she said (cm round the body). */
	medianCm: number;
	/** The rule path and its change per quarter. */
	rule: 'ease.waist' | 'ease.hip';
	perQuarterCm: number;
	words: string;
};

const median = (xs: number[]) => {
	const s = [...xs].sort((a, b) => a - b);
	const m = Math.floor(s.length / 2);
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/**
 * A house-rule change for a style whose reports keep saying the same: "waist too tight" on more than
 * half of at least three reports suggests more waist ease; the same for the hip. Ease in the house
 * rules is per quarter (a half pattern's panel), so a girth change is shared by four.
 */
export function suggestRules(byStyle: Map<string, FitAnswers[]>): RuleSuggestion[] {
	const out: RuleSuggestion[] = [];
	for (const [style, reports] of byStyle) {
		if (reports.length < SUGGEST_MIN_REPORTS) continue;
		for (const area of ['waist', 'hipSeat'] as const) {
			const tight = reports.map((r) => r[area]).filter((a): a is FitAnswer => !!a && a.feel < 0);
			if (tight.length / reports.length <= SUGGEST_SHARE) continue;
			const m = median(tight.map((a) => Math.abs(a.amountCm ?? 0) || DEFAULT_AMOUNT[a.feel]));
			// Quarter of the girth, to the nearest quarter centimetre a cutter can mark.
			const perQuarter = Math.max(0.25, Math.round((m / 4) * 4) / 4);
			const rule = area === 'waist' ? 'ease.waist' : 'ease.hip';
			out.push({
				style,
				area,
				matching: tight.length,
				reports: reports.length,
				medianCm: m,
				rule,
				perQuarterCm: perQuarter,
				words: `${tight.length} of ${reports.length} reports on ${style} say the ${area === 'waist' ? 'waist' : 'hip'} is too tight (median ${m} cm): add ${perQuarter} cm of ${area === 'waist' ? 'waist' : 'hip'} ease on each quarter.`
			});
		}
	}
	return out;
}
