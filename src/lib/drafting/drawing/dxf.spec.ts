// The DXF read back by an independent reader, dxf-parser (npm): what a cutting table or CAD program would
// find in it, compared with the engine's own pieces.
import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { draftSkirt } from '../index';
import { pathLength, pointAt, type Point } from '../geometry';
import { blockName, CURVE_TOLERANCE_CM, DXF_LAYER, DXF_LETTER, flattenWithin, pieceText, piecesToDxf, worstGap } from './dxf';

const size12 = { waist: 68, hip: 94, length: 62, waistToHip: 20.6 };

type V = { x: number; y: number };
type Entity = { type: string; layer: string; vertices?: V[]; shape?: boolean; text?: string; name?: string; position?: V; };
type Parsed = { header: Record<string, unknown>; tables: { layer: { layers: Record<string, unknown> } }; blocks: Record<string, { entities?: Entity[] }>; entities: Entity[] };

const parse = (text: string) => new DxfParser().parseSync(text) as unknown as Parsed;
const perimeter = (vs: V[]) => vs.reduce((s, v, i) => s + Math.hypot(vs[(i + 1) % vs.length].x - v.x, vs[(i + 1) % vs.length].y - v.y), 0);

const cases = [
	{ label: 'straight with lining and pockets', choice: { style: 'straight' as const, lining: true, pockets: true } },
	{ label: 'six gores', choice: { style: 'gored' as const } },
	{ label: 'full circle with facings', choice: { style: 'full-circle' as const, waistband: 'facing' as const } }
];

describe('the open DXF, read back with dxf-parser', () => {
	for (const c of cases) {
		it(`${c.label}: millimetres, one block per piece inserted once, boundary perimeter within 0.5 mm of the cutting line`, () => {
			const draft = draftSkirt(size12, c.choice);
			const pieces = draft.pieces.map((piece) => ({ piece }));
			const dxf = parse(piecesToDxf({ orderNumber: 'Q-TEST-1', styleName: 'Test', pieces }));
			// $INSUNITS 4 = millimetres in the DXF reference's unit codes.
			expect(dxf.header.$INSUNITS).toBe(4);
			const inserts = dxf.entities.filter((e) => e.type === 'INSERT');
			expect(inserts.map((e) => e.name).sort()).toEqual(pieces.map((p) => blockName('Q-TEST-1', p)).sort());
			for (const { piece } of pieces) {
				const block = dxf.blocks[blockName('Q-TEST-1', { piece })];
				const ents = block.entities ?? [];
				const on = (layer: string, type?: string) => ents.filter((e) => e.layer === layer && (!type || e.type === type));
				// Layer 1: exactly one closed boundary, the cutting line, in mm.
				const boundary = on(DXF_LAYER.boundary, 'LWPOLYLINE');
				expect(boundary).toHaveLength(1);
				expect(boundary[0].shape).toBe(true);
				const cutMm = pathLength(piece.cutting.segments) * 10;
				expect(Math.abs(perimeter(boundary[0].vertices!) - cutMm), piece.name).toBeLessThan(0.5);
				// Layer 14: the seam line, closed, its length the engine's too.
				const sew = on(DXF_LAYER.sew, 'LWPOLYLINE');
				expect(sew).toHaveLength(1);
				expect(Math.abs(perimeter(sew[0].vertices!) - pathLength(piece.seam.segments) * 10)).toBeLessThan(0.5);
				// Layer 7: one grain line as long as the engine's.
				const grain = on(DXF_LAYER.grain);
				expect(grain.map((e) => e.type)).toEqual(['LINE']);
				const g = grain[0];
				const [g0, g1] = g.vertices!;
				expect(Math.hypot(g1.x - g0.x, g1.y - g0.y)).toBeCloseTo(Math.hypot(piece.grain.to.x - piece.grain.from.x, piece.grain.to.y - piece.grain.from.y) * 10, 1);
				// Layer 6: the mirror line only on a piece cut on the fold.
				expect(on(DXF_LAYER.mirror)).toHaveLength(piece.fold ? 1 : 0);
				// Layer 4: one cut per notch, two for a double notch.
				expect(on(DXF_LAYER.notch, 'LINE')).toHaveLength(piece.notches.reduce((s, n) => s + (n.double ? 2 : 1), 0));
				// Layer 8: each dart's legs and each marking line; layer 13 a drill hole per dart.
				expect(on(DXF_LAYER.internal)).toHaveLength(piece.darts.length + piece.lines.filter((l) => l.points.length >= 2).length);
				expect(on(DXF_LAYER.drill, 'POINT')).toHaveLength(piece.darts.length);
				// Layers 2 and 3: every boundary vertex is a turn or a curve point.
				expect(on(DXF_LAYER.turn, 'POINT').length + on(DXF_LAYER.curve, 'POINT').length).toBe(boundary[0].vertices!.length);
				expect(on(DXF_LAYER.turn, 'POINT').length).toBeGreaterThanOrEqual(3);
				// Layer 1 text: name and quantity; layer 15: the cut instruction and the order number.
				const words = (layer: string) => on(layer, 'TEXT').map((e) => e.text);
				expect(words(DXF_LAYER.boundary)).toEqual([`Piece Name: ${piece.name}`, `Quantity: ${piece.cut.count}`]);
				expect(words(DXF_LAYER.annotation)).toContain('Order Q-TEST-1');
				expect(words(DXF_LAYER.annotation).some((t) => t?.startsWith(piece.cutText))).toBe(true);
				// No layer the convention does not give.
				const used = new Set(ents.map((e) => e.layer));
				for (const l of used) expect(Object.values(DXF_LAYER)).toContain(l);
			}
		});
	}

	it('keeps curves within 0.1 mm of the engine Béziers, without needless points', () => {
		const draft = draftSkirt(size12, { style: 'full-circle' });
		let curves = 0;
		for (const piece of draft.pieces)
			for (const s of piece.cutting.segments) {
				if (s.kind !== 'cubic') continue;
				curves++;
				const { points } = flattenWithin([s]);
				const poly: Point[] = [...points, s.to];
				expect(worstGap(s, poly)).toBeLessThanOrEqual(CURVE_TOLERANCE_CM + 1e-9);
				// Adaptive: a gently curved stretch is not cut into hundreds of chords.
				expect(poly.length).toBeLessThan(400);
				expect(poly[0]).toEqual(pointAt(s, 0));
			}
		expect(curves).toBeGreaterThan(0);
	});

	it('places pieces side by side without overlap and writes the order in the header text', () => {
		const draft = draftSkirt(size12, { style: 'straight' });
		const dxf = parse(piecesToDxf({ orderNumber: 'Q-TEST-2', styleName: 'Straight skirt', pieces: draft.pieces.map((piece) => ({ piece })) }));
		const xs = dxf.entities.filter((e) => e.type === 'INSERT').map((e) => e.position!.x);
		expect(new Set(xs).size).toBe(xs.length);
		const header = dxf.entities.filter((e) => e.type === 'TEXT').map((e) => e.text);
		expect(header).toContain('Style Name: Q-TEST-2 Straight skirt');
		expect(header).toContain('Units: METRIC');
		expect(Object.keys(dxf.tables.layer.layers)).toEqual(expect.arrayContaining(Object.values(DXF_LAYER)));
	});
});

describe('the DXF words', () => {
	// A CAD font sets a letter some 0.6 of the text's em wide (its cap height is 0.7 em), wider than Lora:
	// the stack is placed for that width (common practice for the plain CAD fonts; from memory).
	const across = (t: ReturnType<typeof pieceText>[number]) => [...t.text].length * t.size * DXF_LETTER;
	for (const c of [...cases, { label: 'six gores, lined, with pockets', choice: { style: 'gored' as const, lining: true, pockets: true } }])
		it(`${c.label}: every line of each piece's words lies inside its seam line and off its grain line`, () => {
			for (const piece of draftSkirt(size12, c.choice).pieces) {
				const seam = flattenWithin(piece.seam.segments).points;
				const inside = (q: Point) => {
					let n = false;
					for (let i = 0, j = seam.length - 1; i < seam.length; j = i++)
						if (seam[i].y > q.y !== seam[j].y > q.y && q.x < ((seam[j].x - seam[i].x) * (q.y - seam[i].y)) / (seam[j].y - seam[i].y) + seam[i].x) n = !n;
					return n;
				};
				const g = piece.grain;
				for (const t of pieceText(piece, 'QL-1005')) {
					const rad = (t.angle * Math.PI) / 180;
					const [ux, uy] = [Math.cos(rad), Math.sin(rad)];
					const [w, h] = [across(t) / 2, (t.size * 0.7) / 2];
					const corners = [
						[-w, -h],
						[w, -h],
						[w, h],
						[-w, h]
					].map(([a, b]) => ({ x: t.at.x + a * ux - b * uy, y: t.at.y + a * uy + b * ux }));
					for (const q of corners) expect(inside(q), `${piece.name}: “${t.text}”`).toBe(true);
					// Off the grain line: the line's middle stretch does not pass through the text's box.
					const xs = corners.map((q) => q.x);
					const ys = corners.map((q) => q.y);
					const hit = [0.3, 0.4, 0.5, 0.6, 0.7].some((k) => {
						const q = { x: g.from.x + (g.to.x - g.from.x) * k, y: g.from.y + (g.to.y - g.from.y) * k };
						return q.x > Math.min(...xs) && q.x < Math.max(...xs) && q.y > Math.min(...ys) && q.y < Math.max(...ys);
					});
					expect(hit, `${piece.name}: “${t.text}” on the grain line`).toBe(false);
				}
			}
		});
});
