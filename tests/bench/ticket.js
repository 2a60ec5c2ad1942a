// @ts-check
// Ticket PDF: GET of one order's cutting ticket as a signed-in cutter, one request at a time, against
// a floor made in this (the bench's) process: a one-page pdfkit document in the same embedded Lora
// faces the ticket uses (latin 400 and 600 from @fontsource/lora's .woff files, their tables inflated
// once with zlib by src/lib/server/fonts/woff.js, the converter the ticket uses), with a heading and a few lines of text.
// Beside it, the same document from the raw .woff files, where fontkit inflates every table in
// JavaScript for each new document: the cost the ticket code avoids by converting once.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { summarise } from './stats.js';
import { woffToSfnt } from '../../src/lib/server/fonts/woff.js';

export const TICKET_ROUTE = '/workroom/orders/[id=id]/ticket.pdf';

/** Signs in through Auth.js's credentials endpoint (as tests/support/session.ts does); returns the cookie. */
export async function signInCookie(/** @type {string} */ appUrl, /** @type {string} */ email) {
	const res = await fetch(`${appUrl}/auth/callback/credentials`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: appUrl },
		body: new URLSearchParams({ email, password: DEMO_SIGN_INS.password, callbackUrl: '/' })
	});
	const session = res.headers
		.getSetCookie()
		.map((c) => c.split(';')[0])
		.find((c) => c.startsWith('authjs.session-token='));
	if (!session) throw new Error(`sign-in as ${email} gave no session cookie (status ${res.status})`);
	return session;
}

const require = createRequire(import.meta.url);
const loraDir = join(dirname(require.resolve('@fontsource/lora/400.css')), 'files');
// Read and converted once, as the app's fonts.ts does: the floor times making the document only.
const LORA_WOFF = {
	regular: readFileSync(join(loraDir, 'lora-latin-400-normal.woff')),
	semibold: readFileSync(join(loraDir, 'lora-latin-600-normal.woff'))
};
const LORA = { regular: woffToSfnt(LORA_WOFF.regular), semibold: woffToSfnt(LORA_WOFF.semibold) };

/** One A4 page of text in embedded Lora, ended and collected into a Buffer. */
export function floorPdf(fonts = LORA) {
	return new Promise((resolve, reject) => {
		const doc = new PDFDocument({
			autoFirstPage: false,
			margin: 0,
			font: /** @type {string} */ (/** @type {unknown} */ (null))
		});
		/** @type {Buffer[]} */
		const chunks = [];
		doc.on('data', (c) => chunks.push(c));
		doc.on('end', () => resolve(Buffer.concat(chunks)));
		doc.on('error', reject);
		doc.registerFont('lora-400', fonts.regular);
		doc.registerFont('lora-600', fonts.semibold);
		doc.addPage({ size: [595.28, 841.89], margin: 0 });
		doc.font('lora-600').fontSize(16).text('Cutting ticket QL-0000', 34, 40);
		doc.font('lora-400').fontSize(9);
		for (let i = 0; i < 12; i++)
			doc.text(`Line ${i + 1}: waist 68.0 cm, hip 94.0 cm, length 58.5 cm, waist to hip 20.6 cm.`, 34, 80 + i * 14);
		doc.end();
	});
}

/**
 * @param {{ appUrl: string, orderId: number, routeMissing: boolean, runs?: number, warmup?: number }} o
 */
export async function measureTicket(o) {
	const runs = o.runs ?? 30;
	const warmup = o.warmup ?? 5;
	for (let i = 0; i < warmup; i++) await floorPdf();
	/** @type {number[]} */
	const floorTimes = [];
	let floorBytes = 0;
	for (let i = 0; i < runs; i++) {
		const t = performance.now();
		const pdf = /** @type {Buffer} */ (await floorPdf());
		floorTimes.push(performance.now() - t);
		floorBytes = pdf.length;
	}
	/** @type {number[]} */
	const woffTimes = [];
	for (let i = 0; i < Math.min(runs, 10); i++) {
		const t = performance.now();
		await floorPdf(LORA_WOFF);
		woffTimes.push(performance.now() - t);
	}
	const floor = { ...summarise(floorTimes), bytes: floorBytes, fromRawWoff: summarise(woffTimes) };
	if (o.routeMissing) return { measured: false, reason: 'route missing', floor };

	const cookie = await signInCookie(o.appUrl, DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter')?.email ?? '');
	const url = `${o.appUrl}/workroom/orders/${o.orderId}/ticket.pdf`;
	const get = async () => {
		const t = performance.now();
		const res = await fetch(url, { headers: { cookie }, redirect: 'manual' });
		const body = Buffer.from(await res.arrayBuffer());
		const ms = performance.now() - t;
		const ok =
			res.status === 200 &&
			/pdf/.test(res.headers.get('content-type') ?? '') &&
			body.subarray(0, 5).toString() === '%PDF-';
		return {
			ms,
			ok,
			status: res.status,
			bytes: body.length,
			pages: (body.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length
		};
	};
	const first = await get();
	if (!first.ok) return { measured: false, reason: `GET ${url} answered ${first.status}, not a PDF`, floor };
	for (let i = 1; i < warmup; i++) await get();
	/** @type {number[]} */
	const times = [];
	let failed = 0;
	let last = first;
	for (let i = 0; i < runs; i++) {
		last = await get();
		if (!last.ok) failed++;
		times.push(last.ms);
	}
	return {
		measured: true,
		url,
		orderId: o.orderId,
		...summarise(times),
		failed,
		bytes: last.bytes,
		pages: last.pages,
		floor
	};
}
