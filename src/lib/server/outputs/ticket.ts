// What one cutting ticket shows, built from an order line by re-drafting it: the stored measurements
// and options, drafted with the house rules the order was placed under, so a reprint never changes.
// Body measurements are personal data (GDPR): the ticket carries the shopper's first name only and
// just the four measurements the workroom drafts from.
import type { FigureSource } from '$lib/drafting/figures-source';
import { firstName } from '$lib/orders/names';
import {
	draftSkirt,
	estimateFabric,
	type Draft,
	type FabricEstimate,
	type HouseRules,
	type HouseRulesInput,
	DraftInputError,
	type FitAdjustments
} from '$lib/drafting';
import { draftInputOf, isErased, type StoredChoice, type StoredLine, type StoredMeasurements } from '../order/lines';
import type { OrderStage } from '$lib/orders/stages';
import type { StoredCutterLay } from '../db/schema';
import { clothOf, cutterLayFits } from '../order/cloth';
import type { RemakeChanges } from '../fit/remake-changes';

/** The cloth as the workroom has it on the shelf. */
export interface TicketFabric {
	name: string;
	colour: string;
	fibreContent: string;
	widthCm: number;
	nap: boolean;
	stretch: boolean;
	shrinkagePct: number;
	/** Shrinkage across when it differs from along; null or absent: the one value applies to both. */
	shrinkageAcrossPct?: number | null;
}

/** The measurements as the shopper gave them (cm); a missing depth stays null. */
export type GivenMeasurements = StoredMeasurements;

/** Everything one ticket (one order line) prints. */
export interface Ticket {
	orderId: number;
	number: string;
	firstName: string;
	status: OrderStage;
	/** YYYY-MM-DD */
	promisedDate: string;
	houseRulesId: number;
	line: { id: number; index: number; count: number };
	styleName: string;
	given: GivenMeasurements;
	/** Where the figures came from: her tape, a size chart, or a skirt that fits her laid flat. */
	figuresSource: FigureSource;
	draft: Draft;
	fabric: TicketFabric;
	/** The shell fabric to cut, or why it could not be laid (a fabric narrower than a piece). */
	estimate: FabricEstimate | null;
	estimateProblem: string | null;
	/** The lay drawn is the cutter's (a longer search, stored with the order), not the quote's. */
	cutterLay: boolean;
	/** Fabric length priced with the order (cm), for comparison with today's estimate. */
	orderedCm: number | null;
	/** The re-drafted figures agree with those stored at order time (null when none were stored). */
	figuresAgree: boolean | null;
	/** For a remake: what changed against the first cut (filled in by the loader). */
	remake?: RemakeChanges | null;
}

/** What makeTicket needs: an order line with its order, fabric and house rules. */
export interface TicketInput {
	orderId: number;
	number: string;
	shopperName: string;
	status: OrderStage;
	promisedDate: string;
	houseRulesId: number;
	rules: HouseRulesInput | HouseRules;
	line: {
		id: number;
		index: number;
		count: number;
		styleName: string;
		measurements: StoredLine['measurements'];
		figuresSource?: FigureSource;
		options: StoredChoice;
		adjustments?: FitAdjustments | null;
		figures?: StoredLine['figures'] | null;
		fabricCm?: number | null;
		/** The cutter's lay stored with the line (drawn instead of a fresh quote lay when it fits the cloth). */
		cutterLay?: StoredCutterLay | null;
	};
	fabric: TicketFabric;
}

/** Two figure sets agree when every number is within half a millimetre (they are stored rounded to it). */
export function sameFigures(a: unknown, b: unknown): boolean {
	if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) < 0.05 + 1e-9;
	if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameFigures(x, b[i]));
	if (a && b && typeof a === 'object' && typeof b === 'object') {
		const ka = Object.keys(a).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
		const kb = Object.keys(b).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
		return (
			ka.length === kb.length &&
			ka.every((k) => sameFigures((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]))
		);
	}
	return a === b;
}

/** Re-drafts an order line from its stored measurements, options and fit adjustments, with the fabric's
 * stretch and the order's house rules: the one draft every output of the line (ticket, DXF, full-scale
 * prints) is made from. Throws DraftInputError when the stored input no longer drafts or was erased. */
export function redraftLine(input: {
	rules: TicketInput['rules'];
	line: Pick<TicketInput['line'], 'measurements' | 'options' | 'adjustments'>;
	fabric: Pick<TicketFabric, 'stretch'>;
}): Draft {
	const stored = draftInputOf({ measurements: input.line.measurements, options: input.line.options, adjustments: input.line.adjustments ?? null });
	if (!stored || isErased(input.line.measurements)) {
		throw new DraftInputError([{ field: 'measurements', message: 'Her measurements were erased at her request, so this line can no longer be drafted.' }]);
	}
	// The shop drafts with the fabric's stretch when the options do not say (a stretch knit needs no vent).
	return draftSkirt(stored.measurements, { stretch: input.fabric.stretch, ...stored.choice }, input.rules);
}

/** Re-drafts an order line and lays its fabric. Throws DraftInputError when the stored input no longer drafts. */
export function makeTicket(input: TicketInput): Ticket {
	const draft = redraftLine(input);
	// Never true here (redraftLine has refused erased figures); it tells the type checker so.
	if (isErased(input.line.measurements)) throw new DraftInputError([{ field: 'measurements', message: 'Her measurements were erased.' }]);
	const given: GivenMeasurements = input.line.measurements;
	let estimate: FabricEstimate | null = null;
	let estimateProblem: string | null = null;
	const stored = input.line.cutterLay;
	const facts = { ...input.fabric, shrinkageAcrossPct: input.fabric.shrinkageAcrossPct ?? null };
	const useStored = cutterLayFits(stored, facts);
	if (useStored && stored) estimate = { length: stored.length, need: stored.need, layout: stored.layout };
	else
		try {
			estimate = estimateFabric(draft, clothOf(facts));
		} catch (e) {
			estimateProblem = e instanceof Error ? e.message : String(e);
		}
	return {
		orderId: input.orderId,
		number: input.number,
		firstName: firstName(input.shopperName),
		status: input.status,
		promisedDate: input.promisedDate,
		houseRulesId: input.houseRulesId,
		line: { id: input.line.id, index: input.line.index, count: input.line.count },
		styleName: input.line.styleName,
		given,
		figuresSource: input.line.figuresSource ?? 'measured',
		draft,
		fabric: input.fabric,
		estimate,
		estimateProblem,
		cutterLay: useStored,
		orderedCm: input.line.fabricCm ?? null,
		figuresAgree:
			input.line.figures === undefined || input.line.figures === null
				? null
				: sameFigures(draft.figures, input.line.figures)
	};
}
