// Full-size pattern files, in process (run by `npm run bench` through tsx; prints one JSON line): the
// tiled A4 PDF of a full-circle skirt against a floor made in the same run, its page count; the roll and
// projector files; the A0 file (of a pencil skirt); the lay PDF (its drawing apart from the engine's search, which is timed alone).
//
// The floor is a bare pdfkit document that makes the same file a tiled print is, minus the pattern: the
// same number of pages of the same size, the same Lora embedded (both weights, from the same faces), and
// on each page the very words the tiled print sets on that page (read back from it with pdf-parse), one
// line each. So the ratio is what drawing and placing the pattern costs over writing its words. The two
// are timed in turn, run after run, so a busy machine slows both alike.
import PDFDocument from 'pdfkit';
import { PDFParse } from 'pdf-parse';
import { resolveRules } from '../../src/lib/drafting';
import { registerLora, useFont } from '../../src/lib/server/fonts/lora';
import { renderLay } from '../../src/lib/server/outputs/lay';
import { renderSheet } from '../../src/lib/server/outputs/sheet';
import { laysOf, sourceOf } from '../../src/lib/server/outputs/source';
import { renderTiled } from '../../src/lib/server/outputs/tiled';
import { makeTicket } from '../../src/lib/server/outputs/ticket';
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
// A0 is one sheet, and a full circle needs more than one: the A0 file is timed on the seed's pencil skirt
// (QL-1004), whose pieces fit one sheet.
const pencil = sourceOf([
	makeTicket({
		orderId: 2,
		number: 'QL-1004',
		shopperName: 'Chloé Marchand',
		status: 'finished',
		promisedDate: '2026-12-20',
		houseRulesId: 1,
		rules: resolveRules({}),
		line: { id: 2, index: 1, count: 1, styleName: 'Quill pencil skirt', measurements: { waist: 70, hip: 96, length: 62, waistToHip: 20 }, options: { style: 'pencil', waistband: 'facing', stretch: true } },
		fabric: { name: 'Black ponte', colour: 'Black', fibreContent: '70 % viscose, 25 % nylon, 5 % elastane', widthCm: 150, nap: false, stretch: true, shrinkagePct: 0 }
	})
]);

/** The words on each page of a PDF, a line each (pdf-parse). */
async function wordsByPage(bytes: Uint8Array): Promise<string[][]> {
	const parser = new PDFParse({ data: new Uint8Array(bytes) });
	try {
		const { pages } = await parser.getText();
		return pages.map((p) => p.text.split('\n').filter((l) => l.trim()));
	} finally {
		await parser.destroy();
	}
}

/** The bare document: pages of the given sizes, each with its words in Lora, the first line semibold. */
function bare(pages: { size: [number, number]; lines: string[] }[]): Promise<Buffer> {
	return new Promise((resolve, reject) => {
		const doc = new PDFDocument({ autoFirstPage: false, margin: 0, font: null as unknown as string });
		const chunks: Buffer[] = [];
		doc.on('data', (c: Buffer) => chunks.push(c));
		doc.on('end', () => resolve(Buffer.concat(chunks)));
		doc.on('error', reject);
		registerLora(doc);
		for (const p of pages) {
			doc.addPage({ size: p.size, margin: 0 });
			p.lines.forEach((l, i) => {
				useFont(doc, i === 0 ? 600 : 400, 9);
				doc.text(l, 30, 30 + i * 12, { lineBreak: false });
			});
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

/** Two pieces of work timed in turn, after a warm-up of each; also the ratio run by run. */
async function pair(runs: number, a: () => Promise<unknown>, b: () => Promise<unknown>) {
	await a();
	await b();
	const [ta, tb, ratio, ca, cb]: number[][] = [[], [], [], [], []];
	const cpuMs = (c: NodeJS.CpuUsage) => (c.user + c.system) / 1000;
	for (let i = 0; i < runs; i++) {
		let c = process.cpuUsage();
		let t = performance.now();
		await a();
		ta.push(performance.now() - t);
		ca.push(cpuMs(process.cpuUsage(c)));
		c = process.cpuUsage();
		t = performance.now();
		await b();
		tb.push(performance.now() - t);
		cb.push(cpuMs(process.cpuUsage(c)));
		ratio.push(ta[i] / tb[i]);
	}
	// CPU time of this process as well as the clock: on a machine others are using, the clock counts
	// their work too, the CPU time much less so.
	return { a: summarise(ta), b: summarise(tb), ratio: summarise(ratio), cpu: { a: summarise(ca), b: summarise(cb) } };
}

async function main() {
	const runs = Number(process.env.QL_BENCH_RUNS ?? 21);
	const first = await renderTiled(src, 'a4');
	const words = await wordsByPage(first.bytes);
	const landscape = first.landscape;
	const [w, h] = [595.28, 841.89];
	const floorPages = words.map((lines, i) => ({ size: (i > 0 && landscape ? [h, w] : [w, h]) as [number, number], lines }));
	const floorBytes = await bare(floorPages);
	const { a: tiled, b: floor, ratio, cpu } = await pair(
		runs,
		() => renderTiled(src, 'a4'),
		() => bare(floorPages)
	);
	const a0First = await renderSheet(pencil, 'a0');
	const a0 = await time(runs, () => renderSheet(pencil, 'a0'));
	const roll = await time(runs, () => renderSheet(src, 'roll', 91.4));
	const projector = await time(runs, () => renderSheet(src, 'projector'));
	const lays = laysOf(src);
	const layFirst = await renderLay(src, lays);
	const layDraw = await time(runs, () => renderLay(src, lays));
	const laySearch = await time(Math.min(runs, 5), async () => laysOf(src));
	console.log(
		JSON.stringify({
			pages: first.pages,
			bytes: first.bytes.length,
			floorBytes: floorBytes.length,
			floorChars: words.reduce((n, p) => n + p.join('').length, 0),
			tiled,
			floor,
			ratio,
			cpu: { tiled: cpu.a, floor: cpu.b },
			a0,
			a0Pages: a0First.pages,
			roll,
			projector,
			layDraw,
			layPages: layFirst.pages,
			laySearch
		})
	);
}
main().catch((e) => {
	console.error(e);
	process.exit(1);
});
