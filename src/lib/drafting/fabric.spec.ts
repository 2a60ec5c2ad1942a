import ClipperLib from 'clipper-lib';
import { describe, expect, it } from 'vitest';
import { type Point } from './geometry';
import { flatten, polygonArea } from './outline';
import { DraftInputError, draftSkirt, estimateFabric, type Draft } from './index';

// TRADE.md: handbook size 12 is waist 68, hip 94, waist to hip 20.6, waist to knee 58.5 [from memory].
const knee = { waist: 68, hip: 94, length: 58.5, waistToHip: 20.6 };
const YARD = 91.44;
const plain = (width: number) => ({ width, nap: false, shrinkage: 0 });
const buy = (d: Draft, width: number, more: Partial<{ nap: boolean; shrinkage: number }> = {}) => estimateFabric(d, { ...plain(width), ...more }).length;

/** Area of every piece as cut (a fold piece opened out counts twice, a pair twice). */
const cutArea = (d: Draft) =>
	d.pieces.filter((p) => p.fabric === 'shell').reduce((s, p) => s + Math.abs(polygonArea(flatten(p.cutting.segments, 2))) * (p.cut.onFold ? 2 : p.cut.count), 0);

describe('fabric estimate against the rules of thumb (TRADE.md; bounds, not the method)', () => {
	it('a knee-length straight or pencil skirt: about 1 m at 150 cm and 1.5 m at 110 cm', () => {
		// Metric rules of thumb: pencil 1.5 m at 110 cm or 1 m at 150 cm.
		for (const style of ['straight', 'pencil'] as const) {
			const d = draftSkirt(knee, { style });
			expect(buy(d, 150)).toBeLessThanOrEqual(100);
			expect(buy(d, 150)).toBeGreaterThanOrEqual(75);
			expect(buy(d, 110)).toBeLessThanOrEqual(150);
			expect(buy(d, 110)).toBeGreaterThanOrEqual(110);
		}
	});

	it('a straight skirt within the general sewing handbook’s 2 yd at 36 in and 1⅝ yd at 45 in', () => {
		const d = draftSkirt(knee);
		expect(buy(d, 36 * 2.54)).toBeLessThanOrEqual(2 * YARD);
		expect(buy(d, 45 * 2.54)).toBeLessThanOrEqual(1.625 * YARD);
	});

	it('an A-line within 2 m at 110 cm and 1.5 m at 150 cm (and 2¼ / 1¾ yd at 36 / 45 in)', () => {
		const d = draftSkirt(knee, { style: 'a-line' });
		expect(buy(d, 110)).toBeLessThanOrEqual(200);
		expect(buy(d, 150)).toBeLessThanOrEqual(150);
		expect(buy(d, 36 * 2.54)).toBeLessThanOrEqual(2.25 * YARD);
		expect(buy(d, 45 * 2.54)).toBeLessThanOrEqual(1.75 * YARD);
	});

	it('a full circle: within 2.5 m at 150 cm and 3 m at 110 cm, never under the pieces’ area', () => {
		// The rules of thumb are what to buy without a lay; a nested lay may need less, never less than the
		// area of the pieces over the width.
		const d = draftSkirt(knee, { style: 'full-circle' });
		expect(buy(d, 150)).toBeLessThanOrEqual(250);
		expect(buy(d, 150) * 150).toBeGreaterThanOrEqual(cutArea(d));
		expect(buy(d, 110)).toBeLessThanOrEqual(300);
	});
});

describe('fabric estimate', () => {
	it('never reports less fabric than the pieces take, and rounds up to the 10 cm sale step', () => {
		for (const style of ['straight', 'a-line', 'half-circle', 'gored'] as const) {
			const d = draftSkirt(knee, { style, pockets: true });
			for (const width of [110, 140, 150]) {
				const e = estimateFabric(d, plain(width));
				expect(e.length % 10).toBe(0);
				expect(e.length * width).toBeGreaterThanOrEqual(cutArea(d));
				expect(e.length).toBeGreaterThanOrEqual(e.layout.layLength + 5);
				expect(e.length).toBeLessThan(e.layout.layLength + 5 + 10);
			}
		}
	});

	it('grows with shrinkage and with a nap, never the other way', () => {
		const d = draftSkirt(knee, { style: 'a-line' });
		const e = estimateFabric(d, { width: 140, nap: false, shrinkage: 6 });
		expect(e.length).toBe(Math.ceil(((e.layout.layLength + 5) * 1.06) / 10) * 10);
		expect(buy(d, 140, { shrinkage: 6 })).toBeGreaterThanOrEqual(buy(d, 140));
		// A-line panels nest when turned end for end; on a napped fabric they may not be.
		expect(buy(d, 140, { nap: true })).toBeGreaterThan(buy(d, 140));
		expect(estimateFabric(d, { width: 140, nap: true, shrinkage: 0 }).layout.pieces.every((p) => p.orientation === 'as-cut' || p.orientation === 'mirrored')).toBe(true);
	});

	it('needs more length on narrower fabric', () => {
		for (const style of ['straight', 'full-circle', 'gored'] as const) {
			const d = draftSkirt(knee, { style });
			const lengths = [90, 110, 115, 140, 150, 160].map((w) => buy(d, w));
			for (let i = 1; i < lengths.length; i++) expect(lengths[i]).toBeLessThanOrEqual(lengths[i - 1]);
		}
	});

	it('lays every piece inside the fabric without overlaps (checked with Clipper)', () => {
		const d = draftSkirt({ ...knee, length: 70 }, { style: 'gored', pockets: true });
		for (const width of [115, 150]) {
			const { layout } = estimateFabric(d, plain(width));
			const S = 100;
			const paths = layout.pieces.map((p) => p.outline.map((q: Point) => ({ X: Math.round(q.x * S), Y: Math.round(q.y * S) })));
			for (const p of layout.pieces) {
				for (const q of p.outline) {
					expect(q.x).toBeGreaterThanOrEqual(-1e-6);
					expect(q.x).toBeLessThanOrEqual(layout.laneWidth + 1e-6);
					expect(q.y).toBeGreaterThanOrEqual(-1e-6);
					expect(q.y).toBeLessThanOrEqual(layout.layLength + 1e-6);
				}
			}
			for (let i = 0; i < paths.length; i++) {
				for (let j = i + 1; j < paths.length; j++) {
					const c = new ClipperLib.Clipper();
					c.AddPath(paths[i], ClipperLib.PolyType.ptSubject, true);
					c.AddPath(paths[j], ClipperLib.PolyType.ptClip, true);
					const out: ClipperLib.Paths = [];
					c.Execute(ClipperLib.ClipType.ctIntersection, out, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
					const overlap = out.reduce((s, path) => s + Math.abs(ClipperLib.Clipper.Area(path)), 0) / S / S;
					expect(overlap, `${layout.pieces[i].name} / ${layout.pieces[j].name} at ${width}`).toBeLessThan(0.05);
				}
			}
		}
	});

	// TRADE.md, circle skirts: a full circle cut in one piece fits a width w only if r + length + hem ≤ w / 2
	// (folded in four). Our quarter on the fold spans exactly r + length + hem across the folded width.
	it('cuts a full-circle quarter on the fold only when r + length + hem fits half the width', () => {
		const side = { style: 'full-circle' as const, closure: { position: 'side' as const } };
		const d = draftSkirt(knee, side);
		const r = d.exactFigures.waistRadius!;
		const across = r + 58.5 + 1.5;
		const front = d.pieces.find((p) => p.id === 'front')!;
		expect(front.bounds.maxX).toBeCloseTo(across, 6);
		const wide = estimateFabric(d, plain(2 * across + 0.2));
		expect(wide.layout.notes.join(' ')).not.toContain('too narrow');
		const narrow = estimateFabric(d, plain(2 * across - 0.2));
		expect(narrow.layout.folded).toBe(false);
		expect(narrow.layout.notes.join(' ')).toContain('too narrow to cut the front and back on the fold');
	});

	it('refuses a fabric too narrow for a piece, naming the width needed', () => {
		const d = draftSkirt({ waist: 120, hip: 130, length: 110, waistToHip: 24 }, { style: 'full-circle' });
		try {
			estimateFabric(d, plain(90));
			expect.unreachable();
		} catch (e) {
			expect(e).toBeInstanceOf(DraftInputError);
			expect((e as DraftInputError).fields[0]).toMatchObject({ field: 'width' });
			expect((e as DraftInputError).fields[0].min).toBeGreaterThan(120);
		}
		expect(() => estimateFabric(d, { width: 150, nap: 'yes' as never, shrinkage: 0 })).toThrow(DraftInputError);
	});

	it('estimates the lining from the lining pieces only', () => {
		const d = draftSkirt(knee, { lining: true });
		const lining = estimateFabric(d, { width: 140, nap: false, shrinkage: 0, fabric: 'lining' });
		expect(lining.layout.pieces.map((p) => p.pieceId).sort()).toEqual(['back-lining', 'front-lining']);
		expect(lining.length).toBeGreaterThan(0);
		expect(estimateFabric(draftSkirt(knee), { width: 140, nap: false, shrinkage: 0, fabric: 'lining' }).length).toBe(0);
	});
});
