import { z } from 'zod';
import { email } from './auth';

// Countries the atelier ships to (ISO 3166-1 alpha-2 codes).
export const COUNTRIES = [
	['AT', 'Austria'],
	['BE', 'Belgium'],
	['DE', 'Germany'],
	['DK', 'Denmark'],
	['ES', 'Spain'],
	['FI', 'Finland'],
	['FR', 'France'],
	['IE', 'Ireland'],
	['IT', 'Italy'],
	['NL', 'Netherlands'],
	['NO', 'Norway'],
	['PT', 'Portugal'],
	['SE', 'Sweden'],
	['GB', 'United Kingdom']
] as const;

const text = (label: string, max = 120) => z.string().trim().min(1, `Enter your ${label}.`).max(max, `Keep the ${label} under ${max} characters.`);

export const checkoutSchema = z.object({
	email,
	name: text('name'),
	line1: text('street and number', 160),
	line2: z.string().trim().max(160).default(''),
	city: text('town or city', 80),
	postcode: text('postcode', 20),
	// Empty until she chooses: no country is assumed for her.
	country: z
		.string()
		.default('')
		.refine((c) => COUNTRIES.some(([code]) => code === c), 'Choose the country we ship to.'),
	// Body measurements are personal data: drafting from them needs her explicit agreement, so the
	// boxes start unticked.
	measurementConsent: z.boolean().default(false).refine(Boolean, 'We need your agreement to draft from your measurements.'),
	madeToMeasure: z.boolean().default(false).refine(Boolean, 'Please confirm you have read how returns work for made-to-measure skirts.')
});

/**
 * The checkout page's form: the shopper's details plus the key the page made when it loaded, so the
 * same form sent twice (double click, a retry after a lost answer) finds the order the first one placed.
 * Optional: without it an order is placed each time, as through the API.
 */
export const checkoutFormSchema = checkoutSchema.extend({
	checkoutKey: z
		.string()
		.regex(/^[A-Za-z0-9-]{16,64}$/, 'This checkout page is out of date: reload it and send the form again.')
		.optional()
});
