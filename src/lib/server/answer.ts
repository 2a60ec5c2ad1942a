// How JSON endpoints answer a failure: the one shape `{ message, fields? }` with the failure's status.
import { json } from '@sveltejs/kit';
import type { z } from 'zod';
import { failure, failureBody, type Failure } from '$lib/failure';
import { fieldErrors } from '$lib/forms/errors';

export function failureJson(f: Failure, headers?: Record<string, string>) {
	return json(failureBody(f), { status: f.status, headers });
}

/** A request body that did not pass its schema: 400 with each field's messages. */
export function invalidBody(error: z.ZodError): Failure {
	return failure(400, 'Some values need a second look.', { fields: fieldErrors(error) });
}
