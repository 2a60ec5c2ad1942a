import { describe, expect, it } from 'vitest';
import { CHART_SIZES, chartFigures, HIP_IN, WAIST_IN } from './size-chart';
import { validateMeasurements } from './measurements';

// ASTM D5585-11e1 Table 1, waist girth in inches for sizes 00, 0, 2 … 20, as written in TRADE.md
// (typed here again from that text, in its own fractions, so a slip in either copy shows).
const TRADE_MD_WAIST = {
	curvy: '23⅞, 24⅝, 25⅜, 26⅛, 27, 28, 29, 30¾, 32½, 34½, 36¾, 39',
	straight: '25⅜, 26⅛, 26⅞, 27⅝, 28½, 29½, 30½, 32¼, 34, 36, 38¼, 40½'
};
const FRACTIONS: Record<string, number> = { '⅛': 0.125, '¼': 0.25, '⅜': 0.375, '½': 0.5, '⅝': 0.625, '¾': 0.75, '⅞': 0.875 };
const inches = (s: string) => {
	const m = s.trim().match(/^(\d+)(.?)$/)!;
	return Number(m[1]) + (m[2] ? FRACTIONS[m[2]] : 0);
};

describe('size chart (ASTM D5585-11e1)', () => {
	it('has the waist girths of the standard for every size, curvy and straight (TRADE.md)', () => {
		for (const shape of ['curvy', 'straight'] as const) {
			expect(WAIST_IN[shape]).toEqual(TRADE_MD_WAIST[shape].split(',').map(inches));
			expect(WAIST_IN[shape]).toHaveLength(CHART_SIZES.length);
		}
	});

	it('turns inches into cm exactly (1 in = 2.54 cm) to the millimetre: size 8 curvy waist 28 in = 71.1 cm', () => {
		// 28 × 2.54 = 71.12 → 71.1; size 12 straight 32¼ × 2.54 = 81.915 → 81.9.
		expect(chartFigures('8', 'curvy')).toMatchObject({ waist: 71.1, waistIn: 28 });
		expect(chartFigures('12', 'straight')).toMatchObject({ waist: 81.9, waistIn: 32.25 });
	});

	// The hip row is FROM MEMORY (not in TRADE.md): only its shape is checked, not its values.
	it('[from memory] hip girths lie above the waist, grow with the size and draft', () => {
		for (const shape of ['curvy', 'straight'] as const) {
			const hips = HIP_IN[shape];
			expect(hips).toHaveLength(CHART_SIZES.length);
			hips.forEach((h, i) => {
				expect(h).toBeGreaterThan(WAIST_IN[shape][i]);
				if (i) expect(h).toBeGreaterThan(hips[i - 1]);
			});
			for (const size of CHART_SIZES) {
				const f = chartFigures(size, shape)!;
				expect(validateMeasurements({ waist: f.waist, hip: f.hip, length: 60 })).toEqual([]);
			}
		}
		// A curvy figure carries more hip for its waist than a straight one of the same size.
		CHART_SIZES.forEach((_, i) => expect(HIP_IN.curvy[i] - WAIST_IN.curvy[i]).toBeGreaterThan(HIP_IN.straight[i] - WAIST_IN.straight[i]));
	});

	it('has no figures for a size or shape the chart lacks', () => {
		expect(chartFigures('22', 'curvy')).toBeNull();
		expect(chartFigures('8', 'round')).toBeNull();
	});
});
