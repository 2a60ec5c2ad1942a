// Styles and options the shopper chooses, their labels for the shop, and how a choice is completed.
import { lengthProblem, type FieldProblem } from './errors';
import type { ResolvedMeasurements } from './measurements';
import type { HouseRules } from './rules';
import { formatCm } from './units';

/** The styles the engine drafts. */
export type StyleId = 'straight' | 'pencil' | 'a-line' | 'half-circle' | 'full-circle' | 'gored';

/** A style as the shop lists it. */
export interface StyleInfo {
	id: StyleId;
	name: string;
	description: string;
}

/** Every style, in the order the shop shows them. */
export const STYLES: readonly StyleInfo[] = [
	{ id: 'straight', name: 'Straight skirt', description: 'The block itself: darts front and back, straight from the hip to the hem. Below the knee it gets a back vent so you can walk.' },
	{ id: 'pencil', name: 'Pencil skirt', description: 'Taken in at the side seams from the hip to the hem for a close line, with a back vent to walk in.' },
	{ id: 'a-line', name: 'A-line skirt', description: 'The dart nearest each side seam is closed, fully or in part, and opened into flare at the hem; the side seams add whatever flare is still wanted.' },
	{ id: 'half-circle', name: 'Half-circle skirt', description: 'A half circle of cloth from the waist: no darts, soft folds.' },
	{ id: 'full-circle', name: 'Full-circle skirt', description: 'A full circle of cloth from the waist that swings out as you turn. It takes the most fabric.' },
	{ id: 'gored', name: 'Six-gore skirt', description: 'Six panels fitted through the hip, the dart shaping taken into the panel seams, flaring below the hip.' }
];

/** Waist finish: a straight waistband with an underlap, or a facing inside the waist. */
export type WaistFinish = 'band' | 'facing';
/** Back vent choice: decided by the style and length, or set. */
export type VentChoice = 'auto' | 'vent' | 'kick-pleat' | 'none';

/** The zip: kind, where it goes, its length (default from the house rules and the hip depth). */
export interface Closure {
	kind: 'zip' | 'invisible-zip';
	position: 'centre-back' | 'side';
	length?: number;
}

/** Options of a skirt (the same for every style; a style ignores what does not apply to it). */
export interface SkirtOptions {
	waistband: WaistFinish;
	closure: Closure;
	lining: boolean;
	pockets: boolean;
	/** Hem allowance, cm; default from the house rules (a narrow hem for circle styles). */
	hemDepth?: number;
	vent: VentChoice;
	/** The fabric stretches: a straight or pencil skirt then needs no vent. */
	stretch: boolean;
}

/** A style and its options. */
export type SkirtChoice = { style: StyleId } & SkirtOptions;

/** What callers pass: any option may be left out (then the default is used). */
export type SkirtChoiceInput = { style?: StyleId } & Partial<Omit<SkirtOptions, 'closure'>> & { closure?: Partial<Closure> };

/** Defaults for every option. */
export const DEFAULT_OPTIONS: SkirtOptions = {
	waistband: 'band',
	closure: { kind: 'zip', position: 'centre-back' },
	lining: false,
	pockets: false,
	vent: 'auto',
	stretch: false
};

/** One option as the shop renders it. */
export interface OptionField {
	id: 'waistband' | 'closure.kind' | 'closure.position' | 'closure.length' | 'lining' | 'pockets' | 'hemDepth' | 'vent' | 'stretch';
	label: string;
	kind: 'choice' | 'boolean' | 'length';
	values?: { id: string; label: string }[];
	min?: number;
	max?: number;
	help: string;
}

/** The options with their labels and allowed values, for the shop's forms. */
export const OPTION_FIELDS: readonly OptionField[] = [
	{ id: 'waistband', label: 'Waist finish', kind: 'choice', values: [{ id: 'band', label: 'Waistband' }, { id: 'facing', label: 'Facing' }], help: 'A straight waistband with an underlap, or a facing turned inside so the skirt sits without a band.' },
	{ id: 'closure.kind', label: 'Zip', kind: 'choice', values: [{ id: 'zip', label: 'Zip' }, { id: 'invisible-zip', label: 'Invisible zip' }], help: 'An invisible zip shows only as a seam.' },
	{ id: 'closure.position', label: 'Zip position', kind: 'choice', values: [{ id: 'centre-back', label: 'Centre back' }, { id: 'side', label: 'Left side seam' }], help: 'With the zip in the side seam the back can be cut in one piece.' },
	{ id: 'closure.length', label: 'Zip length', kind: 'length', min: 10, max: 60, help: 'Long enough to open past your hip; we choose it for you unless you set it.' },
	{ id: 'lining', label: 'Lining', kind: 'boolean', help: 'A lining cut from the same pattern, a little shorter than the skirt.' },
	{ id: 'pockets', label: 'In-seam pockets', kind: 'boolean', help: 'A pocket hidden in each side seam.' },
	{ id: 'hemDepth', label: 'Hem depth', kind: 'length', min: 1, max: 10, help: 'How much is turned up at the hem.' },
	{ id: 'vent', label: 'Back vent', kind: 'choice', values: [{ id: 'auto', label: 'As the style needs' }, { id: 'vent', label: 'Vent' }, { id: 'kick-pleat', label: 'Kick pleat' }, { id: 'none', label: 'None' }], help: 'A straight skirt below the knee, or any pencil skirt, needs one to walk in unless the fabric stretches.' },
	{ id: 'stretch', label: 'Stretch fabric', kind: 'boolean', help: 'Set by the fabric you choose.' }
];

/** A choice with every default filled in and every length decided. */
export interface ResolvedChoice extends SkirtChoice {
	closure: Required<Closure>;
	hemDepth: number;
	vent: 'vent' | 'kick-pleat' | 'none';
	ventLength: number;
}

/** Circle styles draft from the waist radius, not the block. */
export const isCircle = (s: StyleId) => s === 'half-circle' || s === 'full-circle';

const oneOf = <T extends string>(v: unknown, allowed: readonly T[]): v is T => typeof v === 'string' && (allowed as readonly string[]).includes(v);

/** Completes a choice; lists problems with what was given and sentences about what the engine decided. */
export function resolveChoice(input: SkirtChoiceInput | undefined, m: ResolvedMeasurements, rules: HouseRules): { choice: ResolvedChoice; problems: FieldProblem[]; warnings: string[] } {
	const c = (input ?? {}) as Record<string, unknown>;
	const problems: FieldProblem[] = [];
	const warnings: string[] = [];
	const pick = <T extends string>(field: string, v: unknown, allowed: readonly T[], fallback: T): T => {
		if (v === undefined) return fallback;
		if (oneOf(v, allowed)) return v;
		problems.push({ field: `choice.${field}`, message: `Choose one of: ${allowed.join(', ')}.` });
		return fallback;
	};
	const bool = (field: string, v: unknown, fallback: boolean) => {
		if (v === undefined) return fallback;
		if (typeof v === 'boolean') return v;
		problems.push({ field: `choice.${field}`, message: `The option ${field} must be yes or no.` });
		return fallback;
	};
	const style = pick('style', c.style, STYLES.map((s) => s.id), 'straight');
	const closureIn = (typeof c.closure === 'object' && c.closure !== null ? c.closure : {}) as Record<string, unknown>;
	const kind = pick('closure.kind', closureIn.kind, ['zip', 'invisible-zip'] as const, DEFAULT_OPTIONS.closure.kind);
	const position = pick('closure.position', closureIn.position, ['centre-back', 'side'] as const, DEFAULT_OPTIONS.closure.position);
	const stretch = bool('stretch', c.stretch, DEFAULT_OPTIONS.stretch);
	const circle = isCircle(style);

	let hemDepth = circle ? rules.allowances.circleHem : rules.allowances.hem;
	if (c.hemDepth !== undefined) {
		if (typeof c.hemDepth !== 'number' || !Number.isFinite(c.hemDepth) || c.hemDepth < 1 || c.hemDepth > 10) {
			problems.push(lengthProblem({ field: 'choice.hemDepth', min: 1, max: 10 }, (w) => `The hem depth must be ${w.range(1, 10)}.`));
		} else hemDepth = c.hemDepth;
	}
	if (circle && hemDepth > 2.5) warnings.push('A deep hem will not lie flat on the curved hem of a circle skirt: 1.5 cm or less is usual.');

	// The zip must open far enough to pass the hip: at least to 2 cm above the hip line.
	const maxZip = Math.max(10, Math.min(60, m.length - hemDepth - 5));
	let zipLength = Math.min(maxZip, Math.max(rules.zip[kind], Math.ceil(m.hipDepth - 2)));
	if (closureIn.length !== undefined) {
		const v = closureIn.length;
		if (typeof v !== 'number' || !Number.isFinite(v) || v < 10 || v > maxZip) {
			problems.push(lengthProblem({ field: 'choice.closure.length', min: 10, max: Math.floor(maxZip) }, (w) => `The zip length must be ${w.range(10, Math.floor(maxZip))} for this skirt.`));
		} else {
			zipLength = v;
			if (v < m.hipDepth - 4 && m.waist < m.hip) warnings.push(`A ${formatCm(v)} zip stops well above your hip line: the skirt may be hard to put on.`);
		}
	}

	const wanted = pick('vent', c.vent, ['auto', 'vent', 'kick-pleat', 'none'] as const, 'auto');
	let vent: ResolvedChoice['vent'] = 'none';
	const fitted = style === 'straight' || style === 'pencil';
	const knee = m.kneeDepth;
	const pastKnee = m.length > knee;
	// A pencil skirt's hem grips the legs near the knee; well above it the stride is free (common practice).
	const pencilNeeds = style === 'pencil' && m.length > knee - rules.vent.pencilAboveKnee;
	if (!fitted) {
		if (wanted === 'vent' || wanted === 'kick-pleat') warnings.push('A flared skirt has room to walk in, so it has no vent.');
	} else if (wanted === 'auto') {
		if (!stretch && (pencilNeeds || pastKnee)) vent = 'vent';
	} else if (wanted === 'none' && (pencilNeeds || pastKnee) && !stretch) {
		vent = 'vent';
		warnings.push(style === 'pencil' ? 'A pencil skirt needs a vent to walk in, so we added one.' : 'Your skirt passes the knee, so we added a vent to walk in.');
	} else vent = wanted;
	const ventRule = vent === 'kick-pleat' ? rules.kickPleat : rules.vent;
	// The vent opens from the hem to about the knee (TRADE.md: a fitted skirt past the knee needs a vent
	// reaching about the knee); never shorter than the house vent, never above the hip line + 5 cm.
	const room = m.length - m.hipDepth - 5;
	const reach = pastKnee ? m.length - knee + rules.vent.reachAboveKnee : 0;
	const ventLength = Math.min(Math.max(ventRule.length, reach), room);
	if (vent !== 'none' && ventLength < 8) {
		vent = 'none';
		warnings.push('Your skirt is short enough to walk in without a vent, so it has none.');
	} else if (vent !== 'none' && wanted === 'auto' && pastKnee) {
		warnings.push(`Your skirt passes the knee, so it has a ${vent === 'vent' ? 'back vent' : 'kick pleat'} to walk in.`);
	}

	let pockets = bool('pockets', c.pockets, DEFAULT_OPTIONS.pockets);
	if (pockets && m.length < rules.pocket.fromWaist + rules.pocket.opening + 12) {
		pockets = false;
		warnings.push('Your skirt is too short for pockets in the side seams, so it has none.');
	} else if (pockets && position === 'side') {
		warnings.push('Your zip is in the left side seam, so your pocket goes in the right side seam only.');
	}
	const choice: ResolvedChoice = {
		style,
		waistband: pick('waistband', c.waistband, ['band', 'facing'] as const, DEFAULT_OPTIONS.waistband),
		closure: { kind, position, length: zipLength },
		lining: bool('lining', c.lining, DEFAULT_OPTIONS.lining),
		pockets,
		hemDepth,
		vent,
		ventLength: vent === 'none' ? 0 : ventLength,
		stretch
	};
	return { choice, problems, warnings };
}
