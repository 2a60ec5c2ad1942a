// The tiled print's words stay whole on one page: a piece's name, its cut and whose it is are placed off
// the edges between pages (where the trim line, its circles and the page's notes are), so none is cut in
// two by a page edge. Widths measured in the embedded Lora, as the PDF sets them.
import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../drafting';
import type { Mark } from '../../drafting/drawing/model';
import { pdfMeasure } from '../ticket/draw-pdf';
import { newDoc } from './doc';
import { sourceOf } from './source';
import { makeTicket } from './ticket';
import { tilePlanFor, tiledMarks } from './tiled';

const src = sourceOf([
	makeTicket({
		orderId: 1,
		number: 'QL-9007',
		shopperName: 'Ada Vale',
		status: 'cutting',
		promisedDate: '2026-12-20',
		houseRulesId: 1,
		rules: resolveRules({}),
		line: { id: 1, index: 1, count: 1, styleName: 'Full-circle skirt', measurements: { waist: 64, hip: 88, length: 55, waistToHip: 18 }, options: { style: 'full-circle', stretch: false } },
		fabric: { name: 'Viscose crepe', colour: 'Ink', fibreContent: '100 % viscose', widthCm: 140, nap: false, stretch: false, shrinkagePct: 0 }
	})
]);

const texts = (marks: Mark[]): Extract<Mark, { kind: 'text' }>[] =>
	marks.flatMap((m) => (m.kind === 'group' ? texts(m.marks) : m.kind === 'text' ? [m] : []));

describe('tiled print', () => {
	for (const paper of ['a4', 'letter'] as const)
		it(`${paper}: no piece name, cut or order line crosses an edge between two pages`, () => {
			const { plan } = tilePlanFor(src, paper);
			const { doc } = newDoc('test', 'test', 'test');
			const measure = pdfMeasure(doc);
			const names = new Set(src.pieces.flatMap((sp) => sp.piece.labels.filter((l) => l.kind === 'name' || l.kind === 'cut').map((l) => l.text)));
			const all = texts(tiledMarks(doc, src, plan).flat());
			const words = all.filter((t) => names.has(t.text) || t.text.startsWith('Order '));
			expect(words.length).toBeGreaterThanOrEqual(2 * src.pieces.length);
			// A stack's lines share a centre line across them; a stack longer than a page between its edge
			// bands cannot keep off every edge (its words are kept whole instead, none left out).
			const along = (t: (typeof all)[number]) => (Math.round(t.angle ?? 0) % 180 === 0 ? t.at.x : t.at.y);
			const longest = (t: (typeof all)[number]) =>
				Math.max(...all.filter((o) => o.angle === t.angle && Math.abs(along(o) - along(t)) < 1e-6).map((o) => measure(o.text, o.size, o.weight ?? 400)));
			const room = (t: (typeof all)[number]) => (Math.round(t.angle ?? 0) % 180 === 0 ? plan.cellW : plan.cellH) - 2 * 1.2;
			let checked = 0;
			for (const t of words) {
				if (longest(t) > room(t)) continue;
				checked++;
				const [long, thick] = [measure(t.text, t.size, t.weight ?? 400), t.size];
				const upright = Math.round(t.angle ?? 0) % 180 === 0;
				const [w, h] = upright ? [long, thick] : [thick, long];
				const [x0, x1, y0, y1] = [t.at.x - w / 2, t.at.x + w / 2, t.at.y - h / 2, t.at.y + h / 2];
				const crossed = [
					...Array.from({ length: plan.cols - 1 }, (_, c) => (c + 1) * plan.cellW).filter((x) => x0 < x && x < x1),
					...Array.from({ length: plan.rows - 1 }, (_, r) => (r + 1) * plan.cellH).filter((y) => y0 < y && y < y1)
				];
				expect(crossed, `“${t.text}” at ${t.at.x.toFixed(1)}, ${t.at.y.toFixed(1)} cm`).toEqual([]);
			}
			expect(checked).toBeGreaterThanOrEqual(src.pieces.length);
		});
});
