import { z } from 'zod';
import { ORDER_STAGES } from '../orders/stages';

/** A stage move, from a workroom form or the API. */
export const stageSchema = z.object({
	to: z.enum(ORDER_STAGES, { error: 'Choose a stage.' }),
	note: z.string().trim().max(500).optional(),
	carrier: z.string().trim().max(60).optional(),
	tracking: z.string().trim().max(80).optional(),
	overrideStock: z.boolean().optional()
});
