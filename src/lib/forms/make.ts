// The measuring-and-configuring form as flat fields, so it works as a plain HTML form without
// JavaScript and with superforms' client validation alike. It becomes the skirt request (quote.ts):
// sent for her price from the browser, kept as a bag item on the server.
import { z } from 'zod';
import { bagItemOf, measurementProblems, toCm, UNITS, type BagItem, type QuoteRequest, type ShopOptions } from './quote';
import { adjustmentsOfForm, FIT_FIELD_OF, fitFields, sideMissing } from './fit';
import { FIGURE_SOURCES } from '../drafting/figures-source';

// Empty until the shopper types (null), so the form never shows a made-up 0.
const measure = z.number().nullable().default(null);
const LABELS = { waist: 'waist', hip: 'hip', length: 'skirt length', waistToHip: 'waist-to-hip depth' } as const;

export const makeFormSchema = z
	.object({
		units: z.enum(UNITS).default('cm'),
		waist: measure,
		hip: measure,
		unknownDepth: z.boolean().default(false),
		waistToHip: measure,
		length: measure,
		// Optional: empty means the house default, said so on the page and on the pattern.
		waistToKnee: measure,
		// She has said a figure outside what a block usually fits is right ("did you mean …?").
		confirmed: z.boolean().default(false),
		...fitFields,
		waistband: z.enum(['band', 'facing']).default('band'),
		closureKind: z.enum(['zip', 'invisible-zip']).default('zip'),
		closurePosition: z.enum(['centre-back', 'side']).default('centre-back'),
		lining: z.boolean().default(false),
		pockets: z.boolean().default(false),
		vent: z.enum(['auto', 'vent', 'kick-pleat', 'none']).default('auto'),
		// Offered as presets in cm (narrow, standard, deep) whatever the shopper's units.
		hemDepth: z.number().min(1, 'A hem needs at least 1 cm.').max(8, 'Hems deeper than 8 cm do not lie flat.').optional(),
		fabricId: z.number({ error: 'Choose a fabric.' }).int().positive('Choose a fabric.'),
		saveCard: z.boolean().default(false),
		cardName: z.string().trim().max(80).default(''),
		consent: z.boolean().default(false),
		// Where the figures came from (her tape, a size chart, a skirt laid flat): set by the way in she
		// chose, kept on the order line and the measure card.
		figuresSource: z.enum(FIGURE_SOURCES).default('measured'),
		// Save over one of her own cards (0: a new card), so chart or flat-garment figures can be replaced
		// by measured ones later.
		replaceCardId: z.number().int().min(0).default(0)
	})
	.superRefine((f, ctx) => {
		const fields: (keyof typeof LABELS)[] = f.unknownDepth ? ['waist', 'hip', 'length'] : ['waist', 'hip', 'length', 'waistToHip'];
		const missing = fields.filter((k) => f[k] === null);
		for (const k of missing) {
			const message = k === 'waistToHip' ? 'Enter your waist-to-hip depth, or tick "I don’t know it".' : `Enter your ${LABELS[k]}.`;
			ctx.addIssue({ code: 'custom', path: [k], message });
		}
		// The same check as the skirt request's, on the request this form becomes; each problem back on its
		// flat field. A figure she may confirm is not an error of the form: the engine asks "did you mean …?".
		const q = skirtRequestOf('', f);
		for (const p of measurementProblems(toCm(q.measurements, q.units), q.units)) {
			const field = FIT_FIELD_OF[p.field] ?? p.field;
			if (!(missing as string[]).includes(field)) ctx.addIssue({ code: 'custom', path: [field], message: p.message });
		}
		if (sideMissing(f)) ctx.addIssue({ code: 'custom', path: ['oneHipSide'], message: 'Say which hip is higher or fuller: left or right.' });
		if (f.saveCard && !f.cardName) ctx.addIssue({ code: 'custom', path: ['cardName'], message: 'Give your measure card a name, such as "Everyday".' });
		if (f.saveCard && !f.consent) ctx.addIssue({ code: 'custom', path: ['consent'], message: 'We can only keep your measurements with your consent.' });
	});

export type MakeForm = z.infer<typeof makeFormSchema>;

/** The form's options as the skirt request nests them. */
export const optionsOfForm = (f: MakeForm): ShopOptions => ({
	waistband: f.waistband,
	closure: { kind: f.closureKind, position: f.closurePosition },
	lining: f.lining,
	pockets: f.pockets,
	vent: f.vent,
	...(f.hemDepth !== undefined ? { hemDepth: f.hemDepth } : {})
});

/**
 * The one conversion from the flat form to the skirt request (what /api/quote takes, in her units): the
 * configure page sends it for her price, and the add-to-bag action keeps it. An empty girth is NaN, which
 * the checks name.
 */
export function skirtRequestOf(style: string, f: MakeForm): QuoteRequest {
	return {
		style,
		units: f.units,
		fabricId: f.fabricId || undefined,
		figuresSource: f.figuresSource,
		measurements: {
			waist: f.waist ?? NaN,
			hip: f.hip ?? NaN,
			length: f.length ?? NaN,
			waistToHip: f.unknownDepth ? null : (f.waistToHip ?? NaN),
			waistToKnee: f.waistToKnee,
			confirmed: f.confirmed,
			adjustments: adjustmentsOfForm(f)
		},
		options: optionsOfForm(f)
	};
}

/** A valid form as a bag item (every measurement a number, a fabric chosen). */
export const bagItemFrom = (style: string, f: MakeForm): BagItem => bagItemOf({ ...skirtRequestOf(style, f), fabricId: f.fabricId }, crypto.randomUUID().slice(0, 12));
