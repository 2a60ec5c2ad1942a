// How much each quarter panel is taken in between hip and waist, and where: centre back, darts, side seam.
// The house method adds fixed dart allowances at the waist mark and lets the side take the rest; this
// module keeps that exact on a usual figure and bends it sensibly at the edges of the range.
import type { ResolvedMeasurements } from './measurements';
import type { HouseRules } from './rules';

/** One quarter panel's share-out of its waist suppression (cm). */
export interface PanelPlan {
	kind: 'front' | 'back';
	hip: number;
	/** The waist seam with darts closed. */
	seam: number;
	centre: number;
	darts: number[];
	side: number;
	raise: number;
	/** A dart was wanted but left out because it came out smaller than the smallest worth sewing. */
	dartsLeftOut: boolean;
}

/** The plan of both panels and what had to give. */
export interface BlockPlan {
	back: PanelPlan;
	front: PanelPlan;
	/** The hip line was widened past hip + ease to clear a waist larger than the hip. */
	widened: boolean;
	/** Darts deeper than the house's largest were needed. */
	deepDarts: boolean;
}

function finish(kind: 'front' | 'back', hip: number, seam: number, centre: number, dartTotal: number, side: number, rules: HouseRules): PanelPlan {
	let dartsLeftOut = false;
	if (dartTotal > 0 && dartTotal < rules.darts.minIntake) {
		side += dartTotal;
		dartTotal = 0;
		dartsLeftOut = true;
	}
	const n = dartTotal <= 1e-9 ? 0 : dartTotal > rules.darts.maxIntake + 1e-9 ? 2 : 1;
	const darts = Array.from({ length: n }, () => dartTotal / n);
	const full = rules.side.fullRaiseAt;
	const raise = rules.sideRaise * (full > 0 ? Math.min(1, side / full) : 1);
	return { kind, hip, seam, centre, darts, side, raise, dartsLeftOut };
}

/** The house method on one panel: suppression S, dart allowance A (centre take-in included for the back). */
function byAllowance(kind: 'front' | 'back', hip: number, seam: number, rules: HouseRules, backOnFold: boolean): PanelPlan {
	const S = hip - seam;
	if (S <= 1e-9) return finish(kind, hip, seam, 0, 0, 0, rules);
	const A = rules.dartAllowance[kind];
	// A back cut on the fold has no centre seam to shape: its darts take the whole allowance.
	const c0 = kind === 'back' && !backOnFold ? rules.centreBackShaping : 0;
	let taken = A;
	let side = S - A;
	// Small differences: the side keeps its share, darts and centre shrink together (never a flare).
	if (side < rules.side.minShare * S) {
		side = rules.side.minShare * S;
		taken = S - side;
	}
	// Large differences: the side stops at its limit, the darts take the excess (a second one if needed).
	if (side > rules.side.maxShaping) {
		taken += side - rules.side.maxShaping;
		side = rules.side.maxShaping;
	}
	const centre = Math.min(taken, A > 0 ? c0 * Math.min(1, taken / A) : 0);
	return finish(kind, hip, seam, centre, taken - centre, side, rules);
}

/** Plans both panels from the measurements and house rules. */
export function planBlock(m: ResolvedMeasurements, rules: HouseRules, backOnFold = false): BlockPlan {
	const qH = m.hip / 4 + rules.ease.hip;
	const seamB = m.waist / 4 + rules.ease.waist.back;
	const seamF = m.waist / 4 + rules.ease.waist.front;
	let hb = qH - rules.balance;
	let hf = qH + rules.balance;
	// A panel whose hip would not clear its waist first borrows width across the side seam (the hip
	// line total stays hip + ease); only when the whole hip is short is the hip line widened.
	if (hb < seamB && hf > seamF) {
		const t = Math.min(seamB - hb, hf - seamF);
		hb += t;
		hf -= t;
	}
	if (hf < seamF && hb > seamB) {
		const t = Math.min(seamF - hf, hb - seamB);
		hf += t;
		hb -= t;
	}
	const widened = hb < seamB - 1e-12 || hf < seamF - 1e-12;
	hb = Math.max(hb, seamB);
	hf = Math.max(hf, seamF);
	const s = rules.suppression;
	const T = 2 * (hb + hf) - 2 * (seamB + seamF);
	let back: PanelPlan;
	let front: PanelPlan;
	if (s.method === 'shares' && T > 1e-9) {
		const k = T / 100;
		const cb = backOnFold ? 0 : s.centreBack;
		back = finish('back', hb, hb - k * (s.side + s.backDart + s.centreBack), k * cb, k * (s.backDart + s.centreBack - cb), k * s.side, rules);
		front = finish('front', hf, hf - k * (s.side + s.frontDart), 0, k * s.frontDart, k * s.side, rules);
	} else {
		back = byAllowance('back', hb, seamB, rules, backOnFold);
		front = byAllowance('front', hf, seamF, rules, false);
	}
	const deepDarts = [...back.darts, ...front.darts].some((d) => d > rules.darts.maxIntake + 1e-9);
	return { back, front, widened, deepDarts };
}
