// The files a background job can make for each order, by kind. A producer takes one order and gives
// one file, or throws OutputProblem saying why it cannot. New outputs (the full-scale PDFs) plug in here
// by kind; the job runner knows nothing of what they draw.
import { DraftInputError } from '../../drafting';
import type { Db } from '../db/client';
import { siteOrigin } from '../origin';
import { shopSettingsOf } from '../house/rules';
import { loadTickets } from '../ticket/load';
import { renderTickets } from '../ticket/pdf';
import { produceDxf } from './dxf';
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
	dxf: { label: 'Pattern for CAD and cutting tables (DXF)', produce: produceDxf }
};

export const OUTPUT_KINDS = Object.keys(PRODUCERS);
export const isOutputKind = (k: string) => Object.hasOwn(PRODUCERS, k);
