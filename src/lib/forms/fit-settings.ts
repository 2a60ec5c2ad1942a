import { z } from 'zod';

// The fit loop's settings as the owner edits them. Bounds are the atelier's own: a window under a week
// gives her no time to try the skirt on, over a year is no longer a fit question; photos are kept at
// least a week so the workroom can judge them, at most a year (body photos are kept no longer than
// needed: GDPR art. 5(1)(e), from memory — defer to local law); more than three free remakes is not a
// promise a small workroom can keep.
const whole = (m: { type: string; whole: string; min: string; max: string }, min: number, max: number) =>
	z.coerce.number({ error: m.type }).refine(Number.isFinite, m.type).pipe(z.number().int(m.whole).min(min, m.min).max(max, m.max));

export const fitSettingsSchema = z.object({
	remakeWindowDays: whole(
		{ type: 'Give the remake window as a number of days.', whole: 'Give the remake window in whole days.', min: 'The remake window is at least 7 days.', max: 'The remake window is at most 365 days.' },
		7,
		365
	),
	photoRetentionDays: whole(
		{ type: 'Give how long photos are kept as a number of days.', whole: 'Give how long photos are kept in whole days.', min: 'Keep photos at least 7 days, so the workroom can judge the fit.', max: 'Keep photos at most 365 days.' },
		7,
		365
	),
	freeRemakesPerOrder: whole(
		{ type: 'Give the free remakes as a whole number from 0 to 3.', whole: 'Give the free remakes as a whole number from 0 to 3.', min: 'Free remakes cannot be fewer than 0.', max: 'At most 3 free remakes per order.' },
		0,
		3
	)
});
export type FitSettings = z.infer<typeof fitSettingsSchema>;
