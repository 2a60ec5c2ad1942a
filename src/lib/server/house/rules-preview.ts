import { z } from 'zod';
import { RULE_FIELDS } from './rules-form';

/**
 * POST /api/admin/rules/preview: the house rules being edited, by dotted path, each a number (or the
 * form's text of one). Rules left out keep their current value; unknown keys are ignored. Ranges are
 * checked by the engine's resolveRules, which names the rule at fault.
 */
export const rulesPreviewSchema = z.object(
	Object.fromEntries(
		RULE_FIELDS.map((f) => [
			f.path,
			z
				.union([z.number(), z.string().max(40)], { error: `Enter ${f.label.toLowerCase()} as a number of centimetres.` })
				.optional()
				.meta({ description: `${f.label}, in centimetres.${f.help ? ` ${f.help}` : ''}` })
		])
	) as Record<(typeof RULE_FIELDS)[number]['path'], z.ZodOptional<z.ZodUnion<[z.ZodNumber, z.ZodString]>>>
);
