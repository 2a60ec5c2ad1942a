// The same pieces decoded on a ladder of strip widths, widest first, for the quote (see quote.ts for why
// a ladder). Decoding an order on a narrower strip repeats the wider decode exactly as long as each piece's
// chosen place still lies within the narrower strip: the places tried there are the wider strip's, less
// the outermost ones, in the same order, so the same one wins. So each rung re-decodes only from the first
// piece that had gone further across than the narrower strip allows, from a copy of the strip saved there.
import { decode, offsets, type Prepared, type Spot } from './decode';
import { bandFor, NestInputError, type NestItem, type NestPlacement } from './engine';
import { shapeOf } from './shape';
import { Sheet } from './sheet';

interface Run {
	order: number[];
	width: number;
	spots: Spot[];
	/** The strip before piece i was placed. */
	before: Sheet[];
	length: number;
}

export interface RungLay {
	width: number;
	length: number;
	placements: NestPlacement[];
	order: number[];
}

export class Ladder {
	private readonly prepared: Prepared[];
	private readonly runs: (Run | null)[];
	private readonly orders: number[][];
	private readonly choice: Int8Array;
	private readonly count: number;

	/** `top` is the widest strip the ladder will be asked for; `starts` how many orders by size to decode. */
	constructor(
		private readonly items: NestItem[],
		top: number,
		gap: number,
		readonly band: number = bandFor(top),
		starts = 2
	) {
		this.prepared = items.map((it) => ({
			shapes: it.variants.map((v) => shapeOf(v.points, band, gap / 2)),
			atFold: !!it.atFold
		}));
		this.count = Math.ceil(top / band - 1e-9);
		const n = items.length;
		const byKey = (f: (p: Prepared) => number) =>
			Array.from({ length: n }, (_, i) => i).sort(
				(a, b) =>
					Number(this.prepared[b].atFold) - Number(this.prepared[a].atFold) ||
					f(this.prepared[b]) - f(this.prepared[a]) ||
					a - b
			);
		this.orders = [byKey((p) => p.shapes[0].area), byKey((p) => Math.min(...p.shapes.map((s) => s.length)))].slice(
			0,
			starts
		);
		this.runs = this.orders.map(() => null);
		this.choice = new Int8Array(n).fill(-1);
	}

	/** The best lay over the orders on a strip `width` wide (each call narrower than the one before), or
	 * null when some piece is wider than the strip. */
	at(width: number): RungLay | null {
		if (this.prepared.some((p) => !p.shapes.some((s) => offsets(s, p.atFold, width, this.band) > 0))) return null;
		let best: Run | null = null;
		this.orders.forEach((order, o) => {
			const run = this.decodeAt(order, width, this.runs[o]);
			this.runs[o] = run;
			if (run && (!best || run.length < best.length - 1e-9)) best = run;
		});
		if (!best) return null;
		const b = best as Run;
		return { width, length: b.length, order: b.order, placements: this.placementsOf(b) };
	}

	private decodeAt(order: number[], width: number, prev: Run | null): Run | null {
		let from = 0;
		if (prev && prev.width >= width) {
			while (from < prev.spots.length) {
				const s = prev.spots[from];
				const p = this.prepared[s.item];
				if (s.offset >= offsets(p.shapes[s.variant], p.atFold, width, this.band)) break;
				from++;
			}
		} else prev = null;
		if (prev && from === prev.spots.length) return { ...prev, width };
		const sheet = prev ? prev.before[from].clone() : new Sheet(this.count, this.band);
		const before = prev ? prev.before.slice(0, from + 1) : [sheet.clone()];
		const spots = prev ? prev.spots.slice(0, from) : [];
		const done = decode(sheet, this.prepared, order, this.choice, width, from, spots, (i) => {
			if (i + 1 < order.length) before[i + 1] = sheet.clone();
		});
		if (!done) return null;
		return { order, width, spots: done, before, length: sheet.length };
	}

	private placementsOf(run: Run): NestPlacement[] {
		return run.spots.map((s) => {
			const shape = this.prepared[s.item].shapes[s.variant];
			const dx = s.x - shape.minX;
			const dy = s.offset * this.band - shape.minY;
			return {
				index: s.item,
				key: this.items[s.item].key,
				variant: s.variant,
				dx,
				dy,
				points: shape.points.map((p) => ({ x: p.x + dx, y: p.y + dy }))
			};
		});
	}
}

export { NestInputError };
