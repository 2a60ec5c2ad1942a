import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { layFaults } from './check-lay';
import { compactLay, nest, NestInputError, type NestProblem } from './engine';
import { itemArea, placementsJson, problemOf, readInstance, rotated } from './instance';

// A small instance in the shared strip-packing form: an L, a notched block, a triangle and a slim bar.
const instance = {
	name: 'small',
	strip_height: 20,
	items: [
		{
			id: 0,
			demand: 3,
			allowed_orientations: [0, 180],
			shape: {
				type: 'simple_polygon',
				data: [
					[0, 0],
					[8, 0],
					[8, 3],
					[3, 3],
					[3, 9],
					[0, 9],
					[0, 0]
				]
			}
		},
		{
			id: 1,
			demand: 2,
			allowed_orientations: [0, 180],
			shape: {
				type: 'simple_polygon',
				data: [
					[0, 0],
					[10, 0],
					[10, 6],
					[6, 6],
					[5, 3],
					[4, 6],
					[0, 6]
				]
			}
		},
		{
			id: 2,
			demand: 4,
			allowed_orientations: [0],
			shape: {
				type: 'simple_polygon',
				data: [
					[0, 0],
					[7, 0],
					[0, 7]
				]
			}
		},
		{
			id: 'bar',
			demand: 1,
			allowed_orientations: [0, 180],
			shape: { type: 'rectangle', data: { x_min: 0, y_min: 0, width: 18, height: 1.5 } }
		}
	]
};

describe('nesting engine', () => {
	const inst = readInstance(instance);
	const problem = problemOf(inst);
	const result = nest(problem, { evaluations: 60, seed: 3 });

	it('places every copy once, each turned only as allowed', () => {
		const json = placementsJson(inst, result);
		const counts = new Map<string, number>();
		for (const p of json.placements) counts.set(String(p.item), (counts.get(String(p.item)) ?? 0) + 1);
		expect(Object.fromEntries(counts)).toEqual({ '0': 3, '1': 2, '2': 4, bar: 1 });
		for (const p of json.placements) expect(inst.items.find((it) => it.id === p.item)!.rotations).toContain(p.rotation);
	});

	it('writes placements anyone can check: the item turned about the origin, then moved by (x, y)', () => {
		const json = placementsJson(inst, result);
		json.placements.forEach((p, i) => {
			const item = inst.items.find((it) => it.id === p.item)!;
			const mine = rotated(item.outline, p.rotation).map((q) => ({ x: q.x + p.x, y: q.y + p.y }));
			mine.forEach((q, k) => {
				expect(q.x).toBeCloseTo(result.placements[i].points[k].x, 9);
				expect(q.y).toBeCloseTo(result.placements[i].points[k].y, 9);
			});
		});
		expect(json.length).toBe(result.length);
	});

	it('overlaps nothing and stays in the strip (Clipper intersection at 0.1 mm, units as cm)', () => {
		expect(
			layFaults(
				result.placements.map((p) => p.points),
				problem.width,
				result.length,
				0.01
			)
		).toEqual([]);
		const density = itemArea(inst) / (inst.height * result.length);
		expect(density).toBeGreaterThan(0.5);
		expect(density).toBeLessThanOrEqual(1);
	});

	it('the check itself finds an overlap of a square millimetre and a piece past the strip', () => {
		const sq = (x: number, y: number) => [
			{ x, y },
			{ x: x + 1, y },
			{ x: x + 1, y: y + 1 },
			{ x, y: y + 1 }
		];
		expect(layFaults([sq(0, 0), sq(0.9, 0.9)], 5, 5, 0.01).map((f) => f.kind)).toEqual(['overlap']);
		expect(layFaults([sq(0, 0), sq(1, 0)], 5, 5, 0.01)).toEqual([]);
		expect(layFaults([sq(0, 0), sq(1.3, 0)], 5, 5, 0.01, 1e4, 0.5).map((f) => f.kind)).toEqual(['overlap']);
		expect(layFaults([sq(0, 4.5)], 5, 5, 0.01).map((f) => f.kind)).toEqual(['outside']);
	});

	it('keeps the gap asked for between pieces', () => {
		const spaced = nest({ ...problem, gap: 0.5 }, { evaluations: 20 });
		expect(
			layFaults(
				spaced.placements.map((p) => p.points),
				problem.width,
				spaced.length,
				0.01,
				1e4,
				0.5
			)
		).toEqual([]);
	});

	it('gives the same lay for the same seed and number of lays tried', () => {
		const again = nest(problem, { evaluations: 60, seed: 3 });
		expect(again.placements.map((p) => [p.key, p.variant, p.dx, p.dy])).toEqual(
			result.placements.map((p) => [p.key, p.variant, p.dx, p.dy])
		);
	});

	it('puts a fold piece on the fold (y = 0) and refuses a piece wider than the strip', () => {
		const square = [
			{ x: 0, y: 0 },
			{ x: 4, y: 0 },
			{ x: 4, y: 4 },
			{ x: 0, y: 4 }
		];
		const r = nest({
			width: 10,
			items: [
				{ key: 'a', variants: [{ name: '0', points: square }] },
				{ key: 'f', atFold: true, variants: [{ name: '0', points: square.map((q) => ({ x: q.x + 50, y: q.y + 7 })) }] }
			]
		});
		const fold = r.placements.find((p) => p.key === 'f')!;
		expect(Math.min(...fold.points.map((q) => q.y))).toBeCloseTo(0, 9);
		const wide: NestProblem = { width: 3, items: [{ key: 'w', variants: [{ name: '0', points: square }] }] };
		expect(() => nest(wide)).toThrow(NestInputError);
	});

	it('lays random polygons without overlaps (property, small sizes)', () => {
		const poly = fc
			.array(fc.tuple(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 8 })), { minLength: 3, maxLength: 7 })
			.map((pts) => {
				// A star-shaped polygon: points sorted by angle about their centre.
				const cx = pts.reduce((a, p) => a + p[0], 0) / pts.length;
				const cy = pts.reduce((a, p) => a + p[1], 0) / pts.length;
				const sorted = [...pts].sort((a, b) => Math.atan2(a[1] - cy, a[0] - cx) - Math.atan2(b[1] - cy, b[0] - cx));
				return sorted.map(([x, y]) => ({ x, y }));
			});
		fc.assert(
			fc.property(fc.array(poly, { minLength: 1, maxLength: 6 }), fc.boolean(), (polys, turns) => {
				const items = polys
					.filter(
						(p) =>
							Math.abs(p.reduce((a, q, i) => a + q.x * p[(i + 1) % p.length].y - p[(i + 1) % p.length].x * q.y, 0)) > 1
					)
					.map((p, i) => ({
						key: String(i),
						variants: (turns ? [0, 180] : [0]).map((d) => ({ name: String(d), points: rotated(p, d) }))
					}));
				if (!items.length) return;
				const r = nest({ width: 12, items, gap: 0 }, { evaluations: 8 });
				expect(r.placements).toHaveLength(items.length);
				expect(
					layFaults(
						r.placements.map((p) => p.points),
						12,
						r.length,
						0.01
					)
				).toEqual([]);
			}),
			{ numRuns: 40 }
		);
	});

	it('compaction shortens the lay, overlaps nothing, keeps the ways allowed, and repeats for a seed and move count', () => {
		const plain = nest(problem, { evaluations: 30, seed: 5 });
		const compacted = nest(problem, { evaluations: 30, seed: 5, compaction: 0.5, compactionMoves: 4000 });
		expect(compacted.moves).toBeGreaterThan(0);
		expect(compacted.length).toBeLessThan(plain.length);
		expect(layFaults(compacted.placements.map((p) => p.points), problem.width, compacted.length, 0.01)).toEqual([]);
		const json = placementsJson(inst, compacted);
		for (const p of json.placements) expect(inst.items.find((it) => it.id === p.item)!.rotations).toContain(p.rotation);
		expect(json.placements).toHaveLength(10);
		const again = nest(problem, { evaluations: 30, seed: 5, compaction: 0.5, compactionMoves: 4000 });
		expect(again.placements.map((p) => [p.key, p.variant, p.dx, p.dy])).toEqual(
			compacted.placements.map((p) => [p.key, p.variant, p.dx, p.dy])
		);
		// Going on from a lay (the sliced searches): never longer, still sound.
		const more = compactLay(problem, plain, { moves: 2000, seed: 9 });
		expect(more.length).toBeLessThanOrEqual(plain.length);
		expect(layFaults(more.placements.map((p) => p.points), problem.width, more.length, 0.01)).toEqual([]);
	});

	it('compaction keeps the gap and a fold piece on the fold (property, random polygons)', () => {
		const poly = fc
			.array(fc.tuple(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 8 })), { minLength: 3, maxLength: 7 })
			.map((pts) => {
				const cx = pts.reduce((a, p) => a + p[0], 0) / pts.length;
				const cy = pts.reduce((a, p) => a + p[1], 0) / pts.length;
				return [...pts]
					.sort((a, b) => Math.atan2(a[1] - cy, a[0] - cx) - Math.atan2(b[1] - cy, b[0] - cx))
					.map(([x, y]) => ({ x, y }));
			});
		fc.assert(
			fc.property(fc.array(poly, { minLength: 2, maxLength: 7 }), fc.integer({ min: 1, max: 1000 }), (polys, seed) => {
				const items = polys
					.filter(
						(p) =>
							Math.abs(p.reduce((a, q, i) => a + q.x * p[(i + 1) % p.length].y - p[(i + 1) % p.length].x * q.y, 0)) > 1
					)
					.map((p, i) => ({
						key: String(i),
						atFold: i === 0,
						variants: [0, 180].map((d) => ({ name: String(d), points: rotated(p, d) }))
					}));
				if (items.length < 2) return;
				const r = nest({ width: 14, items, gap: 0.5 }, { evaluations: 6, seed, compaction: 0.5, compactionMoves: 600 });
				expect(r.placements).toHaveLength(items.length);
				expect(layFaults(r.placements.map((p) => p.points), 14, r.length, 0.01, 1e4, 0.5)).toEqual([]);
				const fold = r.placements.find((p) => p.key === '0')!;
				expect(Math.min(...fold.points.map((q) => q.y))).toBeCloseTo(0, 9);
			}),
			{ numRuns: 40 }
		);
	});

	it('reads the instance forms and refuses bad files with a clear message', () => {
		expect(() => readInstance({ items: [] })).toThrow(/strip_height/);
		expect(() => readInstance({ strip_height: 10, items: [{ demand: 1, shape: { type: 'circle' } }] })).toThrow(
			/not one this command reads/
		);
		expect(() =>
			readInstance({
				strip_height: 10,
				items: [
					{
						demand: 1,
						shape: {
							type: 'simple_polygon',
							data: [
								[0, 0],
								[1, 1]
							]
						}
					}
				]
			})
		).toThrow(/three/);
		const holes = readInstance({
			strip_height: 10,
			items: [
				{
					shape: {
						type: 'polygon',
						data: {
							outer: [
								[0, 0],
								[4, 0],
								[4, 4],
								[0, 4]
							],
							inner: []
						}
					}
				}
			]
		});
		expect(holes.items[0]).toMatchObject({ demand: 1, rotations: [0, 90, 180, 270] });
	});
});
