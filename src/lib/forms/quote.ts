// One schema for the shopper's measurements and choices, used by the measuring form in the browser,
// the form actions and the /api/quote endpoint, so all three refuse the same things in the same words.
import { z } from 'zod';
import { validateMeasurements } from '../drafting/measurements';
import { problemIn } from '../drafting/errors';
import type { FitAdjustments } from '../drafting/fit';
import { inToCm } from '../drafting/units';
import { FIGURE_SOURCES } from '../drafting/figures-source';

export const UNITS = ['cm', 'in'] as const;

const num = (label: string) =>
	z.number({ error: `Enter your ${label} as a number.` }).refine(Number.isFinite, `Enter your ${label} as a number.`);

const amount = (label: string) => num(label).nullish();

/** Fit adjustments (fit.ts), each amount in the shopper's units; their ranges are the engine's (FIT_LIMITS). */
export const adjustmentsInput = z
	.object({
		hollowBack: amount('hollow back'),
		roundedAbdomen: amount('rounded abdomen'),
		prominentSeat: amount('prominent seat'),
		highHip: amount('high hip'),
		oneHip: z
			.object({
				side: z.enum(['left', 'right'], { error: 'Say which hip is higher or fuller: left or right.' }),
				higher: amount('higher hip'),
				fuller: amount('fuller hip')
			})
			.strict()
			.nullish(),
		ease: z.object({ waist: amount('personal waist ease'), hip: amount('personal hip ease') }).strict().nullish()
	})
	.strict();

/** Measurements as typed, in the shopper's units. `confirmed`: she has said a figure outside what a block
 * usually fits is right (the engine refuses it until then). */
export const measurementsInput = z.object({
	waist: num('waist'),
	hip: num('hip'),
	length: num('skirt length'),
	waistToHip: num('waist-to-hip depth').nullish(),
	waistToKnee: num('waist-to-knee length').nullish(),
	confirmed: z.boolean().optional(),
	adjustments: adjustmentsInput.nullish()
});

/** Measurements in cm as the engine takes them (its Measurements), as the bag and the order line keep them. */
export type MeasurementsCm = { waist: number; hip: number; length: number; waistToHip?: number; waistToKnee?: number; confirmed?: boolean; adjustments?: FitAdjustments };

const round1 = (n: number) => Math.round(n * 10) / 10;

/** Adjustments to centimetres, to the millimetre, leaving out the empty ones (none at all gives undefined). */
export function adjustmentsToCm(a: z.infer<typeof adjustmentsInput> | null | undefined, units: (typeof UNITS)[number]): FitAdjustments | undefined {
	if (!a) return undefined;
	// Amounts are small (a few cm): kept to the millimetre in both units, negative ease included.
	const f = (v: number | null | undefined) => (v === null || v === undefined ? undefined : units === 'in' ? round1(inToCm(v)) : round1(v));
	const out: FitAdjustments = {};
	for (const k of ['hollowBack', 'roundedAbdomen', 'prominentSeat', 'highHip'] as const) {
		const v = f(a[k]);
		if (v) out[k] = v;
	}
	if (a.oneHip) {
		const higher = f(a.oneHip.higher);
		const fuller = f(a.oneHip.fuller);
		if (higher || fuller) out.oneHip = { side: a.oneHip.side, ...(higher ? { higher } : {}), ...(fuller ? { fuller } : {}) };
	}
	if (a.ease) {
		const waist = f(a.ease.waist);
		const hip = f(a.ease.hip);
		if (waist || hip) out.ease = { ...(waist ? { waist } : {}), ...(hip ? { hip } : {}) };
	}
	return Object.keys(out).length ? out : undefined;
}

/** To centimetres, to the millimetre (the precision the database keeps). */
export function toCm(m: z.infer<typeof measurementsInput>, units: (typeof UNITS)[number]): MeasurementsCm {
	const f = units === 'in' ? (v: number) => round1(inToCm(v)) : round1;
	const out: MeasurementsCm = { waist: f(m.waist), hip: f(m.hip), length: f(m.length) };
	if (m.waistToHip !== null && m.waistToHip !== undefined) out.waistToHip = f(m.waistToHip);
	if (m.waistToKnee !== null && m.waistToKnee !== undefined) out.waistToKnee = f(m.waistToKnee);
	if (m.confirmed === true) out.confirmed = true;
	const adjustments = adjustmentsToCm(m.adjustments, units);
	if (adjustments) out.adjustments = adjustments;
	return out;
}

export const optionsSchema = z
	.object({
		waistband: z.enum(['band', 'facing']).default('band'),
		closure: z
			.object({
				kind: z.enum(['zip', 'invisible-zip']).default('zip'),
				position: z.enum(['centre-back', 'side']).default('centre-back')
			})
			.default({ kind: 'zip', position: 'centre-back' }),
		lining: z.boolean().default(false),
		pockets: z.boolean().default(false),
		vent: z.enum(['auto', 'vent', 'kick-pleat', 'none']).default('auto'),
		hemDepth: z.number().min(1, 'A hem needs at least 1 cm.').max(8, 'Hems deeper than 8 cm do not lie flat.').optional()
	})
	.strict();

export type ShopOptions = z.infer<typeof optionsSchema>;

/**
 * The one check of her measurements, behind the API, the configure form and the measure card: the engine's
 * own ranges, each message in her units. A figure she may confirm is left to the engine, which answers with
 * its value and limit ("did you mean …?").
 */
export function measurementProblems(m: MeasurementsCm, units: (typeof UNITS)[number]): { field: string; message: string }[] {
	return validateMeasurements(m)
		.filter((p) => !p.confirmable)
		.map((p) => ({ field: p.field, message: problemIn(p, units) }));
}

export const quoteSchema = z
	.object({
		measurements: measurementsInput,
		style: z.string().min(1).max(80),
		options: optionsSchema.default({ waistband: 'band', closure: { kind: 'zip', position: 'centre-back' }, lining: false, pockets: false, vent: 'auto' }),
		fabricId: z.number().int().positive().optional(),
		units: z.enum(UNITS).default('cm'),
		figuresSource: z.enum(FIGURE_SOURCES).default('measured')
	})
	.superRefine((q, ctx) => {
		for (const p of measurementProblems(toCm(q.measurements, q.units), q.units)) ctx.addIssue({ code: 'custom', message: p.message, path: ['measurements', ...p.field.split('.')] });
	});

/** The skirt request: what /api/quote and /api/orders take, and what the configure form becomes. */
export type QuoteRequest = z.infer<typeof quoteSchema>;

/** The request in centimetres, as the quote, the bag and the order line take it. */
export function requestInCm(q: QuoteRequest) {
	return { style: q.style, fabricId: q.fabricId, units: q.units, figuresSource: q.figuresSource, options: q.options, measurements: toCm(q.measurements, q.units) };
}

/** A configured skirt in the bag: always stored in centimetres. */
export const bagItemSchema = z.object({
	id: z.string().min(6).max(40),
	style: z.string().min(1).max(80),
	fabricId: z.number().int().positive(),
	measurements: z.object({
		waist: z.number(),
		hip: z.number(),
		length: z.number(),
		waistToHip: z.number().optional(),
		waistToKnee: z.number().optional(),
		confirmed: z.boolean().optional(),
		// In cm; the engine checks the amounts again whenever the item is quoted.
		adjustments: z.custom<FitAdjustments>((v) => typeof v === 'object' && v !== null && !Array.isArray(v)).optional()
	}),
	options: optionsSchema,
	units: z.enum(UNITS),
	// Bags from before the source was kept hold measured figures.
	figuresSource: z.enum(FIGURE_SOURCES).default('measured')
});

export type BagItem = z.infer<typeof bagItemSchema>;

/** A request with its fabric chosen, as a bag item. */
export const bagItemOf = (q: QuoteRequest & { fabricId: number }, id: string): BagItem => ({ id, ...requestInCm(q), fabricId: q.fabricId });
