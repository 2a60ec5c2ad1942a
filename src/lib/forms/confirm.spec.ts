import { describe, expect, it } from 'vitest';
import { confirmAsk, likelyFigure, slipsOf } from './confirm';
import { lengthProblem } from '../drafting/errors';

describe('did you mean …?', () => {
	it('lists the slips one keystroke away', () => {
		expect(slipsOf(150)).toContain(105);
		expect(slipsOf(170)).toContain(107);
		expect(slipsOf(170)).toContain(70);
		expect(slipsOf(150)).not.toContain(150);
	});

	it('offers 105 for a hip typed 150 over a 65 waist (the figure the trade audit found)', () => {
		const ask = confirmAsk([{ field: 'hip', message: 'Please check your hip: 150 cm over a 65 cm waist …', value: 150, limit: 130.6, confirmable: true }], { waist: 65, hip: 150 }, { waist: 65, hip: 150 }, 'cm');
		expect(ask).toMatchObject({ field: 'hip', value: 150, suggestion: 105 });
	});

	it('offers 70 for a waist typed 170 over a 96 hip (a digit too many): nearer a usual waist for that hip than 107', () => {
		const ask = confirmAsk([{ field: 'waist', message: 'x', value: 170, limit: 116, confirmable: true }], { waist: 170, hip: 96 }, { waist: 170, hip: 96 }, 'cm');
		expect(ask?.suggestion).toBe(70);
	});

	it('offers nothing when no slip fits, and nothing for a problem that is not confirmable', () => {
		expect(likelyFigure(199, 'cm', (v) => v >= 130 && v <= 180, 150)).toBeNull();
		expect(confirmAsk([{ field: 'hip', message: 'x', min: 70, max: 200 }], { waist: 65, hip: 150 }, { waist: 65, hip: 150 }, 'cm')).toBeNull();
	});

	it('works in inches: 59 in typed for 95? no, 95 in is past the limit; the message is in inches', () => {
		const ask = confirmAsk([lengthProblem({ field: 'hip', value: 150, limit: 130.6, confirmable: true }, (w) => `Please check your hip: ${w.len(150)} over a ${w.len(65)} waist`)], { waist: 25.5, hip: 59 }, { waist: 64.8, hip: 149.9 }, 'in');
		expect(ask?.message).toBe('Please check your hip: 59″ over a 25⅝″ waist');
		expect(ask?.suggestion).toBeNull();
	});
});
