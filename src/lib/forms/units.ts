const CM_PER_IN = 2.54;

/** Turns the engine's range messages (written in cm) into the shopper's units. */
export function inUnits(message: string, units: 'cm' | 'in') {
	if (units === 'cm') return message;
	const conv = (v: string) => (Number(v) / CM_PER_IN).toFixed(1).replace(/\.0$/, '');
	return message
		.replace(/from ([\d.]+) to ([\d.]+) cm/, (_, a, b) => `from ${conv(a)} to ${conv(b)} in`)
		.replace(/([\d.]+) cm or more/, (_, a) => `${conv(a)} in or more`)
		.replace('in centimetres', 'in inches');
}
