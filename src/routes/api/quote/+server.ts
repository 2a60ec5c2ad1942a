import { json } from '@sveltejs/kit';
import type { FailureAnswer, QuoteAnswer } from '$lib/server/api/answers';
import { fieldErrors } from '$lib/forms/errors';
import { quoteSchema, toCm } from '$lib/forms/quote';
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
		return json({ message: 'Send the quote request as JSON.', fields: { body: ['Malformed JSON.'] } } satisfies FailureAnswer, { status: 400 });
	}
	const parsed = quoteSchema.safeParse(body);
	if (!parsed.success) return json({ message: 'Some values need a second look.', fields: fieldErrors(parsed.error) } satisfies FailureAnswer, { status: 400 });
	const q = parsed.data;
	const result = await quoteSkirt(db, { measurements: toCm(q.measurements, q.units), style: q.style, options: q.options, fabricId: q.fabricId, units: q.units });
	if (!result.ok) return json({ message: result.problem.message, fields: result.problem.fields ?? {} } satisfies FailureAnswer, { status: result.problem.status === 404 ? 400 : result.problem.status });
	return json(result.quote satisfies QuoteAnswer);
};
