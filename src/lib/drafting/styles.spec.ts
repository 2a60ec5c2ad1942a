import { describe, expect, it } from 'vitest';
import { segmentLength, type Segment } from './geometry';
import { circleWaistRadius, DEFAULT_RULES_INCH, draftSkirt, type Draft, type Piece } from './index';

const size12 = { waist: 68, hip: 94, length: 58.5, waistToHip: 20.6 };
const edgeLength = (p: Piece, edge: Segment['edge']) => p.seam.segments.filter((s) => s.edge === edge).reduce((a, s) => a + segmentLength(s), 0);
const piece = (d: Draft, id: string) => {
	const p = d.pieces.find((x) => x.id === id);
	if (!p) throw new Error(`no piece ${id} in ${d.pieces.map((x) => x.id).join(', ')}`);
	return p;
};
const cuts = (d: Draft) => Object.fromEntries(d.pieces.map((p) => [p.id, p.cutText]));

describe('straight skirt', () => {
	it('is cut front on the fold, back as a pair with the zip seam, and a waistband', () => {
		const d = draftSkirt(size12);
		expect(cuts(d)).toEqual({ front: 'Cut 1 on the fold', back: 'Cut 2 (a pair)', waistband: 'Cut 1' });
		// Allowances (house rules; TRADE.md: 1.5 cm European seams, ≈ 2 cm at a zip, hem 2.5–4 cm).
		expect(piece(d, 'back').allowances).toMatchObject({ waist: 1.5, side: 1.5, centre: 2, hem: 4 });
		expect(piece(d, 'front').allowances).toMatchObject({ fold: 0, side: 1.5, hem: 4 });
		expect(d.figures.hemGirth).toBe(94 + 4);
	});

	it('gets a back vent past the knee, not above it, and none in a stretch fabric (TRADE.md: vent 15–30 cm, extension 3–4)', () => {
		const long = draftSkirt({ ...size12, length: 70 });
		expect(piece(long, 'back').allowances.vent).toBe(1.5);
		expect(long.choice.vent).toBe('vent');
		expect(long.choice.ventLength).toBe(20);
		expect(long.warnings).toContain('Your skirt passes the knee, so it has a back vent to walk in.');
		const xs = piece(long, 'back').seam.segments.filter((s) => s.edge === 'vent').flatMap((s) => [s.from.x, s.to.x]);
		expect(Math.min(...xs)).toBeCloseTo(-4, 9);
		expect(draftSkirt({ ...size12, length: 55 }).choice.vent).toBe('none');
		expect(draftSkirt({ ...size12, length: 70 }, { stretch: true }).choice.vent).toBe('none');
		const kick = piece(draftSkirt({ ...size12, length: 70 }, { vent: 'kick-pleat' }), 'back');
		expect(Math.min(...kick.seam.segments.filter((s) => s.edge === 'vent').map((s) => s.from.x))).toBeCloseTo(-6, 9);
		expect(kick.labels.map((l) => l.text)).toContain('Kick pleat: stitch the extensions together, press to one side');
	});

	it('cuts the back on the fold with a side zip, its centre back take-in going into the darts', () => {
		const d = draftSkirt({ waist: 100, hip: 128, length: 55, waistToHip: 22 }, { closure: { position: 'side' } });
		expect(piece(d, 'back').cut).toEqual({ count: 1, onFold: true });
		expect(d.figures.back.centreShaping).toBe(0);
		// The whole 4 cm back allowance is dart now: more than 3.5, so two darts of 2.
		expect(d.figures.back.darts.map((x) => x.intake)).toEqual([2, 2]);
		expect(piece(d, 'front').allowances.side).toBe(2);
		expect(piece(d, 'front').notches.some((n) => n.label === 'zip (left side)')).toBe(true);
	});
});

describe('pencil skirt', () => {
	it('takes the hem in at the side seams and always has a vent in a woven', () => {
		const d = draftSkirt(size12, { style: 'pencil' });
		const below = 58.5 - 20.6;
		// Four side-seam edges each taken in by 0.065 cm a cm below the hip line (house rule).
		expect(d.exactFigures.hemGirth).toBeCloseTo(94 + 4 - 4 * 0.065 * below, 0);
		expect(d.choice.vent).toBe('vent');
		const forced = draftSkirt(size12, { style: 'pencil', vent: 'none' });
		expect(forced.choice.vent).toBe('vent');
		expect(forced.warnings).toContain('A pencil skirt needs a vent to walk in, so we added one.');
		expect(draftSkirt(size12, { style: 'pencil', stretch: true }).choice.vent).toBe('none');
	});

	it('keeps front and back side seams the same length below the hip', () => {
		const d = draftSkirt(size12, { style: 'pencil' });
		expect(Math.abs(edgeLength(piece(d, 'front'), 'side') - edgeLength(piece(d, 'back'), 'side'))).toBeLessThan(0.5 + 1e-6);
	});
});

describe('A-line skirt', () => {
	it('closes the side-most dart into flare at the hem and adds the rest at the side', () => {
		const d = draftSkirt(size12, { style: 'a-line' });
		const below = 58.5 - 20.6;
		// House rule: each panel flares 0.15 cm a cm below the hip line at the hem.
		expect(d.exactFigures.hemGirth).toBeGreaterThan(94 + 4 + 4 * 0.15 * below - 1.5);
		expect(d.exactFigures.hemGirth).toBeLessThan(94 + 4 + 4 * 0.15 * below + 1.5);
		// The dart is partly closed: what is left is smaller than the block's.
		for (const id of ['front', 'back']) {
			const left = piece(d, id).darts.reduce((s, x) => s + x.intake, 0);
			expect(left).toBeLessThan(3);
		}
		expect(Math.abs(edgeLength(piece(d, 'front'), 'side') - edgeLength(piece(d, 'back'), 'side'))).toBeLessThan(1);
	});
});

describe('circle skirts', () => {
	// TRADE.md, circle geometry: r = W / θ; for W = 68 cm full 10.82, ¾ 14.43, half 21.65, quarter 43.29.
	it('gives the published waist radii for W = 68', () => {
		expect(circleWaistRadius(68, 2 * Math.PI)).toBeCloseTo(10.82, 2);
		expect(circleWaistRadius(68, 1.5 * Math.PI)).toBeCloseTo(14.43, 2);
		expect(circleWaistRadius(68, Math.PI)).toBeCloseTo(21.65, 2);
		expect(circleWaistRadius(68, Math.PI / 2)).toBeCloseTo(43.29, 2);
		const noEase = { ease: { waist: { front: 0, back: 0 } } };
		expect(draftSkirt({ ...size12, waist: 68 }, { style: 'full-circle' }, noEase).figures.waistRadius).toBe(10.8);
		expect(draftSkirt({ ...size12, waist: 68 }, { style: 'half-circle' }, noEase).exactFigures.waistRadius).toBeCloseTo(21.65, 2);
	});

	it('sets the waist seam to W + 4 × waist ease and the hem to θ (r + length)', () => {
		const full = draftSkirt(size12, { style: 'full-circle' });
		const r = (68 + 2) / (2 * Math.PI);
		expect(full.exactFigures.waistRadius).toBeCloseTo(r, 9);
		expect(full.exactFigures.hemGirth).toBeCloseTo(2 * Math.PI * (r + 58.5), 2);
		const front = piece(full, 'front');
		expect(edgeLength(front, 'waist') * 2).toBeCloseTo((68 + 2) / 2, 3);
		expect(front.cut).toEqual({ count: 1, onFold: true });
		expect(piece(full, 'back').cut).toEqual({ count: 2, onFold: false });
		expect(front.allowances.hem).toBe(1.5);
		const half = draftSkirt(size12, { style: 'half-circle' });
		expect(half.exactFigures.hemGirth).toBeCloseTo(Math.PI * ((68 + 2) / Math.PI + 58.5), 2);
		expect(half.warnings).toEqual([]);
	});
});

describe('six-gore skirt', () => {
	it('has six panels whose seams match and whose waist makes the block waist', () => {
		const d = draftSkirt(size12, { style: 'gored' });
		expect(cuts(d)).toEqual({
			'centre-front': 'Cut 1 on the fold',
			'side-front': 'Cut 2 (a pair)',
			'centre-back': 'Cut 2 (a pair)',
			'side-back': 'Cut 2 (a pair)',
			waistband: 'Cut 1'
		});
		for (const side of ['front', 'back']) {
			const c = piece(d, `centre-${side}`);
			const s = piece(d, `side-${side}`);
			expect(edgeLength(c, 'gore')).toBeCloseTo(edgeLength(s, 'gore'), 6);
			const waist = edgeLength(c, 'waist') + edgeLength(s, 'waist');
			expect(waist).toBeCloseTo(side === 'front' ? d.exactFigures.check.waistSeam.front : d.exactFigures.check.waistSeam.back, 6);
		}
		expect(d.exactFigures.hemGirth).toBeGreaterThan(94 + 4 + 10);
	});
});

describe('options', () => {
	it('facings follow the waist with the darts closed', () => {
		const d = draftSkirt(size12, { waistband: 'facing' });
		expect(d.pieces.map((p) => p.id)).toEqual(['front', 'back', 'front-facing', 'back-facing']);
		expect(edgeLength(piece(d, 'front-facing'), 'waist')).toBeCloseTo(d.exactFigures.check.waistSeam.front, 6);
		expect(edgeLength(piece(d, 'back-facing'), 'waist')).toBeCloseTo(d.exactFigures.check.waistSeam.back, 6);
		expect(piece(d, 'front-facing').cut.onFold).toBe(true);
	});

	it('the waistband is the whole waist plus the underlap, twice the finished width', () => {
		const b = piece(draftSkirt(size12), 'waistband');
		expect(edgeLength(b, 'band-edge') / 2).toBeCloseTo(68 + 2 + 3.5, 9);
		expect(edgeLength(b, 'band-end') / 2).toBeCloseTo(7, 9);
		expect(b.notches.map((n) => n.label)).toEqual(['side', 'CF', 'side', 'CB']);
	});

	it('lining pieces are cut from lining, 2.5 cm shorter; pocket bags come four to a skirt', () => {
		const d = draftSkirt(size12, { lining: true, pockets: true });
		const lining = piece(d, 'front-lining');
		expect(lining.fabric).toBe('lining');
		expect(edgeLength(piece(d, 'front'), 'side') - edgeLength(lining, 'side')).toBeCloseTo(2.5, 6);
		expect(lining.allowances.hem).toBe(3);
		expect(piece(d, 'pocket-bag').cut).toEqual({ count: 4, onFold: false });
		expect(piece(d, 'front').notches.filter((n) => n.label === 'pocket')).toHaveLength(2);
		expect(piece(d, 'back').notches.filter((n) => n.label === 'pocket')).toHaveLength(2);
	});

	it('chooses a zip long enough to pass the hip, and takes the hem depth asked for', () => {
		expect(draftSkirt(size12).choice.closure).toEqual({ kind: 'zip', position: 'centre-back', length: 20 });
		expect(draftSkirt(size12, { closure: { kind: 'invisible-zip' } }).choice.closure.length).toBe(22);
		expect(draftSkirt({ ...size12, waistToHip: 28, length: 70 }).choice.closure.length).toBe(26);
		expect(piece(draftSkirt(size12, { hemDepth: 6 }), 'front').allowances.hem).toBe(6);
	});

	it('a shop working in inches cuts ⅝″ seams (TRADE.md: US commercial patterns)', () => {
		const d = draftSkirt(size12, {}, DEFAULT_RULES_INCH);
		expect(piece(d, 'front').allowances.side).toBeCloseTo(1.5875, 12);
	});
});
