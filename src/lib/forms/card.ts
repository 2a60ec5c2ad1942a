// The measure card's optional parts, edited in the account: the waist-to-knee length and the fit
// adjustments. Read from a plain form post; checked by the engine's own rules with the card's girths.
import type { FitAdjustments } from '../drafting/fit';
import { inToCm } from '../drafting/units';
import { measurementProblems } from './quote';
import { FIT_FIELD_OF, fitFields, fitFromForm, sideMissing, type FitField, type FitForm } from './fit';

export type CardFitForm = FitForm & { waistToKnee: number | null };
export type CardFitErrors = Partial<Record<FitField | 'waistToKnee', string[]>>;

/** A stored card's girths (cm), against which the knee and the adjustments are checked. */
export type CardGirths = { waist: number; hip: number; length: number; waistToHip: number | null; units: 'cm' | 'in' };

/** Reads the posted fields: an empty field is none; anything else must be a number. */
export function readCardFit(data: FormData): { values: CardFitForm; errors: CardFitErrors } {
	const errors: CardFitErrors = {};
	const values = { waistToKnee: null } as CardFitForm;
	for (const k of [...(Object.keys(fitFields) as FitField[]), 'waistToKnee' as const]) {
		const raw = String(data.get(k) ?? '').trim();
		if (k === 'oneHipSide') {
			values.oneHipSide = raw === 'left' || raw === 'right' ? raw : '';
			continue;
		}
		if (raw === '') {
			(values as Record<string, unknown>)[k] = null;
			continue;
		}
		const v = Number(raw);
		if (!Number.isFinite(v)) errors[k] = ['Enter a number, or leave it empty.'];
		(values as Record<string, unknown>)[k] = Number.isFinite(v) ? v : null;
	}
	return { values, errors };
}

/** Checks the knee and the adjustments with the card's girths; gives what to store (cm) or the problems. */
export function checkCardFit(card: CardGirths, values: CardFitForm, errors: CardFitErrors = {}) {
	const out: CardFitErrors = { ...errors };
	const units = card.units;
	const knee = values.waistToKnee === null ? null : Math.round((units === 'in' ? inToCm(values.waistToKnee) : values.waistToKnee) * 10) / 10;
	const adjustments: FitAdjustments | null = fitFromForm(values, units) ?? null;
	const m = { waist: card.waist, hip: card.hip, length: card.length, ...(card.waistToHip === null ? {} : { waistToHip: card.waistToHip }), ...(knee === null ? {} : { waistToKnee: knee }), ...(adjustments ? { adjustments } : {}) };
	// Only what this form changes: the card's girths were checked when it was saved, and a figure she
	// confirmed then is not asked again here.
	for (const p of measurementProblems(m, units)) {
		const field = FIT_FIELD_OF[p.field] ?? (p.field === 'waistToKnee' ? 'waistToKnee' : null);
		if (field) (out[field] ??= []).push(p.message);
	}
	if (sideMissing(values)) (out.oneHipSide ??= []).push('Say which hip is higher or fuller: left or right.');
	return Object.keys(out).length ? { ok: false as const, errors: out } : { ok: true as const, waistToKnee: knee, adjustments };
}
