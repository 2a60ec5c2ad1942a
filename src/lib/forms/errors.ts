import type { z } from 'zod';

/** zod issues as { "measurements.waist": ["…"] }, the shape forms show beside each field. */
export function fieldErrors(error: z.ZodError) {
	const out: Record<string, string[]> = {};
	for (const issue of error.issues) (out[issue.path.join('.') || 'body'] ??= []).push(issue.message);
	return out;
}
