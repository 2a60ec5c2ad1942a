// From an order of pieces to a lay: each piece in turn at its bottom-left place (least x along the length,
// then nearest the fold or first selvedge), in whichever of its allowed ways of lying gets it furthest left.
import { Sheet } from './sheet';
import type { Shape } from './shape';

/** A piece prepared for decoding: its ways of lying, and whether it must touch the fold (y = 0). */
export interface Prepared {
	shapes: Shape[];
	atFold: boolean;
}

/** Where one piece went: way of lying, box offset along (x) and band offset across. */
export interface Spot {
	item: number;
	variant: number;
	x: number;
	offset: number;
}

/** The room across the width, in whole bands, a shape may start at. */
export function offsets(shape: Shape, atFold: boolean, width: number, band: number): number {
	if (atFold) return shape.breadth <= width + 1e-9 ? 1 : 0;
	return Math.max(0, Math.floor((width - shape.breadth) / band + 1e-9) + 1);
}

/** Places `items[order[i]]` for i from `from` on, on `sheet` (changed in place). `choice[item]` ≥ 0 forces
 * a way of lying; −1 lets the placement pick. Returns the spots, or null when a piece fits nowhere. */
export function decode(
	sheet: Sheet,
	items: Prepared[],
	order: number[],
	choice: Int8Array,
	width: number,
	from: number,
	spots: Spot[],
	onPlaced?: (i: number) => void
): Spot[] | null {
	const band = sheet.band;
	for (let i = from; i < order.length; i++) {
		const item = items[order[i]];
		let best: Spot | null = null;
		let bestX = Infinity;
		const forced = choice[order[i]];
		for (let v = 0; v < item.shapes.length && bestX > 1e-9; v++) {
			if (forced >= 0 && v !== forced) continue;
			const shape = item.shapes[v];
			const room = offsets(shape, item.atFold, width, band);
			for (let k = 0; k < room; k++) {
				const x = sheet.fit(shape, k, 0, bestX - 1e-9);
				if (x < bestX) {
					bestX = x;
					best = { item: order[i], variant: v, x, offset: k };
					if (x <= 1e-9) break;
				}
			}
		}
		if (!best) return null;
		sheet.put(item.shapes[best.variant], best.offset, best.x);
		spots.push(best);
		onPlaced?.(i);
	}
	return spots;
}
