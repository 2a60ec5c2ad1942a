// One shape for every refusal, from the journey's modules up to the JSON endpoints and form actions:
// a status a client can act on, a sentence for a person, and the fields it is about. Endpoints answer
// `{ message, fields? }` with the status; pages show the message beside the fields.
import type { ConfirmAsk } from './forms/confirm';

export type FailureStatus = 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429 | 502 | 503;

export interface Failure {
	ok: false;
	status: FailureStatus;
	/** A sentence for the person: what is wrong and what to do. */
	message: string;
	/** Field path ("measurements.waist") → messages, where the failure is about what was sent. */
	fields?: Record<string, string[]>;
	/** A word for code that must tell failures apart (e.g. "away": the payment service did not answer). */
	reason?: string;
	/** A figure outside what a block fits, which she may confirm: the shop asks "did you mean …?". */
	confirm?: ConfirmAsk;
}

export function failure(status: FailureStatus, message: string, more: { fields?: Record<string, string[]>; reason?: string; confirm?: ConfirmAsk } = {}): Failure {
	return { ok: false, status, message, ...(more.fields ? { fields: more.fields } : {}), ...(more.reason ? { reason: more.reason } : {}), ...(more.confirm ? { confirm: more.confirm } : {}) };
}

/** The body a JSON endpoint answers for a failure. */
export function failureBody(f: Pick<Failure, 'message' | 'fields' | 'confirm'>) {
	return { message: f.message, ...(f.fields ? { fields: f.fields } : {}), ...(f.confirm ? { confirm: f.confirm } : {}) };
}

/**
 * A style or fabric named in a request body that does not exist is the body's fault (400), not a
 * missing page (404): the URL the client asked for exists.
 */
export function asBodyFailure(f: Failure): Failure {
	return f.status === 404 ? { ...f, status: 400 } : f;
}
