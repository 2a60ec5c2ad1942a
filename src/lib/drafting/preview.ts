// The configure page's engine: drafts her skirt and draws it in the browser on every change, loaded as a
// chunk of its own after the page's first paint (so the page's first script stays small). The server is
// asked only for what it alone knows: price, metres of cloth, stock and ship date.
import { draftSkirt, type Draft } from './draft';
import { DraftInputError, type FieldProblem } from './errors';
import type { SkirtChoiceInput, StyleId } from './options';
import type { HouseRules } from './rules';
import { completeFigure, type PartialMeasurements } from './sample';
import { drawingToSvg } from './svg';
import { garmentView, garmentWords, type GarmentCloth } from './drawing/garment';
import { estimateWidth } from './drawing/model';
import { piecesView } from './drawing/views';
import type { Units } from './units';

export interface PreviewInput {
	style: StyleId;
	/** As typed so far, in cm. */
	measurements: PartialMeasurements;
	options: SkirtChoiceInput;
	rules: HouseRules;
	cloth?: GarmentCloth;
	units: Units;
	/** Draw the pattern pieces as well (only while that tab is open: they cost more than the skirt). */
	pieces?: boolean;
	/** Unique on the page (names the cloth pattern). */
	id?: string;
}

export type Preview =
	| {
			ok: true;
			garment: string;
			/** The skirt alone, front only, for the small drawing of the phone summary. */
			small: string;
			pieces: string | null;
			words: string;
			/** Which measurements were taken from the usual figure. */
			filled: ('waist' | 'hip' | 'length')[];
			draft: Pick<Draft, 'figures' | 'warnings'> & { pieces: { name: string; cut: { count: number; onFold: boolean } }[] };
			ms: number;
	  }
	| { ok: false; problems: FieldProblem[]; ms: number };

/** Drafts and draws. Never throws for her input: a figure the engine cannot draft returns its problems
 * (the page keeps the last drawing meanwhile). Figures past a block's usual range are drawn as if
 * confirmed: the drawing is a preview, and the order still asks her to confirm them. */
export function preview(input: PreviewInput): Preview {
	const t0 = performance.now();
	const { measurements, filled } = completeFigure(input.measurements);
	let draft: Draft;
	try {
		draft = draftSkirt({ ...measurements, confirmed: true }, { ...input.options, style: input.style }, input.rules);
	} catch (err) {
		if (err instanceof DraftInputError) return { ok: false, problems: err.fields, ms: performance.now() - t0 };
		throw err;
	}
	const id = input.id ?? 'live';
	const garment = drawingToSvg(garmentView(draft, { cloth: input.cloth, units: input.units }), { id, size: false });
	const small = drawingToSvg(garmentView(draft, { cloth: input.cloth, units: input.units, views: ['front'], labels: false, crop: true }), { id: `${id}-s`, size: false });
	const pieces = input.pieces ? drawingToSvg(piecesView(draft, input.units, estimateWidth)) : null;
	return {
		ok: true,
		garment,
		small,
		pieces,
		words: garmentWords(draft, input.units, input.cloth),
		filled,
		draft: { figures: draft.figures, warnings: draft.warnings, pieces: draft.pieces.map((p) => ({ name: p.name, cut: p.cut })) },
		ms: performance.now() - t0
	};
}
