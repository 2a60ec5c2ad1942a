import { draftSkirt, type StyleId } from '$lib/drafting';
import { CALICO, garmentView, type GarmentCloth } from '$lib/drafting/drawing/garment';
import type { HouseRules } from '$lib/drafting/rules';
import { SAMPLE_FIGURE } from '$lib/drafting/sample';
import { drawingToSvg } from '$lib/drafting/svg';
import { blockView, piecesView } from '$lib/drafting/drawing/views';
import { estimateWidth } from '$lib/drafting/drawing/model';

export { SAMPLE_FIGURE };

const cache = new Map<string, string>();

/** A style on the sample figure, cached per style, rules version and view: the finished skirt (in calico,
 * the atelier's toile, unless a cloth is given), the pattern pieces behind it, or the block (house rules). */
export function sampleDrawing(kind: string, rules: HouseRules, rulesId: number, view: 'garment' | 'pieces' | 'block' = 'garment', cloth: GarmentCloth = CALICO) {
	const key = `${kind}:${rulesId}:${view}:${cloth.colour}:${cloth.image ?? ''}`;
	let svg = cache.get(key);
	if (!svg) {
		const draft = draftSkirt(SAMPLE_FIGURE, { style: kind as StyleId }, rules);
		svg = view === 'garment' ? drawingToSvg(garmentView(draft, { cloth }), { id: `sample-${kind}`, size: false }) : drawingToSvg((view === 'block' ? blockView : piecesView)(draft, 'cm', estimateWidth));
		if (cache.size > 500) cache.clear();
		cache.set(key, svg);
	}
	return svg;
}
