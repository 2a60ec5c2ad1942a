// A second way to lay a few pieces: in columns side by side, each column a stack of pieces along the
// length (as a cutter lays a long waistband beside front and back stacked one after the other). Every
// way of sharing the pieces into columns is tried; each has a fixed width and length, so the shortest
// that fits a width can only get shorter as the width grows.
import { oriented, type LayItem, type LayPlacement } from './pack';

/** Beyond this many pieces the column search (Bell-number many groupings) is left to the row packer. */
export const MAX_COLUMN_ITEMS = 6;

interface Box {
	item: LayItem;
	points: { x: number; y: number }[];
	minX: number;
	width: number;
	height: number;
	minY: number;
}

function boxOf(item: LayItem): Box {
	const points = oriented(item.polygon, item.orientations[0]);
	let minX = Infinity;
	let maxX = -Infinity;
	let minY = Infinity;
	let maxY = -Infinity;
	for (const p of points) {
		minX = Math.min(minX, p.x);
		maxX = Math.max(maxX, p.x);
		minY = Math.min(minY, p.y);
		maxY = Math.max(maxY, p.y);
	}
	// A fold piece's column starts at the fold itself.
	if (item.atFold) minX = Math.min(0, minX);
	return { item, points, minX, width: maxX - minX, height: maxY - minY, minY };
}

/** Best column lay within `width`, or null when none fits (or there are too many pieces to try them all). */
export function packColumns(items: LayItem[], width: number): { length: number; placements: LayPlacement[] } | null {
	if (!items.length || items.length > MAX_COLUMN_ITEMS) return null;
	const boxes = items.map(boxOf).sort((a, b) => Number(b.item.atFold) - Number(a.item.atFold) || b.height - a.height || a.item.key.localeCompare(b.item.key));
	const folds = boxes.filter((b) => b.item.atFold).length;
	let best: { length: number; width: number; groups: Box[][] } | null = null;
	const groups: Box[][] = [];
	// Every set partition, as a restricted growth string; all fold pieces share the first column.
	const visit = (i: number) => {
		if (i === boxes.length) {
			let w = 0;
			let len = 0;
			for (const g of groups) {
				w += Math.max(...g.map((b) => b.width));
				len = Math.max(len, g.reduce((s, b) => s + b.height, 0));
			}
			if (w <= width + 1e-9 && (!best || len < best.length - 1e-9 || (Math.abs(len - best.length) <= 1e-9 && w < best.width - 1e-9))) {
				best = { length: len, width: w, groups: groups.map((g) => [...g]) };
			}
			return;
		}
		const b = boxes[i];
		if (i < folds) {
			if (!groups.length) groups.push([]);
			groups[0].push(b);
			visit(i + 1);
			groups[0].pop();
			if (!groups[0].length) groups.pop();
			return;
		}
		for (let g = 0; g < groups.length; g++) {
			groups[g].push(b);
			visit(i + 1);
			groups[g].pop();
		}
		groups.push([b]);
		visit(i + 1);
		groups.pop();
	};
	visit(0);
	if (!best) return null;
	const chosen: { length: number; groups: Box[][] } = best;
	const placements: LayPlacement[] = [];
	let x = 0;
	for (const g of chosen.groups) {
		let y = 0;
		for (const b of g) {
			const dx = x - b.minX;
			const dy = y - b.minY;
			placements.push({ item: b.item, orientation: b.item.orientations[0], x: dx, y: dy, outline: b.points.map((p) => ({ x: p.x + dx, y: p.y + dy })) });
			y += b.height;
		}
		x += Math.max(...g.map((b) => b.width));
	}
	return { length: chosen.length, placements };
}
