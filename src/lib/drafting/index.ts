/**
 * Quarterline drafting engine: the skirt a pattern cutter drafts by hand, computed.
 *
 * How it works
 * - Input: four measurements in cm (waist, hip, length at the side, waist-to-hip depth if known), the
 *   waist-to-knee length if known (else the house default, said so), optional fit adjustments (fit.ts), a
 *   style with options, and the house rules (every default overridable, merged over DEFAULT_RULES). Bad
 *   input throws one DraftInputError naming every field with its allowed range (validateMeasurements gives
 *   the same list without throwing); a figure past what a block fits (a waist far over the hip, more
 *   shaping than darts can take) is a `confirmable` problem with its value and limit, drafted once
 *   `confirmed` is set. Nothing returns NaN.
 * - The block (suppression.ts, panel.ts, block.ts): quarter measures with ease, back and front balanced
 *   about the side seam, the waist suppression shared between centre back, darts and side seam. On a
 *   usual figure that is the house method exactly; on unusual ones the darts shrink, vanish or split (up
 *   to three a panel), grow longer with their intake, never open past the house's largest angle nor reach
 *   past the hip line less its margin; intake beyond the usual goes mostly to the back; the side seam
 *   never flares, and a waist larger than the hip widens the hip line. Fit adjustments move the centre
 *   waists, the darts, the back hip and the side curve; one hip higher or fuller drafts each half from its
 *   own figure and asymmetric.ts joins them into pieces cut open. Each waist is a
 *   cubic curve through the darts, square to the centre line and to the side seam, each dart's two sides
 *   turned by half its angle so the waist runs on smoothly when the dart is folded shut (its cap). Then it
 *   is trued as a cutter trues it: the side waist point moves along the waist until the waist seam,
 *   measured along the curve with the darts closed, is exactly the intended quarter waist; and where the
 *   front and back side seams differ by more than the house easing the longer one's waist point is lowered.
 * - Styles (styles/*.ts) are derivations from the block: straight (a vent past the knee, opening to about
 *   the knee), pencil (taken in at the side seams down to the knee, vented in a woven near or past it), A-line (the side-most dart closed, fully or in part, into
 *   hem flare by rotation about its point; the side seam adds the rest), half and full circle (waist radius
 *   = waist seam / θ), six gores (panel seams through the darts, flaring below the hip). extras.ts adds the
 *   waistband or the facings (the waist with the darts closed), lining and pocket bags.
 * - Pieces (pieces.ts, offset.ts, loops.ts): seam lines are closed paths of lines and cubic curves. The
 *   cutting line is a true offset, edge by edge with its own allowance, curves fitted as curves within
 *   0.1 mm, corners mitred or trimmed, the seam mirrored below the hem line so a hem folds up flat, and
 *   any loop an offset makes inside a tight bend cut out. (A uniform polygon offset, such as Clipper's,
 *   cannot give per-edge allowances or mirrored hem corners; the tests use Clipper to cross-check.)
 * - Fabric (fabric.ts, pack.ts, columns.ts, nest/): the cutting pieces laid on the width left after
 *   shrinking, grain along the selvedge, folded where a piece is cut on the fold, turned end for end only
 *   without nap, a gap between pieces. The nester (nest/) fits pieces into each other: outlines as bands
 *   across the strip, bottom-left placement exact along the length, a search over order and turns. The
 *   quote takes the best nested lay over a fixed ladder of widths, or the row and column lays if shorter;
 *   each only shortens as the cloth widens, so the estimate does too. The lay is grown as L ÷ (1 − s) and
 *   rounded up to the sale step (10 cm, or ⅛ yd by the yard). cutterLay searches one order for seconds;
 *   combinedLay lays several orders of one cloth together.
 * - Drawings (drawing/, svg.ts): each drawing is described once as marks with a role (seam, cutting,
 *   construction, dart, grain, fold, notch, label, dimension, scale bar) in cm, with the words placed
 *   once (text widths supplied by the back end); svg.ts writes the block, the pieces or the lay as one
 *   self-contained SVG in cm, and the ticket's pdfkit back end draws the same marks at a stated scale.
 * Plain TypeScript with no framework, DOM or database import and no randomness: the shop draws in the
 * browser and the workroom prints on the server from the same code, and a draft is always the same.
 * Draft.figures are rounded to the millimetre; Draft.exactFigures keep full precision.
 */
export { draftSkirt, type Draft } from './draft';
export { estimateFabric, saleLength, type FabricEstimate, type FabricOptions, type Layout, type LayoutPiece } from './fabric';
export { combinedLay, combinedLayInSlices, cutterLay, cutterLayInSlices, type Pause, type CombinedLay, type CutterLay, type LayOrder, type SearchOptions } from './nest/cutter';
export { toSvg, type SvgOptions } from './svg';
export { CM_PER_INCH, cmToIn, formatCm, formatInches, formatLength, inToCm, type Units } from './units';
export { DEFAULT_RULES, DEFAULT_RULES_INCH, resolveRules, type FrontBack, type HouseRules, type HouseRulesInput, type SuppressionRule } from './rules';
export {
	DEFAULT_OPTIONS,
	OPTION_FIELDS,
	STYLES,
	type Closure,
	type OptionField,
	type ResolvedChoice,
	type SkirtChoice,
	type SkirtChoiceInput,
	type SkirtOptions,
	type StyleId,
	type StyleInfo,
	type VentChoice,
	type WaistFinish
} from './options';
export { DraftInputError, problemIn, type FieldProblem } from './errors';
export { MEASUREMENT_LIMITS, validateMeasurements, type Measurements, type ResolvedMeasurements } from './measurements';
export type { BackFigures, Block, CheckPair, DartFigure, Figures, FrontFigures, PanelFigures } from './block';
export type { DartGeom, Panel, PanelSpec } from './panel';
export { pathProblems } from './checks';
export { FIT_LIMITS, fitWords, hasFit, NO_FIT, resolveFit, type BodySide, type FitAdjustments, type ResolvedFit } from './fit';
export type { CutInstruction, Label, Notch, Piece, PieceDart } from './pieces';
export type { MarkLine } from './styles/common';
export type { ClosedPath, CubicSegment, Edge, LineSegment, Point, Segment } from './geometry';
export { circleWaistRadius } from './styles/circle';
