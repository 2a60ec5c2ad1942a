// The drawing model: a pattern drawing described once, as marks with a role, in centimetres of the drawing,
// x to the right and y down. Back ends (SVG for the screen, pdfkit for the ticket, and the full-scale
// outputs to come) only turn marks into their own strokes and letters; what is drawn, where the words go
// and how large the symbols are is decided here. The house look (DESIGN.md) lives in PALETTE and PENS.
import type { Point } from '../geometry';

/** What a mark is on the pattern: it chooses the pen (colour, width, dash) a back end draws it with. */
export type Role = 'seam' | 'cutting' | 'construction' | 'dart' | 'grain' | 'fold' | 'notch' | 'label' | 'dimension' | 'scale-bar' | 'cloth';

/** The house colours by name. */
export type Tone = 'ink' | 'thread' | 'pencil' | 'chalk' | 'paper' | 'white';

/** The one palette (DESIGN.md): ink, thread red, pencil grey, chalk blue, paper. */
export const PALETTE: Record<Tone, string> = { ink: '#1E2230', thread: '#A8323E', pencil: '#6B6F7A', chalk: '#35598A', paper: '#F6F1E7', white: '#FFFFFF' };

/** Where a drawing is seen: on a screen (widths in cm of a 1:1 drawing that the page shrinks to fit) or
 * on paper (widths in points, whatever the scale, so a 1:10 drawing keeps printable lines). */
export type Medium = 'screen' | 'print';

export interface Pen {
	tone: Tone;
	width: Record<Medium, number>;
	/** Dash and gap, for marks of this role drawn dashed. */
	dash: Record<Medium, [number, number]>;
	/** Drawn dashed unless the mark says otherwise. */
	dashed?: boolean;
}

const DASH: Record<Medium, [number, number]> = { screen: [0.5, 0.35], print: [2.4, 1.6] };

/** One pen a role: seam line solid ink, cutting line thread red, construction pencil grey dashed,
 * darts chalk blue (DESIGN.md). */
export const PENS: Record<Role, Pen> = {
	seam: { tone: 'ink', width: { screen: 0.12, print: 0.6 }, dash: DASH },
	cutting: { tone: 'thread', width: { screen: 0.1, print: 0.9 }, dash: { screen: [0.5, 0.35], print: [2, 1.5] } },
	construction: { tone: 'pencil', width: { screen: 0.06, print: 0.4 }, dash: DASH, dashed: true },
	dart: { tone: 'chalk', width: { screen: 0.09, print: 0.7 }, dash: DASH },
	grain: { tone: 'ink', width: { screen: 0.08, print: 0.6 }, dash: DASH },
	fold: { tone: 'ink', width: { screen: 0.08, print: 0.5 }, dash: DASH },
	notch: { tone: 'ink', width: { screen: 0.08, print: 0.8 }, dash: DASH },
	label: { tone: 'ink', width: { screen: 0.04, print: 0.4 }, dash: DASH },
	dimension: { tone: 'pencil', width: { screen: 0.04, print: 0.35 }, dash: DASH },
	'scale-bar': { tone: 'ink', width: { screen: 0.04, print: 0.4 }, dash: DASH },
	cloth: { tone: 'pencil', width: { screen: 0.08, print: 0.8 }, dash: { screen: [0.6, 0.4], print: [3, 2] } }
};

/** A stretch of a path: a line, or a cubic curve when both control points are given. The engine's
 * segments are curves of this shape already. */
export interface Curve {
	from: Point;
	to: Point;
	c1?: Point;
	c2?: Point;
}

export type Weight = 400 | 600;

export interface Rect {
	x0: number;
	y0: number;
	x1: number;
	y1: number;
}

export type Mark =
	| {
			kind: 'path';
			role: Role;
			parts: Curve[];
			closed?: boolean;
			/** Not stroked: a filled shape only. */
			noStroke?: boolean;
			fill?: Tone;
			fillOpacity?: number;
			/** Filled with the drawing's cloth (its colour, or its swatch image as a pattern): garment views. */
			fillCloth?: boolean;
			dashed?: boolean;
			/** A tone other than the role's (a garment's lines drawn light on a dark cloth). */
			tone?: Tone;
			/** Stroke width as a share of the role's pen (a garment's fine topstitching). */
			weight?: number;
	  }
	| { kind: 'dot'; role: Role; at: Point; r: number }
	| {
			kind: 'text';
			role: Role;
			at: Point;
			text: string;
			/** Letter size (em) in cm of the drawing. */
			size: number;
			/** Degrees, clockwise as seen (90 reads from the top down). */
			angle?: number;
			anchor?: 'start' | 'middle' | 'end';
			/** `at` is the middle of the letters (the default) or their baseline. */
			baseline?: 'middle' | 'alphabetic';
			weight?: Weight;
			italic?: boolean;
			tone?: Tone;
	  }
	/** Paper laid under words so lines stop short of them; never outside `clip` (a seam line). */
	| { kind: 'patch'; rects: Rect[]; clip: Curve[] }
	| { kind: 'group'; name: string; marks: Mark[] };

/** A whole drawing: its marks and the box (cm) they are drawn in. */
export interface Drawing {
	title: string;
	box: { x: number; y: number; w: number; h: number };
	marks: Mark[];
	/** Pens drawn this many times their screen width: a garment view is seen much smaller than 1:1
	 * pieces of the same size in cm, and its outline must still read. */
	penScale?: number;
	/** The cloth that marks with `fillCloth` are filled with: a colour (#RRGGBB) and, if given, a swatch image
	 * repeated over it every `tile` cm. */
	cloth?: { colour: string; image?: string | null; tile?: number };
	/** A longer description for assistive technology (the SVG's <desc>). */
	description?: string;
	/** Figures of the drawing a back end may expose for checking (SVG: data-* attributes on the root). */
	data?: Record<string, number | string>;
}

/** Points of paper (1/72 in, 25.4 mm to the inch) a centimetre of cloth takes at a scale 1:n. */
export const ptPerCm = (n: number) => 72 / 2.54 / n;

/** The width of a line of text at a letter size, in the units of the size; supplied by the back end. */
export type Measure = (text: string, size: number, weight?: Weight) => number;

/** Lora's average advance over the drawings' words, measured with pdfkit on @fontsource/lora 5 (0.463 em
 * regular, 0.471 semibold): for a back end that cannot measure, such as an SVG drawn before the browser. */
export const estimateWidth: Measure = (text, size, weight = 400) => [...text].length * size * (weight === 600 ? 0.48 : 0.47);

/** A path through points. */
export const through = (pts: Point[]): Curve[] => pts.slice(1).map((to, i) => ({ from: pts[i], to }));

export const overlaps = (a: Rect, b: Rect, pad = 0) => a.x0 < b.x1 + pad && b.x0 < a.x1 + pad && a.y0 < b.y1 + pad && b.y0 < a.y1 + pad;

/** A segment's bounding rectangle, widened by `pad`. */
export const segRect = (a: Point, b: Point, pad: number): Rect => ({
	x0: Math.min(a.x, b.x) - pad,
	y0: Math.min(a.y, b.y) - pad,
	x1: Math.max(a.x, b.x) + pad,
	y1: Math.max(a.y, b.y) + pad
});

/** An angle (degrees clockwise) turned so text never reads upside down; upright text reads from the
 * top down, as the engine letters long pieces. */
export function upright(deg: number): number {
	let d = (((deg % 360) + 540) % 360) - 180;
	if (d > 90 + 1e-6) d -= 180;
	else if (d <= -90 + 1e-6) d += 180;
	return d;
}
