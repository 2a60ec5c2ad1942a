// The garment view: her finished skirt, front and back, on a simple figure outline at her proportions,
// drawn from the draft itself. Lengths run true down the body (waist line at y = 0, cm); widths are the
// body and the skirt as seen from the front, so the drawing is to her proportions but not to scale (no
// scale bar: DESIGN.md asks for one on drawings that are to scale).
//
// How widths are seen (garmentFigures):
// - A body section seen from the front shows about 0.37 of its girth: an ellipse about 1.4 times as wide
//   as it is deep (from memory: a waist of 68 cm is about 25 cm across). The skirt where it follows the
//   body (waist, hip, a straight or pencil hem) is seen the same way: width = SEEN × girth.
// - Cloth beyond the fitted hip girth stands out as a cone would, each extra cm of girth widening the
//   silhouette by 1/π cm (a circle's diameter is 1/π of its circumference), but cloth is not stiff: it
//   falls in folds and shows about half that spread (DRAPE, our own choice, checked by eye against
//   photographs of wool and cotton circle skirts). So an A-line, a gored or a circle skirt is as wide at
//   the hem as its hem girth makes it, and a straight skirt as wide as its hip.
import type { Draft } from '../draft';
import type { Point } from '../geometry';
import { isCircle } from '../options';
import { formatLength, type Units } from '../units';
import { through, type Curve, type Drawing, type Mark, type Tone } from './model';

/** Share of a girth seen from the front (an ellipse 1.4 times as wide as deep, from memory). */
export const SEEN = 0.37;
/** Share of a stiff cone's spread that hanging cloth shows (see above). */
export const DRAPE = 0.5;
/** The handbook size 12's waist to knee (TRADE.md, from memory): the figure's unmeasured heights scale
 * with her knee against it. */
const USUAL_KNEE = 58.5;
/** Waist to floor over waist to knee on the same size 12 (104 / 58.5 cm, from memory). */
const FLOOR_PER_KNEE = 104 / 58.5;

/** The drawn widths and depths, in cm of the drawing, with the draft's girths they come from. */
export interface GarmentFigures {
	/** Finished waist, hip line and hem girths of the skirt (cm round). */
	waistGirth: number;
	hipGirth: number;
	hemGirth: number;
	/** The block's hip with ease: the girth up to which the skirt follows the body. */
	fittedHip: number;
	/** Drawn widths of the skirt at the waist, the hip line and the hem. */
	waistWidth: number;
	hipWidth: number;
	hemWidth: number;
	/** Depths below the waist line: hip line, hem at the side seam, knee, floor. */
	hipDepth: number;
	length: number;
	knee: number;
	floor: number;
	/** Waistband above the waist line (0 with a facing). */
	band: number;
}

/** Width seen from the front of a skirt girth, given the girth up to which it follows the body. */
export const seenWidth = (girth: number, fitted: number) => SEEN * Math.min(girth, fitted) + (DRAPE * Math.max(0, girth - fitted)) / Math.PI;

export function garmentFigures(draft: Draft): GarmentFigures {
	const f = draft.exactFigures;
	const m = draft.measurements;
	const fittedHip = 2 * (f.front.hipWidth + f.back.hipWidth);
	let waistGirth = 2 * (f.check.waistSeam.front + f.check.waistSeam.back);
	let hipGirth = fittedHip;
	if (isCircle(draft.style) && f.waistRadius) {
		// A circle's girth grows with the radius: θ·r at the waist, θ·(r + d) at the hip line.
		const theta = draft.style === 'full-circle' ? 2 * Math.PI : Math.PI;
		waistGirth = theta * f.waistRadius;
		hipGirth = theta * (f.waistRadius + m.hipDepth);
	}
	return {
		waistGirth,
		hipGirth,
		hemGirth: f.hemGirth,
		fittedHip,
		waistWidth: seenWidth(waistGirth, fittedHip),
		hipWidth: seenWidth(hipGirth, fittedHip),
		hemWidth: seenWidth(f.hemGirth, fittedHip),
		hipDepth: m.hipDepth,
		length: m.length,
		knee: m.kneeDepth,
		floor: m.kneeDepth * FLOOR_PER_KNEE,
		band: draft.choice.waistband === 'band' ? draft.rules.waistband.width : 0
	};
}

/** The cloth the skirt is drawn in: a #RRGGBB colour and, if there is one, its swatch image. */
export interface GarmentCloth {
	colour: string;
	image?: string | null;
	name?: string;
}

export interface GarmentOptions {
	views?: ('front' | 'back')[];
	/** Calico (the atelier's toile) until she chooses a cloth. */
	cloth?: GarmentCloth;
	units?: Units;
	/** Words on the drawing ("Front", "Back", "knee"); left out on the smallest drawings. */
	labels?: boolean;
	/** Frame the skirt only (waist to below the hem or knee) rather than the whole figure: small drawings. */
	crop?: boolean;
}

/** Calico, the cloth a toile is made in: the skirt before she chooses hers. */
export const CALICO: GarmentCloth = { colour: '#E8DFCC', name: 'calico' };

const P = (x: number, y: number): Point => ({ x, y });

/** A smooth curve through points (Catmull-Rom, as cubic Béziers), open at both ends. */
function smooth(pts: Point[]): Curve[] {
	const out: Curve[] = [];
	for (let i = 0; i < pts.length - 1; i++) {
		const p0 = pts[Math.max(0, i - 1)];
		const [p1, p2] = [pts[i], pts[i + 1]];
		const p3 = pts[Math.min(pts.length - 1, i + 2)];
		out.push({ from: p1, c1: P(p1.x + (p2.x - p0.x) / 6, p1.y + (p2.y - p0.y) / 6), c2: P(p2.x - (p3.x - p1.x) / 6, p2.y - (p3.y - p1.y) / 6), to: p2 });
	}
	return out;
}

const mirrorX = (c: Curve): Curve => ({ from: P(-c.to.x, c.to.y), to: P(-c.from.x, c.from.y), ...(c.c1 && c.c2 ? { c1: P(-c.c2.x, c.c2.y), c2: P(-c.c1.x, c.c1.y) } : {}) });
const shift = (c: Curve, dx: number): Curve => ({ from: P(c.from.x + dx, c.from.y), to: P(c.to.x + dx, c.to.y), ...(c.c1 && c.c2 ? { c1: P(c.c1.x + dx, c.c1.y), c2: P(c.c2.x + dx, c.c2.y) } : {}) });
const reversed = (cs: Curve[]): Curve[] => [...cs].reverse().map((c) => ({ from: c.to, to: c.from, ...(c.c1 && c.c2 ? { c1: c.c2, c2: c.c1 } : {}) }));

/** The figure's outline, centred on x = 0: a dress form's torso from the neck, on legs to the floor.
 * Girths are hers; what she did not measure (bust, legs) follows her hip, and heights follow her knee. */
function figureOutline(g: GarmentFigures, waist: number, hip: number): Curve[] {
	const sv = g.knee / USUAL_KNEE;
	const sw = hip / 94;
	// Bust from the girths (a size 12 has 88 over a 68 waist and 94 hip, from memory).
	const bust = Math.max(waist + 6, (waist + hip) / 2 + 7);
	const shoulder = 0.42 * bust;
	const [d, K, F] = [g.hipDepth, g.knee, g.floor];
	const right = [
		P(shoulder / 2, -36.5 * sv),
		P((SEEN * bust) / 2 + 0.6 * sw, -26 * sv),
		P((SEEN * bust) / 2, -20 * sv),
		P((SEEN * waist) / 2, 0),
		P((SEEN * hip) / 2, d),
		P((SEEN * hip) / 2 - 1.2 * sw, d + 14 * sv),
		P(11 * sw, K),
		P(11.6 * sw, K + 11 * sv),
		P(7.2 * sw, F - 7 * sv)
	];
	const inner = [P(3.4 * sw, F - 7 * sv), P(1.6 * sw, K + 10 * sv), P(1 * sw, K), P(0, d + 7 * sv)];
	const neck = [P(5.2 * sw, -45 * sv), P(5.6 * sw, -40 * sv)];
	const half: Curve[] = [
		...through(neck),
		...smooth([neck[1], P(neck[1].x + 3 * sw, -38.2 * sv), right[0]]),
		...smooth(right),
		...through([right.at(-1)!, P(9.6 * sw, F - 0.8), P(8.6 * sw, F), P(2.6 * sw, F), P(3 * sw, F - 1.5), inner[0]]),
		...smooth(inner)
	];
	return [{ from: P(-neck[0].x, neck[0].y), to: neck[0] }, ...half, ...[...half].reverse().map(mirrorX)];
}

/** Where a point round the body, `share` of the way from the centre to the side seam, is seen across a
 * width: the side seam at the edge, the centre in the middle. */
const across = (width: number, share: number) => (width / 2) * Math.sin((Math.PI / 2) * Math.min(1, Math.max(0, share)));

interface Side {
	/** Half-width of the skirt's silhouette at depth y. */
	halfAt: (y: number) => number;
	/** The right side seam, waist to hem. */
	side: Curve[];
	/** How far the hem's middle hangs below its ends (the hem seen a little from above). */
	sag: (half: number) => number;
}

function silhouette(g: GarmentFigures, circle: boolean): Side {
	const [w, h, e] = [g.waistWidth / 2, g.hipWidth / 2, g.hemWidth / 2];
	const d = Math.min(g.hipDepth, g.length - 1);
	const top = P(w, 0);
	const hip = P(h, d);
	const hem = P(e, g.length);
	// Below the hip line the side runs straight to the hem; above it curves out from the waist and meets
	// that line tangent (a circle is one cone from the waist).
	const dir = { x: hem.x - hip.x, y: hem.y - hip.y };
	const len = Math.hypot(dir.x, dir.y) || 1;
	const side: Curve[] = circle
		? [{ from: top, c1: P(w + (e - w) * 0.05, g.length * 0.12), c2: P(w + (e - w) * 0.55, g.length * 0.6), to: hem }]
		: [{ from: top, c1: P(w + (h - w) * 0.45, d * 0.3), c2: P(h - (dir.x / len) * d * 0.45, d - (dir.y / len) * d * 0.45), to: hip }, { from: hip, to: hem }];
	const halfAt = (y: number) => {
		if (circle) return w + (e - w) * Math.min(1, Math.max(0, y / g.length)) ** 0.85;
		if (y <= d) return w + (h - w) * Math.sin((Math.PI / 2) * Math.min(1, Math.max(0, y / d)));
		return h + (e - h) * Math.min(1, (y - d) / Math.max(1e-9, g.length - d));
	};
	return { halfAt, side, sag: (half) => Math.min(3, half * 0.06) };
}

type Pen = { tone?: Tone };

/** One view of the skirt (front or back) centred on x = 0. */
function skirtView(draft: Draft, g: GarmentFigures, view: 'front' | 'back', pen: Pen): Mark[] {
	const c = draft.choice;
	const r = draft.rules;
	const f = draft.exactFigures;
	const circle = isCircle(draft.style);
	const s = silhouette(g, circle);
	const L = g.length;
	const marks: Mark[] = [];
	const line = (pts: Point[], extra: Partial<Extract<Mark, { kind: 'path' }>> = {}): Mark => ({ kind: 'path', role: 'seam', parts: through(pts), ...pen, ...extra });
	const hemHalf = s.halfAt(L);
	const sag = s.sag(hemHalf);
	// The hem: a shallow curve (its middle nearer the eye), in folds for a circle.
	const hem: Curve[] = [];
	const folds = circle ? Math.max(5, Math.round((g.hemGirth - g.fittedHip) / 40)) : 0;
	if (folds) {
		const n = folds * 2 + 1;
		for (let i = 0; i < n; i++) {
			const [x0, x1] = [hemHalf - (2 * hemHalf * i) / n, hemHalf - (2 * hemHalf * (i + 1)) / n];
			const dip = (x: number) => sag * (1 - (x / hemHalf) ** 2);
			const depth = i % 2 === 0 ? 2.2 : -0.6;
			hem.push({ from: P(x0, L + dip(x0)), c1: P(x0 - (x0 - x1) * 0.2, L + dip(x0) + depth), c2: P(x1 + (x0 - x1) * 0.2, L + dip(x1) + depth), to: P(x1, L + dip(x1)) });
		}
	} else hem.push({ from: P(hemHalf, L), c1: P(hemHalf * 0.4, L + sag * 1.33), c2: P(-hemHalf * 0.4, L + sag * 1.33), to: P(-hemHalf, L) });
	const band = g.band;
	const w = g.waistWidth / 2;
	const waistSag = Math.min(1.2, w * 0.05);
	const waistLine: Curve = { from: P(-w, 0), c1: P(-w * 0.4, waistSag * 1.33), c2: P(w * 0.4, waistSag * 1.33), to: P(w, 0) };
	const flipX = (x: Curve): Curve => ({ from: P(-x.from.x, x.from.y), to: P(-x.to.x, x.to.y), ...(x.c1 && x.c2 ? { c1: P(-x.c1.x, x.c1.y), c2: P(-x.c2.x, x.c2.y) } : {}) });
	// The body of the skirt: right side down, the hem across, the left side up, the waist across.
	const outline: Curve[] = [...s.side, ...hem, ...reversed(s.side).map(flipX), waistLine];
	// The outline stays ink on any cloth: it is what separates the skirt from the paper.
	const body: Mark = { kind: 'path', role: 'seam', parts: outline, closed: true, fillCloth: true };
	marks.push(body);
	// Light falls from the front: the sides turn away and darken a little.
	for (const side of [1, -1]) {
		const pts: Point[] = [];
		for (let i = 0; i <= 12; i++) {
			const y = (L * i) / 12;
			pts.push(P(side * s.halfAt(y), y));
		}
		const inner = pts.map((q) => P(q.x - side * Math.max(1, Math.abs(q.x) * 0.12), q.y));
		marks.push({ kind: 'path', role: 'seam', parts: [...through(pts), ...through([...inner].reverse())], closed: true, noStroke: true, fill: 'ink', fillOpacity: 0.07 });
	}
	// Darts (chalk blue), or the gores' panel seams, at their place round the body.
	const panel = view === 'front' ? f.front : f.back;
	const seen = (y: number, share: number) => across(2 * s.halfAt(y), share);
	if (draft.style === 'gored') {
		const share = panel.darts.length ? panel.darts[0].fromCentre / panel.waistWidth : 0.5;
		for (const sgn of [1, -1]) marks.push({ kind: 'path', role: 'seam', parts: smooth([0, g.hipDepth, L].map((y) => P(sgn * seen(y, share), y))), weight: 0.7, ...pen });
	} else if (!circle) {
		for (const d of panel.darts) {
			const share = d.fromCentre / panel.waistWidth;
			for (const sgn of [1, -1]) marks.push({ kind: 'path', role: 'dart', parts: through([P(sgn * seen(0, share), 0), P(sgn * seen(d.length, share * 0.96), d.length)]), ...pen });
		}
	}
	// Circle skirts fall in folds from about the hip line.
	if (folds) {
		const n = folds * 2 + 1;
		for (let i = 1; i < n; i += 2) {
			const x = hemHalf - (2 * hemHalf * (i + 0.5)) / n;
			const top = g.hipDepth * (0.5 + 0.5 * (1 - Math.abs(x) / hemHalf));
			marks.push({ kind: 'path', role: 'fold', parts: [{ from: P(x * (s.halfAt(top) / hemHalf), top), c1: P(x * 0.7, (top + L) / 2), c2: P(x * 0.95, L - 4), to: P(x, L + sag * (1 - (x / hemHalf) ** 2) + 1) }], weight: 0.7, ...pen });
		}
	}
	// The centre back seam (not when the back is cut on the fold) with the zip, vent or pleat on it.
	const zipAtBack = c.closure.position === 'centre-back';
	const backSeam = view === 'back' && !(c.closure.position === 'side' && c.vent === 'none') && draft.style !== 'full-circle';
	if (backSeam) marks.push(line([P(0, -band), P(0, L + sag)], { weight: 0.7 }));
	const zipLine = (x: (y: number) => number) => {
		const zl = c.closure.length;
		const top = -band;
		if (c.closure.kind === 'zip') {
			// A regular zip shows its topstitching: down one side, across below the stop, up the other.
			const o = 0.8;
			marks.push({ kind: 'path', role: 'seam', parts: through([P(x(0) - o, 0), P(x(zl) - o, zl), P(x(zl) + o, zl + 0.6), P(x(zl) + o, zl), P(x(0) + o, 0)]), dashed: true, weight: 0.5, ...pen });
		}
		marks.push({ kind: 'path', role: 'seam', parts: through([P(x(0), top), P(x(zl), zl)]), weight: 0.7, ...pen });
		marks.push({ kind: 'path', role: 'seam', parts: through([P(x(0) + 0.3, top + 0.6), P(x(0) + 0.3, top + 2.4)]), weight: 1.4, ...pen });
	};
	if (view === 'back' && zipAtBack) zipLine(() => 0);
	// The zip in the left side seam: the wearer's left is on the right of the front view, the left of the back.
	if (c.closure.position === 'side') {
		const sgn = view === 'front' ? 1 : -1;
		zipLine((y) => sgn * (s.halfAt(Math.max(0, y)) - 1.2));
	}
	if (view === 'back' && c.vent !== 'none' && !circle) {
		const top = L - c.ventLength;
		const ext = c.vent === 'vent' ? r.vent.extension : r.kickPleat.extension;
		if (c.vent === 'vent') {
			// A vent: the left back laps over the right, stitched across at its top.
			marks.push(line([P(0, top), P(ext, top + ext * 0.8), P(ext, L + sag)], { dashed: true, weight: 0.5 }));
			marks.push(line([P(0, L + sag - 0.2), P(0.8, L + sag + 0.4)], { weight: 0.7 }));
		} else {
			// A kick pleat: folded under behind the seam, stitched in a small triangle at its top.
			marks.push(line([P(-ext * 0.8, top + ext), P(0, top), P(ext * 0.8, top + ext)], { dashed: true, weight: 0.5 }));
			marks.push(line([P(-0.9, L + sag), P(0, L + sag - 1.6), P(0.9, L + sag)], { weight: 0.6 }));
		}
	}
	// In-seam pockets: the opening in the side seam shows as a short line just inside it.
	if (view === 'front' && c.pockets) {
		const [y0, y1] = [r.pocket.fromWaist, r.pocket.fromWaist + r.pocket.opening];
		const sides = c.closure.position === 'side' ? [-1] : [1, -1];
		for (const sgn of sides) {
			const pts = [y0, (y0 + y1) / 2, y1].map((y) => P(sgn * (s.halfAt(y) - 1.6), y));
			marks.push({ kind: 'path', role: 'seam', parts: smooth(pts), weight: 0.8, ...pen });
		}
	}
	// The lining, seen through: a dashed line where its hem falls.
	if (c.lining) {
		const y = L - r.lining.shorter;
		const half = s.halfAt(y) - 0.8;
		marks.push({ kind: 'path', role: 'construction', parts: [{ from: P(-half, y), c1: P(-half * 0.4, y + sag * 1.3), c2: P(half * 0.4, y + sag * 1.3), to: P(half, y) }], tone: pen.tone ?? 'pencil', weight: 1.2 });
	}
	// A facing is turned inside: its lower edge only shows as a faint line; a band sits on the waist.
	if (band) {
		const top: Curve = { from: P(w, -band), c1: P(w * 0.4, -band + waistSag * 1.33), c2: P(-w * 0.4, -band + waistSag * 1.33), to: P(-w, -band) };
		marks.push({ kind: 'path', role: 'seam', parts: [waistLine, { from: P(w, 0), to: P(w, -band) }, top, { from: P(-w, -band), to: P(-w, 0) }], closed: true, fillCloth: true });
		// The band's seam to the skirt, in the lines' tone (light on a dark cloth).
		if (pen.tone) marks.push({ kind: 'path', role: 'seam', parts: [waistLine], ...pen, weight: 0.7 });
		if (view === 'back' && zipAtBack) marks.push({ kind: 'dot', role: 'seam', at: P(-r.waistband.underlap / 2, -band / 2), r: 0.45 });
	} else {
		const y = r.facingDepth;
		const half = s.halfAt(y) - 0.6;
		marks.push({ kind: 'path', role: 'construction', parts: [{ from: P(-half, y), c1: P(-half * 0.4, y + waistSag * 1.33), c2: P(half * 0.4, y + waistSag * 1.33), to: P(half, y) }], tone: pen.tone ?? 'pencil', weight: 0.8 });
	}
	return marks;
}

/** Perceived lightness of a #RRGGBB colour, 0 (black) to 1 (white). */
function lightness(hex: string): number {
	const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
	if (!m) return 1;
	const [r, g, b] = [m[1], m[2], m[3]].map((h) => parseInt(h, 16) / 255);
	return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** A sentence of her skirt's figures, for the drawing's text alternative. */
export function garmentWords(draft: Draft, units: Units = 'cm', cloth: GarmentCloth = CALICO): string {
	const m = draft.measurements;
	const fl = (v: number) => formatLength(v, units);
	const g = garmentFigures(draft);
	const knee = m.length <= m.kneeDepth ? `${fl(m.kneeDepth - m.length)} above the knee` : `${fl(m.length - m.kneeDepth)} below the knee`;
	const finish = draft.choice.waistband === 'band' ? 'a waistband' : 'a facing';
	const extras = [draft.choice.lining ? 'lined' : '', draft.choice.pockets ? 'with pockets' : '', draft.choice.vent === 'vent' ? 'a back vent' : draft.choice.vent === 'kick-pleat' ? 'a kick pleat' : ''].filter(Boolean);
	return (
		`Your skirt in ${cloth.name ?? 'your cloth'}, front and back, on a figure with a ${fl(m.waist)} waist and ${fl(m.hip)} hip` +
		`${m.hipDepthAssumed ? '' : ` ${fl(m.hipDepth)} below it`}: ${fl(m.length)} long, ${knee}${m.kneeAssumed ? ' (a usual knee height)' : ''}; ` +
		`${fl(g.waistGirth)} round the waist, ${fl(g.hemGirth)} round the hem; ${finish}${extras.length ? ', ' + extras.join(', ') : ''}.`
	);
}

/** The garment view of a draft: the finished skirt on her figure, front then back. */
export function garmentView(draft: Draft, options: GarmentOptions = {}): Drawing {
	const views = options.views ?? ['front', 'back'];
	const cloth = options.cloth ?? CALICO;
	const labels = options.labels ?? true;
	const g = garmentFigures(draft);
	const m = draft.measurements;
	// On a dark cloth the lines inside the skirt are drawn in paper, or they would vanish.
	const pen: Pen = lightness(cloth.colour) < 0.3 ? { tone: 'paper' } : {};
	const figure = figureOutline(g, m.waist, m.hip);
	const figureHalf = Math.max(...figure.flatMap((c) => [c.from.x, c.to.x]));
	const half = Math.max(figureHalf, g.hipWidth / 2, g.hemWidth / 2 + 1.5) + 4;
	let top = Math.min(...figure.flatMap((c) => [c.from.y, c.to.y])) - 3;
	let bottom = g.floor + (labels ? 8 : 2);
	const gap = 4;
	const marks: Mark[] = [];
	views.forEach((view, i) => {
		const dx = half + i * (2 * half + gap);
		const inView: Mark[] = [{ kind: 'path', role: 'construction', parts: figure, closed: true, fill: 'white', dashed: false }];
		inView.push(...skirtView(draft, g, view, pen));
		// Her knee: where the hem falls against it is the point of the drawing.
		inView.push({ kind: 'path', role: 'construction', parts: through([P(-half + 1, g.knee), P(half - 1, g.knee)]), weight: 1.4 });
		if (labels) {
			inView.push({ kind: 'text', role: 'label', at: P(-half + 1, g.knee - 1.8), text: 'knee', size: 2.6, anchor: 'start', tone: 'pencil', italic: true });
			inView.push({ kind: 'text', role: 'label', at: P(0, g.floor + 4.5), text: view === 'front' ? 'Front' : 'Back', size: 3.6, weight: 600 });
		}
		marks.push({ kind: 'group', name: `skirt, ${view}`, marks: inView.map((mk) => shiftMark(mk, dx)) });
	});
	const width = views.length * 2 * half + (views.length - 1) * gap;
	let box = { x: 0, w: width };
	if (options.crop) {
		const y0 = -g.band - 5;
		const y1 = Math.max(g.length, g.knee) + 6;
		const w0 = Math.max(g.hipWidth, g.hemWidth) / 2 + 3;
		// As wide as the skirt and no narrower than four fifths of its height, centred on the first view.
		const cw = Math.max(2 * w0, 0.8 * (y1 - y0));
		top = y0;
		bottom = y1;
		box = { x: half - cw / 2, w: cw };
	}
	return {
		title: `Your skirt${views.length === 1 ? `, ${views[0]}` : ', front and back'}`,
		box: { x: box.x, y: top, w: box.w, h: bottom - top },
		marks,
		penScale: 3.2,
		cloth: { colour: cloth.colour, image: cloth.image ?? null, tile: 14 },
		description: garmentWords(draft, options.units ?? 'cm', cloth),
		data: {
			seen: SEEN,
			'waist-width': g.waistWidth,
			'hip-width': g.hipWidth,
			'hem-width': g.hemWidth,
			length: g.length,
			knee: g.knee,
			'waist-girth': g.waistGirth,
			'hip-girth': g.hipGirth,
			'hem-girth': g.hemGirth,
			'fitted-hip': g.fittedHip
		}
	};
}

function shiftMark(m: Mark, dx: number): Mark {
	const p = (q: Point) => P(q.x + dx, q.y);
	switch (m.kind) {
		case 'path':
			return { ...m, parts: m.parts.map((c) => shift(c, dx)) };
		case 'dot':
			return { ...m, at: p(m.at) };
		case 'text':
			return { ...m, at: p(m.at) };
		case 'patch':
			return { ...m, rects: m.rects.map((r) => ({ ...r, x0: r.x0 + dx, x1: r.x1 + dx })), clip: m.clip.map((c) => shift(c, dx)) };
		case 'group':
			return { ...m, marks: m.marks.map((x) => shiftMark(x, dx)) };
	}
}
