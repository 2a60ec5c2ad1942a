import { describe, expect, it } from 'vitest';
import { draftSkirt, STYLES, toSvg } from './index';
import { estimateWidth } from './drawing/model';

const size12 = { waist: 68, hip: 94, length: 62, waistToHip: 20.6 };

/** Every opened tag is closed in order (a small well-formedness check without a DOM). */
function balanced(svg: string): boolean {
	const stack: string[] = [];
	for (const m of svg.matchAll(/<(\/?)([a-zA-Z]+)([^>]*?)(\/?)>/g)) {
		const [, close, name, , self] = m;
		if (self) continue;
		if (!close) stack.push(name);
		else if (stack.pop() !== name) return false;
	}
	return stack.length === 0;
}

describe('drawings', () => {
	it('are self-contained SVG in centimetres with a scale bar and Lora labels, for every style and view', () => {
		for (const { id } of STYLES) {
			const d = draftSkirt(size12, { style: id, pockets: true });
			for (const view of ['block', 'pieces', 'layout'] as const) {
				const svg = toSvg(d, { view, units: 'cm' });
				expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg" viewBox="')).toBe(true);
				expect(svg).toMatch(/width="[\d.]+cm" height="[\d.]+cm"/);
				expect(svg).toContain('font-family="Lora, Georgia, serif"');
				expect(svg).toContain('aria-label="scale bar"');
				expect(svg).toContain('>10 cm</text>');
				// No external references of any kind.
				expect(svg).not.toMatch(/href=|url\(|<image|@import|<script/);
				expect(svg).not.toMatch(/NaN|Infinity|undefined/);
				expect(balanced(svg), `${id} ${view}`).toBe(true);
			}
		}
	});

	it('draws pieces in the house conventions', () => {
		const svg = toSvg(draftSkirt(size12), { view: 'pieces', units: 'cm' });
		expect(svg).toContain('stroke="#A8323E"'); // cutting line, thread red
		expect(svg).toContain('stroke="#1E2230" stroke-width="0.12"'); // seam line, ink
		expect(svg).toMatch(/stroke="#6B6F7A" stroke-width="0.06" stroke-dasharray/); // hip line, pencil grey dashed
		expect(svg).toContain('stroke="#35598A"'); // darts, chalk blue
		expect(svg).toContain('>fold</text>');
		expect(svg).toContain('>Cut 1 on the fold</text>');
		expect(svg).toContain('>Cut 2 (a pair)</text>');
		expect(svg).toContain('Allowances included: seams 1.5 cm / 2 cm · hem 4 cm');
		// Grain lines: a double-headed arrow is a line and two filled heads.
		expect((svg.match(/<path d="M[^"]*Z" fill="#1E2230"\/>/g) ?? []).length).toBeGreaterThanOrEqual(6);
	});

	it('writes the figures in the shopper’s units', () => {
		const d = draftSkirt(size12);
		const inches = toSvg(d, { view: 'pieces', units: 'in' });
		expect(inches).toContain('Allowances included: seams ⅝″ / ¾″ · hem 1⅝″');
		expect(inches).toContain('>4″</text>'); // the scale bar: eight half-inch blocks
		const block = toSvg(d, { view: 'block', units: 'cm' });
		expect(block).toContain('>Back 23.5 cm</text>');
		expect(block).toContain('>Front 25.5 cm</text>');
		expect(block).toContain('back mark 21.5 cm · front mark 20.5 cm');
		const lay = toSvg(d, { view: 'layout', units: 'cm', fabric: { width: 150, nap: false, shrinkage: 0 } });
		// Nested, the pieces go side by side across the opened cloth.
		expect(lay).toContain('>Buy 80 cm of 150 cm wide fabric');
		expect(lay).toContain('Lay on 150 cm fabric, opened out');
		// In inches a length to buy is rounded up to the ⅛″, never down: 80 cm is 31.496″, so 31½″.
		expect(toSvg(d, { view: 'layout', units: 'in', fabric: { width: 150, nap: false, shrinkage: 0 } })).toContain('>Buy 31½″ of 59″ wide fabric');
	});

	it('gives the block a grain line in each panel and keeps the hip-line words off the side seam', () => {
		for (const style of ['straight', 'a-line', 'gored'] as const) {
			const d = draftSkirt(size12, { style });
			const svg = toSvg(d, { view: 'block', units: 'cm' });
			// Grain lines (DESIGN.md: a long double-headed arrow): two filled heads a panel.
			expect((svg.match(/<path d="M[^"]*Z" fill="#1E2230"\/>/g) ?? []).length, style).toBeGreaterThanOrEqual(4);
			const m = /<text x="([\d.]+)" y="[\d.]+" font-size="([\d.]+)"[^>]*>(Hip line, half the body: [^<]*)<\/text>/.exec(svg);
			expect(m, style).not.toBeNull();
			const [x, size, words] = [Number(m![1]), Number(m![2]), m![3]];
			const half = estimateWidth(words, size) / 2;
			// The side seam meets the hip line at the back panel's hip width from the centre back.
			const side = d.block.back.spec.hip;
			expect(x + half < side - 0.3 || x - half > side + 0.3, `${style}: words ${x - half}..${x + half}, side seam ${side}`).toBe(true);
		}
	});
});
