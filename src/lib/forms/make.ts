// The measuring-and-configuring form as flat fields, so it works as a plain HTML form without
// JavaScript and with superforms' client validation alike. It becomes a bag item on the server.
import { z } from 'zod';
import { toCm, UNITS, type BagItem } from './quote';
import { inUnits } from './units';
import { validateMeasurements } from '../drafting/measurements';
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
		const cm = toCm({ waist: f.waist ?? NaN, hip: f.hip ?? NaN, length: f.length ?? NaN, waistToHip: f.unknownDepth ? null : (f.waistToHip ?? NaN) }, f.units);
		for (const p of validateMeasurements(cm)) {
			if (!(missing as string[]).includes(p.field)) ctx.addIssue({ code: 'custom', path: [p.field], message: inUnits(p.message, f.units) });
		}
		if (f.saveCard && !f.cardName) ctx.addIssue({ code: 'custom', path: ['cardName'], message: 'Give your measure card a name, such as "Everyday".' });
		if (f.saveCard && !f.consent) ctx.addIssue({ code: 'custom', path: ['consent'], message: 'We can only keep your measurements with your consent.' });
	});

export type MakeForm = z.infer<typeof makeFormSchema>;

export function bagItemFrom(style: string, f: MakeForm): BagItem {
	return {
		id: crypto.randomUUID().slice(0, 12),
		style,
		fabricId: f.fabricId,
		units: f.units,
		figuresSource: f.figuresSource,
		// Only called on a valid form, where every measurement is a number.
		measurements: toCm({ waist: f.waist!, hip: f.hip!, length: f.length!, waistToHip: f.unknownDepth ? null : f.waistToHip }, f.units),
		options: {
			waistband: f.waistband,
			closure: { kind: f.closureKind, position: f.closurePosition },
			lining: f.lining,
			pockets: f.pockets,
			vent: f.vent,
			...(f.hemDepth !== undefined ? { hemDepth: f.hemDepth } : {})
		}
	};
}
