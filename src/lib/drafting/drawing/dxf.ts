// The open DXF back end: the same pieces the ticket and the drawings draw, written for cutting tables and
// CAD in the apparel convention of ASTM D6673 (sewn-products pattern data in DXF). Unlike the paper back
// ends it takes the pieces' own lines, not the drawing's marks: a CAD reader wants the bare lines on their
// layers (one grain line, one mirror line), not arrowheads, fold brackets or paper patches under words.
//
// The writer is @tarikjabiri/dxf (MIT, TypeScript, Node >= 18; pinned at 2.9.0, checked on Node 20): it
// writes the handles, tables and block records a DXF 2007 file needs, which ezdxf's audit checks, so we
// do not keep our own. It writes LWPOLYLINE, not the R12 POLYLINE of older cutting-table software: a
// machine that reads only R12 would need the file saved down (ezdxf can).
import { DxfWriter, LWPolylineFlags, TextHorizontalAlignment, TextVerticalAlignment, Units, point2d, point3d } from '@tarikjabiri/dxf';
import { add, dist, mul, pointAt, sub, tangentAt, unit, type Point, type Segment } from '../geometry';
import type { Piece } from '../pieces';
import { flatten } from '../outline';
import { segRect, upright, type Rect, type Role } from './model';
import { placeStack, stackRect, type Fit, type Stack, type StackLine } from './place';

/**
 * Layer of each kind of line. ASTM D6673 numbers them; these numbers are FROM MEMORY of the AAMA/ASTM
 * layer list (no copy of the standard was at hand): 1 piece boundary (the cutting line) with the piece
 * name and quantity, 2 turn points, 3 curve points, 4 notches, 6 mirror (fold) line, 7 grain line,
 * 8 internal lines, 13 drill holes, 14 sew line, 15 annotation text.
 */
export const DXF_LAYER = {
	boundary: '1',
	turn: '2',
	curve: '3',
	notch: '4',
	mirror: '6',
	grain: '7',
	internal: '8',
	drill: '13',
	sew: '14',
	annotation: '15'
} as const;
export type DxfLayerKind = keyof typeof DXF_LAYER;

/** The drawing model's roles as they land on the layers (labels split: name and quantity on the boundary
 * layer, the rest as annotation). */
export const ROLE_LAYER: Partial<Record<Role, DxfLayerKind>> = {
	cutting: 'boundary',
	seam: 'sew',
	notch: 'notch',
	fold: 'mirror',
	grain: 'grain',
	dart: 'internal',
	construction: 'internal',
	label: 'annotation'
};

/** Largest distance (cm) a polyline may stray from the engine's curve: 0.1 mm. */
export const CURVE_TOLERANCE_CM = 0.01;

const distToSegment = (p: Point, a: Point, b: Point) => {
	const d = sub(b, a);
	const len2 = d.x * d.x + d.y * d.y;
	const t = len2 < 1e-18 ? 0 : Math.min(1, Math.max(0, ((p.x - a.x) * d.x + (p.y - a.y) * d.y) / len2));
	return dist(p, add(a, mul(d, t)));
};

/**
 * Points along a cubic (its end point excluded), subdivided until every piece is flat within `tol`.
 * A cubic lies inside the hull of its four control points, and the distance to a chord is convex, so
 * when both inner control points lie within `tol` of the chord the whole curve does: the bound is exact,
 * not sampled. Subdivision is de Casteljau at the middle.
 */
function flattenCubic(a: Point, b: Point, c: Point, d: Point, tol: number, out: Point[], depth = 0) {
	if (depth >= 18 || Math.max(distToSegment(b, a, d), distToSegment(c, a, d)) <= tol) {
		out.push(a);
		return;
	}
	const ab = mul(add(a, b), 0.5);
	const bc = mul(add(b, c), 0.5);
	const cd = mul(add(c, d), 0.5);
	const abc = mul(add(ab, bc), 0.5);
	const bcd = mul(add(bc, cd), 0.5);
	const m = mul(add(abc, bcd), 0.5);
	flattenCubic(a, ab, abc, m, tol, out, depth + 1);
	flattenCubic(m, bcd, cd, d, tol, out, depth + 1);
}

/** A closed path as a polygon within `tol` cm of it, with the index of each segment's first vertex. */
export function flattenWithin(segs: Segment[], tol = CURVE_TOLERANCE_CM): { points: Point[]; starts: number[] } {
	const points: Point[] = [];
	const starts: number[] = [];
	for (const s of segs) {
		starts.push(points.length);
		if (s.kind === 'line') points.push(s.from);
		else flattenCubic(s.from, s.c1, s.c2, s.to, tol, points);
	}
	return { points, starts };
}

/** Turn of direction (degrees) where a path leaves segment i - 1 for segment i. */
function turnAt(segs: Segment[], i: number): number {
	const prev = segs[(i - 1 + segs.length) % segs.length];
	const a = tangentAt(prev, 1);
	const b = tangentAt(segs[i], 0);
	return (Math.abs(Math.atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y)) * 180) / Math.PI;
}

/** A corner sharper than this (degrees) is a turn point; smoother joins are curve points. */
const TURN_DEGREES = 2;
/** Half the gap between the two cuts of a double notch (cm): about 6 mm apart, common practice. */
const DOUBLE_NOTCH_HALF_GAP = 0.3;
/** A drill hole marks a dart's point this far (cm) inside the dart, so the hole is sewn into it:
 * common practice (1 cm short of the point). */
const DRILL_SHORT_OF_POINT = 1;
/** Room (mm) between the pieces where they are inserted side by side. */
const GAP_MM = 30;

export interface DxfPiece {
	piece: Piece;
	/** The order line it belongs to (1-based) when an order has more than one skirt. */
	line?: number;
}

export interface DxfInput {
	orderNumber: string;
	/** Style of each line, for the header text. */
	styleName: string;
	pieces: DxfPiece[];
}

/** Block name safe in any DXF reader: letters, digits, hyphen and underscore. */
export const blockName = (orderNumber: string, p: DxfPiece) =>
	`${orderNumber}_${p.line ? `L${p.line}_` : ''}${p.piece.id}`.replace(/[^A-Za-z0-9_-]+/g, '-').toUpperCase();

/** The whole order as DXF text, millimetres, y up. */
export function piecesToDxf(input: DxfInput): string {
	const w = new DxfWriter();
	// $INSUNITS = 4: millimetres (the DXF reference's unit codes), and $MEASUREMENT = 1: metric.
	w.setUnits(Units.Millimeters);
	w.setVariable('$MEASUREMENT', { 70: 1 });
	for (const [kind, name] of Object.entries(DXF_LAYER)) w.addLayer(name, LAYER_COLOUR[kind as DxfLayerKind], 'CONTINUOUS');
	let x = 0;
	for (const dp of input.pieces) {
		const p = dp.piece;
		// Piece cm (y down) to block mm (y up), the cutting line's box corner at the block's origin.
		const toMm = (q: Point) => point2d(r((q.x - p.bounds.minX) * 10), r((p.bounds.maxY - q.y) * 10));
		const at3 = (q: Point) => {
			const v = toMm(q);
			return point3d(v.x, v.y, 0);
		};
		const block = w.addBlock(blockName(input.orderNumber, dp));
		const onLayer = (k: DxfLayerKind) => ({ layerName: DXF_LAYER[k] });

		const cut = flattenWithin(p.cutting.segments);
		block.addLWPolyline(
			cut.points.map((q) => ({ point: toMm(q) })),
			{ flags: LWPolylineFlags.Closed, ...onLayer('boundary') }
		);
		// Turn and curve points: each vertex of the boundary said to be a corner or a point on a curve, so a
		// reader that grades or smooths knows which vertices it may round off.
		const turns = new Set(cut.starts.filter((_, i) => turnAt(p.cutting.segments, i) > TURN_DEGREES));
		cut.points.forEach((q, i) => {
			const v = toMm(q);
			block.addPoint(v.x, v.y, 0, onLayer(turns.has(i) ? 'turn' : 'curve'));
		});
		const seam = flattenWithin(p.seam.segments);
		block.addLWPolyline(
			seam.points.map((q) => ({ point: toMm(q) })),
			{ flags: LWPolylineFlags.Closed, ...onLayer('sew') }
		);
		block.addLine(at3(p.grain.from), at3(p.grain.to), onLayer('grain'));
		if (p.fold) block.addLine(at3(p.fold.from), at3(p.fold.to), onLayer('mirror'));
		for (const n of p.notches) {
			const d = unit(n.inward);
			const across = { x: -d.y, y: d.x };
			for (const o of n.double ? [-DOUBLE_NOTCH_HALF_GAP, DOUBLE_NOTCH_HALF_GAP] : [0]) {
				const a = add(n.at, mul(across, o));
				block.addLine(at3(a), at3(add(a, mul(d, n.depth))), onLayer('notch'));
			}
		}
		for (const d of p.darts) {
			block.addLWPolyline([d.top1, d.point, d.top2].map((q) => ({ point: toMm(q) })), onLayer('internal'));
			const mid = mul(add(d.top1, d.top2), 0.5);
			const drill = add(d.point, mul(unit(sub(mid, d.point)), Math.min(DRILL_SHORT_OF_POINT, dist(mid, d.point) / 3)));
			const v = toMm(drill);
			block.addPoint(v.x, v.y, 0, onLayer('drill'));
		}
		for (const l of p.lines) if (l.points.length >= 2) block.addLWPolyline(l.points.map((q) => ({ point: toMm(q) })), onLayer('internal'));

		for (const t of pieceText(p, input.orderNumber, dp.line)) {
			const v = at3(t.at);
			block.addText(v, r(t.size * 10 * CAP_HEIGHT), t.text, {
				...onLayer(t.layer),
				// DXF angles run counter-clockwise with y up; the engine's run clockwise with y down.
				rotation: -t.angle,
				horizontalAlignment: TextHorizontalAlignment.Center,
				verticalAlignment: TextVerticalAlignment.Middle,
				secondAlignmentPoint: v
			});
		}
		// One insert per block, side by side along x, never overlapping.
		w.addInsert(block.name, point3d(x, 0, 0), onLayer('boundary'));
		x += r((p.bounds.maxX - p.bounds.minX) * 10) + GAP_MM;
	}
	// The file's own header words (style and units), in model space on layer 1 as the AAMA/ASTM files
	// carry them (FROM MEMORY: "Style Name:" and "Units:" lines).
	const top = Math.max(0, ...input.pieces.map((dp) => (dp.piece.bounds.maxY - dp.piece.bounds.minY) * 10)) + 20;
	w.addText(point3d(0, r(top + 12), 0), 6, `Style Name: ${input.orderNumber} ${input.styleName}`, { layerName: DXF_LAYER.boundary });
	w.addText(point3d(0, r(top), 0), 6, 'Units: METRIC', { layerName: DXF_LAYER.boundary });
	return w.stringify();
}

/** How wide a letter of a plain CAD font is, as a share of the text's em (its cap height 0.7 em): the
 * words are placed for it, as a reader sets them in its own font (common practice; from memory). */
export const DXF_LETTER = 0.6;

/** Cap height of Lora as a share of its em, so DXF text (sized by cap height) matches the paper's. */
const CAP_HEIGHT = 0.7;
const r = (v: number) => Math.round(v * 1000) / 1000;

const LAYER_COLOUR: Record<DxfLayerKind, number> = {
	boundary: 1, // red, as the house draws the cutting line in thread red
	turn: 1,
	curve: 1,
	notch: 7,
	mirror: 6,
	grain: 7,
	internal: 5,
	drill: 5,
	sew: 7,
	annotation: 8
};

interface PieceText {
	text: string;
	at: Point;
	size: number;
	angle: number;
	layer: DxfLayerKind;
}

/** A point of paper in cm at full size: the unit the word placement keeps its clearances in. */
const PT_CM = 2.54 / 72;

/** The words of a piece: piece name and quantity on the boundary layer as the standard's "Piece Name:" and
 * "Quantity:" lines (FROM MEMORY), then the cut instruction, the order number, notes and allowances as
 * annotation. The stack is placed by the drawing model's own rule (place.ts): inside the seam line, off
 * the grain line and the darts, nearest the engine's place for the labels; letters as wide as a CAD font
 * sets them (DXF_LETTER). A stack that finds no place is made smaller, then turned, before it is left where
 * the engine put its labels. */
export function pieceText(p: Piece, orderNumber: string, line?: number): PieceText[] {
	const name = p.labels.find((l) => l.kind === 'name');
	const cut = p.labels.find((l) => l.kind === 'cut');
	const nameSize = name?.size ?? 2;
	const small = cut?.size ?? nameSize * 0.62;
	const angle = name?.angle ?? 0;
	const rows: (Omit<PieceText, 'at' | 'angle'> & { kind: StackLine['kind'] })[] = [
		// As wide as the engine's name was sized to fit the piece: the standard's prefix makes it longer.
		{ text: `Piece Name: ${p.name}`, size: nameSize * Math.min(1, (name?.text.length ?? 1) / `Piece Name: ${p.name}`.length), layer: 'boundary', kind: 'name' },
		{ text: `Quantity: ${p.cut.count}`, size: small, layer: 'boundary', kind: 'cut' },
		{ text: p.fabric === 'lining' ? `${p.cutText}, lining fabric` : p.cutText, size: small, layer: 'annotation', kind: 'cut' },
		{ text: `Order ${orderNumber}${line ? `, skirt ${line}` : ''}`, size: small, layer: 'annotation', kind: 'cut' },
		...p.labels.filter((l) => l.kind === 'note' || l.kind === 'allowances').map((l) => ({ text: l.text, size: l.size, layer: 'annotation' as const, kind: l.kind }))
	];
	const first = p.labels[0];
	const last = p.labels[p.labels.length - 1];
	const centre = first && last ? mul(add(first.at, last.at), 0.5) : { x: (p.bounds.minX + p.bounds.maxX) / 2, y: (p.bounds.minY + p.bounds.maxY) / 2 };
	const fit: Fit = { u: PT_CM, measure: (text, size) => [...text].length * size * DXF_LETTER, readable: false };
	const poly = flatten(p.seam.segments, 0.3);
	const avoid: Rect[] = [
		segRect(p.grain.from, p.grain.to, 1.5 * PT_CM),
		...p.darts.map((d) => ({
			x0: Math.min(d.top1.x, d.point.x, d.top2.x) - PT_CM,
			y0: Math.min(d.top1.y, d.point.y, d.top2.y) - PT_CM,
			x1: Math.max(d.top1.x, d.point.x, d.top2.x) + PT_CM,
			y1: Math.max(d.top1.y, d.point.y, d.top2.y) + PT_CM
		}))
	];
	const soft = p.lines.filter((l) => l.points.length >= 2).map((l) => segRect(l.points[0], l.points[l.points.length - 1], PT_CM));
	const stackOf = (k: number, a: number): Stack => {
		const lines = rows.map((t) => ({ text: t.text, size: t.size * k, weight: 400 as const, kind: t.kind }));
		return { lines, angle: a, centre, rect: stackRect(fit, lines, centre, a) };
	};
	let placed: Stack | null = null;
	let scale = 1;
	search: for (const k of [1, 0.8, 0.64, 0.5, 0.4])
		for (const a of [angle, upright(angle + 90)]) {
			const got = placeStack(fit, stackOf(k, a), poly, [[...avoid, ...soft], avoid]);
			if (got.clear) {
				[placed, scale] = [got.stack, k];
				break search;
			}
		}
	const at = placed?.centre ?? centre;
	const turn = placed?.angle ?? angle;
	// Down the stack, turned with the text (angles clockwise, y down).
	const rad = (turn * Math.PI) / 180;
	const down = { x: -Math.sin(rad), y: Math.cos(rad) };
	const total = rows.reduce((s, t) => s + t.size * scale * 1.3, 0);
	let run = -total / 2;
	return rows.map(({ kind: _kind, ...t }) => {
		const size = t.size * scale;
		const mid = run + (size * 1.3) / 2;
		run += size * 1.3;
		return { ...t, size, at: add(at, mul(down, mid)), angle: turn };
	});
}

/** Where the curve and its polygon disagree most (cm), sampled: for tests. */
export function worstGap(s: Segment, poly: Point[], samples = 200): number {
	let worst = 0;
	for (let i = 0; i <= samples; i++) {
		const q = pointAt(s, i / samples);
		let best = Infinity;
		for (let k = 0; k + 1 < poly.length; k++) best = Math.min(best, distToSegment(q, poly[k], poly[k + 1]));
		worst = Math.max(worst, best);
	}
	return worst;
}
