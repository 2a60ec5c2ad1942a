// The tiled print's words stay whole on one page: a piece's name, its cut and whose it is are placed off
// the edges between pages (where the trim line, its circles and the page's notes are), their long lines
// broken if need be, so none is cut in two by a page edge. Widths measured in the embedded Lora, as the
// PDF sets them. Three seeded skirts on both papers.
import { describe, expect, it } from 'vitest';
import type { Mark } from '$lib/drafting/drawing/model';
import { pdfMeasure } from '../ticket/draw-pdf';
import { newDoc } from './doc';
import { tilePlanFor, tiledMarks } from './tiled';
import { specOrder } from './spec-order';

const sourceFor = (number: string, measurements: { waist: number; hip: number; length: number; waistToHip: number }, options: { style: 'straight' | 'gored' | 'full-circle'; lining?: boolean; pockets?: boolean }) =>
	specOrder(number, measurements, options, { name: 'Viscose crepe', colour: 'Ink', fibreContent: '100 % viscose', widthCm: 140 });
// The seed's full circle (QL-1007), lined straight skirt (QL-1008) and lined six gores with pockets (QL-1005).
const SKIRTS = [
	sourceFor('QL-9007', { waist: 64, hip: 88, length: 55, waistToHip: 18 }, { style: 'full-circle' }),
	sourceFor('QL-9008', { waist: 88, hip: 112, length: 72, waistToHip: 21.5 }, { style: 'straight', lining: true }),
	sourceFor(
		'QL-9005',
		{ waist: 72, hip: 98, length: 70, waistToHip: 20.5 },
		{ style: 'gored', lining: true, pockets: true }
	)
];

const texts = (marks: Mark[]): Extract<Mark, { kind: 'text' }>[] =>
	marks.flatMap((m) => (m.kind === 'group' ? texts(m.marks) : m.kind === 'text' ? [m] : []));

describe('tiled print', () => {
	for (const src of SKIRTS)
		for (const paper of ['a4', 'letter'] as const)
			it(`${src.tickets[0].draft.choice.style}, ${paper}: no piece name, cut or order line crosses an edge between two pages`, () => {
				const { plan } = tilePlanFor(src, paper);
				const { doc } = newDoc('test', 'test', 'test');
				const measure = pdfMeasure(doc);
				const names = new Set(
					src.pieces.flatMap((sp) =>
						sp.piece.labels.filter((l) => l.kind === 'name' || l.kind === 'cut').map((l) => l.text)
					)
				);
				const words = texts(tiledMarks(doc, src, plan).flat()).filter(
					(t) => names.has(t.text) || t.text.startsWith('Order ')
				);
				expect(words.length).toBeGreaterThanOrEqual(2 * src.pieces.length);
				for (const t of words) {
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
			});
});
