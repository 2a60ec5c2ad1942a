// The fit adjustments as flat form fields (a plain HTML form posts no nesting), shared by the measure
// card in the account and the configure page. Amounts in the form's units; the engine keeps cm.
import { z } from 'zod';
import { FIT_LIMITS, type FitAdjustments } from '../drafting/fit';
import { cmToIn } from '../drafting/units';
import { adjustmentsToCm } from './quote';

const amount = z.number().nullable().default(null);

export const fitFields = {
	hollowBack: amount,
	roundedAbdomen: amount,
	prominentSeat: amount,
	highHip: amount,
	oneHipSide: z.enum(['', 'left', 'right']).default(''),
	oneHipHigher: amount,
	oneHipFuller: amount,
	easeWaist: amount,
	easeHip: amount
};

export type FitForm = { [K in keyof typeof fitFields]: z.infer<(typeof fitFields)[K]> };
export type FitField = keyof typeof fitFields;

/** The engine's name of each adjustment ("adjustments.oneHip.higher") to its form field. */
export const FIT_FIELD_OF: Record<string, FitField> = {
	'adjustments.hollowBack': 'hollowBack',
	'adjustments.roundedAbdomen': 'roundedAbdomen',
	'adjustments.prominentSeat': 'prominentSeat',
	'adjustments.highHip': 'highHip',
	'adjustments.oneHip.side': 'oneHipSide',
	'adjustments.oneHip.higher': 'oneHipHigher',
	'adjustments.oneHip.fuller': 'oneHipFuller',
	'adjustments.ease.waist': 'easeWaist',
	'adjustments.ease.hip': 'easeHip',
	adjustments: 'hollowBack'
};

/** What each field means, its range (FIT_LIMITS, cm) and the drawing that shows it (FitDrawing). */
export const FIT_STEPS: { field: FitField; label: string; limits: { min: number; max: number }; how: string }[] = [
	{ field: 'hollowBack', label: 'Hollow back', limits: FIT_LIMITS.hollowBack, how: 'Your back curves in deeply above the seat, so a skirt wrinkles across the back below the waistband. We lower the centre back waist by this much (1 to 2 cm is usual).' },
	{ field: 'roundedAbdomen', label: 'Rounded abdomen', limits: FIT_LIMITS.roundedAbdomen, how: 'Your tummy is rounded below the waist, so a skirt rides up at the front hem. We raise the centre front waist by this much and make the front darts smaller.' },
	{ field: 'prominentSeat', label: 'Prominent seat', limits: FIT_LIMITS.prominentSeat, how: 'Your seat is fuller than usual for your hip, so a skirt rides up at the back hem. We make the back darts deeper and longer and add width across the back hip.' },
	{ field: 'highHip', label: 'High hip', limits: FIT_LIMITS.highHip, how: 'You are fuller at the top of the hip, about a hand below the waist. Measure round there, and give how much more it is than the skirt would allow; we fill the side curve out.' },
	{ field: 'oneHipHigher', label: 'One hip higher', limits: FIT_LIMITS['oneHip.higher'], how: 'Standing straight, one side of your waist sits higher than the other. We draft that side from its own figure and cut the skirt open, left and right apart.' },
	{ field: 'oneHipFuller', label: 'One hip fuller', limits: FIT_LIMITS['oneHip.fuller'], how: 'One side of your hips is larger than the other. Give how much more that half measures round the hip.' },
	{ field: 'easeWaist', label: 'Your waist ease', limits: FIT_LIMITS['ease.waist'], how: 'More room at the waist than we usually give, or less (a minus figure) for a closer fit, all the way round.' },
	{ field: 'easeHip', label: 'Your hip ease', limits: FIT_LIMITS['ease.hip'], how: 'More room round the hip than we usually give, or less (a minus figure), all the way round.' }
];

/** The form's fields nested as the skirt request has them, in the form's units. */
export function adjustmentsOfForm(f: FitForm) {
	return {
		hollowBack: f.hollowBack,
		roundedAbdomen: f.roundedAbdomen,
		prominentSeat: f.prominentSeat,
		highHip: f.highHip,
		oneHip: f.oneHipSide ? { side: f.oneHipSide, higher: f.oneHipHigher, fuller: f.oneHipFuller } : null,
		ease: { waist: f.easeWaist, hip: f.easeHip }
	};
}

/** The form's fields as the engine's adjustments in cm (undefined for none). */
export const fitFromForm = (f: FitForm, units: 'cm' | 'in'): FitAdjustments | undefined => adjustmentsToCm(adjustmentsOfForm(f), units);

/** Whether the form gives a higher or fuller hip without saying which side (the engine cannot tell). */
export const sideMissing = (f: FitForm) => !f.oneHipSide && Boolean(f.oneHipHigher || f.oneHipFuller);

/** Stored adjustments (cm) back into form fields in the shopper's units (to the ⅛″ in inches). */
export function fitToForm(a: FitAdjustments | null | undefined, units: 'cm' | 'in'): FitForm {
	const f = (v: number | undefined) => (v === undefined || v === 0 ? null : units === 'in' ? Math.round(cmToIn(v) * 8) / 8 : v);
	return {
		hollowBack: f(a?.hollowBack),
		roundedAbdomen: f(a?.roundedAbdomen),
		prominentSeat: f(a?.prominentSeat),
		highHip: f(a?.highHip),
		oneHipSide: a?.oneHip?.side ?? '',
		oneHipHigher: f(a?.oneHip?.higher),
		oneHipFuller: f(a?.oneHip?.fuller),
		easeWaist: f(a?.ease?.waist),
		easeHip: f(a?.ease?.hip)
	};
}
