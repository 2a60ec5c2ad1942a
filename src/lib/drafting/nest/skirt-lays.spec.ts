import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { draftSkirt, estimateFabric, STYLES, type Draft, type FabricEstimate } from '../index';
import { saleLength } from '../fabric';
import { cutterLay, combinedLay } from './cutter';
import { layFaults } from './check-lay';

// The three skirts the workroom set lay targets for (fabric to buy, cm; the old row lays bought 330, 410
// and 400): the pieces' own outlines fitted into each other must do better.
const targets = [
	{
		name: 'full circle W100 H128 L60 on 150',
		m: { waist: 100, hip: 128, length: 60 },
		style: 'full-circle' as const,
		width: 150,
		most: 290
	},
	{
		name: 'half circle W68 L90 on 150',
		m: { waist: 68, hip: 94, length: 90 },
		style: 'half-circle' as const,
		width: 150,
		most: 330
	},
	{
		name: 'straight W140 H160 L75 on 90',
		m: { waist: 140, hip: 160, length: 75 },
		style: 'straight' as const,
		width: 90,
		most: 300
	}
];

/** Every check a cutter would make of a lay: no overlaps (Clipper, 0.1 mm), the gap kept, inside the lane,
 * grain along the length (never turned end for end on a napped cloth), fold pieces on the fold, counts. */
function checkLay(d: Draft, e: FabricEstimate, nap: boolean) {
	const lay = e.layout;
	// Outlines in lay coordinates: x across (0 at the fold or a selvedge), y along.
	const faults = layFaults(
		lay.pieces.map((p) => p.outline.map((q) => ({ x: q.y, y: q.x }))),
		lay.laneWidth,
		lay.layLength,
		0.01,
		1e4,
		d.rules.fabric.gap - 0.02
	);
	expect(faults).toEqual([]);
	for (const p of lay.pieces) {
		if (nap) expect(['as-cut', 'mirrored']).toContain(p.orientation);
		const piece = d.pieces.find((q) => q.id === p.pieceId)!;
		if (lay.folded && piece.cut.onFold) {
			// The fold edge (x = 0 on the piece) lies on the fold.
			const onFold = p.outline.filter((q) => Math.abs(q.x) < 1e-6);
			expect(onFold.length).toBeGreaterThanOrEqual(2);
			const span = Math.max(...onFold.map((q) => q.y)) - Math.min(...onFold.map((q) => q.y));
			expect(span).toBeGreaterThan(10);
		}
	}
	// Counts: each piece cut as often as its instruction says (a folded layer gives two, a fold piece cut
	// as halves two halves, a waistband in parts one band).
	for (const piece of d.pieces.filter((p) => p.fabric === 'shell')) {
		const placed = lay.pieces.filter((p) => p.pieceId === piece.id);
		let copies = placed.reduce((a, p) => a + (lay.folded ? p.layers : 1), 0);
		if (piece.role === 'waistband' && placed.length === 2 && !lay.folded) copies = 1;
		if (piece.cut.onFold && !lay.folded && placed.length === 2) copies = 1;
		expect(copies, piece.id).toBe(piece.cut.onFold ? (lay.folded ? 2 : 1) : piece.cut.count);
	}
}

describe('nested lays for skirts', () => {
	for (const t of targets) {
		it(`${t.name}: at most ${t.most} cm, a sound lay`, () => {
			const d = draftSkirt(t.m, { style: t.style });
			const e = estimateFabric(d, { width: t.width, nap: false, shrinkage: 0 });
			expect(e.length).toBeLessThanOrEqual(t.most);
			checkLay(d, e, false);
			const napped = estimateFabric(d, { width: t.width, nap: true, shrinkage: 0 });
			checkLay(d, napped, true);
			expect(napped.length).toBeGreaterThanOrEqual(e.length);
		});
	}

	it('grows the lay as L ÷ (1 − s) and lays it on the width left after shrinking across', () => {
		const d = draftSkirt({ waist: 72, hip: 98, length: 62 }, { style: 'a-line' });
		const e = estimateFabric(d, { width: 140, nap: false, shrinkage: 6, shrinkageAcross: 2 });
		// TRADE.md, cloth: a length that shrinks by s must be cut L ÷ (1 − s); usable width W × (1 − s_across).
		expect(e.need).toBeCloseTo((e.layout.layLength + 5) / 0.94, 9);
		expect(e.layout.usableWidth).toBeCloseTo(140 * 0.98, 9);
		expect(Math.max(...e.layout.pieces.flatMap((p) => p.outline.map((q) => q.x)))).toBeLessThanOrEqual(
			e.layout.laneWidth + 1e-6
		);
		// A 4 % shrink across leaves 144 cm of 150: a full-circle quarter of 72.5 cm no longer fits folded.
		const c = draftSkirt({ waist: 68, hip: 94, length: 60.5 }, { style: 'full-circle' });
		const front = c.pieces.find((p) => p.id === 'front')!;
		expect(front.bounds.maxX).toBeGreaterThan(72);
		expect(front.bounds.maxX).toBeLessThan(75);
		expect(estimateFabric(c, { width: 150, nap: false, shrinkage: 0 }).layout.notes.join(' ')).not.toContain(
			'too narrow'
		);
		expect(estimateFabric(c, { width: 150, nap: false, shrinkage: 4 }).layout.notes.join(' ')).toContain(
			'too narrow to cut the front'
		);
	});

	it('rounds up to the sale step: 10 cm by the metre, ⅛ yd by the yard, never below the need', () => {
		expect(saleLength(150, { saleStep: 10, sellBy: 'metre' })).toBe(150);
		expect(saleLength(150.01, { saleStep: 10, sellBy: 'metre' })).toBe(160);
		// ⅛ yd = 4.5 in = 11.43 cm (international yard, 1959): 150 cm needs 14 eighths = 160.02 cm.
		expect(saleLength(150, { saleStep: 10, sellBy: 'yard' })).toBe(160.1);
		fc.assert(
			fc.property(fc.double({ min: 1, max: 2000, noNaN: true }), (need) => {
				const yd = saleLength(need, { saleStep: 10, sellBy: 'yard' });
				expect(yd).toBeGreaterThanOrEqual(need);
				expect(yd - need).toBeLessThan(11.43 + 0.1);
			}),
			{ numRuns: 200 }
		);
	});

	it('pieces a waistband longer than every other piece, joined at a side seam, when that is shorter', () => {
		const d = draftSkirt({ waist: 140, hip: 160, length: 75 }, { style: 'straight' });
		const band = d.pieces.find((p) => p.id === 'waistband')!;
		const e = estimateFabric(d, { width: 90, nap: false, shrinkage: 0 });
		const parts = e.layout.pieces.filter((p) => p.pieceId === 'waistband');
		if (parts.length === 2) {
			const len = (o: { y: number }[]) => Math.max(...o.map((q) => q.y)) - Math.min(...o.map((q) => q.y));
			// Two parts: the band's length plus a seam allowance each side of the join.
			expect(len(parts[0].outline) + len(parts[1].outline)).toBeCloseTo(
				band.bounds.maxY - band.bounds.minY + 2 * d.rules.allowances.seam,
				6
			);
			expect(e.layout.notes.join(' ')).toContain('joined at a side seam');
		}
		const whole = estimateFabric(
			draftSkirt({ waist: 140, hip: 160, length: 75 }, { style: 'straight' }, { fabric: { bandJoin: 'none' } }),
			{ width: 90, nap: false, shrinkage: 0 }
		);
		expect(whole.layout.pieces.filter((p) => p.pieceId === 'waistband')).toHaveLength(1);
		expect(e.length).toBeLessThanOrEqual(whole.length);
	});

	it('never needs more on a wider cloth, nor less with a nap or more shrinkage across (property)', () => {
		const styles = STYLES.map((s) => s.id);
		fc.assert(
			fc.property(
				fc.record({
					waist: fc.double({ min: 68, max: 110, noNaN: true }),
					extra: fc.double({ min: 2, max: 40, noNaN: true }),
					length: fc.double({ min: 40, max: 90, noNaN: true })
				}),
				fc.constantFrom(...styles),
				fc.double({ min: 110, max: 160, noNaN: true }),
				fc.double({ min: 0, max: 8, noNaN: true }),
				({ waist, extra, length }, style, width, s) => {
					const d = draftSkirt({ waist, hip: waist + extra, length }, { style });
					const buy = (w: number, nap: boolean, along: number, across: number) => {
						try {
							return estimateFabric(d, { width: w, nap, shrinkage: along, shrinkageAcross: across }).length;
						} catch {
							return Infinity;
						}
					};
					const base = buy(width, false, 0, 0);
					expect(buy(width - 7, false, 0, 0)).toBeGreaterThanOrEqual(base);
					expect(buy(width, true, 0, 0)).toBeGreaterThanOrEqual(base);
					expect(buy(width, false, 0, s)).toBeGreaterThanOrEqual(base);
					expect(buy(width, false, s, 0)).toBeGreaterThanOrEqual(base);
				}
			),
			{ numRuns: 25 }
		);
	}, 60_000);

	for (const t of targets)
		it(`${t.name}: the cutter’s lay (order search, then compaction) is sound and no longer than the quote’s`, () => {
			const d = draftSkirt(t.m, { style: t.style });
			for (const nap of [false, true]) {
				const cloth = { width: t.width, nap, shrinkage: 0 };
				const cut = cutterLay(d, cloth, { evaluations: 40, seconds: 20 });
				expect(cut.length).toBeLessThanOrEqual(estimateFabric(d, cloth).length);
				checkLay(d, cut, nap);
			}
		}, 60_000);

	it('a cutter’s lay is never longer than the quote’s, and a combined lay reports what it saves', () => {
		const a = draftSkirt({ waist: 70, hip: 96, length: 60 }, { style: 'a-line' });
		const b = draftSkirt({ waist: 80, hip: 104, length: 55 }, { style: 'straight' });
		const fabric = { width: 150, nap: false, shrinkage: 3 };
		const quote = estimateFabric(a, fabric);
		const cut = cutterLay(a, fabric, { evaluations: 60, seconds: 20 });
		expect(cut.length).toBeLessThanOrEqual(quote.length);
		checkLay(a, cut, false);
		const both = combinedLay(
			[
				{ id: 'A', draft: a },
				{ id: 'B', draft: b }
			],
			fabric,
			{ evaluations: 60, seconds: 20 }
		);
		expect(both.alone.map((o) => o.id)).toEqual(['A', 'B']);
		expect(both.saved).toBeCloseTo(both.alone[0].length + both.alone[1].length - both.length, 9);
		expect(new Set(both.layout.pieces.map((p) => p.group))).toEqual(new Set([0, 1]));
		expect(both.utilisation).toBeGreaterThan(0.3);
		expect(
			layFaults(
				both.layout.pieces.map((p) => p.outline.map((q) => ({ x: q.y, y: q.x }))),
				both.layout.laneWidth,
				both.layout.layLength,
				0.01
			)
		).toEqual([]);
	}, 60_000);
});
