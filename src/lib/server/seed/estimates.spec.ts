import { describe, expect, it } from 'vitest';
import { draftSkirt, estimateFabric, type StyleId } from '$lib/drafting';
import { DEMO_FABRICS, DEMO_STYLES } from './catalogue';
import { DEMO_ORDERS } from './orders';

// Fabric to buy (cm) for every seeded order's figure in every style, on the order's own cloth, as the
// quote's lay gave it when the nesting engine's compaction was added (2 December 2026). A change to the
// lays may shorten an estimate, never lengthen one: the shopper would pay for cloth she was not asked
// for before. Styles in the order of DEMO_STYLES: rue-straight, quill-pencil, meadow-a-line, swing-half-circle, carousel-full-circle, promenade-six-gore.
const RECORDED: Record<string, number[]> = {
	'QL-1001': [90, 90, 90, 150, 210, 150],
	'QL-1002': [160, 130, 160, 220, 300, 160],
	'QL-1003': [90, 90, 90, 160, 240, 150],
	'QL-1004': [90, 90, 90, 140, 210, 90],
	'QL-1005': [170, 170, 170, 260, 360, 200],
	'QL-1006': [160, 160, 160, 220, 320, 190],
	'QL-1007': [90, 90, 90, 140, 200, 140],
	'QL-1008': [110, 110, 170, 230, 330, 170],
	'QL-1009': [140, 140, 150, 190, 290, 150],
	'QL-1010': [100, 100, 100, 180, 270, 160],
	'QL-1011': [100, 120, 140, 150, 230, 150],
	'QL-1012': [150, 150, 150, 190, 310, 160],
	'QL-1013': [100, 100, 150, 180, 270, 160],
};

describe('the seeded orders’ estimates', () => {
	it('are no longer than recorded, for every order in every style', () => {
		expect(DEMO_STYLES.map((s) => s.slug)).toEqual(['rue-straight',  'quill-pencil',  'meadow-a-line',  'swing-half-circle',  'carousel-full-circle',  'promenade-six-gore']);
		const longer: string[] = [];
		for (const o of DEMO_ORDERS) {
			const f = DEMO_FABRICS.find((x) => x.slug === o.fabric)!;
			const { waistToHip, ...girths } = o.measurements;
			DEMO_STYLES.forEach((st, k) => {
				const d = draftSkirt(
					waistToHip === null ? girths : { ...girths, waistToHip },
					{ style: st.kind as StyleId, ...o.options, stretch: f.stretch },
					{}
				);
				const cloth = {
					width: f.widthCm,
					nap: f.nap,
					shrinkage: f.shrinkagePct,
					...('shrinkageAcrossPct' in f ? { shrinkageAcross: f.shrinkageAcrossPct as number } : {})
				};
				const cm = estimateFabric(d, cloth).length;
				if (cm > RECORDED[o.number][k]) longer.push(`${o.number} ${st.slug}: ${cm} cm, was ${RECORDED[o.number][k]}`);
			});
		}
		expect(longer).toEqual([]);
	});
});
