import { beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { users } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { findRoutes, pathFor, raw, spellings, type Raw } from '../support/routes';
import { signInCookie } from '../support/session';

// Every route in src/routes, for every audience, each path also spelled a dozen other ways, and every
// form action of every page posted by each audience. The table below says who may use which part of
// the shop; it is written here on purpose, not imported from the app, so a mistake in the app's own
// table shows up as a failure.
type Audience = 'anonymous' | 'shopper' | 'cutter' | 'owner';
const AUDIENCES: Audience[] = ['anonymous', 'shopper', 'cutter', 'owner'];
const WHO: { prefix: string; allowed: Audience[] }[] = [
	{ prefix: '/admin', allowed: ['owner'] },
	// Fit reports carry photos of a body: the owner, and cutters she allows (the demo cutter is not).
	{ prefix: '/workroom/fit-reports', allowed: ['owner'] },
	{ prefix: '/api/admin', allowed: ['owner'] },
	{ prefix: '/workroom', allowed: ['cutter', 'owner'] },
	{ prefix: '/api/workroom', allowed: ['cutter', 'owner'] },
	{ prefix: '/account', allowed: ['shopper', 'cutter', 'owner'] }
];
const allowedFor = (path: string) => WHO.find((w) => path === w.prefix || path.startsWith(`${w.prefix}/`))?.allowed ?? AUDIENCES;

// Actions that act on the signed-in person herself: posted by refused audiences only, since a
// permitted post would sign the test's own sessions out or delete the demo shopper's measurements.
const OWN_ACCOUNT_ACTIONS = new Set(['/signout default', '/account deleteMeasurements']);

const db = testDb();
const cookies: Partial<Record<Audience, string>> = {};
let real: Record<string, string> = {};
let absent: Record<string, string> = {};
// A line of text only a refused audience should never see in an answer: a shopper's e-mail.
const SECRET = 'priya@example.com';

beforeAll(async () => {
	for (const role of ['shopper', 'cutter', 'owner'] as const) {
		cookies[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	}
	const [cutter] = await db.select({ id: users.id }).from(users).where(eq(users.email, DEMO_SIGN_INS.accounts.find((a) => a.role === 'cutter')!.email));
	// Real records for reading; records that do not exist for posting, so a permitted action
	// exercises its checks without changing the demo data other tests read.
	real = { 'id=photo': 'x'.repeat(43), 'id=id': '1', 'id=uuid': cutter.id, 'number=number': 'QL-1001', 'slug=slug': 'rue-straight' };
	absent = { 'id=photo': 'y'.repeat(43), 'id=id': '2147483647', 'id=uuid': '00000000-0000-4000-8000-000000000000', 'number=number': 'QL-99999999', 'slug=slug': 'no-such-style' };
});

function headers(audience: Audience, extra: Record<string, string> = {}) {
	const c = cookies[audience];
	return { ...(c ? { cookie: c } : {}), ...extra };
}

/** What a refused audience may get: sent to sign in, refused, or no such route. Never the thing itself. */
function expectRefused(res: Raw, what: string) {
	expect(res.status, `${what} answered ${res.status}`).not.toBe(200);
	expect([301, 302, 303, 307, 308, 400, 401, 403, 404, 405], `${what} answered ${res.status}`).toContain(res.status);
	if (res.status >= 300 && res.status < 400) {
		// A redirect may only lead to sign-in, or to the same path tidied (trailing slash): never onwards.
		expect(res.location ?? '', what).toMatch(/^(\/signin\?|\/[^/]|https?:\/\/127\.0\.0\.1)/);
	}
	expect(res.body.includes(SECRET), `${what} revealed a shopper's e-mail`).toBe(false);
}

function expectNoServerError(res: Raw, what: string) {
	expect(res.status, `${what} answered ${res.status}: ${res.body.slice(0, 200)}`).toBeLessThan(500);
}

const routes = findRoutes();

describe('the route walk', () => {
	it('finds the routes in the file tree', () => {
		expect(routes.length).toBeGreaterThan(35);
		expect(routes.map((r) => r.id)).toContain('/admin/orders.csv');
		expect(routes.find((r) => r.id === '/admin/staff/[id=uuid]')?.actions).toEqual(['role', 'disable', 'enable', 'fitLeave']);
	});

	it('changes nothing in MariaDB while refused audiences try every route and action', async () => {
		const tables = ['user', 'order', 'order_event', 'payment', 'fabric', 'style', 'house_rules', 'measurement_profile'];
		const checksum = async () => (await db.execute(sql.raw(`CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`)))[0];
		const before = await checksum();
		for (const r of routes) {
			const path = pathFor(r.id, real);
			const refused = AUDIENCES.filter((a) => !allowedFor(path).includes(a));
			for (const audience of refused) {
				for (const p of [path, ...spellings(path)]) {
					for (const method of r.endpoint.filter((m) => m !== 'GET')) {
						expectRefused(await raw(method, p, headers(audience, { 'content-type': 'application/json', origin: testEnv.appUrl }), '{}'), `${audience} ${method} ${p}`);
					}
					for (const a of r.actions) {
						const target = a === 'default' ? p : `${p}?/${a}`;
						const form = 'role=owner&confirm=on&amount=1&to=cutting&note=x&id=1';
						expectRefused(await raw('POST', target, headers(audience, { 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl, accept: 'text/html' }), form), `${audience} POST ${target}`);
					}
				}
			}
		}
		expect(await checksum()).toEqual(before);
	}, 240_000);

	for (const audience of AUDIENCES) {
		it(`${audience}: every page and endpoint, spelled every way`, async () => {
			for (const r of routes) {
				const path = pathFor(r.id, real);
				const allowed = allowedFor(path).includes(audience);
				const gets = r.page || r.endpoint.includes('GET');
				if (!gets) continue;
				// Ticket PDFs need ids in the query.
				const query = r.id.endsWith('tickets.pdf') ? '?ids=1,2' : '';
				const exact = await raw('GET', path + query, headers(audience));
				if (allowed) {
					expectNoServerError(exact, `${audience} GET ${path}`);
					expect([401, 403], `${audience} GET ${path}`).not.toContain(exact.status);
					expect(exact.location ?? '', `${audience} GET ${path}`).not.toMatch(/^\/signin/);
				} else {
					expectRefused(exact, `${audience} GET ${path}`);
					const signIn = audience === 'anonymous';
					if (r.id.startsWith('/api/')) expect(exact.status).toBe(signIn ? 401 : 403);
					else if (signIn) expect(exact.location).toBe(`/signin?next=${encodeURIComponent(path + query)}`);
					else expect(exact.status).toBe(403);
				}
				for (const p of spellings(path)) {
					const res = await raw('GET', p + query, headers(audience));
					if (allowed) expectNoServerError(res, `${audience} GET ${p}`);
					else expectRefused(res, `${audience} GET ${p}`);
				}
				// The data of each page, as the client router asks for it.
				if (r.page) {
					const data = await raw('GET', `${path.replace(/\/$/, '')}/__data.json`, headers(audience));
					if (allowed) expectNoServerError(data, `${audience} GET ${path}/__data.json`);
					else expect(data.body.includes(SECRET), `${audience} read ${path}/__data.json`).toBe(false);
				}
			}
		}, 240_000);

		it(`${audience}: every form action where permitted answers without a server error`, async () => {
			for (const r of routes) {
				const path = pathFor(r.id, absent);
				if (!allowedFor(path).includes(audience)) continue;
				for (const a of r.actions) {
					if (audience !== 'anonymous' && OWN_ACCOUNT_ACTIONS.has(`${r.id} ${a}`)) continue;
					const target = a === 'default' ? path : `${path}?/${a}`;
					const res = await raw('POST', target, headers(audience, { 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl, accept: 'application/json', 'x-sveltekit-action': 'true' }), '');
					expectNoServerError(res, `${audience} POST ${target}`);
					expect(res.body, `${audience} POST ${target}`).not.toMatch(/"status":5\d\d/);
				}
			}
		}, 120_000);
	}
});
