import { describe, expect, it } from 'vitest';
import { draftSkirt } from '../drafting';
import { lineMeasurements, lineSnapshot } from './line';

describe('an order line as stored, and back to the engine', () => {
	const given = { waist: 70, hip: 100, length: 62, waistToKnee: 53, confirmed: true, adjustments: { hollowBack: 1.5, oneHip: { side: 'left' as const, higher: 1 } } };

	it('keeps the knee, the confirmation and the adjustments, and drafts the same skirt from them', () => {
		const snap = lineSnapshot(given);
		expect(snap.measurements).toEqual({ waist: 70, hip: 100, length: 62, waistToHip: null, waistToKnee: 53, confirmed: true });
		expect(snap.adjustments).toEqual(given.adjustments);
		const back = lineMeasurements(JSON.parse(JSON.stringify(snap.measurements)), JSON.parse(JSON.stringify(snap.adjustments)));
		const a = draftSkirt(given, { style: 'pencil' });
		const b = draftSkirt(back, { style: 'pencil' });
		expect(b.figures).toEqual(a.figures);
		expect(b.measurements.kneeDepth).toBe(53);
		expect(b.left).toBeDefined();
	});

	it('reads a line placed before the knee and the adjustments existed: house knee, no adjustments', () => {
		const m = lineMeasurements({ waist: 70, hip: 96, length: 60, waistToHip: null });
		expect(m).toEqual({ waist: 70, hip: 96, length: 60 });
		expect(draftSkirt(m, { style: 'straight' }).measurements.kneeAssumed).toBe(true);
	});
});
