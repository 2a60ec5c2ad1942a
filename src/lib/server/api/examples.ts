// The documented examples: each request example has an answer example of the same name under the
// status it answers with. The figures in the answers come from the drafting engine itself (not typed
// by hand), and a unit test checks every answer against its schema; tests/integration/openapi.test.ts
// sends every request to a running shop and checks the status and the answer's shape.
import { DEFAULT_RULES, draftSkirt } from '$lib/drafting';
import { SAMPLE_FIGURE } from '../quote/sample';
import { DEMO_STYLES } from '../seed/catalogue';
import type { FailureAnswer, PlacedOrderAnswer, QueueAnswer, QuoteAnswer, RulesPreviewAnswer, ShopperOrderAnswer, StageMovedAnswer, SummaryAnswer, WebhookAnswer } from '$lib/api/answers';

export type Example = {
	summary: string;
	/** Path and query parameters, by name. */
	params?: Record<string, string>;
	body?: unknown;
	status: number;
	answer: unknown;
};

/** The demo atelier's style slugs: what `style` takes (a slug, never the style's kind or name). */
export const EXAMPLE_SLUGS = DEMO_STYLES.map((s) => s.slug);

const drawing = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 120 80">…</svg>';
const figure = { waist: 72, hip: 98, length: 60, waistToHip: 20.5 };
const straight = draftSkirt(figure, { style: 'straight' }, DEFAULT_RULES);
const pieces = straight.pieces.map((p) => ({ name: p.name, cut: p.cut }));
const fieldsOf = (fields: Record<string, string[]>): FailureAnswer => ({ message: 'Some values need a second look.', fields });

export const QUOTE_EXAMPLES: Record<string, Example> = {
	'with-fabric': {
		summary: 'A straight skirt in the first fabric, in centimetres',
		body: { measurements: figure, style: 'rue-straight', fabricId: 1 },
		status: 200,
		answer: {
			style: { slug: 'rue-straight', name: 'Rue straight skirt', kind: 'straight' },
			figures: straight.figures,
			figuresSource: 'measured',
			warnings: straight.warnings,
			pieces,
			fabric: { id: 1, name: 'Harbour wool twill', widthCm: 150, lengthCm: 80, inStock: true },
			price: { fabric: 3040, making: 8900, options: 0, shipping: 950, total: 12_890, currency: 'EUR' },
			shipBy: '2026-12-14'
		} satisfies QuoteAnswer
	},
	inches: {
		summary: 'A pencil skirt with a lining, in inches, no fabric chosen yet (no price)',
		body: { measurements: { waist: 28, hip: 38, length: 24 }, style: 'quill-pencil', options: { lining: true }, units: 'in' },
		status: 200,
		answer: {
			style: { slug: 'quill-pencil', name: 'Quill pencil skirt', kind: 'pencil' },
			figures: straight.figures,
			figuresSource: 'measured',
			warnings: ['We used a waist-to-hip depth of 20.5 cm: measure yours for a closer fit.'],
			pieces,
			fabric: null,
			price: null,
			shipBy: '2026-12-15'
		} satisfies QuoteAnswer
	},
	'kind-not-slug': {
		summary: 'The style named by its kind ("straight") instead of its slug',
		body: { measurements: figure, style: 'straight' },
		status: 400,
		answer: { message: 'We do not make that style (any more).', fields: { style: ['Choose one of our styles.'] } } satisfies FailureAnswer
	},
	'out-of-range': {
		summary: 'A waist outside what the engine drafts',
		body: { measurements: { waist: 30, hip: 98, length: 60 }, style: 'rue-straight' },
		status: 400,
		answer: fieldsOf({ 'measurements.waist': ['Your waist must be from 50 to 200 cm: please measure again.'] })
	}
};

const shopper = { email: 'ada.lindqvist@example.com', name: 'Ada Lindqvist', line1: 'Kungsgatan 12', city: 'Uppsala', postcode: '753 21', country: 'SE', measurementConsent: true, madeToMeasure: true };

export const ORDER_EXAMPLES: Record<string, Example> = {
	'one-skirt': {
		summary: 'One straight skirt for a guest shopper',
		body: { items: [{ measurements: figure, style: 'rue-straight', fabricId: 1 }], shopper },
		status: 201,
		answer: { number: 'QL-1042', total: 12_890, currency: 'EUR', paymentUrl: 'https://pay.example.com/pay/cs_test_a1b2c3' } satisfies PlacedOrderAnswer
	},
	'no-consent': {
		summary: 'Without the shopper’s agreement to draft from her measurements',
		body: { items: [{ measurements: figure, style: 'rue-straight', fabricId: 1 }], shopper: { ...shopper, measurementConsent: false } },
		status: 400,
		answer: fieldsOf({ 'shopper.measurementConsent': ['We need your agreement to draft from your measurements.'] })
	}
};

export const ORDER_STATUS_EXAMPLES: Record<string, Example> = {
	'signed-in': {
		summary: 'Her own order, with her session (or any order, as the owner)',
		params: { number: 'QL-1001' },
		status: 200,
		answer: {
			number: 'QL-1001',
			status: 'cutting',
			shopperName: 'Priya Raman',
			currency: 'EUR',
			subtotal: 14_640,
			shipping: 0,
			total: 14_640,
			refundedTotal: 0,
			promisedDate: '2026-12-09',
			createdAt: '2026-11-27T09:12:00.000Z',
			carrier: null,
			trackingNumber: null,
			shippingAddress: { name: 'Priya Raman', line1: 'Rue des Tanneurs 8', city: 'Lyon', postcode: '69002', country: 'FR' },
			lines: [{ id: 1, style: 'Rue straight skirt', styleKind: 'straight', fabric: 'Harbour wool twill', colour: 'Navy', fabricCm: 80, options: { waistband: 'band', closure: { kind: 'zip', position: 'centre-back' }, lining: true, pockets: false, vent: 'auto' }, lineTotal: 14_640, pricing: { fabric: 3040, making: 8900, options: 1800, total: 13_740 } , figuresSource: 'measured' }],
			timeline: [
				{ at: '2026-11-27T09:12:00.000Z', to: 'awaiting_payment', kind: 'stage', note: null },
				{ at: '2026-11-27T09:14:31.000Z', to: 'paid', kind: 'stage', note: null },
				{ at: '2026-11-30T08:02:10.000Z', to: 'cutting', kind: 'stage', note: null }
			]
		} satisfies ShopperOrderAnswer
	},
	unknown: { summary: 'An order that does not exist, or that this caller may not see', params: { number: 'QL-99999999' }, status: 404, answer: { message: 'No such order.' } satisfies FailureAnswer }
};

const signedOut: Example = { summary: 'Without a session', status: 401, answer: { message: 'Sign in first.' } satisfies FailureAnswer };

export const QUEUE_EXAMPLES: Record<string, Example> = {
	today: {
		summary: 'The queue as a cutter sees it',
		status: 200,
		answer: {
			queue: [{ id: 7, number: 'QL-1007', status: 'paid', promisedDate: '2026-12-04', daysLeft: 2, firstName: 'Mirela', remake: false, lines: [{ style: 'Rue straight skirt', fabricId: 1, fabric: 'Harbour wool twill', colour: 'Navy', fabricCm: 80 }] }],
			at: '2026-12-02T07:30:00.000Z'
		} satisfies QueueAnswer
	},
	'signed-out': signedOut
};

export const SUMMARY_EXAMPLES: Record<string, Example> = {
	today: {
		summary: 'Counts per stage and low stock',
		status: 200,
		answer: {
			stages: { awaiting_payment: 1, paid: 3, cutting: 2, sewn: 1, finished: 0, shipped: 4, delivered: 9, cancelled: 1, refunded: 0 },
			lowStock: [{ id: 5, name: 'Cotton poplin', colour: 'Chalk', stockCm: 150, widthCm: 145 }]
		} satisfies SummaryAnswer
	},
	'signed-out': signedOut
};

export const STAGE_EXAMPLES: Record<string, Example> = {
	'to-cutting': { summary: 'A paid order taken to the cutting table (its cloth comes off stock)', params: { id: '7' }, body: { to: 'cutting' }, status: 200, answer: { id: 7, status: 'cutting' } satisfies StageMovedAnswer },
	'not-from-here': {
		summary: 'A paid order cannot jump to Delivered',
		params: { id: '7' },
		body: { to: 'delivered' },
		status: 409,
		answer: { message: 'This order is Paid: it cannot be moved to Delivered.' } satisfies FailureAnswer
	},
	'no-such-stage': { summary: 'A stage the shop does not have', params: { id: '7' }, body: { to: 'pressed' }, status: 400, answer: fieldsOf({ to: ['Choose a stage.'] }) },
	'no-such-order': { summary: 'An order id that does not exist', params: { id: '2147483647' }, body: { to: 'cutting' }, status: 404, answer: { message: 'No such order.' } satisfies FailureAnswer }
};

const sample = draftSkirt(SAMPLE_FIGURE, { style: 'straight' }, { ...DEFAULT_RULES, ease: { ...DEFAULT_RULES.ease, hip: 1.5 } });

export const PREVIEW_EXAMPLES: Record<string, Example> = {
	'more-hip-ease': {
		summary: 'The sample block with 1.5 cm hip ease a quarter',
		body: { 'ease.hip': 1.5 },
		status: 200,
		answer: { svg: drawing, figures: sample.figures, warnings: sample.warnings } satisfies RulesPreviewAnswer
	},
	words: { summary: 'A rule sent as words', body: { 'ease.hip': 'a little' }, status: 400, answer: { message: 'The house rule ease.hip must be a number from 0 to 10.', fields: { 'ease.hip': ['The house rule ease.hip must be a number from 0 to 10.'] } } satisfies FailureAnswer }
};

export const WEBHOOK_EXAMPLES: Record<string, Example> = {
	signed: {
		summary: 'A payment page that expired unpaid (signed by the provider)',
		body: { id: 'evt_1QxExample', object: 'event', type: 'checkout.session.expired', created: 1_764_660_000, data: { object: { id: 'cs_test_expired_example', object: 'checkout.session' } } },
		status: 200,
		answer: { received: true, duplicate: false } satisfies WebhookAnswer
	},
	unsigned: {
		summary: 'The same event without the signature header',
		body: { id: 'evt_1QxExample', object: 'event', type: 'checkout.session.expired', created: 1_764_660_000, data: { object: { id: 'cs_test_expired_example', object: 'checkout.session' } } },
		status: 400,
		answer: { message: 'Missing signature.' } satisfies FailureAnswer
	}
};
