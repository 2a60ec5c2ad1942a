import { z } from 'zod';

// The fit loop's settings as the owner edits them. Bounds are the atelier's own: a window under a week
// gives her no time to try the skirt on, over a year is no longer a fit question; photos are kept at
// least a week so the workroom can judge them, at most a year (body photos are kept no longer than
// needed, GDPR art. 5(1)(e) — defer to local law); more than three free remakes is not a promise a
// small workroom can keep.
const whole = (label: string, min: number, max: number, unit: string) =>
	z.coerce
		.number({ error: `Give ${label} as a number of ${unit}.` })
		.int(`Give ${label} in whole ${unit}.`)
		.min(min, `${label[0].toUpperCase()}${label.slice(1)}: at least ${min} ${min === 1 ? unit.replace(/s$/, '') : unit}.`)
		.max(max, `${label[0].toUpperCase()}${label.slice(1)}: at most ${max} ${unit}.`);

export const fitSettingsSchema = z.object({
	remakeWindowDays: whole('the remake window', 7, 365, 'days'),
	photoRetentionDays: whole('how long photos are kept', 7, 365, 'days'),
	freeRemakesPerOrder: whole('the free remakes per order', 0, 3, 'remakes')
});
export type FitSettings = z.infer<typeof fitSettingsSchema>;
