import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFParse } from 'pdf-parse';
import { afterAll, describe, expect, it } from 'vitest';
import { draftSkirt, formatCm, type Measurements, type SkirtChoiceInput } from '$lib/drafting';
import { renderTickets } from './pdf';
import { makeTicket, type TicketInput } from '../outputs/ticket';
import type { RemakeChanges } from '../fit/remake-changes';

// Invented order data; the figures the ticket must print are the engine's own output for it, drafted
// here beside the ticket (the engine's numbers are the values under test, not copied constants).
const FABRIC = {
	name: 'Harbour wool twill',
	colour: 'Navy',
	fibreContent: '100 % wool',
	widthCm: 150,
	nap: false,
	stretch: false,
	shrinkagePct: 3
};
// Handbook size 12 (TRADE.md: waist 68, hip 94, waist to hip 20.6 cm [from memory]) at knee length.
const SIZE_12: Measurements = { waist: 68, hip: 94, waistToHip: 20.6, length: 58.5 };

function input(
	number: string,
	m: Measurements,
	options: SkirtChoiceInput,
	over: Partial<TicketInput> = {}
): TicketInput {
	return {
		orderId: 42,
		number,
		shopperName: 'Beatriz Lima Okonkwo',
		status: 'paid',
		promisedDate: '2025-03-14',
		houseRulesId: 3,
		rules: {},
		line: {
			id: 7,
			index: 1,
			count: 1,
			styleName: 'Rue straight skirt',
			measurements: { waist: m.waist, hip: m.hip, length: m.length, waistToHip: m.waistToHip ?? null },
			options: { style: 'straight', stretch: false, ...options }
		},
		fabric: FABRIC,
		...over
	};
}

async function parsed(pdf: Buffer) {
	// pdf.js takes the bytes over, so it gets a copy.
	const parser = new PDFParse({ data: new Uint8Array(pdf) });
	try {
		const text = (await parser.getText()).text;
		const info = await parser.getInfo({ parsePageInfo: true });
		return { text, info };
	} finally {
		await parser.destroy();
	}
}

const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
/** A row of the block figures table as the PDF's text layer gives it: label, back value, front value. */
const rowOf = (label: string, back: number, front: number) =>
	new RegExp(`${esc(label)}\\s+${esc(formatCm(back))}\\s+${esc(formatCm(front))}`);

// A remake decided on fit report 12 of order QL-2040 (invented): four figures changed.
const REMAKE: RemakeChanges = {
	firstNumber: 'QL-2040',
	reportId: 12,
	decidedAt: '2025-06-03T10:00:00.000Z',
	reason: 'Waist too tight and a little short on her first skirt: we let out the waist, add ease and lengthen the hem.',
	corrections: [
		{ field: 'waist', from: 68, to: 70 },
		{ field: 'ease.waist', from: null, to: 0.5 },
		{ field: 'length', from: 58.5, to: 60.5 },
		{ field: 'hollowBack', from: 0.5, to: 1 }
	]
};

const work = mkdtempSync(join(tmpdir(), 'ticket-spec-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('cutting ticket PDF', () => {
	const choice: SkirtChoiceInput = { style: 'straight' };

	it('prints the order number, the first name only and the block figures the engine drafted', async () => {
		const draft = draftSkirt(SIZE_12, choice);
		const { text } = await parsed(
			await renderTickets([makeTicket(input('QL-2042', SIZE_12, choice))], {
				paper: 'A4',
				origin: 'http://127.0.0.1:5173'
			})
		);
		expect(text).toContain('QL-2042');
		expect(text).toContain('Beatriz');
		// Body measurements are personal data (GDPR, TRADE.md): the ticket names the shopper by first name only.
		expect(text).not.toMatch(/Lima|Okonkwo/);
		const { back, front } = draft.figures;
		expect(text).toMatch(rowOf('Hip width (centre line to side seam, on the hip line)', back.hipWidth, front.hipWidth));
		expect(text).toMatch(rowOf('Waist width (to the waist mark, darts open)', back.waistWidth, front.waistWidth));
		expect(text).toMatch(rowOf('Side raise (side waist point above the waist line)', back.sideRaise, front.sideRaise));
		expect(text).toMatch(rowOf('Centre back shaping / centre front drop', back.centreShaping, front.centreDrop));
		expect(back.darts.length).toBeGreaterThan(0);
		back.darts.forEach((d, i) => {
			const f = front.darts[i];
			expect(text).toMatch(rowOf(`Dart ${i + 1}: position, centre line to its middle`, d.fromCentre, f.fromCentre));
			expect(text).toMatch(rowOf(`Dart ${i + 1}: intake`, d.intake, f.intake));
			expect(text).toMatch(rowOf(`Dart ${i + 1}: length`, d.length, f.length));
		});
		// The measurements as given, and the working quarter: W/4 + ease, from the engine's house rules.
		expect(text).toMatch(/Waist\s+68 cm/);
		expect(text).toContain(
			`17 + ${formatCm(draft.rules.ease.waist.back).replace(' cm', '')} = ${formatCm(17 + draft.rules.ease.waist.back).replace(' cm', '')}`
		);
		for (const p of draft.pieces) expect(text).toContain(`${p.name} Skirt fabric ${p.cutText}`);
	});

	it('a remake lists each change against the first cut, old and new, with why and the report it came from', async () => {
		const ticket = { ...makeTicket(input('QL-2061', { ...SIZE_12, waist: 70 }, choice)), remake: REMAKE };
		const { text } = await parsed(await renderTickets([ticket], { paper: 'A4', origin: 'http://x' }));
		const flat = text.replace(/\s+/g, ' ');
		expect(flat).toContain('Remake of order QL-2040 — changes against the first cut');
		expect(flat).toContain('Waist: first cut 68 cm, now 70 cm');
		expect(flat).toContain('Personal waist ease: first cut none, now 0.5 cm');
		expect(flat).toContain('Skirt length: first cut 58.5 cm, now 60.5 cm');
		expect(flat).toContain('From fit report 12 of 3 Jun 2025. Why: Waist too tight and a little short on her first skirt');
		// An order that is not a remake prints no such block.
		const plain = await parsed(await renderTickets([makeTicket(input('QL-2062', SIZE_12, choice))], { paper: 'A4', origin: 'http://x' }));
		expect(plain.text).not.toContain('changes against the first cut');
	});

	it('draws the pieces at 1:5 on A4 with a scale bar whose 10 cm measure 20 mm in the PDF', async () => {
		const pdf = await renderTickets([makeTicket(input('QL-2043', SIZE_12, choice))], {
			paper: 'A4',
			origin: 'http://127.0.0.1:5173'
		});
		const { text } = await parsed(pdf);
		expect(text).toContain('Scale 1:5: 1 cm on the page is 5 cm of cloth.');
		expect(text).toContain('Check: the 10 cm bar measures 20 mm.');
		// The bar's labels sit centred on its ends: their distance is the bar's length in PDF units,
		// 1/72 in (ISO 32000-1 user space [from memory]); 1 in = 25.4 mm exactly (1959 yard and pound agreement).
		const file = join(work, 'scale.pdf');
		writeFileSync(file, pdf);
		const html = execFileSync('pdftotext', ['-f', '2', '-l', '2', '-bbox', file, '-']).toString();
		const words = [
			...html.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="[\d.]+">([^<]*)<\/word>/g)
		].map((m) => ({ x0: +m[1], y: +m[2], x1: +m[3], text: m[4] }));
		const zero = words.find((w) => w.text === '0' && w.y < 100);
		const ten = words.find((w) => w.text === '10' && zero && Math.abs(w.y - zero.y) < 0.5);
		const cm = words.find((w) => w.text === 'cm' && ten && Math.abs(w.y - ten.y) < 0.5 && w.x0 > ten.x1);
		expect(zero && ten && cm).toBeTruthy();
		const length = (ten!.x0 + cm!.x1) / 2 - (zero!.x0 + zero!.x1) / 2;
		expect(length).toBeCloseTo((20 / 25.4) * 72, 0);
	});

	it('states a smaller scale when the pieces of a lined skirt would not fit one sheet at 1:5', async () => {
		const lined: SkirtChoiceInput = { style: 'straight', lining: true, pockets: true };
		const { text } = await parsed(
			await renderTickets([makeTicket(input('QL-2044', SIZE_12, lined))], { paper: 'A4', origin: 'http://x' })
		);
		const scale = /Scale 1:(\d+): 1 cm on the page is (\d+) cm of cloth\./.exec(text);
		expect(scale).not.toBeNull();
		expect(Number(scale![1])).toBeGreaterThan(5);
		expect(scale![1]).toBe(scale![2]);
		// Every piece is drawn and listed, lining included.
		for (const p of draftSkirt(SIZE_12, lined).pieces) expect(text).toContain(p.name);
	});

	it('gives a circle skirt the waist radius r = W / θ (TRADE.md: W = 68 cm, full circle 10.82 cm)', async () => {
		// No waist ease, so the waist seam is the published example's 68 cm.
		const rules = { ease: { waist: { front: 0, back: 0 }, hip: 1 } };
		const circle: SkirtChoiceInput = { style: 'full-circle' };
		const { text } = await parsed(
			await renderTickets([makeTicket(input('QL-2045', SIZE_12, circle, { rules }))], {
				paper: 'A4',
				origin: 'http://x'
			})
		);
		expect(text).toMatch(/Waist radius\s+10\.8 cm/);
		expect(text).toContain('waist radius r = 10.8 cm');
	});

	it('re-drafts with the order’s own house rules and says when stored figures disagree', async () => {
		const rules = { ease: { waist: { front: 0.5, back: 0.5 }, hip: 2 } };
		const mine = draftSkirt(SIZE_12, choice, rules);
		const stored = draftSkirt(SIZE_12, choice).figures;
		const t = makeTicket(
			input('QL-2046', SIZE_12, choice, { rules, line: { ...input('', SIZE_12, choice).line, figures: stored } })
		);
		const { text } = await parsed(await renderTickets([t], { paper: 'A4', origin: 'http://x' }));
		expect(text).toMatch(
			rowOf(
				'Hip width (centre line to side seam, on the hip line)',
				mine.figures.back.hipWidth,
				mine.figures.front.hipWidth
			)
		);
		expect(mine.figures.back.hipWidth).not.toBe(stored.back.hipWidth);
		expect(text).toContain('The figures drafted now differ from those stored with the order');
	});

	it('warns not to cut a cancelled order', async () => {
		const { text } = await parsed(
			await renderTickets([makeTicket(input('QL-2047', SIZE_12, choice, { status: 'cancelled' }))], {
				paper: 'A4',
				origin: 'http://x'
			})
		);
		expect(text).toContain('Do not cut: this order is cancelled.');
	});

	it('carries the sharp-tools caution, sign-off boxes and the fabric to cut', async () => {
		const t = makeTicket(input('QL-2048', SIZE_12, choice));
		const { text } = await parsed(await renderTickets([t], { paper: 'A4', origin: 'http://x' }));
		// TRADE.md, workroom: rotary cutters and shears cause deep cuts; tickets carry a short reminder.
		expect(text).toMatch(/Sharp tools\. Shears and rotary cutters cut deep/);
		expect(text).toMatch(/Cut\s+Who\s+Date\s+Sewn\s+Who\s+Date\s+Finished\s+Who\s+Date/);
		expect(text).toContain('Harbour wool twill');
		expect(text).toContain('Width 150 cm · no nap · shrinkage 3 %');
		expect(text).toContain(`Cut ${(t.estimate!.length / 100).toFixed(2)} m`);
	});

	it('sets the title and the paper: A4 is 210 × 297 mm (ISO 216), Letter 8.5 × 11 in (ANSI/ASME Y14.1)', async () => {
		const a4 = await parsed(
			await renderTickets([makeTicket(input('QL-2049', SIZE_12, choice))], { paper: 'A4', origin: 'http://x' })
		);
		expect(a4.info.info?.Title).toBe('Cutting ticket QL-2049');
		expect(a4.info.pages?.[0].width).toBeCloseTo((210 / 25.4) * 72, 1);
		expect(a4.info.pages?.[0].height).toBeCloseTo((297 / 25.4) * 72, 1);
		const letter = await parsed(
			await renderTickets([makeTicket(input('QL-2049', SIZE_12, choice))], { paper: 'Letter', origin: 'http://x' })
		);
		expect(letter.info.pages?.[0].width).toBeCloseTo(8.5 * 72, 1);
		expect(letter.info.pages?.[0].height).toBeCloseTo(11 * 72, 1);
		expect(letter.text).toMatch(/Scale 1:\d+: 1 cm on the page/);
	});

	it('prints a batch of orders in one PDF, one or two pages each', async () => {
		const tickets = [
			makeTicket(input('QL-2050', SIZE_12, choice)),
			makeTicket(
				input('QL-2051', { waist: 81, hip: 106, length: 65, waistToHip: 21 }, { style: 'a-line', pockets: true })
			)
		];
		const { text, info } = await parsed(await renderTickets(tickets, { paper: 'A4', origin: 'http://x' }));
		expect(text).toContain('QL-2050');
		expect(text).toContain('QL-2051');
		expect(info.total).toBe(4);
		expect(info.info?.Title).toBe('Cutting tickets QL-2050, QL-2051');
	});

	// What a cutter must be able to cut from, on the skirts with the most pieces and the largest ones.
	const CASES: [string, Measurements, SkirtChoiceInput, RemakeChanges?][] = [
		['straight, lined, with pockets', SIZE_12, { style: 'straight', lining: true, pockets: true }],
		['full circle', { waist: 64, hip: 88, length: 55, waistToHip: 18 }, { style: 'full-circle' }],
		[
			'six gores, lined, with pockets',
			{ waist: 72, hip: 98, length: 70, waistToHip: 20.5 },
			{ style: 'gored', lining: true, pockets: true }
		],
		// A remake's block takes room on the first page: the fullest ticket still keeps to two pages.
		['six gores, lined, with pockets, a remake with four changes', { waist: 74, hip: 98, length: 72, waistToHip: 20.5 }, { style: 'gored', lining: true, pockets: true }, REMAKE]
	];
	for (const [name, m, c, remake] of CASES) {
		for (const paper of ['A4', 'Letter'] as const) {
			it(`${name} on ${paper}: two pages, no words on top of each other, nothing in the 11 mm edge`, async () => {
				const file = join(work, `${name.replace(/\W+/g, '-')}-${paper}.pdf`);
				writeFileSync(file, await renderTickets([{ ...makeTicket(input('QL-2060', m, c)), remake }], { paper, origin: 'http://x' }));
				const html = execFileSync('pdftotext', ['-bbox', file, '-']).toString();
				const pages = html.split('<page ').slice(1);
				expect(pages.length).toBe(2);
				const overlaps: string[] = [];
				for (const page of pages) {
					const words = [
						...page.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)</g)
					].map((w) => ({ box: w.slice(1, 5).map(Number), text: w[5] }));
					for (let i = 0; i < words.length; i++) {
						for (let j = i + 1; j < words.length; j++) {
							const [a, b] = [words[i].box, words[j].box];
							// Word boxes carry the font's ascent and descent: overlapping lines must share more than that.
							const slack = 0.4 * Math.min(a[3] - a[1], b[3] - b[1]);
							const across = Math.min(a[2], b[2]) - Math.max(a[0], b[0]);
							const down = Math.min(a[3], b[3]) - Math.max(a[1], b[1]);
							if (across > 0.5 && down > slack) overlaps.push(`${words[i].text} / ${words[j].text}`);
						}
					}
				}
				expect(overlaps).toEqual([]);
				// The remake's changes are on the ticket: above the fabric, or under the pieces when the first page is full.
				if (remake) expect(execFileSync('pdftotext', [file, '-']).toString().replace(/\s+/g, ' ')).toContain('Waist: first cut 68 cm, now 70 cm');
				// Office printers lose 4–6 mm at an edge (common practice): the pages print nothing within 11 mm of it.
				execFileSync('pdftoppm', ['-r', '50', '-gray', file, join(work, `edge-${paper}`)]);
				for (const n of [1, 2]) {
					const pgm = readFileSync(join(work, `edge-${paper}-${n}.pgm`));
					const [, w, h, , body] = /^P5\s+(\d+)\s+(\d+)\s+(\d+)\s([\s\S]*)$/.exec(pgm.toString('latin1'))!;
					const px = pgm.subarray(pgm.length - body.length);
					const edge = Math.floor((11 / 25.4) * 50);
					let dark = 0;
					for (let y = 0; y < +h; y++)
						for (let x = 0; x < +w; x++)
							if ((x < edge || y < edge || x >= +w - edge || y >= +h - edge) && px[y * +w + x] < 200) dark++;
					expect(dark, `page ${n}`).toBe(0);
				}
			}, 30_000);
		}
	}

	it('renders page 1 to a PNG with pdftoppm', async () => {
		const file = join(work, 'ticket.pdf');
		writeFileSync(
			file,
			await renderTickets([makeTicket(input('QL-2052', SIZE_12, choice))], { paper: 'A4', origin: 'http://x' })
		);
		execFileSync('pdftoppm', ['-r', '60', '-png', '-f', '1', '-l', '1', file, join(work, 'page')]);
		const png = join(work, 'page-1.png');
		expect(existsSync(png)).toBe(true);
		expect(readFileSync(png).subarray(1, 4).toString()).toBe('PNG');
		// A blank A4 page at 60 dpi comes out at 2 KB (measured with pdftoppm 22.12); a ticket is far larger.
		expect(statSync(png).size).toBeGreaterThan(20_000);
	});
});
