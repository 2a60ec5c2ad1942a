import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { orders } from '../../src/lib/server/db/schema';
import { OPERATIONS, openApiDocument } from '../../src/lib/server/api/document';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { fakeStripe } from '../support/payments';
import { signInCookie } from '../support/session';
import { paidOrder } from '../support/shop';

// Every example the served document gives is sent to the running shop as a client would send it:
// the status must be the one documented for it, the answer must pass the schema of that status, and
// a documented failure must say the same message about the same fields.
type Doc = ReturnType<typeof openApiDocument>;
const db = testDb();
let served: Doc;
const cookies: Record<string, string> = {};
let paidOrderId = '';

beforeAll(async () => {
	served = await (await fetch(`${testEnv.appUrl}/api/openapi.json`)).json();
	for (const role of ['cutter', 'owner'] as const) cookies[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	// The stage examples move "a paid order": this test's own, so the demo orders stay as they are.
	const { number } = await paidOrder(1);
	const [row] = await db.select({ id: orders.id }).from(orders).where(eq(orders.number, number));
	paidOrderId = String(row.id);
}, 60_000);

type Media = { examples?: Record<string, { value: unknown }> };
type Param = { name: string; in: string; examples?: Record<string, { value: string }> };

/** Who sends an operation's examples: the session of the first role it documents, if any. */
function cookieFor(op: (typeof OPERATIONS)[number], status: number) {
	if (status === 401) return undefined;
	if (op.operationId === 'orderStatus') return cookies.owner; // the owner may read any order
	return op.roles ? cookies[op.roles[0] === 'owner' ? 'owner' : 'cutter'] : undefined;
}

describe('GET /api/openapi.json', () => {
	it('serves the generated document to anyone, cacheable', async () => {
		const res = await fetch(`${testEnv.appUrl}/api/openapi.json`);
		expect(res.status).toBe(200);
		expect(res.headers.get('cache-control')).toBe('public, max-age=3600');
		expect(await res.json()).toEqual(JSON.parse(JSON.stringify(openApiDocument())));
	});
});

for (const op of OPERATIONS) {
	describe(`${op.method.toUpperCase()} ${op.path}`, () => {
		// Refusals first, so the success that changes an order runs last.
		const names = Object.entries(op.examples)
			.sort(([, a], [, b]) => b.status - a.status)
			.map(([name]) => name);
		for (const name of names) {
			it(`example "${name}" answers as documented`, async () => {
				const item = served.paths?.[op.path]?.[op.method];
				expect(item, 'the served document has the operation').toBeDefined();
				const status = Number(Object.entries(item!.responses ?? {}).find(([, r]) => ((r as { content?: Record<string, Media> }).content?.['application/json']?.examples ?? {})[name])?.[0]);
				expect(status, 'the example is filed under a status').toBe(op.examples[name].status);
				const documented = (item!.responses![String(status)] as { content: Record<string, Media> }).content['application/json'].examples![name].value as { message?: string; fields?: Record<string, string[]> };

				let path = op.path;
				const query = new URLSearchParams();
				for (const p of (item!.parameters ?? []) as Param[]) {
					let value = p.examples?.[name]?.value;
					if (value === undefined) continue;
					if (op.operationId === 'moveStage' && value === '7') value = paidOrderId;
					if (p.in === 'path') path = path.replace(`{${p.name}}`, encodeURIComponent(value));
					else query.set(p.name, value);
				}
				const body = ((item!.requestBody as { content?: Record<string, Media> } | undefined)?.content?.['application/json']?.examples ?? {})[name]?.value;
				const headers: Record<string, string> = { accept: 'application/json' };
				const text = body === undefined ? undefined : JSON.stringify(body);
				if (text !== undefined) headers['content-type'] = 'application/json';
				const cookie = cookieFor(op, status);
				if (cookie) headers.cookie = cookie;
				if (op.operationId === 'paymentCallback' && name === 'signed') headers['stripe-signature'] = fakeStripe().webhooks.generateTestHeaderString({ payload: text!, secret: testEnv.webhookSecret });

				const res = await fetch(`${testEnv.appUrl}${path}${query.size ? `?${query}` : ''}`, { method: op.method.toUpperCase(), headers, body: text });
				const answer = await res.json();
				expect(res.status, JSON.stringify(answer).slice(0, 300)).toBe(status);
				const parsed = op.answers[status].schema.safeParse(answer);
				expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
				if (status >= 400) {
					expect(answer.message).toBe(documented.message);
					expect(Object.keys(answer.fields ?? {}).sort()).toEqual(Object.keys(documented.fields ?? {}).sort());
					for (const [field, messages] of Object.entries(documented.fields ?? {})) expect(answer.fields[field]).toEqual(messages);
				}
			});
		}
	});
}
