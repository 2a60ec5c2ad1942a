import { describe, expect, it } from 'vitest';
import { suggestRules, suggestedChanges, answerWords, type FitAnswers } from './report';

describe('corrections from her answers', () => {
	it('lets a tight waist out by what she measured, and guesses nothing for the hem or darts', () => {
		expect(suggestedChanges({ waist: { feel: -1, amountCm: 2 }, hemWidth: { feel: -2 }, dartsBack: { feel: 1 } })).toEqual({ waist: 2 });
	});
	it('takes in a loose hip, lengthens a short skirt, and starts from 1 or 2 cm when she gives no amount', () => {
		expect(suggestedChanges({ hipSeat: { feel: 2 }, length: { feel: -1, amountCm: 3 }, highHip: { feel: -1 } })).toEqual({ hip: -2, length: 3, highHip: 1 });
	});
	it('says her answer in words', () => {
		expect(answerWords('waist', { feel: -1, amountCm: 2 }, (cm) => `${cm} cm`)).toBe('Waist: a little tight, by 2 cm');
		expect(answerWords('length', { feel: 0 }, (cm) => `${cm} cm`)).toBe('Length: fine');
	});
});

describe('house-rule suggestions', () => {
	const tight = (cm?: number): FitAnswers => ({ waist: { feel: -1, amountCm: cm ?? null } });
	const fine: FitAnswers = { waist: { feel: 0 } };
	it('needs at least three reports of a style and more than half saying the same', () => {
		expect(suggestRules(new Map([['Rue', [tight(2), tight(2)]]]))).toEqual([]);
		expect(suggestRules(new Map([['Rue', [tight(2), tight(2), fine, fine]]]))).toEqual([]);
		const [s] = suggestRules(new Map([['Rue', [tight(2), tight(4), fine]]]));
		expect(s).toMatchObject({ style: 'Rue', rule: 'ease.waist', matching: 2, reports: 3, medianCm: 3, perQuarterCm: 0.75 });
	});
});
