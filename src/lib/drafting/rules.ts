// House rules: every default of the drafting method, each one the owner may change. The values are the
// atelier's practice (marked "common practice" in the tests) unless a comment names a published source.
import { DraftInputError, type FieldProblem } from './errors';

/** A pair of values for the front and the back panel. */
export interface FrontBack {
	front: number;
	back: number;
}

/** How the waist suppression (hip with ease minus waist with ease) is shared out on each quarter panel. */
export type SuppressionRule =
	| {
			/** Fixed dart allowances added at the waist mark (the house method); the side seam takes the rest. */
			method: 'allowance';
	  }
	| {
			/** Percentages of the whole-body suppression: each side-seam edge, each front dart, each back dart,
			 * each half of the centre back. 4·side + 2·frontDart + 2·backDart + 2·centreBack must make 100. */
			method: 'shares';
			side: number;
			frontDart: number;
			backDart: number;
			centreBack: number;
	  };

/** The drafting defaults of one atelier (all lengths in cm; "a quarter" is one panel of a half pattern). */
export interface HouseRules {
	/** Ease added on each quarter: waist (front and back may differ) and hip. */
	ease: { waist: FrontBack; hip: number };
	/** Hip width moved from the back to the front at the side seam (back = quarter − balance, front = + balance). */
	balance: number;
	/** How the suppression is shared between darts, centre back and side seam. */
	suppression: SuppressionRule;
	/** Added to the quarter waist at the waist mark for darts (house method): back 4 (1 of it the centre back take-in), front 3. */
	dartAllowance: FrontBack;
	/** Centre back taken in at the waist and ruled to the hip line, when the darts are at full size. */
	centreBackShaping: number;
	/** Centre front waist dropped below the waist line. */
	centreFrontDrop: number;
	/** Side-seam waist points raised above the waist line (full raise once the side takes `fullRaiseAt`). */
	sideRaise: number;
	darts: {
		/** Distance from the centre line to the dart's middle on a usual panel (scaled on small or large ones). */
		fromCentre: FrontBack;
		/** Dart length on a usual figure; never past `clearAboveHip` above the hip line. */
		length: FrontBack;
		/** The most one dart may take; beyond it a second dart shares the intake. */
		maxIntake: number;
		/** A dart smaller than this is left out and its share goes to the side seam. */
		minIntake: number;
		/** Seam left between two darts of a panel (measured with the darts closed). */
		spacing: number;
		/** Dart points stay at least this far above the hip line. */
		clearAboveHip: number;
		/** The widest a dart may open at its point, in degrees: past about 25° the cloth puckers at the point
		 * however well it is sewn (TRADE.md, common practice); a larger intake is split or lengthened. */
		maxAngle: number;
		/** The most darts one quarter panel carries; beyond them the side seam takes the rest. */
		maxCount: number;
		/** A dart grows `perCm` cm longer for each cm of intake over `from` (a larger intake, a longer dart). */
		lengthGrowth: { from: number; perCm: number };
		/** Share of the dart intake beyond the usual that goes to the back (the seat wants it, the front less). */
		backShare: number;
	};
	side: {
		/** The side seam keeps at least this share of a panel's suppression (small hip–waist differences). */
		minShare: number;
		/** The most the side seam takes on one panel; beyond it the darts take more. */
		maxShaping: number;
		/** Side shaping at which the side waist point gets the full raise (less shaping, less raise). */
		fullRaiseAt: number;
		/** Front and back side seams may differ by this much (eased in); beyond it the longer one is lowered. */
		easing: number;
	};
	/** Waist-to-hip depth used when the shopper does not know hers (shown as an assumption). */
	defaultWaistToHip: number;
	/** Waist-to-knee depth used when the shopper does not give hers (shown as an assumption). */
	kneeDepth: number;
	allowances: {
		seam: number;
		zipSeam: number;
		hem: number;
		/** Circle skirts get a narrow hem: a deep hem on a curved edge will not lie flat. */
		circleHem: number;
		/** Lower edge of a facing, neatened rather than turned. */
		facingEdge: number;
		liningHem: number;
	};
	waistband: { width: number; underlap: number };
	facingDepth: number;
	/** Default zip lengths by kind. */
	zip: { zip: number; 'invisible-zip': number };
	/** A vent is at least `length` long; past the knee it reaches `reachAboveKnee` above the knee. A pencil
	 * skirt whose hem is more than `pencilAboveKnee` above the knee needs none. */
	vent: { length: number; extension: number; reachAboveKnee: number; pencilAboveKnee: number };
	kickPleat: { length: number; extension: number };
	/** Style shaping below the hip line, in cm per cm of skirt below the hip line. */
	styles: {
		/** Pencil: hem taken in at each side seam. */
		pencilTaper: number;
		/** A-line: total flare of each panel at the hem (the closed dart opens part of it, the side seam adds the rest). */
		aLineFlare: number;
		/** Gored: flare added each side of every panel seam. */
		goreFlare: number;
	};
	/** The lining is `shorter` than the skirt; its centre back stays open `slitAbove` higher than a vent's top. */
	lining: { shorter: number; slitAbove: number };
	pocket: { fromWaist: number; opening: number; width: number };
	fabric: {
		/** Fabric is sold in steps of this length (cm) when sold by the metre. */
		saleStep: number;
		/** Added to a lay to square the cut ends of the fabric. */
		endAllowance: number;
		/** Sold by the metre (in `saleStep` steps) or by the yard (in ⅛ yard steps, 11.43 cm). */
		sellBy: 'metre' | 'yard';
		/** Least room between pieces on a lay, for the shears (cm). */
		gap: number;
		/** A waistband longer than every other piece may be cut in two and joined at a side seam. */
		bandJoin: 'none' | 'side-seam';
	};
}

/** A partial set of rules, merged over the defaults (each field optional, nested too). */
export type HouseRulesInput = { [K in keyof HouseRules]?: HouseRules[K] extends object ? Partial<HouseRules[K]> | HouseRules[K] : HouseRules[K] };

/** The atelier's drafting defaults, in centimetres. */
export const DEFAULT_RULES: HouseRules = {
	ease: { waist: { front: 0.5, back: 0.5 }, hip: 1 },
	balance: 1,
	suppression: { method: 'allowance' },
	dartAllowance: { front: 3, back: 4 },
	centreBackShaping: 1,
	centreFrontDrop: 1,
	sideRaise: 1,
	darts: {
		fromCentre: { front: 12, back: 12 },
		length: { front: 11, back: 14 },
		maxIntake: 3.5,
		minIntake: 1,
		spacing: 3.5,
		clearAboveHip: 2.5,
		maxAngle: 25,
		maxCount: 3,
		lengthGrowth: { from: 3, perCm: 1.5 },
		backShare: 0.6
	},
	side: { minShare: 0.25, maxShaping: 6, fullRaiseAt: 2, easing: 0.5 },
	defaultWaistToHip: 22,
	// Handbook size 12 waist-to-knee 58.5 cm (TRADE.md, from memory).
	kneeDepth: 58.5,
	allowances: { seam: 1.5, zipSeam: 2, hem: 4, circleHem: 1.5, facingEdge: 1, liningHem: 3 },
	waistband: { width: 3.5, underlap: 3.5 },
	facingDepth: 6,
	zip: { zip: 20, 'invisible-zip': 22 },
	vent: { length: 20, extension: 4, reachAboveKnee: 2, pencilAboveKnee: 10 },
	kickPleat: { length: 20, extension: 6 },
	styles: { pencilTaper: 0.065, aLineFlare: 0.15, goreFlare: 0.1 },
	lining: { shorter: 2.5, slitAbove: 2 },
	pocket: { fromWaist: 5, opening: 15, width: 16 },
	fabric: { saleStep: 10, endAllowance: 5, sellBy: 'metre', gap: 0.5, bandJoin: 'side-seam' }
};

const INCH = 2.54;
/** Rules that are not lengths (shares, rates, angles, counts): kept as they are in inches. */
const NOT_LENGTHS = ['styles', 'side.minShare', 'darts.maxAngle', 'darts.maxCount', 'darts.backShare', 'darts.lengthGrowth.perCm', 'suppression'];
/** A length in whole inch steps as a tape reads them: ½″ from 10 cm, ¼″ from 2 cm, ⅛″ below. */
const inchStep = (cm: number) => {
	const step = cm >= 10 ? 0.5 : cm >= 2 ? 0.25 : 0.125;
	return Math.max(0.125, Math.round(cm / INCH / step) * step) * INCH;
};
function inInches(v: unknown, path: string): unknown {
	if (NOT_LENGTHS.some((p) => path === p || path.startsWith(`${p}.`))) return v;
	if (typeof v === 'number') return v === 0 ? 0 : inchStep(v);
	if (typeof v === 'object' && v !== null) return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, inInches(x, path ? `${path}.${k}` : k)]));
	return v;
}
/** The same defaults for a shop working in inches: every length a whole number of eighths (so the figures
 * a cutter reads to ⅛″ are the lengths drafted), allowances ⅝″ (¾″ at a zip), hem 1½″, narrow hem ½″. */
export const DEFAULT_RULES_INCH: HouseRules = {
	...(inInches(DEFAULT_RULES, '') as HouseRules),
	allowances: { seam: 0.625 * INCH, zipSeam: 0.75 * INCH, hem: 1.5 * INCH, circleHem: 0.5 * INCH, facingEdge: 0.375 * INCH, liningHem: 1.25 * INCH },
	// Cloth sold by the yard goes in ⅛ yard steps, 4.5″ (TRADE.md, from memory for the steps).
	fabric: { ...(inInches(DEFAULT_RULES.fabric, 'fabric') as HouseRules['fabric']), saleStep: 4.5 * INCH, endAllowance: 2 * INCH, sellBy: 'yard' }
};

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function merge<T>(base: T, over: unknown): T {
	if (!isObject(over) || !isObject(base)) return (over === undefined ? base : over) as T;
	const out: Record<string, unknown> = { ...base };
	for (const [k, v] of Object.entries(over)) {
		if (v === undefined) continue;
		// A suppression rule is replaced whole: its fields depend on its method.
		out[k] = k === 'suppression' ? v : merge((base as Record<string, unknown>)[k], v);
	}
	return out as T;
}

/** The range the engine accepts for each numeric rule, by the first part of its name that is listed. */
const RULE_RANGES: [string, number, number][] = [
	['ease.waist', 0, 5],
	['ease.hip', 0, 10],
	['balance', -5, 5],
	['dartAllowance', 0, 15],
	['centreBackShaping', 0, 5],
	['centreFrontDrop', 0, 5],
	['sideRaise', 0, 5],
	['darts.fromCentre', 2, 40],
	['darts.length', 3, 30],
	['darts.maxIntake', 0.5, 10],
	['darts.minIntake', 0, 5],
	['darts.spacing', 1, 15],
	['darts.clearAboveHip', 0, 10],
	['darts.maxAngle', 8, 40],
	['darts.maxCount', 1, 4],
	['darts.lengthGrowth.from', 0, 10],
	['darts.lengthGrowth.perCm', 0, 5],
	['darts.backShare', 0, 1],
	['side.minShare', 0, 0.6],
	['side.maxShaping', 0.5, 20],
	['side.fullRaiseAt', 0, 10],
	['side.easing', 0, 2],
	['defaultWaistToHip', 10, 35],
	['kneeDepth', 30, 90],
	['allowances', 0.3, 10],
	['waistband.width', 1, 10],
	['waistband.underlap', 0, 10],
	['facingDepth', 2, 15],
	['zip', 10, 80],
	['vent.length', 5, 60],
	['vent.extension', 1, 10],
	['vent.reachAboveKnee', -5, 15],
	['vent.pencilAboveKnee', 0, 40],
	['kickPleat.length', 5, 60],
	['kickPleat.extension', 1, 12],
	['styles.pencilTaper', 0, 0.2],
	['styles', 0, 0.6],
	['lining.shorter', 0, 10],
	['lining.slitAbove', 0, 10],
	['pocket.fromWaist', 0, 20],
	['pocket.opening', 8, 25],
	['pocket.width', 8, 30],
	['fabric.saleStep', 1, 100],
	['fabric.endAllowance', 0, 30],
	['fabric.gap', 0, 3]
];

/** Every numeric rule's path with its range, listed once from the defaults. */
const NUMERIC_RULES: { path: string; keys: string[]; min: number; max: number }[] = [];
(function list(v: unknown, keys: string[]) {
	if (isObject(v)) for (const k of Object.keys(v)) list(v[k], [...keys, k]);
	else if (typeof v === 'number') {
		const path = keys.join('.');
		const [, min, max] = RULE_RANGES.find(([p]) => path === p || path.startsWith(`${p}.`)) ?? ['', 0, 200];
		NUMERIC_RULES.push({ path, keys, min, max });
	}
})(DEFAULT_RULES, []);

/** Every numeric rule outside the range the engine accepts for it. */
function numericProblems(rules: HouseRules): FieldProblem[] {
	const problems: FieldProblem[] = [];
	const groups = new Set<string>();
	for (const { path, keys, min, max } of NUMERIC_RULES) {
		let v: unknown = rules;
		let broken = false;
		for (let i = 0; i < keys.length && !broken; i++) {
			if (isObject(v)) v = v[keys[i]];
			else {
				broken = true;
				const group = keys.slice(0, i).join('.');
				if (!groups.has(group)) problems.push({ field: `rules.${group}`, message: `The house rule ${group} must be a group of values.` });
				groups.add(group);
			}
		}
		if (broken) continue;
		if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max)
			problems.push({ field: `rules.${path}`, message: `The house rule ${path} must be a number from ${min} to ${max}.`, min, max });
	}
	return problems;
}

/** Merges house rules over the defaults and checks them; throws DraftInputError naming each bad rule. */
export function resolveRules(input?: HouseRulesInput | HouseRules): HouseRules {
	const rules = merge(DEFAULT_RULES, input);
	const problems = numericProblems(rules);
	const s = rules.suppression as SuppressionRule | undefined;
	if (!s || (s.method !== 'allowance' && s.method !== 'shares')) {
		problems.push({ field: 'rules.suppression', message: 'The suppression rule must be "allowance" or "shares".' });
	} else if (s.method === 'shares') {
		const parts = [s.side, s.frontDart, s.backDart, s.centreBack];
		if (parts.some((p) => typeof p !== 'number' || !Number.isFinite(p) || p < 0)) {
			problems.push({ field: 'rules.suppression', message: 'Each suppression share must be a percentage of 0 or more.' });
		} else if (Math.abs(4 * s.side + 2 * s.frontDart + 2 * s.backDart + 2 * s.centreBack - 100) > 0.01) {
			problems.push({ field: 'rules.suppression', message: 'The suppression shares must add up to 100 % over the whole body.' });
		}
	}
	if (!isObject(rules.fabric) || (rules.fabric.sellBy !== 'metre' && rules.fabric.sellBy !== 'yard'))
		problems.push({ field: 'rules.fabric.sellBy', message: 'Fabric is sold by the "metre" or by the "yard".' });
	if (!isObject(rules.fabric) || (rules.fabric.bandJoin !== 'none' && rules.fabric.bandJoin !== 'side-seam'))
		problems.push({ field: 'rules.fabric.bandJoin', message: 'The waistband join must be "none" or "side-seam".' });
	if (rules.darts.minIntake > rules.darts.maxIntake) {
		problems.push({ field: 'rules.darts.minIntake', message: 'The smallest dart must not be larger than the largest.', max: rules.darts.maxIntake });
	}
	if (problems.length) throw new DraftInputError(problems);
	return rules;
}
