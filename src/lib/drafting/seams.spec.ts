import { describe, expect, it } from 'vitest';
import { flatten, polygonArea } from './outline';
import { DEFAULT_RULES, DEFAULT_RULES_INCH, draftSkirt, pathProblems, toSvg, type Draft, type Piece } from './index';

// Pockets, zips and drawings. Check values: TRADE.md "Allowances, closures, vents" (skirt zip 18–20 cm,
// ≈ 2 cm allowance at a zip seam, 1.5 cm elsewhere) and "Paper and files"; an inch is 2.54 cm exactly
// (international yard and pound agreement, 1959), tapes read to ⅛″.

const size12 = { waist: 68, hip: 94, length: 60, waistToHip: 20.6 };
const piece = (d: Draft, id: string): Piece => {
	const p = d.pieces.find((x) => x.id === id);
	if (!p) throw new Error(`no piece ${id}`);
	return p;
};
const area = (p: Piece) => Math.abs(polygonArea(flatten(p.seam.segments, 2)));
/** Angle (degrees) between the bag's opening edge and its grain line, which runs down the piece. */
const openingSkew = (p: Piece) => {
	const e = p.seam.segments.filter((s) => s.edge === 'bag-seam');
	const a = e[0].from;
	const b = e[e.length - 1].to;
	return Math.abs((Math.atan2(b.x - a.x, Math.abs(b.y - a.y)) * 180) / Math.PI);
};

describe('defect 4: pocket bags follow the seam the style has', () => {
	it('a full circle with pockets gets a bag with area, its opening along its grain', () => {
		const bag = piece(draftSkirt(size12, { style: 'full-circle', pockets: true }), 'pocket-bag');
		expect(pathProblems(bag.seam.segments)).toEqual([]);
		// 16 cm wide (house), the opening 15 cm plus 2 cm each end: well over 150 cm².
		expect(area(bag)).toBeGreaterThan(150);
		expect(openingSkew(bag)).toBeLessThan(1);
	});

	it('a half circle bag is not skewed, and is about the straight skirt’s bag', () => {
		const half = piece(draftSkirt(size12, { style: 'half-circle', pockets: true }), 'pocket-bag');
		const straight = piece(draftSkirt(size12, { style: 'straight', pockets: true }), 'pocket-bag');
		expect(openingSkew(half)).toBeLessThan(1);
		// Within a tenth: the straight skirt's opening follows the hip curve, the circle's is straight.
		expect(Math.abs(area(half) / area(straight) - 1)).toBeLessThan(0.1);
	});
});

describe('defect 5: a side zip and pockets do not share a seam', () => {
	it('the pocket goes in the right side seam only, one pair of bags, and the shopper is told', () => {
		const d = draftSkirt(size12, { closure: { position: 'side' }, pockets: true });
		expect(piece(d, 'pocket-bag').cutText).toBe('Cut 2 (a pair)');
		const labels = piece(d, 'front').notches.map((n) => n.label).filter(Boolean);
		expect(labels).toContain('zip (left side)');
		expect(labels.filter((l) => l?.startsWith('pocket'))).toEqual(['pocket (right side)', 'pocket (right side)']);
		expect(d.warnings).toContain('Your zip is in the left side seam, so your pocket goes in the right side seam only.');
		// Centre back zip: both sides, two pairs, as before.
		expect(piece(draftSkirt(size12, { pockets: true }), 'pocket-bag').cutText).toBe('Cut 4 (two pairs)');
	});
});

describe('defect 10: smaller ones', () => {
	it('a side zip: the right side seam is trimmed back to 1.5 cm, the zip side keeps 2 cm', () => {
		const d = draftSkirt(size12, { closure: { position: 'side' } });
		for (const id of ['front', 'back']) {
			const p = piece(d, id);
			expect(p.allowances.side).toBe(DEFAULT_RULES.allowances.zipSeam);
			const trims = p.lines.filter((l) => l.kind === 'trim-line');
			expect(trims.length).toBeGreaterThan(0);
			// The trim line lies 1.5 cm out from the seam line: at the hem corner, seam x + 1.5.
			const side = p.seam.segments.filter((s) => s.edge === 'side');
			const hemEnd = side.reduce((a, s) => (s.to.y > a.y ? s.to : s.from.y > a.y ? s.from : a), side[0].from);
			const nearest = Math.min(...trims.flatMap((l) => l.points).map((q) => Math.hypot(q.x - hemEnd.x, q.y - hemEnd.y)));
			expect(nearest).toBeCloseTo(1.5, 1);
			expect(p.labels.map((l) => l.text)).toContain('Right side seam: trim to the dashed line beside it; the zip side keeps its allowance');
		}
		expect(piece(draftSkirt(size12), 'front').lines.some((l) => l.kind === 'trim-line')).toBe(false);
	});

	// The block view's grain lines and hip-line words: svg.spec.ts checks them on the drawing model.

	it('in inches every house length is a whole number of eighths, so what a cutter reads is what is drafted', () => {
		const eighth = 2.54 / 8;
		const lengths: [string, number][] = [];
		(function walk(v: unknown, path: string) {
			if (typeof v === 'number') lengths.push([path, v]);
			else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, path ? `${path}.${k}` : k);
		})(DEFAULT_RULES_INCH, '');
		const notLengths = /^(styles|side\.minShare|darts\.(maxAngle|maxCount|backShare|lengthGrowth\.perCm))/;
		const odd = lengths.filter(([p, v]) => !notLengths.test(p) && Math.abs(v / eighth - Math.round(v / eighth)) > 1e-9);
		expect(odd).toEqual([]);
		expect(DEFAULT_RULES_INCH.vent.length).toBeCloseTo(8 * 2.54, 9);
		expect(DEFAULT_RULES_INCH.fabric.saleStep).toBeCloseTo(11.43, 9);
	});
});
