// The stages of an order, with the same words in the shop, the workroom, the back office and the e-mails.
export const ORDER_STAGES = [
	'awaiting_payment',
	'paid',
	'cutting',
	'sewn',
	'finished',
	'shipped',
	'delivered',
	'cancelled',
	'refunded'
] as const;

export type OrderStage = (typeof ORDER_STAGES)[number];

export const STAGE_LABELS: Record<OrderStage, string> = {
	awaiting_payment: 'Awaiting payment',
	paid: 'Paid',
	cutting: 'Cutting',
	sewn: 'Sewn',
	finished: 'Finished',
	shipped: 'Shipped',
	delivered: 'Delivered',
	cancelled: 'Cancelled',
	refunded: 'Refunded'
};

/** The workroom's forward path; cancelled and refunded sit beside it. */
export const MAIN_PATH: readonly OrderStage[] = [
	'awaiting_payment',
	'paid',
	'cutting',
	'sewn',
	'finished',
	'shipped',
	'delivered'
];

// Which moves a person may make by hand. Payment (awaiting → paid) and a full refund come from the
// payment provider's webhooks, so they are not offered as buttons; cancelling is possible until
// the fabric is cut, because after that the cloth is spent.
export const ALLOWED_MOVES: Record<OrderStage, readonly OrderStage[]> = {
	awaiting_payment: ['cancelled'],
	paid: ['cutting', 'cancelled'],
	cutting: ['sewn'],
	sewn: ['finished'],
	finished: ['shipped'],
	shipped: ['delivered'],
	delivered: [],
	cancelled: [],
	refunded: []
};

// What the payment provider's events move: a paid checkout, and a refund of everything paid (from any
// stage an order can have been paid in).
export const PROVIDER_MOVES: Record<OrderStage, readonly OrderStage[]> = {
	awaiting_payment: ['paid'],
	paid: ['refunded'],
	cutting: ['refunded'],
	sewn: ['refunded'],
	finished: ['refunded'],
	shipped: ['refunded'],
	delivered: ['refunded'],
	cancelled: ['refunded'],
	refunded: []
};

/** Who moves an order: a person in the workroom or back office, or the payment provider's events. */
export type Mover = 'person' | 'provider';

export function canMove(from: OrderStage, to: OrderStage, by: Mover = 'person'): boolean {
	return (by === 'provider' ? PROVIDER_MOVES : ALLOWED_MOVES)[from].includes(to);
}

/** Stages in which an order still waits for the workroom (used for queue length and ship dates). */
export const OPEN_WORK_STAGES: readonly OrderStage[] = ['paid', 'cutting', 'sewn', 'finished'];
