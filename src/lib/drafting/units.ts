// Centimetres inside, the shopper's units outside. An inch is exactly 2.54 cm (international yard and
// pound agreement, 1959); shops working in inches read tapes to the nearest eighth.

/** Units a drawing or figure is shown in. */
export type Units = 'cm' | 'in';

/** Exactly, by definition. */
export const CM_PER_INCH = 2.54;

/** Centimetres to inches, full precision. */
export const cmToIn = (cm: number): number => cm / CM_PER_INCH;
/** Inches to centimetres, full precision. */
export const inToCm = (inches: number): number => inches * CM_PER_INCH;

const EIGHTHS = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'];

/** Inches to the nearest ⅛, as a tape reads: 26.35 cm → "10⅜″". */
export function formatInches(cm: number): string {
	const eighths = Math.round(cmToIn(Math.abs(cm)) * 8);
	const whole = Math.floor(eighths / 8);
	const frac = EIGHTHS[eighths % 8];
	const sign = cm < 0 && eighths > 0 ? '−' : '';
	return `${sign}${whole > 0 || !frac ? whole : ''}${frac}″`;
}

/** Centimetres to the nearest millimetre, without a trailing ".0": 25.5 → "25.5 cm", 32 → "32 cm". */
export function formatCm(cm: number): string {
	const mm = Math.round(cm * 10);
	const sign = mm < 0 ? '−' : '';
	const a = Math.abs(mm);
	return `${sign}${Math.floor(a / 10)}${a % 10 ? `.${a % 10}` : ''} cm`;
}

/** A length in the shopper's units. */
export const formatLength = (cm: number, units: Units = 'cm'): string => (units === 'in' ? formatInches(cm) : formatCm(cm));

/** Rounds to the millimetre, the precision a cutter reads from a rule (and never gives −0). */
export const toMm = (cm: number): number => Math.round(cm * 10) / 10 + 0;

/** A length to buy in the shopper's units, rounded up (to the ⅛″ or the millimetre), never below the need:
 * 150 cm is "59⅛″", not the nearer "59″". */
export function formatBuy(cm: number, units: Units = 'cm'): string {
	if (units === 'cm') return formatCm(Math.ceil(cm * 10 - 1e-9) / 10);
	return formatInches(inToCm(Math.ceil(cmToIn(cm) * 8 - 1e-9) / 8));
}

/** A limit as she would type it: decimal inches to the tenth ("13.8"), centimetres as given. */
const typedNumber = (cm: number, units: Units) => (units === 'in' ? cmToIn(cm).toFixed(1).replace(/\.0$/, '') : String(cm));

/**
 * How the engine's sentences name lengths in the shopper's units, built from the numbers themselves (never
 * by rewriting English text): limits she types ("from 13.8 to 31.5 in"), lengths as a tape reads them (⅛″).
 */
export interface LengthWords {
	/** "centimetres" or "inches". */
	unitName: string;
	/** "from 35 to 80 cm" / "from 13.8 to 31.5 in". */
	range(min: number, max: number): string;
	/** "26 cm or more" / "10.2 in or more". */
	atLeast(min: number): string;
	/** One length: "22.5 cm" / "8⅞″". */
	len(cm: number): string;
}

export function lengthWords(units: Units): LengthWords {
	const unit = units === 'in' ? 'in' : 'cm';
	return {
		unitName: units === 'in' ? 'inches' : 'centimetres',
		range: (min, max) => `from ${typedNumber(min, units)} to ${typedNumber(max, units)} ${unit}`,
		atLeast: (min) => `${typedNumber(min, units)} ${unit} or more`,
		len: (cm) => formatLength(cm, units)
	};
}
