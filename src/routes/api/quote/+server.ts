import { json } from '@sveltejs/kit';
import type { QuoteAnswer } from '$lib/api/answers';
import { asBodyFailure, failure } from '$lib/failure';
import { failureJson, invalidBody } from '$lib/server/answer';
import { quoteSchema, requestInCm } from '$lib/forms/quote';
import { db } from '$lib/server/db';
import { quoteSkirt } from '$lib/server/quote/quote';
import type { RequestHandler } from './$types';

// Anyone may ask for a quote. Every refusal is a 400 with field errors, never a 500: the body is
// read as text first so malformed JSON is a shopper's mistake, not a crash.
export const POST: RequestHandler = async ({ request }) => {
	const text = await request.text().catch(() => '');
	let body: unknown;
	try {
		body = JSON.parse(text);
	} catch {
		return failureJson(failure(400, 'Send the quote request as JSON.', { fields: { body: ['Malformed JSON.'] } }));
	}
	const parsed = quoteSchema.safeParse(body);
	if (!parsed.success) return failureJson(invalidBody(parsed.error));
	const q = parsed.data;
	const result = await quoteSkirt(db, requestInCm(q));
	if (!result.ok) return failureJson(asBodyFailure(result));
	return json(result.quote satisfies QuoteAnswer);
};
