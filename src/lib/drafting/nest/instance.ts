// Strip-packing instances in the shared JSON form (a strip height, items with a polygon, a demand and the
// orientations allowed in degrees) read into a nesting problem, and lays written back: as JSON placements
// anyone can check with their own geometry, or as a drawing.
import type { Point } from '../geometry';
import { area } from './shape';
import type { NestItem, NestProblem, NestResult } from './engine';

export class InstanceError extends Error {}

/** An item of the instance with its outline and the rotations it may take. */
export interface InstanceItem {
	id: number | string;
	demand: number;
	rotations: number[];
	outline: Point[];
}

export interface Instance {
	name: string;
	height: number;
	items: InstanceItem[];
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const num = (v: unknown) => typeof v === 'number' && Number.isFinite(v);

function ring(data: unknown, where: string): Point[] {
	if (!Array.isArray(data) || data.length < 3)
		throw new InstanceError(`${where}: a polygon needs at least three [x, y] points.`);
	const pts = data.map((q, i) => {
		if (!Array.isArray(q) || q.length < 2 || !num(q[0]) || !num(q[1]))
			throw new InstanceError(`${where}: point ${i} is not a pair of numbers.`);
		return { x: q[0] as number, y: q[1] as number };
	});
	const last = pts[pts.length - 1];
	if (pts.length > 3 && last.x === pts[0].x && last.y === pts[0].y) pts.pop();
	if (Math.abs(area(pts)) <= 0) throw new InstanceError(`${where}: the polygon has no area.`);
	return pts;
}

/** The outer outline of a shape: a simple polygon, a polygon with holes (holes are not used: pieces are
 * never put inside another piece's hole), or a rectangle. */
function outlineOf(shape: unknown, where: string): Point[] {
	if (!isObject(shape)) throw new InstanceError(`${where}: "shape" is missing.`);
	const data = shape.data;
	switch (shape.type) {
		case 'simple_polygon':
			return ring(data, where);
		case 'polygon':
			if (!isObject(data)) throw new InstanceError(`${where}: a "polygon" shape needs data.outer.`);
			return ring(data.outer, where);
		case 'rectangle': {
			if (!isObject(data) || !num(data.width) || !num(data.height))
				throw new InstanceError(`${where}: a rectangle needs width and height.`);
			const x = num(data.x_min) ? (data.x_min as number) : 0;
			const y = num(data.y_min) ? (data.y_min as number) : 0;
			const w = data.width as number;
			const h = data.height as number;
			return [
				{ x, y },
				{ x: x + w, y },
				{ x: x + w, y: y + h },
				{ x, y: y + h }
			];
		}
		default:
			throw new InstanceError(
				`${where}: shape type ${JSON.stringify(shape.type)} is not one this command reads (simple_polygon, polygon, rectangle).`
			);
	}
}

/** Reads a parsed instance file. Items without a list of orientations may turn freely: they are tried
 * at every 90°, the most this engine samples (said in the output). */
export function readInstance(json: unknown): Instance {
	if (!isObject(json)) throw new InstanceError('The file is not a JSON object.');
	const height = json.strip_height;
	if (!num(height) || (height as number) <= 0)
		throw new InstanceError('"strip_height" must be a positive number (only strip packing instances are read).');
	if (!Array.isArray(json.items) || !json.items.length) throw new InstanceError('"items" must be a non-empty list.');
	const items = json.items.map((it, i): InstanceItem => {
		const where = `item ${i}`;
		if (!isObject(it)) throw new InstanceError(`${where} is not an object.`);
		const demand = it.demand ?? 1;
		if (!num(demand) || (demand as number) < 0 || !Number.isInteger(demand))
			throw new InstanceError(`${where}: "demand" must be a whole number.`);
		const rot = it.allowed_orientations;
		if (rot !== undefined && rot !== null && (!Array.isArray(rot) || !rot.length || !rot.every(num)))
			throw new InstanceError(`${where}: "allowed_orientations" must be a list of degrees.`);
		const rotations = Array.isArray(rot) ? [...new Set(rot as number[])] : [0, 90, 180, 270];
		const id = typeof it.id === 'number' || typeof it.id === 'string' ? it.id : i;
		return { id, demand: demand as number, rotations, outline: outlineOf(it.shape, where) };
	});
	return { name: typeof json.name === 'string' ? json.name : 'instance', height: height as number, items };
}

/** The outline turned about the origin by `deg` degrees (counter-clockwise for x right, y up). */
export function rotated(points: Point[], deg: number): Point[] {
	const t = (deg * Math.PI) / 180;
	// Exact for quarter turns, so integer outlines stay integer.
	const quarter = Math.round(deg / 90);
	const c = Math.abs(deg - quarter * 90) < 1e-12 ? [1, 0, -1, 0][((quarter % 4) + 4) % 4] : Math.cos(t);
	const s = Math.abs(deg - quarter * 90) < 1e-12 ? [0, 1, 0, -1][((quarter % 4) + 4) % 4] : Math.sin(t);
	return points.map((p) => ({ x: p.x * c - p.y * s, y: p.x * s + p.y * c }));
}

/** The nesting problem of an instance: one item per demanded copy. */
export function problemOf(inst: Instance, band?: number): NestProblem {
	const items: NestItem[] = [];
	for (const it of inst.items) {
		const variants = it.rotations.map((deg) => ({ name: String(deg), points: rotated(it.outline, deg) }));
		for (let k = 0; k < it.demand; k++) items.push({ key: String(it.id), variants });
	}
	return { width: inst.height, items, gap: 0, band };
}

/** Total area of the demanded items. */
export const itemArea = (inst: Instance) => inst.items.reduce((a, it) => a + Math.abs(area(it.outline)) * it.demand, 0);

/** The lay as placements: each item's outline turned by `rotation` about the origin, then moved by (x, y). */
export function placementsJson(inst: Instance, result: NestResult) {
	return {
		length: result.length,
		placements: result.placements.map((p) => ({
			item: inst.items.find((it) => String(it.id) === p.key)!.id,
			rotation: Number(inst.items.find((it) => String(it.id) === p.key)!.rotations[p.variant]),
			x: p.dx,
			y: p.dy
		}))
	};
}

/** The lay drawn to scale: the strip, each piece, the length. */
export function laySvg(result: NestResult, title: string): string {
	const w = result.length;
	const h = result.width;
	const pad = h * 0.04;
	const f = (v: number) => +v.toFixed(4);
	const paths = result.placements
		.map(
			(p, i) =>
				`<path d="M${p.points.map((q) => `${f(q.x)} ${f(h - q.y)}`).join('L')}Z" fill="hsl(${(i * 47) % 360} 45% 78%)" stroke="#333" stroke-width="${f(h / 800)}"/>`
		)
		.join('\n');
	return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${f(-pad)} ${f(-pad * 2)} ${f(w + 2 * pad)} ${f(h + 3 * pad)}">
<title>${title.replace(/[<&]/g, '')}</title>
<text x="0" y="${f(-pad * 0.6)}" font-size="${f(pad)}" font-family="sans-serif">${title.replace(/[<&]/g, '')}</text>
<rect x="0" y="0" width="${f(w)}" height="${f(h)}" fill="#fff" stroke="#000" stroke-width="${f(h / 400)}"/>
${paths}
</svg>
`;
}
