// The house symbols, once for every drawing: arrowhead, grain arrow, fold bracket, notch, dart, dimension
// and scale bar. Sizes are given in cm of the drawing by the caller, who knows the drawing's scale.
import { add, mul, normalOf, sub, unit, type Point } from '../geometry';
import { through, upright, type Mark, type Measure, type Role, type Tone } from './model';

/** A filled arrowhead at `tip`, pointing along `dir`. */
export function arrowhead(tip: Point, dir: Point, size: number, role: Role = 'grain'): Mark {
	const d = unit(dir);
	const back = sub(tip, mul(d, size));
	const side = mul(normalOf(d), size * 0.37);
	return { kind: 'path', role, parts: through([tip, add(back, side), sub(back, side)]), closed: true, noStroke: true, fill: 'ink' };
}

/** The grain line: a long double-headed arrow. */
export function grainArrow(from: Point, to: Point, head: number): Mark[] {
	const d = sub(to, from);
	return [{ kind: 'path', role: 'grain', parts: through([from, to]) }, arrowhead(to, d, head), arrowhead(from, mul(d, -1), head)];
}

/** The fold bracket: parallel to the fold edge on the `inward` side, over the stretch `span` (fractions
 * of the fold), its ends turned to the fold with arrowheads, and the word "fold" beside it. */
export function foldBracket(
	a: Point,
	b: Point,
	inward: Point,
	span: [number, number],
	sizes: { off: number; head: number; word: number }
): { marks: Mark[]; word: Mark } {
	const n = unit(inward);
	const along = sub(b, a);
	const at = (t: number, o: number) => add(add(a, mul(along, t)), mul(n, o));
	const [p1, p2] = [at(span[0], 0), at(span[1], 0)];
	const leg = sizes.head * 0.73;
	const path: Mark = {
		kind: 'path',
		role: 'fold',
		parts: through([add(p1, mul(n, leg)), at(span[0], sizes.off), at(span[1], sizes.off), add(p2, mul(n, leg))])
	};
	const angle = upright((Math.atan2(along.y, along.x) * 180) / Math.PI);
	const word: Mark = {
		kind: 'text',
		role: 'fold',
		at: at((span[0] + span[1]) / 2, sizes.off + sizes.word * 0.6),
		text: 'fold',
		size: sizes.word,
		angle,
		italic: true
	};
	return { marks: [path, arrowhead(p1, mul(n, -1), sizes.head, 'fold'), arrowhead(p2, mul(n, -1), sizes.head, 'fold')], word };
}

/** A notch: a short tick (two side by side for the back) cut in from `at` along `inward`. */
export function notchTicks(at: Point, inward: Point, len: number, double: boolean, spread: number): Mark[] {
	const d = unit(inward);
	const across = normalOf(d);
	return (double ? [-spread, spread] : [0]).map((o) => {
		const a = add(at, mul(across, o));
		return { kind: 'path', role: 'notch', parts: through([a, add(a, mul(d, len))]) };
	});
}

/** A dart: its legs from the tops to the point, and the point marked with a dot. */
export const dartMarks = (top1: Point, point: Point, top2: Point, dot: number): Mark[] => [
	{ kind: 'path', role: 'dart', parts: through([top1, point, top2]) },
	{ kind: 'dot', role: 'dart', at: point, r: dot }
];

/** A dimension line from a to b with slash ticks, its value written upright in a gap in the middle. */
export function dimension(a: Point, b: Point, label: string, size: number, measure: Measure): Mark[] {
	const d = unit(sub(b, a));
	const len = Math.hypot(b.x - a.x, b.y - a.y);
	const gap = measure(label, size) + size * 0.6;
	const mid = mul(add(a, b), 0.5);
	const out: Mark[] = [];
	if (len > gap + size * 0.6)
		out.push({
			kind: 'path',
			role: 'dimension',
			parts: [
				{ from: a, to: sub(mid, mul(d, gap / 2)) },
				{ from: add(mid, mul(d, gap / 2)), to: b }
			]
		});
	const tick = mul(add(d, normalOf(d)), size * 0.31);
	for (const p of [a, b]) out.push({ kind: 'path', role: 'dimension', parts: [{ from: sub(p, tick), to: add(p, tick) }] });
	out.push({ kind: 'text', role: 'dimension', at: mid, text: label, size, angle: upright((Math.atan2(d.y, d.x) * 180) / Math.PI) });
	return out;
}

/** A scale bar: `parts` blocks over `length` cm from `origin`, alternately ink and `light`, with its ends
 * written under it (`ends`: the words, their size and how far below the bar's top their baseline is). */
export function scaleBar(
	origin: Point,
	length: number,
	parts: number,
	height: number,
	light: Tone,
	ends?: { left: string; right: string; size: number; below: number }
): Mark {
	const step = length / parts;
	const marks: Mark[] = Array.from({ length: parts }, (_, i) => {
		const x = origin.x + i * step;
		return {
			kind: 'path',
			role: 'scale-bar',
			closed: true,
			fill: i % 2 ? light : 'ink',
			parts: through([P(x, origin.y), P(x + step, origin.y), P(x + step, origin.y + height), P(x, origin.y + height)])
		};
	});
	if (ends)
		for (const [x, text] of [
			[origin.x, ends.left],
			[origin.x + length, ends.right]
		] as const)
			marks.push({ kind: 'text', role: 'scale-bar', at: P(x, origin.y + ends.below), text, size: ends.size, baseline: 'alphabetic' });
	return { kind: 'group', name: 'scale bar', marks };
}

const P = (x: number, y: number): Point => ({ x, y });

/** The key to the pen roles, in a row from (x, y): a sample of each line and its name. Returns the marks
 * and where the row ends. */
export function legendMarks(x: number, y: number, u: number, measure: Measure): { marks: Mark[]; end: number } {
	const at = (dx: number, dy: number) => P(dx * u, y + dy * u);
	const line = (role: Role, ...pts: [number, number][]): Mark => ({ kind: 'path', role, parts: through(pts.map(([a, b]) => at(a, b))) });
	const samples: [string, (x: number) => Mark[]][] = [
		['seam line', (x) => [line('seam', [x, 0], [x + 16, 0])]],
		['cutting line', (x) => [line('cutting', [x, 0], [x + 16, 0])]],
		['dart', (x) => [line('dart', [x, -3], [x + 8, 3], [x + 16, -3])]],
		['construction line', (x) => [line('construction', [x, 0], [x + 16, 0])]],
		['grain line', (x) => grainArrow(at(x, 0), at(x + 16, 0), 4 * u)],
		['notch', (x) => [line('cutting', [x + 4, -4], [x + 4, 4]), line('notch', [x + 4, -4], [x + 4, 0.5])]]
	];
	const marks: Mark[] = [];
	let cx = x / u;
	for (const [label, sample] of samples) {
		marks.push(...sample(cx));
		cx += 20;
		marks.push({ kind: 'text', role: 'label', at: at(cx, 2.5), text: label, size: 7 * u, anchor: 'start', baseline: 'alphabetic' });
		cx += measure(label, 7 * u) / u + 12;
	}
	return { marks, end: cx * u };
}
