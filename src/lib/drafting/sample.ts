// The atelier's usual figure: what every style is drawn on in the catalogue, and what the configure page
// draws with for the measurements she has not given yet. The handbook size 12 (waist 68, hip 94, waist to
// hip 20.6 cm, TRADE.md, from memory) at a knee length of 60 cm.
import type { Measurements } from './measurements';

export const SAMPLE_FIGURE = { waist: 68, hip: 94, waistToHip: 20.6, length: 60 } as const;

/** Measurements as she has typed them so far, in cm; null or missing where she has not. */
export type PartialMeasurements = { [K in 'waist' | 'hip' | 'length' | 'waistToHip' | 'waistToKnee']?: number | null };

const given = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/** Her figure so far, the usual one for the rest: a girth she has not given keeps the usual figure's
 * difference to the one she has (so a 100 cm waist is drawn over a 126 cm hip, not a 94 cm one), an
 * unknown depth is left to the house rules, and the length is the usual one. Which were filled is listed. */
export function completeFigure(m: PartialMeasurements): { measurements: Measurements; filled: ('waist' | 'hip' | 'length')[] } {
	const s = SAMPLE_FIGURE;
	const filled: ('waist' | 'hip' | 'length')[] = [];
	const waist = given(m.waist) ? m.waist : given(m.hip) ? Math.max(50, m.hip - (s.hip - s.waist)) : s.waist;
	if (!given(m.waist)) filled.push('waist');
	const hip = given(m.hip) ? m.hip : Math.max(70, waist + (s.hip - s.waist));
	if (!given(m.hip)) filled.push('hip');
	const length = given(m.length) ? m.length : s.length;
	if (!given(m.length)) filled.push('length');
	const out: Measurements = { waist, hip, length };
	if (given(m.waistToHip)) out.waistToHip = m.waistToHip;
	if (given(m.waistToKnee)) out.waistToKnee = m.waistToKnee;
	return { measurements: out, filled };
}
