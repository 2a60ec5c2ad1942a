// Lora for PDFs, embedded from the shipped @fontsource/lora package. Fontsource splits the face into subsets
// (latin, latin-ext, cyrillic...) by Unicode range, so a name like "Łucja" or a fabric called
// "Šaty" needs its letters drawn from the subset that has them: text is cut into runs, each run set
// in the first subset whose range holds its characters. The .woff files are used because fontkit
// (inside pdfkit) crashes on the .woff2 ones when the document ends.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';
import { woffToSfnt } from './woff.js';

export type Weight = 400 | 600;

/** Latin first: nearly every character of the ticket is there. */
const SUBSETS = ['latin', 'latin-ext', 'symbols', 'math', 'cyrillic', 'cyrillic-ext', 'vietnamese'] as const;
type Subset = (typeof SUBSETS)[number];

interface Face {
	ranges: Map<Subset, [number, number][]>;
	files: Map<string, Buffer>;
}

let face: Face | null = null;

function packageDir(): string {
	try {
		const require = createRequire(import.meta.url);
		return dirname(require.resolve('@fontsource/lora/400.css'));
	} catch {
		// A bundled server chunk may not resolve through the package's exports: fall back to the app folder.
		return join(process.cwd(), 'node_modules', '@fontsource', 'lora');
	}
}

function parseRanges(css: string): Map<Subset, [number, number][]> {
	const out = new Map<Subset, [number, number][]>();
	const blocks = css.matchAll(/\/\* lora-([a-z-]+)-400-normal \*\/[^}]*?unicode-range:\s*([^;]+);/g);
	for (const [, subset, list] of blocks) {
		const ranges = list.split(',').map((r) => {
			const [a, b] = r.trim().replace(/^U\+/i, '').split('-');
			return [parseInt(a, 16), parseInt(b ?? a, 16)] as [number, number];
		});
		out.set(subset as Subset, ranges);
	}
	return out;
}

function load(): Face {
	if (face) return face;
	const dir = packageDir();
	const ranges = parseRanges(readFileSync(join(dir, '400.css'), 'utf8'));
	const files = new Map<string, Buffer>();
	for (const s of SUBSETS)
		for (const w of [400, 600])
			files.set(fontName(s, w as Weight), woffToSfnt(readFileSync(join(dir, 'files', `lora-${s}-${w}-normal.woff`))));
	face = { ranges, files };
	return face;
}

const fontName = (subset: Subset, weight: Weight) => `lora-${subset}-${weight}`;

/** The faces parsed once per process. pdfkit 0.20 takes an already parsed font where it takes a file, and
 * parsing is what a document paid most for: every new document read the face's tables again and shaped
 * every word from cold caches. They are parsed by pdfkit's own font reader, in a document that is never
 * written, so no second copy of the reader is needed. A parsed face is shared safely: each document keeps
 * its own subset of the glyphs it uses, and all use of a face is synchronous. */
let parsed: Map<string, unknown> | null = null;

/** What is used here of a face parsed by pdfkit's font reader (fontkit). */
interface ParsedFace {
	characterSet: number[];
	glyphForCodePoint(code: number): unknown;
}

function parsedFaces(): Map<string, unknown> {
	if (parsed) return parsed;
	const reader = new PDFDocument({ autoFirstPage: false, font: null as unknown as string });
	const out = new Map<string, unknown>();
	for (const [name, data] of load().files) {
		reader.registerFont(name, data);
		reader.font(name);
		const face = (reader as unknown as { _font: { font: ParsedFace } })._font.font;
		// A face keeps each glyph with the characters it was first met for, and the PDF's text layer
		// (copy, search, text extraction) is written from those. Met first as a part of another glyph
		// while one document's subset is written, a glyph would keep no character for every later
		// document: so every character's glyph is met here first, by its character.
		for (const code of face.characterSet) face.glyphForCodePoint(code);
		out.set(name, face);
	}
	parsed = out;
	return out;
}

/** Words shaped once per process, per face. pdfkit shapes each word (kerning and ligatures) and keeps the
 * result in a per-document table; documents here set the same words again and again (piece names, cut
 * instructions, page headers), so every document is given the same table. A shaped word is only read
 * afterwards, never changed. Started afresh past a size, so names typed by shoppers cannot grow it without
 * end. */
const shaped = new Map<string, Record<string, unknown>>();
const MAX_SHAPED = 20_000;
/** Documents since the tables' sizes were last counted (counting is not free; a document adds few words). */
let sinceCounted = 0;

function shapedFor(name: string, count: boolean): Record<string, unknown> {
	let table = shaped.get(name);
	if (!table || (count && Object.keys(table).length > MAX_SHAPED)) shaped.set(name, (table = Object.create(null) as Record<string, unknown>));
	return table;
}

/** Registers every subset of Lora 400 and 600 with a document (only the ones used get embedded: pdfkit
 * writes a face into the file only when a page sets text in it). */
export function registerLora(doc: PDFKit.PDFDocument) {
	const open = doc as unknown as { _font: { layoutCache?: Record<string, unknown> } };
	const count = ++sinceCounted >= 100;
	if (count) sinceCounted = 0;
	for (const [name, face] of parsedFaces()) {
		doc.registerFont(name, face as Buffer);
		doc.font(name);
		if (open._font.layoutCache) open._font.layoutCache = shapedFor(name, count);
	}
	doc.font(fontName('latin', 400));
}

/** Each character's subset, looked up in the ranges once (every letter of every document passes here). */
const subsetOfCode = new Map<number, Subset>();

function subsetOf(code: number): Subset {
	const known = subsetOfCode.get(code);
	if (known) return known;
	const { ranges } = load();
	const s = SUBSETS.find((s) => ranges.get(s)?.some(([a, b]) => code >= a && code <= b)) ?? 'latin';
	subsetOfCode.set(code, s);
	return s;
}

/** Runs already cut, by weight and text (the same words come back on every page); started afresh past a size. */
const cut = new Map<string, readonly { text: string; font: string }[]>();
const MAX_CUT = 20_000;

/** The text cut into runs, each with the font that draws it. */
export function runsOf(text: string, weight: Weight): readonly { text: string; font: string }[] {
	const key = `${weight}|${text}`;
	const known = cut.get(key);
	if (known) return known;
	const runs: { text: string; font: string }[] = [];
	for (const ch of text) {
		const code = ch.codePointAt(0)!;
		const font = fontName(subsetOf(code), weight);
		const last = runs[runs.length - 1];
		if (last && last.font === font) last.text += ch;
		else runs.push({ text: ch, font });
	}
	if (cut.size >= MAX_CUT) cut.clear();
	cut.set(key, runs);
	return runs;
}

/** Sets the plain latin face (for text we write ourselves, which stays inside the latin subset). */
export function useFont(doc: PDFKit.PDFDocument, weight: Weight, size: number) {
	doc.font(fontName('latin', weight)).fontSize(size);
}
