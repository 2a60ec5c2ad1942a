import { describe, expect, it } from 'vitest';
import { draftSkirt } from '../draft';
import { drawingToSvg } from '../svg';
import { DRAPE, garmentFigures, garmentView, garmentWords, SEEN } from './garment';
import type { Drawing, Mark } from './model';

const SIZE_12 = { waist: 68, hip: 94, waistToHip: 20.6, length: 60 };

/** Every x and y the marks of one view touch. */
function extent(marks: Mark[]): { minX: number; maxX: number; minY: number; maxY: number } {
	const pts = marks.flatMap((m) => (m.kind === 'path' ? m.parts.flatMap((c) => [c.from, c.to]) : m.kind === 'group' ? [] : []));
	return { minX: Math.min(...pts.map((p) => p.x)), maxX: Math.max(...pts.map((p) => p.x)), minY: Math.min(...pts.map((p) => p.y)), maxY: Math.max(...pts.map((p) => p.y)) };
}

/** The skirt's own outline (the first path filled with the cloth) in a view. */
function skirtOutline(d: Drawing, view: 'front' | 'back') {
	const group = d.marks.find((m) => m.kind === 'group' && m.name === `skirt, ${view}`);
	if (!group || group.kind !== 'group') throw new Error(`no ${view} view`);
	const body = group.marks.find((m) => m.kind === 'path' && m.fillCloth);
	return extent([body!]);
}

describe('garment view', () => {
	it('draws the waist, hip and hem widths in proportion to the draft’s girths', () => {
		const d = draftSkirt(SIZE_12, { style: 'straight' });
		const g = garmentFigures(d);
		// Straight skirt, house method: hip with 1 cm ease a quarter (94 + 4), waist with the waist ease; the hem
		// hangs straight from the hip (TRADE.md, common practice).
		expect(g.fittedHip).toBeCloseTo(98, 6);
		expect(g.hemGirth).toBeCloseTo(98, 1);
		expect(g.waistGirth).toBeCloseTo(2 * (d.exactFigures.check.waistSeam.front + d.exactFigures.check.waistSeam.back), 9);
		expect(g.waistWidth / g.waistGirth).toBeCloseTo(SEEN, 9);
		expect(g.hipWidth / g.hipGirth).toBeCloseTo(SEEN, 9);
		expect(g.hemWidth).toBeCloseTo(g.hipWidth, 1);
		// The drawn outline is as wide as its widest figure and as long as the skirt plus its band.
		const box = skirtOutline(garmentView(d), 'front');
		expect(box.maxX - box.minX).toBeCloseTo(Math.max(g.hipWidth, g.hemWidth), 1);
		expect(box.minY).toBeCloseTo(0, 6);
	});

	it('makes a wider waist, a fuller hip and a wider hem draw wider, in proportion', () => {
		const small = garmentFigures(draftSkirt(SIZE_12, { style: 'a-line' }));
		const large = garmentFigures(draftSkirt({ ...SIZE_12, waist: 88, hip: 114 }, { style: 'a-line' }));
		expect(large.waistWidth - small.waistWidth).toBeCloseTo(SEEN * (large.waistGirth - small.waistGirth), 6);
		expect(large.hipWidth - small.hipWidth).toBeCloseTo(SEEN * (large.hipGirth - small.hipGirth), 6);
		// The A-line's hem flare beyond the hip stands out as hanging cloth: DRAPE / π cm a cm of girth.
		expect(small.hemGirth).toBeGreaterThan(small.fittedHip);
		expect(small.hemWidth - small.hipWidth).toBeCloseTo((DRAPE * (small.hemGirth - small.fittedHip)) / Math.PI, 6);
		// A pencil skirt's hem is taken in: narrower than its hip.
		const pencil = garmentFigures(draftSkirt({ ...SIZE_12, length: 65 }, { style: 'pencil' }));
		expect(pencil.hemWidth).toBeLessThan(pencil.hipWidth);
		expect(pencil.hemWidth / pencil.hemGirth).toBeCloseTo(SEEN, 9);
	});

	it('draws a full circle far wider at the hem than a half circle, from the circle’s own girths', () => {
		const full = draftSkirt(SIZE_12, { style: 'full-circle' });
		const half = draftSkirt(SIZE_12, { style: 'half-circle' });
		const [gf, gh] = [garmentFigures(full), garmentFigures(half)];
		// Hem girth of a full circle = 2π (r + length) (common practice: waist radius = waist seam / 2π).
		expect(gf.hemGirth).toBeCloseTo(2 * Math.PI * (full.exactFigures.waistRadius! + 60), 1);
		expect(gf.waistGirth).toBeCloseTo(2 * Math.PI * full.exactFigures.waistRadius!, 6);
		expect(gf.hemWidth).toBeGreaterThan(gh.hemWidth + 20);
		expect(gf.hipWidth).toBeGreaterThan(gf.waistWidth);
	});

	it('puts the hem at her length against her knee, given or the house’s usual one', () => {
		const given = draftSkirt({ ...SIZE_12, waistToKnee: 62 }, { style: 'straight' });
		const g = garmentFigures(given);
		expect(g.length).toBe(60);
		expect(g.knee).toBe(62);
		const d = garmentView(given);
		const box = skirtOutline(d, 'back');
		expect(box.maxY).toBeGreaterThanOrEqual(60);
		expect(box.maxY).toBeLessThan(60 + 4);
		// Without her knee, the house's usual knee (rules.kneeDepth) is drawn and said to be usual.
		const usual = draftSkirt(SIZE_12, { style: 'straight' }, { kneeDepth: 64 });
		expect(garmentFigures(usual).knee).toBe(64);
		expect(garmentWords(usual)).toMatch(/4 cm above the knee \(a usual knee height\)/);
		expect(garmentWords(draftSkirt({ ...SIZE_12, length: 70, waistToKnee: 58 }, { style: 'straight' }))).toMatch(/12 cm below the knee/);
		// A longer knee lengthens the legs below it: the floor moves down with it.
		expect(garmentFigures(draftSkirt({ ...SIZE_12, waistToKnee: 66 }, { style: 'straight' })).floor).toBeGreaterThan(g.floor);
	});

	it('shows the options: a band or a facing, the back vent, the lining, pockets', () => {
		const banded = draftSkirt({ ...SIZE_12, length: 75 }, { style: 'straight' });
		const band = garmentView(banded);
		const facing = garmentView(draftSkirt({ ...SIZE_12, length: 75 }, { style: 'straight', waistband: 'facing', lining: true, pockets: true }));
		expect(skirtOutline(band, 'front').minY).toBeCloseTo(0, 6);
		const svgBand = drawingToSvg(band, { id: 'b' });
		const svgFacing = drawingToSvg(facing, { id: 'f' });
		expect(svgBand).toContain('a waistband, a back vent');
		expect(svgFacing).toContain('a facing, lined, with pockets, a back vent');
		// The waistband is its own shape above the waist line, filled with the cloth.
		const group = band.marks[0];
		const filled = group.kind === 'group' ? group.marks.filter((m) => m.kind === 'path' && m.fillCloth) : [];
		expect(filled).toHaveLength(2);
		expect(extent([filled[1]]).minY).toBeCloseTo(-banded.rules.waistband.width, 6);
	});

	it('fills with the cloth’s colour, or its swatch image as a pattern over the colour', () => {
		const d = draftSkirt(SIZE_12, { style: 'gored' });
		const plain = drawingToSvg(garmentView(d, { cloth: { colour: '#3F6B4E', name: 'green linen' } }), { id: 'x' });
		expect(plain).toContain('fill="#3F6B4E"');
		expect(plain).not.toContain('<pattern');
		const image = drawingToSvg(garmentView(d, { cloth: { colour: '#3F6B4E', image: '/uploads/12' } }), { id: 'x' });
		expect(image).toContain('<pattern id="cloth-x"');
		expect(image).toContain('href="/uploads/12"');
		expect(image).toContain('fill="url(#cloth-x)"');
		// Nothing but a same-site path or a data URL goes into the markup.
		const hostile = drawingToSvg(garmentView(d, { cloth: { colour: 'red" onload="x', image: 'javascript:alert(1)' } }), { id: 'x' });
		expect(hostile).not.toContain('javascript');
		expect(hostile).not.toContain('onload');
	});
});
