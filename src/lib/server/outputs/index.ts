// The full-scale files of one order, for the routes and for a batch job: each producer loads the order,
// re-drafts it as its ticket does, and returns the PDF's bytes with a file name, or throws an
// OutputError saying why not (the caller turns it into a 400/404/422 or a failed job line).
import type { Db } from '../db/client';
import { OutputError } from './errors';
import { renderLay } from './lay';
import { renderSheet } from './sheet';
import { laysOf, loadPatternSource } from './source';
import { renderTiled } from './tiled';

export const PAPERS = ['a4', 'letter', 'a0', 'roll', 'projector'] as const;
export type PatternPaper = (typeof PAPERS)[number];

export interface PatternOptions {
	paper: PatternPaper;
	/** Roll width in cm (roll only); the shop's plotter width when not given. */
	widthCm?: number;
}

export interface Produced {
	bytes: Uint8Array;
	filename: string;
	pages: number;
}

export { OutputError };

/** The plotter width (cm) a roll takes when none is asked for: a 36 in roll is 91.4 cm (common practice). */
export const DEFAULT_PLOTTER_CM = 91.4;

/** A file name safe in a header: letters, digits and hyphens only. */
const safe = (s: string) => s.replace(/[^A-Za-z0-9-]+/g, '-');

async function dbOf(db?: Db): Promise<Db> {
	// The app's pool by default; scripts and tests pass their own.
	return db ?? (await import('../db')).db;
}

async function plotterWidth(db: Db): Promise<number> {
	const { shopSettingsOf } = await import('../house/rules');
	const w = Number((await shopSettingsOf(db)).plotterWidthCm);
	return Number.isFinite(w) && w > 0 ? w : DEFAULT_PLOTTER_CM;
}

/** The pattern of an order at full size on the chosen paper. */
export async function producePatternPdf(orderId: number, opts: PatternOptions, db?: Db): Promise<Produced> {
	if (!(PAPERS as readonly string[]).includes(opts.paper)) throw new OutputError(400, `Unknown paper “${String(opts.paper)}”: choose one of ${PAPERS.join(', ')}.`);
	const d = await dbOf(db);
	const src = await loadPatternSource(d, orderId);
	const name = `pattern-${safe(src.number)}`;
	if (opts.paper === 'a4' || opts.paper === 'letter') {
		const r = await renderTiled(src, opts.paper);
		return { bytes: r.bytes, filename: `${name}-${opts.paper}-tiled.pdf`, pages: r.pages };
	}
	if (opts.paper === 'roll') {
		const width = opts.widthCm ?? (await plotterWidth(d));
		const r = await renderSheet(src, 'roll', width);
		return { bytes: r.bytes, filename: `${name}-roll-${safe(String(width))}cm.pdf`, pages: r.pages };
	}
	const r = await renderSheet(src, opts.paper);
	return { bytes: r.bytes, filename: `${name}-${opts.paper}.pdf`, pages: r.pages };
}

/** The order's lay at full size, one page a skirt. */
export async function produceLayPdf(orderId: number, db?: Db): Promise<Produced> {
	const src = await loadPatternSource(await dbOf(db), orderId);
	const r = await renderLay(src, laysOf(src));
	return { bytes: r.bytes, filename: `lay-${safe(src.number)}.pdf`, pages: r.pages };
}
