// Full-size pattern files, in process (run by `npm run bench` through tsx; prints one JSON line): the
// tiled A4 PDF of a full-circle skirt against a floor made in the same run, a bare pdfkit document with
// the same number of pages and the same embedded Lora (a line of text a page), its page count; the roll
// and projector files; the lay PDF (its drawing apart from the engine's search, which is timed alone).
import PDFDocument from 'pdfkit';
import { resolveRules } from '../../src/lib/drafting';
import { registerLora, useFont } from '../../src/lib/server/fonts/lora';
import { renderLay } from '../../src/lib/server/outputs/lay';
import { renderSheet } from '../../src/lib/server/outputs/sheet';
import { laysOf, sourceOf } from '../../src/lib/server/outputs/source';
import { renderTiled } from '../../src/lib/server/outputs/tiled';
import { makeTicket } from '../../src/lib/server/ticket/ticket';
import { summarise } from './stats.js';

// The seed's full-circle order (QL-1007) and its cloth.
const ticket = makeTicket({
	orderId: 1,
	number: 'QL-1007',
	shopperName: 'Keiko Mori',
	status: 'cutting',
	promisedDate: '2026-12-20',
	houseRulesId: 1,
	rules: resolveRules({}),
	line: { id: 1, index: 1, count: 1, styleName: 'Carousel full-circle skirt', measurements: { waist: 64, hip: 88, length: 55, waistToHip: 18 }, options: { style: 'full-circle', stretch: false } },
	fabric: { name: 'Ink viscose crepe', colour: 'Ink', fibreContent: '100 % viscose', widthCm: 140, nap: false, stretch: false, shrinkagePct: 0 }
});
const src = sourceOf([ticket]);

function bare(pages: number): Promise<Buffer> {
	return new Promise((resolve, reject) => {
		const doc = new PDFDocument({ autoFirstPage: false, margin: 0, font: null as unknown as string });
		const chunks: Buffer[] = [];
		doc.on('data', (c: Buffer) => chunks.push(c));
		doc.on('end', () => resolve(Buffer.concat(chunks)));
		doc.on('error', reject);
		registerLora(doc);
		for (let i = 0; i < pages; i++) {
			doc.addPage({ size: [595.28, 841.89], margin: 0 });
			useFont(doc, 400, 9);
			doc.text(`Page ${i + 1} of ${pages}`, 40, 40, { lineBreak: false });
		}
		doc.end();
	});
}

async function time(runs: number, fn: () => Promise<unknown>) {
	await fn();
	const ms: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t = performance.now();
		await fn();
		ms.push(performance.now() - t);
	}
	return summarise(ms);
}

async function main() {
	const runs = Number(process.env.QL_BENCH_RUNS ?? 7);
	const first = await renderTiled(src, 'a4');
	const tiled = await time(runs, () => renderTiled(src, 'a4'));
	const floor = await time(runs, () => bare(first.pages));
	const roll = await time(runs, () => renderSheet(src, 'roll', 91.4));
	const projector = await time(runs, () => renderSheet(src, 'projector'));
	const lays = laysOf(src);
	const layDraw = await time(runs, () => renderLay(src, lays));
	const laySearch = await time(3, async () => laysOf(src));
	console.log(JSON.stringify({ pages: first.pages, bytes: first.bytes.length, tiled, floor, roll, projector, layDraw, laySearch }));
}
main().catch((e) => {
	console.error(e);
	process.exit(1);
});
