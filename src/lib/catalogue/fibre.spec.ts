import { describe, expect, it } from 'vitest';
import { fibreProblem } from './fibre';

// Checks against EU Regulation 1007/2011: Art. 7 ("100 %", "pure", "all" for one fibre only) and
// Art. 9 (a blend's fibres with their shares by weight, largest first) [Art. 9 from memory].
describe('fibre content as the shop shows it', () => {
	it.each([
		'100 % wool',
		'Pure new wool',
		'linen',
		'98 % cotton, 2 % elastane',
		'55 % linen / 45 % viscose',
		'70 % wool and 30 % polyamide'
	])('takes “%s”', (t) => {
		expect(fibreProblem(t)).toBeNull();
	});

	it('refuses “100 %” and “pure” on a blend', () => {
		expect(fibreProblem('100 % cotton, 2 % elastane')).toMatch(/only for cloth of one fibre/);
		expect(fibreProblem('pure silk and wool')).toMatch(/only for cloth of one fibre/);
	});

	it('wants every fibre of a blend with its share, adding up to 100 %, largest first', () => {
		expect(fibreProblem('cotton, elastane')).toMatch(/share by weight/);
		expect(fibreProblem('90 % cotton, 5 % elastane')).toBe('The shares add up to 95 %: they must make 100 %.');
		expect(fibreProblem('2 % elastane, 98 % cotton')).toMatch(/largest share to the smallest/);
		expect(fibreProblem('80 % wool')).toMatch(/leaves the rest unnamed/);
		expect(fibreProblem('80 %, 20 % silk')).toMatch(/Name the fibre/);
	});
});
