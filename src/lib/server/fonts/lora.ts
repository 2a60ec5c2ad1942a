// Lora for PDFs, embedded from the shipped @fontsource/lora package. Fontsource splits the face into subsets
// (latin, latin-ext, cyrillic...) by Unicode range, so a name like "Łucja" or a fabric called
// "Šaty" needs its letters drawn from the subset that has them: text is cut into runs, each run set
// in the first subset whose range holds its characters. The .woff files are used because fontkit
// (inside pdfkit) crashes on the .woff2 ones when the document ends.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
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

/** Registers every subset of Lora 400 and 600 with a document (only the ones used get embedded). */
export function registerLora(doc: PDFKit.PDFDocument) {
	for (const [name, data] of load().files) doc.registerFont(name, data);
	doc.font(fontName('latin', 400));
}

function subsetOf(code: number): Subset {
	const { ranges } = load();
	for (const s of SUBSETS) {
		if (ranges.get(s)?.some(([a, b]) => code >= a && code <= b)) return s;
	}
	return 'latin';
}

/** The text cut into runs, each with the font that draws it. */
export function runsOf(text: string, weight: Weight): { text: string; font: string }[] {
	const runs: { text: string; font: string }[] = [];
	for (const ch of text) {
		const code = ch.codePointAt(0)!;
		const font = fontName(subsetOf(code), weight);
		const last = runs[runs.length - 1];
		if (last && last.font === font) last.text += ch;
		else runs.push({ text: ch, font });
	}
	return runs;
}

/** Sets the plain latin face (for text we write ourselves, which stays inside the latin subset). */
export function useFont(doc: PDFKit.PDFDocument, weight: Weight, size: number) {
	doc.font(fontName('latin', weight)).fontSize(size);
}
