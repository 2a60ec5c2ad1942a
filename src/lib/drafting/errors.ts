// The one error the engine throws for bad input, so the shop can show each field's problem beside it.
import { lengthWords, type LengthWords, type Units } from './units';

/** One field's problem: which field (dotted path), a sentence for the shopper, and the allowed range. */
export interface FieldProblem {
	field: string;
	/** The sentence in centimetres (the engine's unit). */
	message: string;
	/** The same sentence in the shopper's units, made from the numbers (absent where it names no length). */
	say?: (units: Units) => string;
	min?: number;
	max?: number;
	/** The number given, and the limit it went past, where the problem is about one number. */
	value?: number;
	limit?: number;
	/** The figure is possible but outside what a block is drafted for: the engine drafts it once the shopper
	 * confirms it (`Measurements.confirmed`); the shop asks "did you mean …?" first. */
	confirmable?: boolean;
}

/** A problem whose sentence names lengths: written once, said in either unit. */
export function lengthProblem(p: Omit<FieldProblem, 'message' | 'say'>, words: (w: LengthWords) => string): FieldProblem {
	return { ...p, message: words(lengthWords('cm')), say: (units) => words(lengthWords(units)) };
}

/** The problem's sentence in the shopper's units. */
export const problemIn = (p: FieldProblem, units: Units): string => p.say?.(units) ?? p.message;

/** Thrown for any measurement, choice or house rule the engine cannot draft from; lists every bad field. */
export class DraftInputError extends Error {
	readonly fields: FieldProblem[];
	constructor(fields: FieldProblem[]) {
		super(fields.map((f) => f.message).join(' '));
		this.name = 'DraftInputError';
		this.fields = fields;
	}
}
