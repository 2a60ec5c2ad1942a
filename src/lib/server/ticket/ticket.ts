// What one cutting ticket shows, built from an order line by re-drafting it: the stored measurements
// and options, drafted with the house rules the order was placed under, so a reprint never changes.
// Body measurements are personal data (GDPR): the ticket carries the shopper's first name only and
// just the four measurements the workroom drafts from.
import {
	draftSkirt,
	estimateFabric,
	type Draft,
	type FabricEstimate,
	type HouseRules,
	type HouseRulesInput,
	type Measurements,
	type SkirtChoiceInput
} from '../../drafting';
import type { OrderStage } from '../../orders/stages';
import type { StoredCutterLay } from '../db/schema';
import { clothOf, cutterLayFits } from '../workroom/cloth';

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

/** The measurements as the shopper gave them (cm); a missing waist-to-hip depth stays null. */
export interface GivenMeasurements {
	waist: number;
	hip: number;
	length: number;
	waistToHip: number | null;
}

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
		measurements: Record<string, number | null | undefined>;
		options: Record<string, unknown>;
		figures?: unknown;
		fabricCm?: number | null;
		/** The cutter's lay stored with the line (drawn instead of a fresh quote lay when it fits the cloth). */
		cutterLay?: StoredCutterLay | null;
	};
	fabric: TicketFabric;
}

/** The first word of a name: all of the shopper the workroom needs to see. */
export function firstNameOf(full: string): string {
	return full.trim().split(/\s+/)[0] ?? '';
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

/** The shopper's given measurements of a stored order line. */
export function givenOf(m: Record<string, number | null | undefined>): GivenMeasurements {
	return {
		waist: Number(m.waist),
		hip: Number(m.hip),
		length: Number(m.length),
		waistToHip: typeof m.waistToHip === 'number' ? m.waistToHip : null
	};
}

/** Re-drafts a stored order line with the house rules it was ordered under. Throws DraftInputError when
 * the stored input no longer drafts. */
export function redraftLine(
	line: { measurements: Record<string, number | null | undefined>; options: Record<string, unknown> },
	rules: HouseRulesInput | HouseRules,
	fabric: { stretch: boolean }
): Draft {
	const given = givenOf(line.measurements);
	const measurements: Measurements = {
		waist: given.waist,
		hip: given.hip,
		length: given.length,
		...(given.waistToHip === null ? {} : { waistToHip: given.waistToHip })
	};
	// The shop drafts with the fabric's stretch when the options do not say (a stretch knit needs no vent).
	const options = { stretch: fabric.stretch, ...line.options } as SkirtChoiceInput;
	return draftSkirt(measurements, options, rules);
}

/** Re-drafts an order line and lays its fabric. Throws DraftInputError when the stored input no longer drafts. */
export function makeTicket(input: TicketInput): Ticket {
	const given = givenOf(input.line.measurements);
	const draft = redraftLine(input.line, input.rules, input.fabric);
	let estimate: FabricEstimate | null = null;
	let estimateProblem: string | null = null;
	const stored = input.line.cutterLay;
	const facts = { ...input.fabric, shrinkageAcrossPct: input.fabric.shrinkageAcrossPct ?? null };
	const useStored = cutterLayFits(stored, facts);
	if (useStored) estimate = { length: stored.length, need: stored.need, layout: stored.layout };
	else
		try {
			estimate = estimateFabric(draft, clothOf(facts));
		} catch (e) {
			estimateProblem = e instanceof Error ? e.message : String(e);
		}
	return {
		orderId: input.orderId,
		number: input.number,
		firstName: firstNameOf(input.shopperName),
		status: input.status,
		promisedDate: input.promisedDate,
		houseRulesId: input.houseRulesId,
		line: { id: input.line.id, index: input.line.index, count: input.line.count },
		styleName: input.line.styleName,
		given,
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
