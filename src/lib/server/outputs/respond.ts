// The HTTP side of the full-scale files: the query read and checked, the file sent inline with its name,
// or the reason it cannot be made as a JSON message (or a short page, for a browser that asked for one).
import type { Db } from '../db/client';
import { OutputError, PAPERS, produceLayPdf, producePatternPdf, type PatternOptions, type Produced } from './index';
import { rememberPaper } from './preference';

/** Reads ?paper= and &width= (cm); the reason they cannot be used, else the options. */
export function patternOptions(params: URLSearchParams): PatternOptions {
	const paper = (params.get('paper') ?? 'a4').trim().toLowerCase();
	if (!(PAPERS as readonly string[]).includes(paper)) throw new OutputError(400, `Unknown paper “${paper.slice(0, 40)}”: choose one of ${PAPERS.join(', ')}.`);
	const raw = params.get('width');
	if (raw === null || raw.trim() === '') return { paper: paper as PatternOptions['paper'] };
	if (paper !== 'roll') throw new OutputError(400, 'A width is only asked for with paper=roll.');
	if (!/^\d{1,4}(\.\d{1,2})?$/.test(raw.trim())) throw new OutputError(400, `The roll width must be a number of centimetres, like 91.4; you gave “${raw.slice(0, 40)}”.`);
	const widthCm = Number(raw);
	if (widthCm <= 0) throw new OutputError(400, 'The roll width must be more than 0 cm.');
	return { paper: 'roll', widthCm };
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** A refusal: JSON for a script, a short page for a browser that followed a link. */
export function refusal(e: OutputError, accept: string | null): Response {
	if (accept?.includes('text/html')) {
		const body = `<!doctype html><html lang="en"><meta charset="utf-8"><title>No file</title><body style="font-family:Georgia,serif;max-width:40rem;margin:3rem auto;padding:0 1rem"><h1>This file cannot be made</h1><p>${escape(e.message)}</p><p><a href="javascript:history.back()">Back</a></p></body></html>`;
		return new Response(body, { status: e.status, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' } });
	}
	return new Response(JSON.stringify({ message: e.message }), { status: e.status, headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' } });
}

function pdf(p: Produced): Response {
	return new Response(p.bytes as Uint8Array<ArrayBuffer>, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `inline; filename="${p.filename}"`,
			'content-length': String(p.bytes.length),
			'cache-control': 'private, no-store'
		}
	});
}

async function answer(make: () => Promise<Produced>, accept: string | null, after?: () => Promise<void>): Promise<Response> {
	try {
		const p = await make();
		if (after) await after();
		return pdf(p);
	} catch (e) {
		if (e instanceof OutputError) return refusal(e, accept);
		throw e;
	}
}

/** GET pattern.pdf: the file, and the paper remembered for the person who asked. */
export async function patternResponse(db: Db, orderId: number, params: URLSearchParams, userId: string | undefined, accept: string | null) {
	let opts: PatternOptions;
	try {
		opts = patternOptions(params);
	} catch (e) {
		if (e instanceof OutputError) return refusal(e, accept);
		throw e;
	}
	return answer(
		() => producePatternPdf(orderId, opts, db),
		accept,
		userId ? () => rememberPaper(db, userId, opts) : undefined
	);
}

/** GET lay.pdf. */
export const layResponse = (db: Db, orderId: number, accept: string | null) => answer(() => produceLayPdf(orderId, db), accept);
