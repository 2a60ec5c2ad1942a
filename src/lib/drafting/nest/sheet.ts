// The strip being filled: for every band across the width, the x-intervals already taken, sorted and
// disjoint. Placing a piece is a bottom-left search: for each band offset across the width, the least x
// where the piece's intervals miss everything laid (found by pushing right past each clash until none is
// left), keeping the leftmost; holes left between earlier pieces are found like any other room.
import type { Shape } from './shape';

const EPS = 1e-9;

export class Sheet {
	readonly rows: Float64Array[];
	readonly sizes: Int32Array;
	/** Length used so far (rightmost true edge of any piece). */
	length = 0;

	constructor(
		readonly count: number,
		readonly band: number
	) {
		this.rows = Array.from({ length: count }, () => new Float64Array(8));
		this.sizes = new Int32Array(count);
	}

	clone(): Sheet {
		const s = new Sheet(0, this.band);
		(s as { count: number }).count = this.count;
		(s as { rows: Float64Array[] }).rows = this.rows.map((r, i) => r.slice(0, Math.max(8, this.sizes[i])));
		(s as { sizes: Int32Array }).sizes = this.sizes.slice();
		s.length = this.length;
		return s;
	}

	/** First interval index in row r whose end is beyond x (binary search). */
	private firstEndingAfter(r: number, x: number): number {
		const row = this.rows[r];
		let a = 0;
		let b = this.sizes[r] >> 1;
		while (a < b) {
			const m = (a + b) >> 1;
			if (row[2 * m + 1] > x + EPS) b = m;
			else a = m + 1;
		}
		return a;
	}

	/** Least x ≥ x0 at which the shape, its box's lowest band at `offset`, clashes with nothing; Infinity
	 * once that passes `limit`. */
	fit(shape: Shape, offset: number, x0: number, limit: number): number {
		const bands = shape.bands;
		const m = bands.length;
		let x = x0;
		let clean = 0;
		let j = 0;
		while (clean < m) {
			const r = offset + shape.first + j;
			let moved = false;
			if (r >= 0 && r < this.count && this.sizes[r] > 0) {
				const own = bands[j];
				const row = this.rows[r];
				const size = this.sizes[r] >> 1;
				for (let i = 0; i < own.length; i += 2) {
					const lo = own[i];
					const hi = own[i + 1];
					let k = this.firstEndingAfter(r, x + lo);
					while (k < size && row[2 * k] < x + hi - EPS) {
						x = row[2 * k + 1] - lo;
						moved = true;
						if (x > limit) return Infinity;
						k++;
						while (k < size && row[2 * k + 1] <= x + lo + EPS) k++;
					}
				}
			}
			// A push may have moved an earlier interval of this band onto something: check it again.
			if (moved) clean = 0;
			else {
				clean++;
				j = j + 1 === m ? 0 : j + 1;
			}
		}
		return x;
	}

	/** Marks the shape taken at (x, band offset). */
	put(shape: Shape, offset: number, x: number) {
		for (let j = 0; j < shape.bands.length; j++) {
			const r = offset + shape.first + j;
			if (r < 0 || r >= this.count) continue;
			const own = shape.bands[j];
			for (let i = 0; i < own.length; i += 2) this.insert(r, x + own[i], x + own[i + 1]);
		}
		this.length = Math.max(this.length, x + shape.length);
	}

	private insert(r: number, lo: number, hi: number) {
		let row = this.rows[r];
		const size = this.sizes[r];
		// Intervals that touch or overlap [lo, hi] merge with it.
		let a = 0;
		while (a < size && row[a + 1] < lo - EPS) a += 2;
		let b = a;
		while (b < size && row[b] <= hi + EPS) {
			lo = Math.min(lo, row[b]);
			hi = Math.max(hi, row[b + 1]);
			b += 2;
		}
		const next = size - (b - a) + 2;
		if (next > row.length) {
			const grown = new Float64Array(Math.max(next, row.length * 2));
			grown.set(row.subarray(0, size));
			row = this.rows[r] = grown;
		}
		row.copyWithin(a + 2, b, size);
		row[a] = lo;
		row[a + 1] = hi;
		this.sizes[r] = next;
	}
}
