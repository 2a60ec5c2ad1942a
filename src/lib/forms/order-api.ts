import { z } from 'zod';
import { checkoutSchema } from './checkout';
import { optionsSchema, quoteSchema } from './quote';

/** POST /api/orders: the bag and the shopper in one JSON body, for headless shops and the benchmark. */
export const orderApiSchema = z.object({
	items: z
		.array(
			z.object({
				measurements: quoteSchema.shape.measurements,
				style: z.string().min(1).max(80),
				fabricId: z.number().int().positive(),
				options: optionsSchema.default({ waistband: 'band', closure: { kind: 'zip', position: 'centre-back' }, lining: false, pockets: false, vent: 'auto' }),
				units: z.enum(['cm', 'in']).default('cm'),
				figuresSource: quoteSchema.shape.figuresSource
			})
		)
		.min(1, 'Send at least one skirt.')
		.max(6, 'An order holds six skirts at most.'),
	shopper: checkoutSchema
});
