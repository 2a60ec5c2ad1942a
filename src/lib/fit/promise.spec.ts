import { describe, expect, it } from 'vitest';
import { freeRemakesWords, remakePromise } from './promise';

describe('the remake promise in words', () => {
	it('says the window and the free remakes the settings hold', () => {
		expect(remakePromise({ remakeWindowDays: 30, freeRemakesPerOrder: 1 })).toBe(
			'If your skirt does not fit as drafted, tell us within 30 days of delivery: we alter it or cut it again from your corrected measurements, free of charge (one remake of each order is free).'
		);
		expect(remakePromise({ remakeWindowDays: 14, freeRemakesPerOrder: 2 })).toContain('within 14 days of delivery');
		expect(freeRemakesWords(2)).toBe('two remakes of each order are free');
	});
	it('promises no remake when none is free', () => {
		expect(remakePromise({ remakeWindowDays: 1, freeRemakesPerOrder: 0 })).toBe('If your skirt does not fit as drafted, tell us within 1 day of delivery: we alter it, free of charge.');
	});
});
