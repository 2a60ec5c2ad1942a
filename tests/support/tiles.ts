// A tiled print put back together the way a person does it: each printed page found by its trim lines
// (the grey frame round the page's cell, drawn over the pieces), laid where its name (row letter, column
// number) says, and the red cutting lines on the assembled sheet measured piece by piece.
import { components, eachPage, pageCount, pdfText, type Raster } from './pixels';

/** The house pencil grey, #6B6F7A (DESIGN.md), as drawn (within 35 levels). */
const isPencil = (r: number, g: number, b: number) => Math.abs(r - 107) <= 35 && Math.abs(g - 111) <= 35 && Math.abs(b - 122) <= 35;
/** The house thread red of the cutting line, #A8323E. */
const isRed = (r: number, g: number, b: number) => r - g > 50 && r - b > 40;

/**
 * Middles of the trim lines running along one direction (`across`: columns, else rows): lines of pixels
 * at least three quarters pencil grey, whose neighbours are not a darker ink line (the grey fringe of an
 * ink line is not a trim line). Each middle is the darkness-weighted centre of the line's pixels and two
 * either side, so anti-aliasing does not pull it by up to a pixel.
 */
function trimLines(r: Raster, across: boolean): number[] {
	const [count, along] = across ? [r.w, r.h] : [r.h, r.w];
	const at = (i: number, j: number) => (across ? (j * r.w + i) * 3 : (i * r.w + j) * 3);
	const grey = new Float64Array(count);
	const ink = new Float64Array(count);
	const shade = new Float64Array(count);
	for (let i = 0; i < count; i++)
		for (let j = 0; j < along; j++) {
			const k = at(i, j);
			const [R, G, B] = [r.rgb[k], r.rgb[k + 1], r.rgb[k + 2]];
			if (isPencil(R, G, B)) grey[i]++;
			if (Math.max(R, G, B) < 80) ink[i]++;
			shade[i] += 255 - (R + G + B) / 3;
		}
	const hits: number[] = [];
	for (let i = 0; i < count; i++) {
		if (grey[i] < 0.75 * along) continue;
		if ((ink[i - 1] ?? 0) + (ink[i + 1] ?? 0) < 0.3 * along) hits.push(i);
	}
	const groups: number[][] = [];
	for (const h of hits) {
		const g = groups[groups.length - 1];
		if (g && h - g[g.length - 1] <= 1) g.push(h);
		else groups.push([h]);
	}
	return groups.map((g) => {
		let [sum, wsum] = [0, 0];
		for (let i = Math.max(0, g[0] - 2); i <= Math.min(count - 1, g[g.length - 1] + 2); i++) {
			const wgt = Math.max(0, shade[i] - Math.min(shade[Math.max(0, g[0] - 4)], shade[Math.min(count - 1, g[g.length - 1] + 4)]));
			sum += i * wgt;
			wsum += wgt;
		}
		return wsum > 0 ? sum / wsum : g.reduce((s, a) => s + a, 0) / g.length;
	});
}

export interface Assembled {
	pages: number;
	/** The largest piece's extent on the assembled sheet, cm, smaller side first. */
	cm: [number, number];
	/** Cell size found on the pages, pixels. */
	cell: { w: number; h: number };
}

/** Assembles pages 2… of a tiled print at `dpi` and measures the piece with the largest extent. */
export function largestPieceOnSheet(pdf: Uint8Array, dpi: number): Assembled {
	const n = pageCount(pdf);
	const texts = pdfText(pdf).split('\f');
	type Found = { row: number; col: number; xs: number[]; ys: number[]; red: Float32Array };
	const found: Found[] = [];
	eachPage(pdf, dpi, 2, n, (r, p) => {
		const name = /page \d+ of \d+ · cell ([A-Z]+)(\d+)/.exec(texts[p - 1] ?? '');
		if (!name) throw new Error(`page ${p} has no row letter and column number`);
		const xs = trimLines(r, true);
		const ys = trimLines(r, false);
		if (xs.length < 2 || ys.length < 2) throw new Error(`page ${p}: trim lines not found (${xs.length} across, ${ys.length} down)`);
		let row = 0;
		for (const ch of name[1]) row = row * 26 + (ch.charCodeAt(0) - 64);
		// The red pixels between the outermost trim lines, kept as page coordinates (pairs).
		const red: number[] = [];
		for (let y = Math.floor(ys[0]); y <= Math.ceil(ys[ys.length - 1]); y++)
			for (let x = Math.floor(xs[0]); x <= Math.ceil(xs[xs.length - 1]); x++) {
				const k = (y * r.w + x) * 3;
				if (isRed(r.rgb[k], r.rgb[k + 1], r.rgb[k + 2])) red.push(x, y);
			}
		found.push({ row: row - 1, col: Number(name[2]) - 1, xs, ys, red: Float32Array.from(red) });
	});
	// A long straight piece line can look like a trim line on some page: the cell's size is the one most
	// pages agree on (the median of the outermost pair), and each page takes its pair nearest to it.
	const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
	const cw = median(found.map((f) => f.xs[f.xs.length - 1] - f.xs[0]));
	const ch = median(found.map((f) => f.ys[f.ys.length - 1] - f.ys[0]));
	const pairNear = (v: number[], gap: number) => {
		let best: [number, number] = [v[0], v[v.length - 1]];
		for (let i = 0; i < v.length; i++) for (let j = i + 1; j < v.length; j++) if (Math.abs(v[j] - v[i] - gap) < Math.abs(best[1] - best[0] - gap)) best = [v[i], v[j]];
		return best;
	};
	const cols = Math.max(...found.map((t) => t.col)) + 1;
	const rows = Math.max(...found.map((t) => t.row)) + 1;
	const [W, H] = [Math.ceil(cols * cw) + 1, Math.ceil(rows * ch) + 1];
	const sheet = new Uint8Array(W * H);
	// Lines thickened by D pixels so a cutting line crossing a trim line joins up; taken off again below.
	const D = 2;
	for (const f of found) {
		const [x0, x1] = pairNear(f.xs, cw);
		const [y0, y1] = pairNear(f.ys, ch);
		if (Math.abs(x1 - x0 - cw) > 1.5 || Math.abs(y1 - y0 - ch) > 1.5) throw new Error(`a page's cell is ${x1 - x0} × ${y1 - y0} px, not ${cw} × ${ch}`);
		for (let i = 0; i < f.red.length; i += 2) {
			const [x, y] = [f.red[i], f.red[i + 1]];
			// Each pixel's middle inside this page's cell (the trim lines are each page's edge).
			if (x + 0.5 < x0 || x + 0.5 >= x1 || y + 0.5 < y0 || y + 0.5 >= y1) continue;
			const X = Math.floor(f.col * cw + (x + 0.5 - x0));
			const Y = Math.floor(f.row * ch + (y + 0.5 - y0));
			for (let dy = -D; dy <= D; dy++)
				for (let dx = -D; dx <= D; dx++) {
					const [XX, YY] = [X + dx, Y + dy];
					if (XX >= 0 && YY >= 0 && XX < W && YY < H) sheet[YY * W + XX] = 1;
				}
		}
	}
	const parts = components(sheet, W, H).filter((c) => c.n > 500);
	const biggest = parts.sort((a, b) => b.w * b.h - a.w * a.h)[0];
	const cm = (v: number) => ((v - 2 * D) / dpi) * 2.54;
	const dims = [cm(biggest.w), cm(biggest.h)].sort((a, b) => a - b) as [number, number];
	return { pages: found.length, cm: dims, cell: { w: cw, h: ch } };
}
