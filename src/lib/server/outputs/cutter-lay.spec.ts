// The ticket draws the cutter's lay stored with the order when it was laid for the cloth as it is now,
// and lays afresh (the quote's lay) when the cloth has changed since.
import { describe, expect, it } from 'vitest';
import { cutterLayInSlices, draftSkirt, estimateFabric } from '$lib/drafting';
import type { StoredCutterLay } from '../db/schema';
import { makeTicket, type TicketInput } from './ticket';

const FABRIC = { name: 'Oat linen canvas', colour: 'Oat', fibreContent: '100 % linen', widthCm: 140, nap: false, stretch: false, shrinkagePct: 3 };
const M = { waist: 100, hip: 128, length: 60, waistToHip: 22 };

function input(cutterLay: StoredCutterLay | null, fabric = FABRIC): TicketInput {
	return {
		orderId: 1,
		number: 'QL-3001',
		shopperName: 'Ada Example',
		status: 'paid',
		promisedDate: '2026-12-20',
		houseRulesId: 1,
		rules: {},
		line: { id: 1, index: 1, count: 1, styleName: 'Carousel full circle', measurements: M, options: { style: 'full-circle', stretch: false }, cutterLay },
		fabric
	};
}

describe('the cutter’s lay on the ticket', async () => {
	const draft = draftSkirt(M, { style: 'full-circle' }, {});
	const cloth = { width: FABRIC.widthCm, nap: FABRIC.nap, shrinkage: FABRIC.shrinkagePct };
	// The sliced search (as the server's background worker runs it) with a few pauses.
	let pauses = 0;
	const lay = await cutterLayInSlices(draft, cloth, { seconds: 1, slice: 0.1 }, async () => void pauses++);
	const stored: StoredCutterLay = {
		length: lay.length,
		need: lay.need,
		utilisation: lay.utilisation,
		evaluations: lay.evaluations,
		seconds: 1,
		layout: lay.layout,
		cloth: { width: 140, nap: false, shrinkage: 3, shrinkageAcross: 3 }
	};

	it('searches in slices and never gives more than the quote', () => {
		expect(pauses).toBeGreaterThan(3);
		expect(lay.length).toBeLessThanOrEqual(estimateFabric(draft, cloth).length);
	});

	it('draws the stored lay when it fits the cloth', () => {
		const t = makeTicket(input(stored));
		expect(t.cutterLay).toBe(true);
		expect(t.estimate?.length).toBe(stored.length);
		expect(t.estimate?.layout.layLength).toBe(stored.layout.layLength);
	});

	it('lays afresh when the cloth is no longer the one it was laid for', () => {
		const t = makeTicket(input(stored, { ...FABRIC, widthCm: 150 }));
		expect(t.cutterLay).toBe(false);
		expect(t.estimate?.length).toBe(estimateFabric(draft, { ...cloth, width: 150 }).length);
		expect(makeTicket(input(null)).cutterLay).toBe(false);
	});
});
