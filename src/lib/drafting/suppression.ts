// How much each quarter panel is taken in between hip and waist, and where: centre back, darts, side seam.
// The house method adds fixed dart allowances at the waist mark and lets the side take the rest; this
// module keeps that exact on a usual figure and bends it as a cutter would at the edges of the range:
// darts split (up to the house's count) and lengthen as they grow, never open wider than the house's
// largest angle nor reach past the hip line less its margin; the intake beyond the usual goes mostly to
// the back; what no block can take is refused until the shopper confirms the figure.
import type { BodySide } from './fit';
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
	/** Length of each dart (they are alike on a panel). */
	dartLength: number;
	side: number;
	raise: number;
	/** Centre waist below the waist line (negative: raised above it). */
	drop: number;
	/** The side waist point is never lowered below this in truing (a higher hip's own raise). */
	raiseFloor: number;
	/** A dart was wanted but left out because it came out smaller than the smallest worth sewing. */
	dartsLeftOut: boolean;
	/** Intake no dart could take within the house's count and angle, given to the side seam instead. */
	overflow: number;
}

/** The plan of both panels and what had to give. */
export interface BlockPlan {
	back: PanelPlan;
	front: PanelPlan;
	/** The hip line was widened past hip + ease to clear a waist larger than the hip. */
	widened: boolean;
	/** Some intake was more than the darts could take: the side seams took it (the figure was confirmed). */
	deepDarts: boolean;
	/** Hip width moved from the front to the back so the back darts take their share of a large intake. */
	seatShift: number;
}

const rad = (deg: number) => (deg * Math.PI) / 180;
/** The front drop is full once the hip exceeds the waist by this much, none when the waist is the hip or
 * more (a full front needs no drop, rather a raise: TRADE.md, common practice). */
const FULL_DROP_AT = 12;

/** The longest a dart may be on this panel: its point clear of the hip line by the house margin. */
export function longestDart(hipDepth: number, drop: number, rules: HouseRules): number {
	// 3 mm kept for the waist curving a little below the waist line where a dart meets it.
	return Math.max(3, hipDepth - rules.darts.clearAboveHip - Math.max(0, drop) - 0.3);
}

/** The widest one dart may be on a panel whose darts may be `longest` long: within the house's largest
 * intake and its largest angle at the point. */
export function widestDart(longest: number, rules: HouseRules): number {
	return Math.min(rules.darts.maxIntake, 2 * longest * Math.tan(rad(rules.darts.maxAngle) / 2));
}

/** A dart's length for its intake: the house length, growing with the intake, long enough to keep the
 * angle within the house's largest, never longer than `longest`. */
export function dartLengthFor(intake: number, base: number, longest: number, rules: HouseRules): number {
	const g = rules.darts.lengthGrowth;
	const grown = base + g.perCm * Math.max(0, intake - g.from);
	const byAngle = intake / (2 * Math.tan(rad(rules.darts.maxAngle) / 2));
	return Math.min(longest, Math.max(grown, byAngle));
}

interface PanelInput {
	kind: 'front' | 'back';
	hip: number;
	seam: number;
	centre: number;
	dartTotal: number;
	side: number;
	drop: number;
	/** Added to the house dart length on this panel (prominent seat +, rounded abdomen −). */
	lengthChange: number;
	extraRaise: number;
}

function finish(p: PanelInput, m: ResolvedMeasurements, rules: HouseRules): PanelPlan {
	let { dartTotal, side } = p;
	let dartsLeftOut = false;
	if (dartTotal > 0 && dartTotal < rules.darts.minIntake) {
		side += dartTotal;
		dartTotal = 0;
		dartsLeftOut = true;
	}
	const longest = longestDart(m.hipDepth, p.drop, rules);
	const widest = widestDart(longest, rules);
	const maxCount = Math.max(1, Math.floor(rules.darts.maxCount));
	let n = dartTotal <= 1e-9 ? 0 : Math.ceil(dartTotal / widest - 1e-9);
	let overflow = 0;
	if (n > maxCount) {
		overflow = dartTotal - maxCount * widest;
		dartTotal = maxCount * widest;
		side += overflow;
		n = maxCount;
	}
	const intake = n ? dartTotal / n : 0;
	const base = Math.max(4, rules.darts.length[p.kind] + p.lengthChange);
	const full = rules.side.fullRaiseAt;
	const raise = rules.sideRaise * (full > 0 ? Math.min(1, Math.max(0, side) / full) : 1) + p.extraRaise;
	return {
		kind: p.kind,
		hip: p.hip,
		seam: p.seam,
		centre: p.centre,
		darts: Array.from({ length: n }, () => intake),
		dartLength: n ? dartLengthFor(intake, base, longest, rules) : 0,
		side,
		raise,
		drop: p.drop,
		raiseFloor: p.extraRaise,
		dartsLeftOut,
		overflow
	};
}

/** The house method on one panel, before the back takes its share: suppression S, dart allowance A
 * (centre take-in included for the back). Returns centre, dart total, side, and the intake beyond the
 * side seam's limit (already in the dart total). */
function byAllowance(kind: 'front' | 'back', S: number, A: number, rules: HouseRules, backOnFold: boolean) {
	if (S <= 1e-9) return { centre: 0, darts: 0, side: 0, excess: 0 };
	// A back cut on the fold has no centre seam to shape: its darts take the whole allowance.
	const c0 = kind === 'back' && !backOnFold ? rules.centreBackShaping : 0;
	let taken = A;
	let side = S - A;
	// Small differences: the side keeps its share, darts and centre shrink together (never a flare).
	if (side < rules.side.minShare * S) {
		side = rules.side.minShare * S;
		taken = S - side;
	}
	// Large differences: the side stops at its limit, the darts take the excess.
	let excess = 0;
	if (side > rules.side.maxShaping) {
		excess = side - rules.side.maxShaping;
		taken += excess;
		side = rules.side.maxShaping;
	}
	const centre = Math.min(taken, A > 0 ? c0 * Math.min(1, taken / A) : 0);
	return { centre, darts: taken - centre, side, excess };
}

/** Plans both panels (of one side of the body, for a figure drafted left and right apart). */
export function planBlock(m: ResolvedMeasurements, rules: HouseRules, backOnFold = false, bodySide?: BodySide): BlockPlan {
	const fit = m.fit;
	const one = bodySide && fit.oneHip ? fit.oneHip : null;
	// One hip fuller: each side drafted from its own figure, the hip shared out so the two halves make the hip.
	const hip = m.hip + (one ? (one.side === bodySide ? one.fuller : -one.fuller) : 0);
	const extraRaise = one && one.side === bodySide ? one.higher : 0;
	const qH = hip / 4 + rules.ease.hip + fit.ease.hip / 4;
	const seamB = m.waist / 4 + rules.ease.waist.back + fit.ease.waist / 4;
	const seamF = m.waist / 4 + rules.ease.waist.front + fit.ease.waist / 4;
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
	// Prominent seat: the back hip line is longer and its darts take all of it.
	const seat = fit.prominentSeat / 2;
	hb += seat;
	const over = Math.max(0, Math.min(1, (m.hip - m.waist) / FULL_DROP_AT));
	const frontDrop = rules.centreFrontDrop * over - fit.roundedAbdomen;
	const backDrop = fit.hollowBack - fit.prominentSeat / 2;
	const s = rules.suppression;
	let back: PanelInput;
	let front: PanelInput;
	let seatShift = 0;
	const common = { extraRaise };
	const backLength = fit.prominentSeat;
	const frontLength = -fit.roundedAbdomen;
	if (s.method === 'shares' && hb - seat + hf - seamB - seamF > 1e-9) {
		// Shares of the whole-body suppression T for each side seam, dart and centre back; the side seam is
		// placed on the hip line where those shares leave each waist seam its quarter waist with ease (the
		// house balance does not apply: the shares decide the back and front hip widths).
		const T = 2 * (hb - seat + hf) - 2 * (seamB + seamF);
		const k = T / 100;
		const cb = backOnFold ? 0 : s.centreBack;
		const bd = k * (s.backDart + s.centreBack - cb) + seat;
		const fd = k * s.frontDart;
		hb = seamB + k * (s.side + cb) + bd;
		hf = seamF + k * s.side + fd;
		back = { kind: 'back', hip: hb, seam: seamB, centre: k * cb, dartTotal: bd, side: k * s.side, drop: backDrop, lengthChange: backLength, ...common };
		front = { kind: 'front', hip: hf, seam: seamF, centre: 0, dartTotal: fd, side: k * s.side, drop: frontDrop, lengthChange: frontLength, ...common };
	} else {
		const b = byAllowance('back', hb - seamB, rules.dartAllowance.back + seat, rules, backOnFold);
		const f = byAllowance('front', hf - seamF, rules.dartAllowance.front, rules, false);
		// Intake beyond what the side seams take goes mostly to the back (the seat wants it, the front less:
		// TRADE.md "Darts"); the back's hip line grows by what it takes over its own excess, the front's
		// shrinks by as much, so the hip line as a whole is unchanged and each side seam keeps its shaping.
		const X = b.excess + f.excess;
		if (X > 1e-9) {
			const toBack = rules.darts.backShare * X;
			// Neither panel's darts can give more than they have, and the back takes no more than its darts can.
			const backRoom = Math.max(0, Math.floor(rules.darts.maxCount) * widestDart(longestDart(m.hipDepth, backDrop, rules), rules) - b.darts);
			seatShift = Math.max(-b.darts, Math.min(f.darts, backRoom, toBack - b.excess));
		}
		hb += seatShift;
		hf -= seatShift;
		back = { kind: 'back', hip: hb, seam: seamB, centre: b.centre, dartTotal: b.darts + seatShift, side: b.side, drop: backDrop, lengthChange: backLength, ...common };
		front = { kind: 'front', hip: hf, seam: seamF, centre: f.centre, dartTotal: f.darts - seatShift, side: f.side, drop: frontDrop, lengthChange: frontLength, ...common };
	}
	// Rounded abdomen: the front darts take half of it less; the side seam takes it.
	const less = Math.min(front.dartTotal, fit.roundedAbdomen / 2);
	front.dartTotal -= less;
	front.side += less;
	const bp = finish(back, m, rules);
	const fp = finish(front, m, rules);
	return { back: bp, front: fp, widened, deepDarts: bp.overflow + fp.overflow > 1e-9, seatShift };
}

/** What the block can take at most: for this figure's waist, depth and the house rules, the largest hip
 * whose darts fit within the house's count and angle (bisection on the hip; a plan is cheap). */
export function largestHip(m: ResolvedMeasurements, rules: HouseRules, backOnFold: boolean): number {
	let lo = m.waist;
	let hi = m.hip;
	const fits = (hip: number) => !planBlock({ ...m, hip }, rules, backOnFold).deepDarts;
	if (!fits(lo)) return lo;
	for (let i = 0; i < 30; i++) {
		const mid = (lo + hi) / 2;
		if (fits(mid)) lo = mid;
		else hi = mid;
	}
	return Math.floor(lo * 10) / 10;
}
