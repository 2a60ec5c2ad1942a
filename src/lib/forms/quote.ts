// One schema for the shopper's measurements and choices, used by the measuring form in the browser,
// the form actions and the /api/quote endpoint, so all three refuse the same things in the same words.
import { z } from 'zod';
import { MEASUREMENT_LIMITS, validateMeasurements } from '../drafting/measurements';
import { inToCm } from '../drafting/units';
import { inUnits } from './units';
import { FIGURE_SOURCES } from '../drafting/figures-source';

export const UNITS = ['cm', 'in'] as const;

const num = (label: string) =>
	z.number({ error: `Enter your ${label} as a number.` }).refine(Number.isFinite, `Enter your ${label} as a number.`);

/** Measurements as typed, in the shopper's units. */
export const measurementsInput = z.object({
	waist: num('waist'),
	hip: num('hip'),
	length: num('skirt length'),
	waistToHip: num('waist-to-hip depth').nullish()
});

export type MeasurementsCm = { waist: number; hip: number; length: number; waistToHip?: number };

const round1 = (n: number) => Math.round(n * 10) / 10;

/** To centimetres, to the millimetre (the precision the database keeps). */
export function toCm(m: z.infer<typeof measurementsInput>, units: (typeof UNITS)[number]): MeasurementsCm {
	const f = units === 'in' ? (v: number) => round1(inToCm(v)) : round1;
	const out: MeasurementsCm = { waist: f(m.waist), hip: f(m.hip), length: f(m.length) };
	if (m.waistToHip !== null && m.waistToHip !== undefined) out.waistToHip = f(m.waistToHip);
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

/** Checks the measurements against the engine's own ranges, with the messages in the shopper's units. */
function checkRanges(m: MeasurementsCm, ctx: z.RefinementCtx, units: (typeof UNITS)[number], path: string[]) {
	for (const p of validateMeasurements(m)) ctx.addIssue({ code: 'custom', message: inUnits(p.message, units), path: [...path, p.field] });
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
	.superRefine((q, ctx) => checkRanges(toCm(q.measurements, q.units), ctx, q.units, ['measurements']));

export type QuoteRequest = z.infer<typeof quoteSchema>;

/** A configured skirt in the bag: always stored in centimetres. */
export const bagItemSchema = z.object({
	id: z.string().min(6).max(40),
	style: z.string().min(1).max(80),
	fabricId: z.number().int().positive(),
	measurements: z.object({ waist: z.number(), hip: z.number(), length: z.number(), waistToHip: z.number().optional() }),
	options: optionsSchema,
	units: z.enum(UNITS),
	// Bags from before the source was kept hold measured figures.
	figuresSource: z.enum(FIGURE_SOURCES).default('measured')
});

export type BagItem = z.infer<typeof bagItemSchema>;
