// The shopper's four measurements: what the engine accepts, and the sentences it says about them.
import { DraftInputError, lengthProblem, type FieldProblem } from './errors';
import { resolveFit, type FitAdjustments, type ResolvedFit } from './fit';
import type { HouseRules } from './rules';
import { formatCm } from './units';

/** The shopper's measurements in cm: whole-body girths, length from the waist line to the hem at the side. */
export interface Measurements {
	waist: number;
	hip: number;
	length: number;
	/** Waist line to hip line, at the side; when missing the house default is used and said so. */
	waistToHip?: number;
	/** Waist line to the middle of the knee, at the side; when missing the house default is used and said
	 * so. Decides "past the knee", the vent's reach and where a pencil skirt stops tapering. */
	waistToKnee?: number;
	/** The shopper has confirmed a figure outside what a block is usually drafted for (see FieldProblem). */
	confirmed?: boolean;
	/** Corrections for the figure beyond the girths (none when absent). */
	adjustments?: FitAdjustments;
}

/** Measurements as drafted: the hip depth always known, and whether it was assumed. */
export interface ResolvedMeasurements {
	waist: number;
	hip: number;
	length: number;
	hipDepth: number;
	hipDepthAssumed: boolean;
	kneeDepth: number;
	kneeAssumed: boolean;
	confirmed: boolean;
	fit: ResolvedFit;
}

/** Plausible input ranges (cm). Waist and hip: TRADE.md input-check ranges [from memory]; waist to hip
 * covers the 17.5–23 cm drafting guides quote with room either side; a skirt must pass the hip line by
 * `belowHip` and is at most `max` long. The shop's form schema mirrors these. */
export const MEASUREMENT_LIMITS = {
	waist: { min: 50, max: 200 },
	hip: { min: 70, max: 200 },
	waistToHip: { min: 10, max: 35 },
	/** Waist to knee: the handbook size 12 has 58.5 (TRADE.md, from memory); petite and tall figures
	 * either side. The knee lies at least `belowHip` under the hip line. */
	waistToKnee: { min: 35, max: 80, belowHip: 20 },
	/** A waist larger than the hip by more than this is asked to be confirmed: it is rare (from memory),
	 * and most often a slip of the tape or the keyboard. */
	waistOverHipToConfirm: 20,
	length: { belowHip: 5, max: 130 },
	/** The hip may exceed the waist by at most this many cm per cm of waist-to-hip depth (a quarter of it
	 * is 1.2 cm of shaping per cm of depth, beyond any body a skirt block is drafted for). */
	hipOverWaistPerDepth: 4.8
} as const;

const LABEL = { waist: 'waist', hip: 'hip', length: 'skirt length', waistToHip: 'waist-to-hip depth', waistToKnee: 'waist-to-knee length' } as const;

function numberProblem(field: keyof typeof LABEL, v: unknown, min: number, max: number): FieldProblem | null {
	if (typeof v !== 'number' || !Number.isFinite(v)) {
		return lengthProblem({ field, min, max }, (w) => `Enter your ${LABEL[field]} in ${w.unitName}, as a number.`);
	}
	if (v < min || v > max) {
		return lengthProblem({ field, min, max }, (w) => `Your ${LABEL[field]} must be ${w.range(min, max)}: please measure again.`);
	}
	return null;
}

/** The most the back waist may be lowered by fit adjustments, as a share of the waist-to-hip depth. */
const LOWERED_BACK_SHARE = 0.4;

/** Every problem with a set of measurements (an empty list means it can be drafted). */
export function validateMeasurements(input: unknown, defaultWaistToHip = 22): FieldProblem[] {
	const m = (typeof input === 'object' && input !== null ? input : {}) as Record<string, unknown>;
	const L = MEASUREMENT_LIMITS;
	const problems: FieldProblem[] = [];
	const push = (p: FieldProblem | null) => p && problems.push(p);
	push(numberProblem('waist', m.waist, L.waist.min, L.waist.max));
	push(numberProblem('hip', m.hip, L.hip.min, L.hip.max));
	let depth = defaultWaistToHip;
	if (m.waistToHip !== undefined && m.waistToHip !== null) {
		const p = numberProblem('waistToHip', m.waistToHip, L.waistToHip.min, L.waistToHip.max);
		push(p);
		if (!p) depth = m.waistToHip as number;
	}
	if (!problems.length && (m.hip as number) - (m.waist as number) > L.hipOverWaistPerDepth * depth + 1e-9) {
		const max = Math.floor((m.waist as number) + L.hipOverWaistPerDepth * depth);
		problems.push(
			lengthProblem(
				{ field: 'hip', max },
				(w) => `Please check your hip and your waist-to-hip depth: a hip more than ${w.len(Math.round(L.hipOverWaistPerDepth * depth))} larger than the waist over ${w.len(depth)} is more shaping than we can draft. Measure again, or ask us about a fitting.`
			)
		);
	}
	if (m.waistToKnee !== undefined && m.waistToKnee !== null) {
		const p = numberProblem('waistToKnee', m.waistToKnee, L.waistToKnee.min, L.waistToKnee.max);
		push(p);
		const knee = m.waistToKnee as number;
		if (!p && knee < depth + L.waistToKnee.belowHip) {
			problems.push(
				lengthProblem(
					{ field: 'waistToKnee', min: Math.ceil(depth + L.waistToKnee.belowHip), max: L.waistToKnee.max, value: knee, limit: depth + L.waistToKnee.belowHip },
					(w) => `Please check your waist-to-knee length: ${w.len(knee)} puts your knee less than ${w.len(L.waistToKnee.belowHip)} below your hip line (${w.len(depth)} down).`
				)
			);
		}
	}
	if (!problems.length && m.confirmed !== true && (m.waist as number) - (m.hip as number) > L.waistOverHipToConfirm) {
		const limit = (m.hip as number) + L.waistOverHipToConfirm;
		const over = (m.waist as number) - (m.hip as number);
		problems.push(
			lengthProblem(
				{ field: 'waist', value: m.waist as number, limit, max: Math.floor(limit), confirmable: true },
				(w) => `Please check your waist and hip: a waist ${w.len(over)} larger than the hip is rare. If both are right, confirm them and we draft for them.`
			)
		);
	}
	const fit = resolveFit(m.adjustments);
	problems.push(...fit.problems);
	// The hollow back and a higher hip both take the back waist down towards the hip line. Past about
	// two fifths of the waist-to-hip depth between them, the back's darts and side curve have no room
	// left and its outline folds over itself (found by the property tests at a 10–12 cm depth; the
	// fraction is ours, common practice would fit such a figure in calico first).
	const lowered = fit.fit.hollowBack + (fit.fit.oneHip?.higher ?? 0);
	const room = Math.floor(LOWERED_BACK_SHARE * depth * 10) / 10;
	if (!fit.problems.length && lowered > room + 1e-9) {
		problems.push(
			lengthProblem(
				{ field: 'adjustments.hollowBack', value: lowered, limit: room, max: room },
				(w) => `Together the hollow back and the higher hip lower the back waist ${w.len(lowered)}; over a ${w.len(depth)} waist-to-hip depth a block takes at most ${w.len(room)}. Please check them, or ask us about a fitting in calico.`
			)
		);
	}
	const minLength = Math.ceil(depth + L.length.belowHip);
	const short = typeof m.length === 'number' && Number.isFinite(m.length) && m.length < minLength;
	push(
		short
			? lengthProblem({ field: 'length', min: minLength, max: L.length.max }, (w) => `Your skirt length must reach at least ${w.len(L.length.belowHip)} below your hip line: ${w.atLeast(minLength)}.`)
			: numberProblem('length', m.length, minLength, L.length.max)
	);
	return problems;
}

/** Checks and completes the measurements; throws DraftInputError naming each bad field. */
export function resolveMeasurements(input: unknown, rules: HouseRules): ResolvedMeasurements {
	const problems = validateMeasurements(input, rules.defaultWaistToHip);
	if (problems.length) throw new DraftInputError(problems);
	const m = input as Measurements;
	const fit = resolveFit(m.adjustments);
	if (fit.problems.length) throw new DraftInputError(fit.problems);
	const known = typeof m.waistToHip === 'number';
	const kneeKnown = typeof m.waistToKnee === 'number';
	return {
		waist: m.waist,
		hip: m.hip,
		length: m.length,
		hipDepth: known ? (m.waistToHip as number) : rules.defaultWaistToHip,
		hipDepthAssumed: !known,
		kneeDepth: kneeKnown ? (m.waistToKnee as number) : rules.kneeDepth,
		kneeAssumed: !kneeKnown,
		confirmed: m.confirmed === true,
		fit: fit.fit
	};
}

/** Sentences about the measurements themselves: an assumed hip depth, values near the edges of the range. */
export function measurementWarnings(m: ResolvedMeasurements): string[] {
	const out: string[] = [];
	if (m.hipDepthAssumed) {
		out.push(
			`You did not give your waist-to-hip depth, so we used ${formatCm(m.hipDepth)}, a usual figure. For a closer fit, measure down your side from your waist to the fullest part of your hip.`
		);
	}
	const near = (field: 'waist' | 'hip' | 'waistToHip', v: number) => {
		const { min, max } = MEASUREMENT_LIMITS[field];
		const margin = (max - min) * 0.04;
		const name = LABEL[field];
		if (v < min + margin) out.push(`Please check your ${name}: ${formatCm(v)} is close to the smallest we draft (${min} cm). If it is right, we draft for it as it is.`);
		else if (v > max - margin) out.push(`Please check your ${name}: ${formatCm(v)} is close to the largest we draft (${max} cm). If it is right, we draft for it as it is.`);
	};
	near('waist', m.waist);
	near('hip', m.hip);
	if (!m.hipDepthAssumed) near('waistToHip', m.hipDepth);
	return out;
}
