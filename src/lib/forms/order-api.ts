import { z } from 'zod';
import { checkoutSchema } from './checkout';
import { quoteSchema } from './quote';

/** POST /api/orders: the bag and the shopper in one JSON body, for headless shops and the benchmark. */
export const orderApiSchema = z.object({
	items: z
		.array(
			// The skirt request itself, its checks included, with the fabric chosen.
			quoteSchema.safeExtend({ fabricId: z.number({ error: 'Choose a fabric.' }).int().positive('Choose a fabric.') })
		)
		.min(1, 'Send at least one skirt.')
		.max(6, 'An order holds six skirts at most.'),
	shopper: checkoutSchema
});
