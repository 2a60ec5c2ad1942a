import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { fabrics } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';

const db = testDb();

async function quote(body: unknown) {
	const res = await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: typeof body === 'string' ? body : JSON.stringify(body) });
	return { status: res.status, body: await res.json() };
}

async function fabricId(slug: string) {
	const [f] = await db.select().from(fabrics).where(eq(fabrics.slug, slug));
	return f;
}

describe('POST /api/quote', () => {
	it('drafts the worked example and prices it from the database', async () => {
		const twill = await fabricId('harbour-wool-twill');
		const { status, body } = await quote({ measurements: { waist: 100, hip: 128, length: 60, waistToHip: 22 }, style: 'rue-straight', fabricId: twill.id });
		expect(status).toBe(200);
		// Quarter hip 128/4 + 1 = 33: back 32, front 34; waist marks 25.5 + 4 and + 3 (common practice, the house method).
		expect(body.figures.back.hipWidth).toBeCloseTo(32, 1);
		expect(body.figures.front.hipWidth).toBeCloseTo(34, 1);
		expect(body.figures.back.waistWidth).toBeCloseTo(29.5, 1);
		expect(body.figures.front.waistWidth).toBeCloseTo(28.5, 1);
		// The quote draws nothing: the configure page drafts and draws in the browser.
		expect(body).not.toHaveProperty('drawing');
		expect(JSON.stringify(body)).not.toContain('<svg');
		// Price = fabric metres × price a metre + making + shipping, all from the seed (€38/m, €89 making, €9.50 shipping).
		const fabricCost = Math.round((body.fabric.lengthCm * 3800) / 100);
		expect(body.price.fabric).toBe(fabricCost);
		expect(body.price.making).toBe(8900);
		expect(body.price.total).toBe(fabricCost + 8900 + body.price.shipping);
		expect(body.fabric.lengthCm % 10).toBe(0);
		expect(body.shipBy).toMatch(/^\d{4}-\d{2}-\d{2}$/);
	});

	it('takes inches when asked', async () => {
		const { status, body } = await quote({ measurements: { waist: 28, hip: 38, length: 24, waistToHip: 8.25 }, style: 'quill-pencil', units: 'in' });
		expect(status).toBe(200);
		// 38 in = 96.52 cm, stored to the millimetre: quarter 24.13 + 1 cm ease; front and back sum to the half hip + 2 ease.
		expect(body.figures.front.hipWidth + body.figures.back.hipWidth).toBeCloseTo(96.5 / 2 + 2, 1);
	});

	it('names the field and range when a measurement is out of range', async () => {
		const { status, body } = await quote({ measurements: { waist: 30, hip: 128, length: 60 }, style: 'rue-straight' });
		expect(status).toBe(400);
		expect(body.fields['measurements.waist'][0]).toContain('from 50 to 200 cm');
	});

	it('answers malformed JSON, wrong types and unknown ids with 400, never 500', async () => {
		expect((await quote('{"measurements": ')).status).toBe(400);
		const wrong = await quote({ measurements: { waist: 'seventy', hip: null, length: 60 }, style: 'rue-straight' });
		expect(wrong.status).toBe(400);
		expect(Object.keys(wrong.body.fields)).toEqual(expect.arrayContaining(['measurements.waist', 'measurements.hip']));
		const unknownStyle = await quote({ measurements: { waist: 70, hip: 96, length: 60 }, style: 'ball-gown' });
		expect(unknownStyle.status).toBe(400);
		expect(unknownStyle.body.fields.style).toBeDefined();
		const unknownFabric = await quote({ measurements: { waist: 70, hip: 96, length: 60 }, style: 'rue-straight', fabricId: 999_999 });
		expect(unknownFabric.status).toBe(400);
		expect(unknownFabric.body.fields.fabricId).toBeDefined();
	});

	it('says when the hip depth was assumed', async () => {
		const { body } = await quote({ measurements: { waist: 70, hip: 96, length: 60 }, style: 'rue-straight' });
		expect(body.figures.hipDepth).toBe(22);
		expect(body.warnings.join(' ')).toMatch(/22 cm/);
	});
});
