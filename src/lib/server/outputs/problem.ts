// Why an output could not be made for an order, in the house's one failure shape ($lib/failure): 404 for
// an order (or a draft) that is not there, 422 for stored figures that no longer draft (as the ticket
// answers). Thrown, so a producer deep in the drafting can stop at once; anything else thrown while
// producing is a fault of ours.
import { failure, failureBody, type Failure } from '$lib/failure';

export class OutputProblem extends Error {
	readonly failure: Failure;
	constructor(status: 400 | 404 | 422, message: string) {
		super(message);
		this.name = 'OutputProblem';
		this.failure = failure(status, message);
	}
	get status() {
		return this.failure.status;
	}
}

/** A JSON message with its status: what an output route answers instead of a file. */
export const problemResponse = (p: OutputProblem) =>
	new Response(JSON.stringify(failureBody(p.failure)), {
		status: p.status,
		headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'private, no-store' }
	});

/** A file name safe in a header and in a zip: letters, digits, dots and hyphens. */
export const safeName = (s: string) => s.replace(/[^A-Za-z0-9.-]+/g, '-');
