// The files a background job can make for each order, by kind. A producer takes one order and gives
// one file, or throws OutputProblem saying why it cannot. New outputs (the full-scale PDFs) plug in here
// by kind; the job runner knows nothing of what they draw.
import { DraftInputError } from '$lib/drafting';
import type { Db } from '../db/client';
import { siteOrigin } from '../origin';
import { shopSettingsOf } from '../house/rules';
import { loadTickets } from './ticket-load';
import { renderTickets } from '../ticket/pdf';
import { produceDxf } from './dxf';
import { produceLayPdf, producePatternPdf } from './index';
import { OutputProblem, safeName } from './problem';
import type { OutputFile } from './types';

export type Producer = (db: Db, orderId: number) => Promise<OutputFile>;

async function produceTicket(db: Db, orderId: number): Promise<OutputFile> {
	let found;
	try {
		[found] = await loadTickets(db, [orderId]);
	} catch (e) {
		if (e instanceof DraftInputError) throw new OutputProblem(422, `This order cannot be drafted again: ${e.message}`);
		throw e;
	}
	if (!found) throw new OutputProblem(404, `There is no order ${orderId}.`);
	if (!found.tickets.length) throw new OutputProblem(404, `Order ${found.number} has no skirt to cut.`);
	const { paperSize } = await shopSettingsOf(db);
	const pdf = await renderTickets(found.tickets, { paper: paperSize === 'Letter' ? 'Letter' : 'A4', origin: siteOrigin() });
	return { name: `${safeName(found.number)}-ticket.pdf`, mime: 'application/pdf', bytes: new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.length) };
}

/** Every producer by kind, in the order their files are listed. */
export const PRODUCERS: Record<string, { label: string; produce: Producer }> = {
	ticket: { label: 'Cutting ticket (PDF)', produce: produceTicket },
	dxf: { label: 'Pattern for CAD and cutting tables (DXF)', produce: produceDxf },
	'pattern-a4': { label: 'Full-size pattern, tiled on A4 (PDF)', produce: (db, id) => pdfFile(producePatternPdf(id, { paper: 'a4' }, db)) },
	'pattern-letter': { label: 'Full-size pattern, tiled on Letter (PDF)', produce: (db, id) => pdfFile(producePatternPdf(id, { paper: 'letter' }, db)) },
	'pattern-roll': { label: 'Full-size pattern on the plotter roll (PDF)', produce: (db, id) => pdfFile(producePatternPdf(id, { paper: 'roll' }, db)) },
	lay: { label: 'The lay at full size (PDF)', produce: (db, id) => pdfFile(produceLayPdf(id, db)) }
};

async function pdfFile(made: Promise<{ bytes: Uint8Array; filename: string }>): Promise<OutputFile> {
	const { bytes, filename } = await made;
	return { name: safeName(filename), mime: 'application/pdf', bytes };
}

export const OUTPUT_KINDS = Object.keys(PRODUCERS);
export const isOutputKind = (k: string) => Object.hasOwn(PRODUCERS, k);
