// The large-paper files are one page each: an A0 sheet holds the whole pattern with its title and test
// square once, or the order is refused with the way out. Sizes against ISO 216 (A0 is 841 × 1189 mm);
// the words read back from the file by pdf-parse, an independent PDF reader.
import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { OutputError } from './errors';
import { K } from './doc';
import { A0, a0Plan, renderSheet } from './sheet';
import { specOrder } from './spec-order';

const sourceFor = specOrder;

async function wordsByPage(bytes: Uint8Array): Promise<string[]> {
	const parser = new PDFParse({ data: new Uint8Array(bytes) });
	try {
		return (await parser.getText()).pages.map((p) => p.text);
	} finally {
		await parser.destroy();
	}
}

/** The page sizes of a PDF in points, from its MediaBox entries. */
const mediaBoxes = (bytes: Uint8Array) =>
	[...Buffer.from(bytes).toString('latin1').matchAll(/\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/g)].map((m) => [Number(m[1]), Number(m[2])]);

const pencil = sourceFor('QL-9001', { waist: 70, hip: 96, length: 62, waistToHip: 20 }, { style: 'pencil' });
const lined = sourceFor('QL-9002', { waist: 72, hip: 98, length: 60, waistToHip: 20.5 }, { style: 'straight', lining: true });

describe('A0', () => {
	it('is one A0 page (841 × 1189 mm) with the title and the test square once', async () => {
		expect(a0Plan(pencil.pieces.map((p) => p.piece))).not.toBeNull();
		const { bytes, pages } = await renderSheet(pencil, 'a0');
		expect(pages).toBe(1);
		const boxes = mediaBoxes(bytes);
		expect(boxes).toHaveLength(1);
		const [w, h] = [...boxes[0]].sort((a, b) => a - b);
		expect(Math.abs(w - A0.w * K)).toBeLessThan(0.5);
		expect(Math.abs(h - A0.h * K)).toBeLessThan(0.5);
		const words = await wordsByPage(bytes);
		expect(words).toHaveLength(1);
		expect(words[0].match(/Full-size pattern on A0/g)).toHaveLength(1);
		expect(words[0].match(/print at 100 %, no scaling; measure this/g)).toHaveLength(1);
		expect(words[0]).not.toMatch(/sheet \d of \d/);
	});

	it('refuses pieces that need more than one A0 sheet, naming the roll and the tiled print, instead of a second page', async () => {
		// A lined straight skirt: shell and lining pieces some 98 × 70 cm of paper between them, plus the band.
		expect(a0Plan(lined.pieces.map((p) => p.piece))).toBeNull();
		const refused = await renderSheet(lined, 'a0').then(
			() => null,
			(e: unknown) => e
		);
		expect(refused).toBeInstanceOf(OutputError);
		expect((refused as OutputError).status).toBe(400);
		expect((refused as OutputError).message).toMatch(/do not all fit on one A0 sheet.*plotter roll.*tiled/);
	});
});

describe('roll and projector', () => {
	it('are one page each, whatever the pieces', async () => {
		for (const kind of ['roll', 'projector'] as const) {
			const { bytes, pages } = await renderSheet(lined, kind, kind === 'roll' ? 91.4 : undefined);
			expect(pages).toBe(1);
			expect(mediaBoxes(bytes)).toHaveLength(1);
		}
	});
});
