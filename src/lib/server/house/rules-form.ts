import { DEFAULT_RULES, type HouseRules } from '$lib/drafting/rules';

/** The house rules the owner edits, by dotted path, with a label and a word of explanation each. */
export const RULE_FIELDS = [
	{ path: 'ease.waist.front', label: 'Waist ease, front quarter', help: 'Added to a quarter of the waist so the waistband does not pinch.' },
	{ path: 'ease.waist.back', label: 'Waist ease, back quarter', help: '' },
	{ path: 'ease.hip', label: 'Hip ease, each quarter', help: 'Room to sit and walk: 1 cm a quarter is 4 cm round the body.' },
	{ path: 'balance', label: 'Front–back balance', help: 'Hip width moved from the back to the front, so the side seam hangs straight.' },
	{ path: 'dartAllowance.back', label: 'Dart allowance at the back waist', help: 'Added to the back waist mark; the centre-back take-in comes out of it.' },
	{ path: 'dartAllowance.front', label: 'Dart allowance at the front waist', help: '' },
	{ path: 'centreBackShaping', label: 'Centre back taken in at the waist', help: 'Ruled to nothing at the hip line.' },
	{ path: 'centreFrontDrop', label: 'Centre front dropped', help: '' },
	{ path: 'sideRaise', label: 'Side waist raised', help: 'Both side-seam waist points, so the waist curves over the hip.' },
	{ path: 'darts.fromCentre.back', label: 'Back dart from centre back', help: 'Scaled on very small or large panels.' },
	{ path: 'darts.fromCentre.front', label: 'Front dart from centre front', help: '' },
	{ path: 'darts.length.back', label: 'Back dart length', help: 'Never past the hip line.' },
	{ path: 'darts.length.front', label: 'Front dart length', help: '' },
	{ path: 'darts.maxIntake', label: 'Largest dart', help: 'Beyond this a second dart shares the intake.' },
	{ path: 'darts.minIntake', label: 'Smallest dart', help: 'A smaller dart is left out and the side seam takes it.' },
	{ path: 'darts.maxAngle', label: 'Widest dart angle', help: 'Degrees at the dart point. Past about 25° the cloth puckers at the point; a larger intake is split or lengthened.', unit: '°', step: 1 },
	{ path: 'darts.maxCount', label: 'Most darts on a quarter panel', help: 'A whole number, 1 to 4. Beyond them the side seam takes the rest.', unit: 'darts', step: 1 },
	{ path: 'darts.lengthGrowth.from', label: 'Darts grow longer from an intake of', help: 'A dart taking more than this grows longer with its intake.' },
	{ path: 'darts.lengthGrowth.perCm', label: 'Dart length added per cm of intake', help: 'cm of length for each cm of intake past the figure above (1.5 is 15 mm per cm).', unit: 'cm/cm', step: 0.05 },
	{ path: 'darts.backShare', label: 'Share of extra intake at the back', help: 'Of the dart intake beyond the usual, the part the back darts take: 0.6 is 60 %. The seat wants it more than the front.', unit: 'share', step: 0.05 },
	{ path: 'defaultWaistToHip', label: 'Waist to hip when unknown', help: 'Used, and said so, when a shopper does not know hers.' },
	{ path: 'kneeDepth', label: 'Waist to knee when unknown', help: 'Used, and said so, when a shopper skips it: decides the vent, where a pencil skirt stops tapering and "past the knee". Handbook size 12: 58.5.' },
	{ path: 'vent.reachAboveKnee', label: 'Vent top above the knee', help: 'On a fitted skirt past the knee the vent opens to this far above the knee, so she can stride.' },
	{ path: 'vent.pencilAboveKnee', label: 'Pencil skirt needs no vent above', help: 'A pencil hem more than this above the knee is short enough to walk in without one.' },
	{ path: 'lining.slitAbove', label: 'Lining slit above the vent top', help: 'The lining stays open this much higher than the vent, so it never holds the vent shut.' },
	{ path: 'allowances.seam', label: 'Seam allowance', help: 'European patterns 1.5 cm; US ⅝ in.' },
	{ path: 'allowances.zipSeam', label: 'Zip seam allowance', help: '' },
	{ path: 'allowances.hem', label: 'Hem allowance', help: 'Circle skirts use their own narrow hem.' },
	{ path: 'waistband.width', label: 'Waistband width (finished)', help: '' },
	{ path: 'waistband.underlap', label: 'Waistband underlap', help: '' },
	{ path: 'fabric.saleStep', label: 'Fabric sold in steps of', help: 'The fabric estimate rounds up to this.' },
	// Lays (nesting): the room left between pieces.
	{ path: 'fabric.gap', label: 'Gap between pieces on a lay', help: 'Room for the shears between neighbouring pieces (0 to 3 cm).' }
] as const satisfies readonly { path: string; label: string; help: string; unit?: string; step?: number }[];

/** What the form checks beyond the engine's ranges: a count of darts is a whole number. */
export function ruleFormProblems(rules: HouseRules): Record<string, string> {
	const out: Record<string, string> = {};
	if (!Number.isInteger(rules.darts?.maxCount)) out['darts.maxCount'] = 'The most darts on a quarter panel is a whole number, from 1 to 4.';
	return out;
}

/** House rules chosen from a short list (a select on the form), by dotted path. */
export const CHOICE_FIELDS = [
	{
		path: 'fabric.bandJoin',
		label: 'A waistband longer than the lay',
		help: 'May be cut in two and joined, when that makes the lay shorter; a seam allowance is added each side of the join.',
		options: [
			{ value: 'side-seam', label: 'Joined at a side seam' },
			{ value: 'none', label: 'Always cut in one piece' }
		]
	}
] as const;

export function getPath(obj: unknown, path: string): unknown {
	return path.split('.').reduce<unknown>((o, k) => (o && typeof o === 'object' ? (o as Record<string, unknown>)[k] : undefined), obj);
}

/** Rules from a posted form: every listed field as a number, over the given base (unlisted rules kept). */
export function rulesFromForm(form: Record<string, unknown>, base: HouseRules = DEFAULT_RULES): HouseRules {
	const out = structuredClone(base) as unknown as Record<string, unknown>;
	for (const { path } of RULE_FIELDS) {
		const raw = form[path];
		// A rule left out keeps its current value; one sent empty or as words is refused.
		if (raw === undefined) continue;
		const value = typeof raw === 'number' ? raw : typeof raw === 'string' && raw.trim() !== '' ? Number(raw) : NaN;
		const keys = path.split('.');
		let o = out;
		for (const k of keys.slice(0, -1)) o = o[k] as Record<string, unknown>;
		o[keys.at(-1)!] = value;
	}
	for (const { path } of CHOICE_FIELDS) {
		const raw = form[path];
		if (raw === undefined) continue;
		const keys = path.split('.');
		let o = out;
		for (const k of keys.slice(0, -1)) o = o[k] as Record<string, unknown>;
		// Any other word is refused by resolveRules with the allowed ones named.
		o[keys.at(-1)!] = String(raw);
	}
	// Checked by resolveRules before any use: a value out of range is refused there, field by field.
	return out as unknown as HouseRules;
}
