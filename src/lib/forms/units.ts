import { formatInches } from '../drafting/units';

const CM_PER_IN = 2.54;

/** Turns the engine's messages (written in cm) into the shopper's units: ranges "from 35 to 80 cm" as
 * decimal inches (what she types), every other length as a tape reads it, to the ⅛″. */
export function inUnits(message: string, units: 'cm' | 'in') {
	if (units === 'cm') return message;
	const conv = (v: string) => (Number(v) / CM_PER_IN).toFixed(1).replace(/\.0$/, '');
	return message
		.replace(/from (-?[\d.]+) to (-?[\d.]+) cm/g, (_, a, b) => `from ${conv(a)} to ${conv(b)} in`)
		.replace(/([\d.]+) cm or more/g, (_, a) => `${conv(a)} in or more`)
		.replace('in centimetres', 'in inches')
		.replace(/(−?)(\d+(?:\.\d+)?) cm\b/g, (_, sign, v) => `${sign}${formatInches(Number(v) * (sign ? -1 : 1)).replace('−', '')}`);
}
