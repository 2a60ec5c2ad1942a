// One way between a skirt as the shop takes it (measurements in cm, with the knee, the confirmation and
// the fit adjustments) and an order line as stored (the measurements snapshot and the adjustments column),
// and back to the engine's input. Every output that drafts a line (the ticket, the cutter's lays, the
// full-scale files) goes through `lineMeasurements`, so none drafts a line differently from the quote.
import type { FitAdjustments } from '../drafting/fit';
import type { Measurements } from '../drafting/measurements';

/** The measurements snapshot kept on an order line (cm). A confirmed figure keeps `confirmed: true`. */
export type MeasurementsSnapshot = Record<string, number | boolean | null>;

/** The shop's measurements (the engine's shape) as the order line keeps them. */
export function lineSnapshot(m: Measurements): { measurements: MeasurementsSnapshot; adjustments: FitAdjustments | null } {
	const measurements: MeasurementsSnapshot = {
		waist: m.waist,
		hip: m.hip,
		length: m.length,
		waistToHip: m.waistToHip ?? null,
		waistToKnee: m.waistToKnee ?? null
	};
	if (m.confirmed === true) measurements.confirmed = true;
	const adjustments = m.adjustments && Object.keys(m.adjustments).length ? m.adjustments : null;
	return { measurements, adjustments };
}

const numberOr = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** A stored order line back into the engine's input: the four girths, the knee when given, the
 * confirmation and the adjustments. Lines placed before the knee or the adjustments existed have neither. */
export function lineMeasurements(measurements: Record<string, unknown>, adjustments?: FitAdjustments | null): Measurements {
	const out: Measurements = { waist: Number(measurements.waist), hip: Number(measurements.hip), length: Number(measurements.length) };
	const depth = numberOr(measurements.waistToHip);
	if (depth !== undefined) out.waistToHip = depth;
	const knee = numberOr(measurements.waistToKnee);
	if (knee !== undefined) out.waistToKnee = knee;
	if (measurements.confirmed === true || measurements.confirmed === 1) out.confirmed = true;
	if (adjustments && typeof adjustments === 'object' && Object.keys(adjustments).length) out.adjustments = adjustments;
	return out;
}
