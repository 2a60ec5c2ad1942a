// What the JSON endpoints answer, as zod schemas: the endpoints type their bodies against these
// (`satisfies`), the OpenAPI document is generated from them, and the API tests validate every real
// and documented answer against them. Objects are strict so an answer that grows a field the
// document does not describe fails the tests instead of drifting out of the reference.
import { z } from 'zod';
import { ORDER_STAGES } from '$lib/orders/stages';

const cm = (description: string) => z.number().meta({ description: `${description}, in centimetres.` });
const money = (description: string) => z.number().int().meta({ description: `${description}, in minor units of the currency (cents).` });
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/).meta({ description: 'A calendar date, YYYY-MM-DD.' });
const isoInstant = z.string().meta({ description: 'An instant, ISO 8601 in UTC.', format: 'date-time' });
const stage = z.enum(ORDER_STAGES).meta({ description: 'An order stage: awaiting_payment, paid, cutting, sewn, finished, shipped, delivered, cancelled or refunded.' });

/** The one failure shape every endpoint answers with. */
export const failureAnswer = z
	.strictObject({
		message: z.string().meta({ description: 'One plain sentence for a person.' }),
		fields: z.record(z.string(), z.array(z.string())).optional().meta({ description: 'Per field, by dotted path (e.g. `measurements.waist`, `items.0.style`): what to change.' })
	})
	.meta({ id: 'Failure', description: 'Every refusal: a message, and where a field is to blame, the messages per field.' });

const dart = z.strictObject({ fromCentre: cm('From the centre line to the dart'), intake: cm('Width taken in at the waist'), length: cm('Dart length') });
const panel = {
	hipWidth: cm('Centre line to side seam on the hip line'),
	waistWidth: cm('Waist mark, along the waist line'),
	sideShaping: cm('Taken in at the side seam'),
	sideRaise: cm('Side-seam waist point above the waist line'),
	darts: z.array(dart)
};
const pair = z.strictObject({ front: z.number(), back: z.number() });

export const figuresAnswer = z
	.strictObject({
		back: z.strictObject({ ...panel, centreShaping: cm('Centre back taken in at the waist'), centreDrop: cm('Centre back waist below the waist line') }),
		front: z.strictObject({ ...panel, centreDrop: cm('Centre front waist below the waist line') }),
		length: cm('Finished length'),
		hipDepth: cm('Waist to hip line'),
		hipDepthAssumed: z.boolean(),
		kneeDepth: cm('Waist to knee the draft used'),
		kneeAssumed: z.boolean(),
		waistRadius: cm('Circle styles: radius of the waist circle').optional(),
		hemGirth: cm('Round the finished hem'),
		check: z.strictObject({ waistSeam: pair, hipLine: pair, sideSeam: pair, dartLegs: pair })
	})
	.meta({ id: 'Figures', description: "The block's figures, every length rounded to the millimetre (what a cutter reads and checks)." });

export const quoteAnswer = z
	.strictObject({
		style: z.strictObject({ slug: z.string(), name: z.string(), kind: z.string().meta({ description: 'The block the style is drafted from: straight, pencil, a-line, half-circle, full-circle or gored.' }) }),
		figures: figuresAnswer,
		figuresSource: z.enum(['measured', 'size_chart', 'flat_garment']).meta({ description: 'Where the figures came from: her own tape, a published size chart, or a skirt that fits her laid flat.' }),
		warnings: z.array(z.string()).meta({ description: 'Plain sentences for the shopper (an assumed hip depth, a vent added).' }),
		pieces: z.array(z.strictObject({ name: z.string(), cut: z.strictObject({ count: z.number().int(), onFold: z.boolean() }) })),
		fabric: z
			.strictObject({ id: z.number().int(), name: z.string(), widthCm: z.number(), lengthCm: cm('Cloth to buy, rounded up to the step it is sold in'), inStock: z.boolean() })
			.nullable()
			.meta({ description: 'Null when no fabricId was sent.' }),
		price: z
			.strictObject({ fabric: money('Cloth'), making: money('Making'), options: money('Options'), shipping: money('Shipping'), total: money('All of it'), currency: z.string().meta({ description: 'ISO 4217 code, the shop’s setting.' }) })
			.nullable()
			.meta({ description: 'Null when no fabricId was sent: the price depends on the cloth.' }),
		shipBy: isoDate.meta({ description: 'The date the atelier promises to ship, from the style’s lead time and the work waiting.' })
	})
	.meta({ id: 'Quote', description: 'One skirt drafted, estimated and priced: the same figures and price the shop pages show.' });

export const placedOrderAnswer = z
	.strictObject({
		number: z.string().meta({ description: 'The order number, e.g. QL-1042.' }),
		total: money('The order total'),
		currency: z.string(),
		paymentUrl: z.string().meta({ description: 'The payment page to send the shopper to.', format: 'uri' })
	})
	.meta({ id: 'PlacedOrder', description: 'An order placed and awaiting payment.' });

export const paymentAwayAnswer = failureAnswer
	.extend({ number: z.string().optional().meta({ description: 'Present when the order was placed but its payment page could not be opened.' }) })
	.meta({ id: 'PaymentAway', description: 'A failure that may name an order already placed.' });

export const shopperOrderAnswer = z
	.strictObject({
		number: z.string(),
		status: stage,
		shopperName: z.string(),
		currency: z.string(),
		subtotal: money('Lines'),
		shipping: money('Shipping'),
		total: money('Total'),
		refundedTotal: money('Refunded so far'),
		promisedDate: isoDate,
		createdAt: isoInstant,
		carrier: z.string().nullable(),
		trackingNumber: z.string().nullable(),
		shippingAddress: z.strictObject({ name: z.string(), line1: z.string(), line2: z.string().optional(), city: z.string(), postcode: z.string(), country: z.string() }),
		lines: z.array(
			z.strictObject({
				id: z.number().int(),
				style: z.string(),
				styleKind: z.string(),
				fabric: z.string(),
				colour: z.string(),
				fabricCm: cm('Cloth cut for this skirt'),
				options: z.record(z.string(), z.unknown()).meta({ description: 'The options as chosen (waistband, closure, lining, pockets, vent, hemDepth).' }),
				lineTotal: money('This skirt'),
				pricing: z.record(z.string(), z.number()).meta({ description: 'The line’s price in parts (fabric, making, options, total), minor units.' }),
				figuresSource: z.enum(['measured', 'size_chart', 'flat_garment']).meta({ description: 'Where the figures came from: her own tape, a published size chart, or a skirt laid flat.' })
			})
		),
		timeline: z.array(z.strictObject({ at: isoInstant, to: stage.nullable(), kind: z.string().meta({ description: '`stage` or `refund`.' }), note: z.string().nullable() }))
	})
	.meta({ id: 'ShopperOrder', description: 'An order as its shopper sees it: no workroom notes.' });

export const queueAnswer = z
	.strictObject({
		queue: z.array(
			z.strictObject({
				id: z.number().int(),
				number: z.string(),
				status: stage,
				promisedDate: isoDate,
				daysLeft: z.number().int().meta({ description: 'Days until the promised date; negative when overdue.' }),
				firstName: z.string(),
				remake: z.boolean().meta({ description: 'A remake of an earlier order (no payment), made after her fit report.' }),
				lines: z.array(z.strictObject({ style: z.string(), fabricId: z.number().int(), fabric: z.string(), colour: z.string(), fabricCm: z.number() }))
			})
		),
		at: isoInstant
	})
	.meta({ id: 'Queue', description: 'Paid orders waiting to be cut, the oldest promised date first.' });

export const summaryAnswer = z
	.strictObject({
		stages: z.record(z.string(), z.number().int()).meta({ description: 'Orders per stage, every stage present.' }),
		lowStock: z.array(z.strictObject({ id: z.number().int(), name: z.string(), colour: z.string(), stockCm: z.number(), widthCm: z.number() }))
	})
	.meta({ id: 'WorkroomSummary', description: 'Counts per stage and the fabrics running low (under 2 m).' });

export const stageMovedAnswer = z.strictObject({ id: z.number().int(), status: stage }).meta({ id: 'StageMoved', description: 'The order and the stage it is now in.' });

export const rulesPreviewAnswer = z
	.strictObject({ svg: z.string().meta({ description: 'The sample figure’s block drawn with the rules sent, as SVG.' }), figures: figuresAnswer, warnings: z.array(z.string()) })
	.meta({ id: 'RulesPreview' });

export const webhookAnswer = z
	.strictObject({ received: z.literal(true), duplicate: z.boolean().meta({ description: 'True when this event id was applied before: nothing changed again.' }) })
	.meta({ id: 'WebhookReceipt' });

export type FailureAnswer = z.input<typeof failureAnswer>;
export type QuoteAnswer = z.input<typeof quoteAnswer>;
export type PlacedOrderAnswer = z.input<typeof placedOrderAnswer>;
export type PaymentAwayAnswer = z.input<typeof paymentAwayAnswer>;
export type ShopperOrderAnswer = z.input<typeof shopperOrderAnswer>;
export type QueueAnswer = z.input<typeof queueAnswer>;
export type SummaryAnswer = z.input<typeof summaryAnswer>;
export type StageMovedAnswer = z.input<typeof stageMovedAnswer>;
export type RulesPreviewAnswer = z.input<typeof rulesPreviewAnswer>;
export type WebhookAnswer = z.input<typeof webhookAnswer>;
