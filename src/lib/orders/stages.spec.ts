import { describe, expect, it } from 'vitest';
import { ALLOWED_MOVES, canMove, ORDER_STAGES, type OrderStage } from './stages';

// The workroom's path, written out by hand: each stage and the only hand moves out of it
// (common practice for a made-to-order workroom: cloth once cut cannot be "uncut", so cancelling
// ends at the cutting table; paid and refunded come from the payment provider).
const EXPECTED: Record<OrderStage, OrderStage[]> = {
	awaiting_payment: ['cancelled'],
	paid: ['cutting', 'cancelled'],
	cutting: ['sewn'],
	sewn: ['finished'],
	finished: ['shipped'],
	shipped: ['delivered'],
	delivered: [],
	cancelled: [],
	refunded: [],
	// The alteration path: a fit decision sends a delivered order to awaiting_return (not a hand move),
	// then the workroom marks it altering when the skirt arrives and shipped when it goes back.
	awaiting_return: ['altering'],
	altering: ['shipped']
};

describe('order stages', () => {
	for (const from of ORDER_STAGES) {
		for (const to of ORDER_STAGES) {
			const allowed = EXPECTED[from].includes(to);
			it(`${from} → ${to} is ${allowed ? 'allowed' : 'refused'}`, () => {
				expect(canMove(from, to)).toBe(allowed);
			});
		}
	}

	it('never allows a move to the same stage or back to awaiting payment', () => {
		for (const from of ORDER_STAGES) {
			expect(ALLOWED_MOVES[from]).not.toContain(from);
			expect(ALLOWED_MOVES[from]).not.toContain('awaiting_payment');
		}
	});

	it('lets a fit decision send only a delivered order back for an alteration', () => {
		for (const from of ORDER_STAGES) {
			for (const to of ORDER_STAGES) expect(canMove(from, to, 'fit-decision')).toBe(from === 'delivered' && to === 'awaiting_return');
		}
	});
});
