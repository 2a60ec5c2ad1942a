// Where a set of figures came from: her own tape, a published size chart, or a skirt that fits her laid
// flat. The order line and the measure card keep it; the ticket and the order pages say it.
import { FLAT_GARMENT_NOTE } from './flat-garment';
import { SIZE_CHART_SHORT } from './size-chart';

export const FIGURE_SOURCES = ['measured', 'size_chart', 'flat_garment'] as const;
export type FigureSource = (typeof FIGURE_SOURCES)[number];

export const isFigureSource = (v: unknown): v is FigureSource => typeof v === 'string' && (FIGURE_SOURCES as readonly string[]).includes(v);

/** A short label (a table cell, a card). */
export const SOURCE_LABEL: Record<FigureSource, string> = {
	measured: 'Measured with a tape',
	size_chart: 'From a size chart',
	flat_garment: 'From a skirt laid flat'
};

/** One sentence for an order line or a ticket: where the figures came from and what that means. */
export const SOURCE_NOTE: Record<FigureSource, string> = {
	measured: 'Figures measured on her body with a tape.',
	size_chart: `Figures from her usual size on the ${SIZE_CHART_SHORT} (a chart body, not hers): no tape measure used.`,
	flat_garment: `Figures ${FLAT_GARMENT_NOTE}: no tape on her body.`
};

/** The same, said to the shopper (the quote, the bag, her order page). */
export const SOURCE_NOTE_SHOPPER: Record<FigureSource, string> = {
	measured: 'Your figures: measured with a tape.',
	size_chart: `Your figures come from your usual size on the ${SIZE_CHART_SHORT}. A chart fits a chart body, not yours: measuring yourself later gives a better fit, and you can replace these figures on your measure card.`,
	flat_garment: 'Your figures come from a skirt that fits you, laid flat: we doubled each width and took off our usual ease. Measuring yourself later gives a better fit.'
};
