// The catalogue's two forms as flat text fields, so they post as plain HTML forms without JavaScript
// and validate alike in the browser and on the server. Figures stay text here and are read exactly
// (see amounts.ts) into the cents and centimetres the database keeps.
import { z } from 'zod';
import { STYLES, type StyleId } from '$lib/drafting/options';
import { amountProblem, type AmountRule } from '../catalogue/amounts';
import { fibreProblem } from '../catalogue/fibre';

// Strings carry no .default(): zod 4 returns a default without checking it, so a field left out of a
// post would slip past its rules (superforms fills the empty string in, which is then checked).

const amount = (rule: AmountRule) =>
	z
		.string()
		.trim()
		.superRefine((v, ctx) => {
			const problem = amountProblem(v, rule);
			if (problem) ctx.addIssue({ code: 'custom', message: problem });
		});

// Prices are typed in the shop's currency (a setting) with two decimals, as the catalogue keeps them in
// hundredths; the labels show the currency's sign.
const money = (label: string, min: number) =>
	amount({ label, decimals: 2, min, max: 9999.99, unit: 'in the shop’s currency', example: '24.50' });
const text = (min: number, max: number, empty: string, long = `Keep it under ${max} characters.`) =>
	z.string().trim().min(min, empty).max(max, long);

export const RULES = {
	width: { label: 'width', decimals: 1, min: 50, max: 330, unit: 'cm', example: '150' },
	stock: { label: 'stock', decimals: 3, min: 0, max: 99_999, unit: 'metres', example: '12.5' },
	shrinkage: { label: 'shrinkage', decimals: 1, min: 0, max: 20, unit: '%', example: '3' },
	shrinkageAcross: { label: 'shrinkage across', decimals: 1, min: 0, max: 20, unit: '%', example: '2' },
	leadDays: { label: 'lead time', decimals: 0, min: 1, max: 120, unit: 'days', example: '7' },
	sortOrder: { label: 'place in the list', decimals: 0, min: 0, max: 999, unit: '', example: '10' }
} satisfies Record<string, AmountRule>;

export const MAX_SWATCH_BYTES = 5 * 1024 * 1024;

const STYLE_IDS = STYLES.map((s) => s.id) as [StyleId, ...StyleId[]];

export const styleSchema = z.object({
	name: text(2, 120, 'Give the style a name, such as “Rue straight skirt”.'),
	slug: z
		.string()
		.trim()
		.toLowerCase()
		.refine(
			(s) => /^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(s) && s.length >= 2 && s.length <= 80,
			'Use lower-case letters, digits and hyphens, such as “rue-straight”.'
		),
	kind: z.enum(STYLE_IDS, { error: 'Choose the cut the workroom drafts for this style.' }),
	description: text(
		20,
		2000,
		'Describe the style in a sentence or two (at least 20 characters): shoppers read it first.'
	),
	makingPrice: money('making price', 1),
	priceLining: money('price of a lining', 0),
	pricePockets: money('price of pockets', 0),
	priceBand: money('price of a waistband', 0),
	priceFacing: money('price of a facing', 0),
	priceInvisibleZip: money('price of an invisible zip', 0),
	leadDays: amount(RULES.leadDays),
	sortOrder: amount(RULES.sortOrder)
});

export const fabricSchema = z.object({
	name: text(2, 120, 'Give the fabric a name, such as “Wool twill”.'),
	colour: text(2, 60, 'Name the colour, such as “Navy”.'),
	swatchHex: z
		.string()
		.trim()
		.refine(
			(s) => /^#[0-9a-fA-F]{6}$/.test(s),
			'Pick a colour, or write it as # and six hexadecimal digits, such as #26344f.'
		),
	fibreContent: z
		.string()
		.trim()
		.max(255, 'Keep it under 255 characters.')
		.superRefine((v, ctx) => {
			const problem = fibreProblem(v);
			if (problem) ctx.addIssue({ code: 'custom', message: problem });
		}),
	careText: text(10, 1000, 'Write the care in words, such as “Machine wash at 30 °C, dry flat, cool iron.”'),
	widthCm: amount(RULES.width),
	pricePerMetre: money('price a metre', 0.01),
	stockMetres: amount(RULES.stock),
	nap: z.boolean().default(false),
	stretch: z.boolean().default(false),
	shrinkagePct: amount(RULES.shrinkage),
	// Left empty: the lengthwise figure applies across as well.
	shrinkageAcrossPct: z
		.string()
		.trim()
		.superRefine((v, ctx) => {
			const problem = v === '' ? null : amountProblem(v, RULES.shrinkageAcross);
			if (problem) ctx.addIssue({ code: 'custom', message: problem });
		}),
	// Checked here for size only (the browser can do that before sending); what is inside the file
	// is decided on the server, from its bytes.
	image: z
		.instanceof(File, { message: 'Choose a photo file.' })
		.refine(
			(f) => f.size <= MAX_SWATCH_BYTES,
			'This photo is larger than 5 MB: save it smaller (800 pixels a side is plenty) and try again.'
		)
		.optional(),
	removeImage: z.boolean().default(false)
});

export type StyleForm = z.infer<typeof styleSchema>;
export type FabricForm = z.infer<typeof fabricSchema>;
