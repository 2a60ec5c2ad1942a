import { describe, expect, it } from 'vitest';
import { draftSkirt } from '../draft';
import { resolveRules } from '../rules';
import { cellName, itemOf, narrowestStrip, outlineMeets, packSheets, packStrip, planTiles, rowLetter, spotMap, stripOutlines, PIECE_PAD } from './tiles';

const rules = resolveRules({});
const drafts = {
	straight: draftSkirt({ waist: 88, hip: 112, length: 72, waistToHip: 21.5 }, { style: 'straight', lining: true }, rules),
	gored: draftSkirt({ waist: 72, hip: 98, length: 70, waistToHip: 20.5 }, { style: 'gored', lining: true, pockets: true }, rules),
	circle: draftSkirt({ waist: 64, hip: 88, length: 55, waistToHip: 18 }, { style: 'full-circle' }, rules)
};

const overlap = (a: { x: number; y: number; w: number; h: number }, b: typeof a) => a.x < b.x + b.w - 1e-9 && b.x < a.x + a.w - 1e-9 && a.y < b.y + b.h - 1e-9 && b.y < a.y + a.h - 1e-9;

describe('packing pieces on paper', () => {
	it('puts every piece on the strip, inside its width, none over another', () => {
		for (const d of Object.values(drafts)) {
			const items = d.pieces.map((p, i) => itemOf(String(i), p));
			const plan = packStrip(items, 91.4 - 4)!;
			expect(plan.spots).toHaveLength(items.length);
			for (const [i, s] of plan.spots.entries()) {
				expect(s.x).toBeGreaterThanOrEqual(0);
				expect(s.x + s.w).toBeLessThanOrEqual(plan.width + 1e-9);
				for (const t of plan.spots.slice(i + 1)) expect(overlap(s, t)).toBe(false);
			}
		}
	});

	it('turns a piece a quarter only when it is wider than the strip; none fits below its narrower side', () => {
		const items = drafts.straight.pieces.map((p, i) => itemOf(String(i), p));
		const band = items.find((_, i) => drafts.straight.pieces[i].role === 'waistband')!;
		const plan = packStrip([band], 60)!;
		expect(plan.spots[0].turned).toBe(false);
		expect(packStrip(items, narrowestStrip(items) - 0.1)).toBeNull();
		expect(packStrip(items, narrowestStrip(items))).not.toBeNull();
	});

	it('puts each piece whole on one sheet, with sheets of limited height', () => {
		const items = drafts.circle.pieces.map((p, i) => itemOf(String(i), p));
		const sheets = packSheets(items, 80.1, 98.9)!;
		expect(sheets.flatMap((s) => s.spots.filter(Boolean))).toHaveLength(items.length);
		for (const s of sheets) for (const sp of s.spots.filter(Boolean)) expect(sp.y + sp.h).toBeLessThanOrEqual(98.9 + 1e-9);
	});

	it('maps a piece into its spot with its padding, turned or not, keeping its size', () => {
		const p = drafts.straight.pieces[0];
		for (const turned of [false, true]) {
			const f = spotMap(p, { key: '0', x: 10, y: 20, w: 0, h: 0, turned });
			const pts = [f({ x: p.bounds.minX, y: p.bounds.minY }), f({ x: p.bounds.maxX, y: p.bounds.maxY })];
			const [w, h] = [Math.abs(pts[1].x - pts[0].x), Math.abs(pts[1].y - pts[0].y)];
			const [bw, bh] = [p.bounds.maxX - p.bounds.minX, p.bounds.maxY - p.bounds.minY];
			expect([w, h]).toEqual(turned ? [bh, bw] : [bw, bh]);
			expect(Math.min(pts[0].x, pts[1].x)).toBeCloseTo(10 + PIECE_PAD, 9);
		}
	});
});

describe('tiles', () => {
	it('names rows by letter and columns by number: A1, B3, Z1, AA2', () => {
		expect(cellName({ row: 0, col: 0 })).toBe('A1');
		expect(cellName({ row: 1, col: 2 })).toBe('B3');
		expect(rowLetter(25)).toBe('Z');
		expect(rowLetter(26)).toBe('AA');
	});

	it('finds an outline in a rectangle by an edge through it or by lying all round it', () => {
		const sq = [
			{ x: 0, y: 0 },
			{ x: 10, y: 0 },
			{ x: 10, y: 10 },
			{ x: 0, y: 10 }
		];
		expect(outlineMeets(sq, 5, 5, 20, 20)).toBe(true);
		expect(outlineMeets(sq, 2, 2, 4, 4)).toBe(true);
		expect(outlineMeets(sq, 11, 0, 20, 10)).toBe(false);
	});

	it('leaves out cells nothing lies on, and covers every piece with the cells it keeps', () => {
		for (const d of Object.values(drafts)) {
			const plan = planTiles(d.pieces, 17.4, 25.2)!;
			expect(plan.cells.length).toBeLessThanOrEqual(plan.rows * plan.cols);
			const outlines = stripOutlines(d.pieces, plan.strip);
			// Every point of every cutting line is on a kept cell.
			for (const o of outlines)
				for (const q of o) {
					const [col, row] = [Math.floor(q.x / plan.cellW), Math.floor(q.y / plan.cellH)];
					expect(plan.cells.some((c) => c.row === row && c.col === col), `${q.x},${q.y}`).toBe(true);
				}
			// No kept cell is empty.
			for (const c of plan.cells) expect(outlines.some((o) => outlineMeets(o, c.x, c.y, c.x + plan.cellW, c.y + plan.cellH))).toBe(true);
		}
	});

	it('needs no more pages than the pieces’ boxes take, laid edge to edge, plus half again (packing bound)', () => {
		for (const d of Object.values(drafts)) {
			const plan = planTiles(d.pieces, 17.4, 25.2)!;
			const area = d.pieces.reduce((a, p) => a + (p.bounds.maxX - p.bounds.minX) * (p.bounds.maxY - p.bounds.minY), 0);
			expect(plan.cells.length).toBeLessThanOrEqual(Math.ceil((1.5 * area) / (17.4 * 25.2)) + 4);
		}
	});
});
