import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pathProblems } from './checks';
import { dist } from './geometry';
import { flatten, polygonArea } from './outline';
import { DEFAULT_RULES, draftSkirt, MEASUREMENT_LIMITS, STYLES, type Draft, type FitAdjustments, type Figures, type SkirtChoiceInput, type StyleId } from './index';

// Properties over the whole valid range (TRADE.md input ranges [from memory]; confirmed figures included),
// every style, with and without each fit adjustment and with or without the knee. The checks are what a
// pattern maker checks (TRADE.md "what a pattern maker checks"), the darts' largest angle (25°, TRADE.md
// "Darts", common practice) and the walking room (TRADE.md "Knee, vents and walking room" [from memory]).
// 60 drafts a property keep each run to a few seconds; a failure prints its seed and shrunk figure.

// QL_PROP_RUNS raises the count for a long hunt by hand; the suite keeps 60.
const RUNS = { numRuns: Number(process.env.QL_PROP_RUNS) || 60 };
const SLOW = 60_000;
const R = DEFAULT_RULES;

const adjustments: fc.Arbitrary<FitAdjustments | undefined> = fc.option(
	fc.record(
		{
			hollowBack: fc.double({ min: 0, max: 3, noNaN: true }),
			roundedAbdomen: fc.double({ min: 0, max: 3, noNaN: true }),
			prominentSeat: fc.double({ min: 0, max: 3, noNaN: true }),
			highHip: fc.double({ min: 0, max: 8, noNaN: true }),
			oneHip: fc.record({ side: fc.constantFrom('left' as const, 'right' as const), higher: fc.double({ min: 0, max: 4, noNaN: true }), fuller: fc.double({ min: 0, max: 8, noNaN: true }) }),
			ease: fc.record({ waist: fc.double({ min: -2, max: 6, noNaN: true }), hip: fc.double({ min: -4, max: 12, noNaN: true }) })
		},
		{ requiredKeys: [] }
	),
	{ nil: undefined }
);

const measurements = fc
	.record({
		waist: fc.double({ min: 50, max: 200, noNaN: true }),
		hipShare: fc.double({ min: 0, max: 1, noNaN: true }),
		waistToHip: fc.option(fc.double({ min: 10, max: 35, noNaN: true }), { nil: undefined }),
		kneeBelowHip: fc.option(fc.double({ min: 20, max: 45, noNaN: true }), { nil: undefined }),
		adjustments
	})
	.chain(({ waist, hipShare, waistToHip, kneeBelowHip, adjustments }) => {
		const depth = waistToHip ?? R.defaultWaistToHip;
		const top = Math.min(200, waist + MEASUREMENT_LIMITS.hipOverWaistPerDepth * depth);
		const knee = kneeBelowHip === undefined ? undefined : Math.min(80, Math.max(35, depth + kneeBelowHip));
		// The engine refuses a back waist lowered by more than two fifths of the depth (measurements.ts):
		// keep hollow back + higher hip inside that, as the shop's form does.
		const room = Math.floor(0.4 * depth * 10) / 10;
		const lowered = (adjustments?.hollowBack ?? 0) + (adjustments?.oneHip?.higher ?? 0);
		const k = lowered > room ? room / lowered : 1;
		const fit = adjustments && k < 1 ? { ...adjustments, hollowBack: (adjustments.hollowBack ?? 0) * k * 0.999, oneHip: adjustments.oneHip && { ...adjustments.oneHip, higher: (adjustments.oneHip.higher ?? 0) * k * 0.999 } } : adjustments;
		const m = { waist, hip: 70 + hipShare * (Math.max(70, top) - 70), waistToHip, waistToKnee: knee, confirmed: true, adjustments: fit };
		return fc.double({ min: Math.ceil(depth + 5), max: 130, noNaN: true }).map((length) => ({ ...m, length }));
	});

const choice: fc.Arbitrary<SkirtChoiceInput & { style: StyleId }> = fc.record({
	style: fc.constantFrom(...STYLES.map((s) => s.id)),
	waistband: fc.constantFrom('band' as const, 'facing' as const),
	closure: fc.record({ kind: fc.constantFrom('zip' as const, 'invisible-zip' as const), position: fc.constantFrom('centre-back' as const, 'side' as const) }),
	lining: fc.boolean(),
	pockets: fc.boolean(),
	vent: fc.constantFrom('auto' as const, 'vent' as const, 'kick-pleat' as const, 'none' as const),
	stretch: fc.boolean()
});

const input = fc.tuple(measurements, choice);
/** Both halves' figures (one when the halves are alike). */
const halves = (d: Draft): Figures[] => [d.exactFigures, ...(d.left ? [d.left.exactFigures] : [])];
const angle = (intake: number, length: number) => (2 * Math.atan(intake / 2 / length) * 180) / Math.PI;

describe('every valid figure, every style, every adjustment', () => {
	it('waist seam with darts closed = W/4 + ease (house + personal); hip line = H/2 + ease (+ half the seat), unless widened', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				const f = d.measurements.fit;
				const quarterWaist = m.waist / 4 + 0.5 + f.ease.waist / 4;
				const sides = halves(d);
				sides.forEach((x, i) => {
					expect(Math.abs(x.check.waistSeam.front - quarterWaist)).toBeLessThan(1e-4);
					expect(Math.abs(x.check.waistSeam.back - quarterWaist)).toBeLessThan(1e-4);
					const hip = m.hip + (f.oneHip ? (f.oneHip.side === (i === 0 && sides.length > 1 ? 'right' : 'left') ? f.oneHip.fuller : -f.oneHip.fuller) : 0);
					const want = hip / 2 + 2 + f.ease.hip / 2 + f.prominentSeat / 2;
					const widened = quarterWaist > hip / 4 + 1 + f.ease.hip / 4;
					if (!widened) expect(Math.abs(x.check.hipLine.front + x.check.hipLine.back - want)).toBeLessThan(1e-6);
					else expect(x.check.hipLine.front + x.check.hipLine.back).toBeGreaterThanOrEqual(2 * quarterWaist - 1e-6);
				});
			}),
			RUNS
		);
	}, SLOW);

	it('no dart wider than 25°, none past the hip line less 2.5 cm, legs equal within 1 mm, side seams matched within the easing', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				for (const x of halves(d)) {
					// 0.01° is far finer than any cutter marks a dart; a dart held at the largest angle lands on it
					// within floating point either side (25.0001000000007 was seen).
					for (const dart of [...x.front.darts, ...x.back.darts]) expect(angle(dart.intake, dart.length)).toBeLessThanOrEqual(R.darts.maxAngle + 0.01);
					expect(x.check.dartLegs.front).toBeLessThan(0.1);
					expect(x.check.dartLegs.back).toBeLessThan(0.1);
					expect(Math.abs(x.check.sideSeam.front - x.check.sideSeam.back)).toBeLessThanOrEqual(R.side.easing + 0.05);
				}
				for (const b of [d.block, ...(d.left ? [d.left.block] : [])])
					for (const p of [b.front, b.back]) for (const dart of p.darts) expect(dart.point.y).toBeLessThanOrEqual(p.hipPoint.y - R.darts.clearAboveHip + 1e-6);
				for (const p of d.pieces)
					for (const x of p.darts) {
						expect(Math.abs(dist(x.top1, x.point) - dist(x.top2, x.point))).toBeLessThan(0.1);
						expect(angle(dist(x.top1, x.top2), Math.min(dist(x.top1, x.point), dist(x.top2, x.point)))).toBeLessThanOrEqual(R.darts.maxAngle + 0.5);
					}
			}),
			RUNS
		);
	}, SLOW);

	it('every piece is a closed outline with area that never crosses itself (seam and cutting lines)', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				for (const p of draftSkirt(m, c).pieces) {
					expect(pathProblems(p.seam.segments), `${p.id} seam`).toEqual([]);
					expect(pathProblems(p.cutting.segments), `${p.id} cutting`).toEqual([]);
					expect(Math.abs(polygonArea(flatten(p.seam.segments, 1))), `${p.id} area`).toBeGreaterThan(1);
				}
			}),
			RUNS
		);
	}, SLOW);

	it('a fitted woven skirt past the knee opens to about the knee, and its lining is slit above the vent', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				const knee = d.measurements.kneeDepth;
				const fitted = c.style === 'straight' || c.style === 'pencil';
				if (!fitted || c.stretch || m.length <= knee) return;
				expect(d.choice.vent).not.toBe('none');
				const backs = d.pieces.filter((p) => p.role === 'panel' && p.id.startsWith('back'));
				for (const b of backs) {
					const top = Math.min(...b.seam.segments.filter((s) => s.edge === 'vent').flatMap((s) => [s.from.y, s.to.y]));
					expect(top).toBeLessThanOrEqual(knee + 3);
					expect(top).toBeGreaterThanOrEqual(Math.min(knee - R.vent.reachAboveKnee, m.length - R.vent.length) - 1e-6);
				}
				if (c.lining) {
					const top = m.length - d.choice.ventLength;
					const linings = d.pieces.filter((p) => p.role === 'lining' && p.id.startsWith('back'));
					expect(linings.length).toBeGreaterThan(0);
					for (const l of linings) {
						const slits = l.notches.filter((n) => n.label === 'slit');
						expect(slits.length, l.id).toBeGreaterThan(0);
						for (const s of slits) expect(s.at.y).toBeLessThanOrEqual(top + 1e-6);
					}
				}
			}),
			RUNS
		);
	}, SLOW);
});
