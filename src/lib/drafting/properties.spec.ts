import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { inside, pathProblems, toOutline } from './checks';
import { dist, segmentLength } from './geometry';
import { flatten, polygonArea } from './outline';
import { DraftInputError, draftSkirt, estimateFabric, MEASUREMENT_LIMITS, STYLES, toSvg, type Draft, type Piece, type SkirtChoiceInput, type StyleId } from './index';

// Property tests over the whole valid input range (TRADE.md ranges: waist 50–200, hip 70–200 cm [from
// memory]; waist to hip 10–35; length from 5 cm below the hip line to 130) and every style and option.
// The invariants are the checks a pattern maker makes (TRADE.md "what a pattern maker checks").

// 100 generated figures a property keeps the whole unit suite to a few seconds; a failing case prints
// its seed and the shrunk figure, so it can be replayed.
const RUNS = { numRuns: 100 };
const SLOW = 60_000; // ms: a property draws hundreds of skirts; the default 5 s is for single examples
const styles = STYLES.map((s) => s.id);
const circle = (s: StyleId) => s === 'half-circle' || s === 'full-circle';

// The hip may not exceed the waist by more than 4.8 cm per cm of hip depth (MEASUREMENT_LIMITS): the
// hip is drawn within what the waist and depth allow.
const measurements = fc
	.record({
		waist: fc.double({ min: 50, max: 200, noNaN: true }),
		hipShare: fc.double({ min: 0, max: 1, noNaN: true }),
		waistToHip: fc.option(fc.double({ min: 10, max: 35, noNaN: true }), { nil: undefined })
	})
	.map(({ waist, hipShare, waistToHip }) => {
		const top = Math.min(200, waist + MEASUREMENT_LIMITS.hipOverWaistPerDepth * (waistToHip ?? 22));
		// Confirmed: figures outside what a block usually fits are drafted once the shopper confirms them.
		return { waist, hip: 70 + hipShare * (Math.max(70, top) - 70), waistToHip, confirmed: true };
	})
	.chain((m) => fc.double({ min: Math.ceil((m.waistToHip ?? 22) + 5), max: 130, noNaN: true }).map((length) => ({ ...m, length })));

const choice: fc.Arbitrary<SkirtChoiceInput & { style: StyleId }> = fc.record({
	style: fc.constantFrom(...styles),
	waistband: fc.constantFrom('band' as const, 'facing' as const),
	closure: fc.record({ kind: fc.constantFrom('zip' as const, 'invisible-zip' as const), position: fc.constantFrom('centre-back' as const, 'side' as const) }),
	lining: fc.boolean(),
	pockets: fc.boolean(),
	vent: fc.constantFrom('auto' as const, 'vent' as const, 'kick-pleat' as const, 'none' as const),
	stretch: fc.boolean()
});

const input = fc.tuple(measurements, choice);
const sideOf = (p: Piece) => p.seam.segments.filter((s) => s.edge === 'side').reduce((a, s) => a + segmentLength(s), 0);

describe('every valid figure, every style', () => {
	it('waist seam with the darts closed is W/4 + ease within 0.5 cm', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const { check } = draftSkirt(m, c).exactFigures;
				expect(Math.abs(check.waistSeam.front - (m.waist / 4 + 0.5))).toBeLessThanOrEqual(0.5);
				expect(Math.abs(check.waistSeam.back - (m.waist / 4 + 0.5))).toBeLessThanOrEqual(0.5);
			}),
			RUNS
		);
	}, SLOW);

	it('front + back hip line is exactly H/2 + 2 × hip ease, unless a larger waist widens it (and says so)', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				const { hipLine } = d.exactFigures.check;
				const quarterWaist = m.waist / 4 + 0.5;
				if (quarterWaist <= m.hip / 4 + 1) {
					expect(Math.abs(hipLine.front + hipLine.back - (m.hip / 2 + 2))).toBeLessThan(1e-9);
				} else {
					expect(hipLine.front).toBeGreaterThanOrEqual(quarterWaist - 1e-9);
					expect(hipLine.back).toBeGreaterThanOrEqual(quarterWaist - 1e-9);
					if (!circle(c.style)) expect(d.warnings.join(' ')).toContain('the hip line is widened to clear your waist, so the skirt hangs straight');
				}
				if (m.waist > m.hip && !circle(c.style)) expect(d.warnings.some((w) => w.startsWith('Your waist is larger than your hip: the back darts are left out'))).toBe(true);
			}),
			RUNS
		);
	}, SLOW);

	it('dart legs are equal within 1 mm and no side seam flares past the hip at the waist', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				for (const p of d.pieces) for (const x of p.darts) expect(Math.abs(dist(x.top1, x.point) - dist(x.top2, x.point))).toBeLessThan(0.1);
				expect(d.exactFigures.check.dartLegs.front).toBeLessThan(0.1);
				expect(d.exactFigures.check.dartLegs.back).toBeLessThan(0.1);
				for (const panel of [d.block.front, d.block.back]) {
					expect(panel.sideTop.x).toBeLessThanOrEqual(panel.hipPoint.x + 1e-9);
					for (const dart of panel.darts) expect(dart.point.y).toBeLessThan(panel.hipPoint.y);
				}
				expect(d.exactFigures.front.sideShaping).toBeGreaterThanOrEqual(0);
				expect(d.exactFigures.back.sideShaping).toBeGreaterThanOrEqual(0);
			}),
			RUNS
		);
	}, SLOW);

	it('front and back side seams are within 1 cm of each other, on the block and on the pieces', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				const { sideSeam } = d.exactFigures.check;
				expect(Math.abs(sideSeam.front - sideSeam.back)).toBeLessThanOrEqual(1);
				const [f, b] = c.style === 'gored' ? ['side-front', 'side-back'] : ['front', 'back'];
				const front = d.pieces.find((p) => p.id === f)!;
				const back = d.pieces.find((p) => p.id === b)!;
				expect(Math.abs(sideOf(front) - sideOf(back))).toBeLessThanOrEqual(1);
			}),
			RUNS
		);
	}, SLOW);

	it('every seam and cutting line is closed, never crosses itself, and the cutting line holds the seam line', () => {
		fc.assert(
			fc.property(input, ([m, c]) => {
				for (const p of draftSkirt(m, c).pieces) {
					expect(pathProblems(p.seam.segments), `${p.id} seam`).toEqual([]);
					expect(pathProblems(p.cutting.segments), `${p.id} cutting`).toEqual([]);
					const cut = flatten(p.cutting.segments, 2);
					const seam = flatten(p.seam.segments, 0.5);
					// A fold edge has no allowance: its seam points lie on the cutting line itself.
					expect(seam.filter((q) => !inside(q, cut) && toOutline(q, cut) > 1e-6).length, `${p.id} seam outside its cutting line`).toBe(0);
				}
			}),
			RUNS
		);
	}, SLOW);

	it('every number in the draft and its drawing is finite', () => {
		const walk = (v: unknown, path: string) => {
			if (typeof v === 'number') expect(Number.isFinite(v), path).toBe(true);
			else if (Array.isArray(v)) v.forEach((x, i) => walk(x, `${path}[${i}]`));
			else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`);
		};
		fc.assert(
			fc.property(input, ([m, c]) => {
				const d = draftSkirt(m, c);
				walk(d, 'draft');
				expect(toSvg(d, { view: 'pieces', units: 'in' })).not.toMatch(/NaN|Infinity/);
			}),
			{ numRuns: 50 }
		);
	}, SLOW);
});

describe('fabric for every valid figure', () => {
	const tryBuy = (d: Draft, width: number, nap: boolean, shrinkage: number) => {
		try {
			return estimateFabric(d, { width, nap, shrinkage }).length;
		} catch (e) {
			if (e instanceof DraftInputError && e.fields[0].field === 'width') return Infinity;
			throw e;
		}
	};
	const area = (d: Draft) => d.pieces.filter((p) => p.fabric === 'shell').reduce((s, p) => s + Math.abs(polygonArea(flatten(p.cutting.segments, 2))) * (p.cut.onFold ? 2 : p.cut.count), 0);

	it('grows as the width shrinks, never shrinks with nap or shrinkage, never under the pieces’ area', () => {
		fc.assert(
			fc.property(input, fc.double({ min: 90, max: 180, noNaN: true }), fc.double({ min: 90, max: 180, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }), ([m, c], a, b, s) => {
				const d = draftSkirt(m, c);
				const [narrow, wide] = a < b ? [a, b] : [b, a];
				const n = tryBuy(d, narrow, false, 0);
				const w = tryBuy(d, wide, false, 0);
				expect(n).toBeGreaterThanOrEqual(w);
				if (Number.isFinite(w)) {
					expect(tryBuy(d, wide, true, 0)).toBeGreaterThanOrEqual(w);
					expect(tryBuy(d, wide, false, s)).toBeGreaterThanOrEqual(w);
					expect(w * wide).toBeGreaterThanOrEqual(area(d));
				}
			}),
			{ numRuns: 100 }
		);
	}, SLOW);
});
