import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { testEnv } from '../support/env';

// Hostile and random input: wrong types, huge and tiny numbers, NaN strings, unicode, SQL and HTML
// fragments. Whatever arrives, the answer is a 2xx or a 4xx with a message, never a 5xx.
const nasty = fc.oneof(
	fc.constantFrom('NaN', 'Infinity', '-1e309', '1e309', "'; DROP TABLE `order`; --", '<script>alert(1)</script>', '\u0000', '𝔴𝔞𝔦𝔰𝔱', '  ', '0x50', '١٢٣'),
	fc.string({ maxLength: 40 }),
	fc.double(),
	fc.integer(),
	fc.constant(null),
	fc.boolean(),
	fc.array(fc.integer(), { maxLength: 3 }),
	fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 })
);
const measurementsLike = fc.record({ waist: nasty, hip: nasty, length: nasty, waistToHip: fc.option(nasty) }, { requiredKeys: [] });
const quoteLike = fc.record({ measurements: fc.oneof(measurementsLike, nasty), style: fc.oneof(fc.constantFrom('rue-straight', 'carousel-full-circle'), nasty), fabricId: fc.oneof(fc.integer({ min: -5, max: 10 }), nasty), units: fc.oneof(fc.constantFrom('cm', 'in'), nasty), options: fc.oneof(fc.record({ lining: nasty, waistband: nasty, hemDepth: nasty }, { requiredKeys: [] }), nasty) }, { requiredKeys: [] });

async function expectNo5xx(res: Response) {
	expect(res.status, await res.clone().text()).toBeLessThan(500);
	if (res.status >= 400) {
		const text = await res.text();
		expect(text.length).toBeGreaterThan(0);
	}
}

const post = (path: string, body: string, type = 'application/json') => fetch(`${testEnv.appUrl}${path}`, { method: 'POST', headers: { 'content-type': type, accept: type === 'application/json' ? 'application/json' : 'text/html', origin: testEnv.appUrl }, body });

describe('hostile input never makes a 5xx', () => {
	it('POST /api/quote', async () => {
		await fc.assert(fc.asyncProperty(quoteLike, async (body) => expectNo5xx(await post('/api/quote', JSON.stringify(body)))), { numRuns: 80 });
	});

	it('POST /api/orders', async () => {
		const orderLike = fc.record({ items: fc.oneof(fc.array(quoteLike, { maxLength: 3 }), nasty), shopper: fc.oneof(fc.record({ email: nasty, name: nasty, line1: nasty, city: nasty, postcode: nasty, country: nasty, measurementConsent: nasty, madeToMeasure: nasty }, { requiredKeys: [] }), nasty) }, { requiredKeys: [] });
		await fc.assert(fc.asyncProperty(orderLike, async (body) => expectNo5xx(await post('/api/orders', JSON.stringify(body)))), { numRuns: 60 });
	});

	it('the measuring form action', async () => {
		const formLike = fc.dictionary(fc.constantFrom('units', 'waist', 'hip', 'length', 'waistToHip', 'unknownDepth', 'fabricId', 'waistband', 'closureKind', 'closurePosition', 'vent', 'hemDepth', 'lining', 'saveCard', 'cardName'), fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom('NaN', '-0', '1e309', '70.5.5', '<b>', "' OR 1=1 --", '١٢٣', ''), fc.double().map(String)), { maxKeys: 12 });
		await fc.assert(
			fc.asyncProperty(formLike, async (fields) => expectNo5xx(await post('/styles/rue-straight/make?/add', new URLSearchParams(fields).toString(), 'application/x-www-form-urlencoded'))),
			{ numRuns: 60 }
		);
	});

	it('malformed JSON, a wrong content type and a 1 MB body', async () => {
		await expectNo5xx(await post('/api/quote', '{"measurements": {"waist": 7'));
		await expectNo5xx(await post('/api/orders', 'null'));
		await expectNo5xx(await post('/api/quote', JSON.stringify({ measurements: { waist: 70, hip: 96, length: 60 }, style: 'x'.repeat(1024 * 1024) })));
		await expectNo5xx(await post('/api/orders', JSON.stringify({ items: Array.from({ length: 5000 }, () => ({ style: 'rue-straight' })) })));
		await expectNo5xx(await fetch(`${testEnv.appUrl}/api/quote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '\u{1F600}'.repeat(300_000) }));
	});
});
