import { draftSkirt, toSvg, type StyleId } from '$lib/drafting';
import type { HouseRules } from '$lib/drafting/rules';

// The figure every style is drawn on in the catalogue: the handbook size 12 (waist 68, hip 94,
// waist to hip 20.6 cm) at a knee length of 60 cm.
export const SAMPLE_FIGURE = { waist: 68, hip: 94, waistToHip: 20.6, length: 60 };

const cache = new Map<string, string>();

/** The drawing of a style on the sample figure, cached per style and rules version. */
export function sampleDrawing(kind: string, rules: HouseRules, rulesId: number, view: 'block' | 'pieces' = 'pieces') {
	const key = `${kind}:${rulesId}:${view}`;
	let svg = cache.get(key);
	if (!svg) {
		svg = toSvg(draftSkirt(SAMPLE_FIGURE, { style: kind as StyleId }, rules), { view, units: 'cm' });
		cache.set(key, svg);
	}
	return svg;
}
