// Pages of a PDF rendered by poppler's pdftoppm (an independent renderer) and read back as pixels, so a
// test measures what a printer would print: lengths in pixels at a known resolution.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface Raster {
	w: number;
	h: number;
	/** RGB, 3 bytes a pixel, row by row. */
	rgb: Uint8Array;
}

function readPpm(buf: Buffer): Raster {
	// P6 header: magic, width, height, maxval, each separated by whitespace, then one whitespace byte.
	let i = 0;
	const tokens: string[] = [];
	while (tokens.length < 4) {
		while (/\s/.test(String.fromCharCode(buf[i]))) i++;
		if (buf[i] === 35) {
			while (buf[i] !== 10) i++;
			continue;
		}
		let t = '';
		while (!/\s/.test(String.fromCharCode(buf[i]))) t += String.fromCharCode(buf[i++]);
		tokens.push(t);
	}
	if (tokens[0] !== 'P6') throw new Error(`not a P6 file: ${tokens[0]}`);
	return { w: Number(tokens[1]), h: Number(tokens[2]), rgb: new Uint8Array(buf.subarray(i + 1)) };
}

/** Renders pages `first`..`last` (1-based) of a PDF at `dpi` with pdftoppm. */
export function renderPages(pdf: Uint8Array, dpi: number, first: number, last = first): Raster[] {
	const dir = mkdtempSync(join(tmpdir(), 'ql-pdf-'));
	try {
		writeFileSync(join(dir, 'in.pdf'), pdf);
		execFileSync('pdftoppm', ['-r', String(dpi), '-f', String(first), '-l', String(last), join(dir, 'in.pdf'), join(dir, 'p')]);
		return readdirSync(dir)
			.filter((f) => f.endsWith('.ppm'))
			.sort()
			.map((f) => readPpm(readFileSync(join(dir, f))));
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}

/** Renders pages `first`..`last` with pdftoppm and hands them over one at a time (a page of A4 at
 * 150 dpi is 6 MB of pixels: a whole tiled print at once would not fit a small test machine). */
export function eachPage(pdf: Uint8Array, dpi: number, first: number, last: number, use: (r: Raster, page: number) => void) {
	const dir = mkdtempSync(join(tmpdir(), 'ql-pdf-'));
	try {
		writeFileSync(join(dir, 'in.pdf'), pdf);
		execFileSync('pdftoppm', ['-r', String(dpi), '-f', String(first), '-l', String(last), join(dir, 'in.pdf'), join(dir, 'p')]);
		const files = readdirSync(dir)
			.filter((f) => f.endsWith('.ppm'))
			.sort();
		files.forEach((f, i) => use(readPpm(readFileSync(join(dir, f))), first + i));
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}

/** The text of pages (all when none given) with poppler's pdftotext, in reading order. */
export function pdfText(pdf: Uint8Array, first?: number, last?: number): string {
	const dir = mkdtempSync(join(tmpdir(), 'ql-pdf-'));
	try {
		writeFileSync(join(dir, 'in.pdf'), pdf);
		const range = first ? ['-f', String(first), '-l', String(last ?? first)] : [];
		return execFileSync('pdftotext', [...range, join(dir, 'in.pdf'), '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}

export const pageCount = (pdf: Uint8Array) => {
	const dir = mkdtempSync(join(tmpdir(), 'ql-pdf-'));
	try {
		writeFileSync(join(dir, 'in.pdf'), pdf);
		const info = execFileSync('pdfinfo', [join(dir, 'in.pdf')], { encoding: 'utf8' });
		return Number(/Pages:\s+(\d+)/.exec(info)![1]);
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
};

export const px = (r: Raster, x: number, y: number) => {
	const i = (y * r.w + x) * 3;
	return [r.rgb[i], r.rgb[i + 1], r.rgb[i + 2]] as const;
};

/**
 * The test square in a window of the page: the rows and columns that carry a straight run of `ink`
 * pixels at least `minRun` long are its edges; each edge's middle is the mean of its rows (or columns).
 * Returns the square's width and height between the middles of opposite edges, in pixels.
 */
export function squareIn(r: Raster, ink: (c: readonly [number, number, number]) => boolean, minRun: number, win = { x0: 0, y0: 0, x1: r.w, y1: r.h }) {
	const longest = (n: number, at: (i: number) => boolean) => {
		let [best, run] = [0, 0];
		for (let i = 0; i < n; i++) {
			run = at(i) ? run + 1 : 0;
			best = Math.max(best, run);
		}
		return best;
	};
	const rows: number[] = [];
	for (let y = win.y0; y < win.y1; y++) if (longest(win.x1 - win.x0, (i) => ink(px(r, win.x0 + i, y))) >= minRun) rows.push(y);
	const cols: number[] = [];
	for (let x = win.x0; x < win.x1; x++) if (longest(win.y1 - win.y0, (i) => ink(px(r, x, win.y0 + i))) >= minRun) cols.push(x);
	const edges = (v: number[]) => {
		// Groups of neighbouring lines: one group per edge.
		const groups: number[][] = [];
		for (const a of v) {
			const g = groups[groups.length - 1];
			if (g && a - g[g.length - 1] <= 1) g.push(a);
			else groups.push([a]);
		}
		return groups.map((g) => g.reduce((s, a) => s + a, 0) / g.length);
	};
	const [ys, xs] = [edges(rows), edges(cols)];
	return { width: xs[xs.length - 1] - xs[0], height: ys[ys.length - 1] - ys[0], xs, ys };
}

/** The extent (w × h pixels) of each connected set of `on` cells in a w × h mask, 8-neighbours. */
export function components(mask: Uint8Array, w: number, h: number): { w: number; h: number; n: number }[] {
	const seen = new Uint8Array(mask.length);
	const out: { w: number; h: number; n: number }[] = [];
	const stack: number[] = [];
	for (let s = 0; s < mask.length; s++) {
		if (!mask[s] || seen[s]) continue;
		let [x0, y0, x1, y1, n] = [w, h, 0, 0, 0];
		stack.push(s);
		seen[s] = 1;
		while (stack.length) {
			const i = stack.pop()!;
			const [x, y] = [i % w, Math.floor(i / w)];
			n++;
			x0 = Math.min(x0, x);
			x1 = Math.max(x1, x);
			y0 = Math.min(y0, y);
			y1 = Math.max(y1, y);
			for (let dy = -1; dy <= 1; dy++)
				for (let dx = -1; dx <= 1; dx++) {
					const [nx, ny] = [x + dx, y + dy];
					if (nx < 0 || ny < 0 || nx >= w || ny >= h) continue;
					const j = ny * w + nx;
					if (mask[j] && !seen[j]) {
						seen[j] = 1;
						stack.push(j);
					}
				}
		}
		out.push({ w: x1 - x0 + 1, h: y1 - y0 + 1, n });
	}
	return out;
}
