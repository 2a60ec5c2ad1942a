// The one error the engine throws for bad input, so the shop can show each field's problem beside it.

/** One field's problem: which field (dotted path), a sentence for the shopper, and the allowed range. */
export interface FieldProblem {
	field: string;
	message: string;
	min?: number;
	max?: number;
	/** The number given, and the limit it went past, where the problem is about one number. */
	value?: number;
	limit?: number;
	/** The figure is possible but outside what a block is drafted for: the engine drafts it once the shopper
	 * confirms it (`Measurements.confirmed`); the shop asks "did you mean …?" first. */
	confirmable?: boolean;
}

/** Thrown for any measurement, choice or house rule the engine cannot draft from; lists every bad field. */
export class DraftInputError extends Error {
	readonly fields: FieldProblem[];
	constructor(fields: FieldProblem[]) {
		super(fields.map((f) => f.message).join(' '));
		this.name = 'DraftInputError';
		this.fields = fields;
	}
}
