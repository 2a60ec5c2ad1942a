import { readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';

type Audience = 'anonymous' | 'shopper' | 'cutter' | 'owner';
type Row = { route: string; path: string; method?: 'GET' | 'POST'; body?: unknown; expect: Record<Audience, number> };

const ALL = (n: number) => ({ anonymous: n, shopper: n, cutter: n, owner: n });
const SIGNED_IN = { anonymous: 303, shopper: 200, cutter: 200, owner: 200 };
const WORKROOM = { anonymous: 303, shopper: 403, cutter: 200, owner: 200 };
const WORKROOM_API = { anonymous: 401, shopper: 403, cutter: 200, owner: 200 };
const OWNER = { anonymous: 303, shopper: 403, cutter: 403, owner: 200 };
// QL-1001 belongs to the demo shopper Priya (the shopper signed in here); strangers get 404, and so do
// cutters: the shopper's page shows her address, and the workroom works from its own order page.
const PRIYAS_ORDER = { anonymous: 404, shopper: 200, cutter: 404, owner: 200 };

// Every route of the app with who may call it. The last test fails when a route is added
// without a row here, so this table cannot fall behind the code.
const ROUTES: Row[] = [
	{ route: '/', path: '/', expect: ALL(200) },
	{ route: '/styles/[slug=slug]', path: '/styles/rue-straight', expect: ALL(200) },
	{ route: '/styles/[slug=slug]/make', path: '/styles/meadow-a-line/make', expect: ALL(200) },
	{ route: '/bag', path: '/bag', expect: ALL(200) },
	{ route: '/checkout', path: '/checkout', expect: ALL(303) }, // an empty bag goes back to the bag
	{ route: '/orders/[number=number]', path: '/orders/QL-1001', expect: PRIYAS_ORDER },
	{ route: '/signin', path: '/signin', expect: { anonymous: 200, shopper: 303, cutter: 303, owner: 303 } },
	{ route: '/signin/check-mail', path: '/signin/check-mail', expect: ALL(200) },
	{ route: '/register', path: '/register', expect: { anonymous: 200, shopper: 303, cutter: 303, owner: 303 } },
	{ route: '/signout', path: '/signout', expect: ALL(303) },
	{ route: '/healthz', path: '/healthz', expect: ALL(200) },
	{ route: '/uploads/[id=id]', path: '/uploads/999999', expect: ALL(404) },
	{ route: '/account', path: '/account', expect: SIGNED_IN },
	{ route: '/account/orders', path: '/account/orders', expect: SIGNED_IN },
	{ route: '/account/data', path: '/account/data', expect: SIGNED_IN },
	{ route: '/workroom', path: '/workroom', expect: WORKROOM },
	{ route: '/workroom/lays', path: '/workroom/lays', expect: WORKROOM },
	{ route: '/workroom/lays/[id=id]', path: '/workroom/lays/999999', expect: { anonymous: 303, shopper: 403, cutter: 404, owner: 404 } },
	{ route: '/workroom/orders/[id=id]', path: '/workroom/orders/1', expect: WORKROOM },
	// QL-1004 and QL-1005 keep their measurements: another test erases QL-1001's at the shopper's request.
	{ route: '/workroom/orders/[id=id]/ticket.pdf', path: '/workroom/orders/4/ticket.pdf', expect: WORKROOM },
	{ route: '/workroom/tickets.pdf', path: '/workroom/tickets.pdf?ids=4,5', expect: WORKROOM },
	{ route: '/workroom/orders/[id=id]/pattern.pdf', path: '/workroom/orders/4/pattern.pdf?paper=a4', expect: WORKROOM },
	{ route: '/workroom/orders/[id=id]/pattern.dxf', path: '/workroom/orders/4/pattern.dxf', expect: WORKROOM },
	{ route: '/workroom/orders/[id=id]/lay.pdf', path: '/workroom/orders/4/lay.pdf', expect: WORKROOM },
	{ route: '/workroom/jobs', path: '/workroom/jobs', expect: WORKROOM },
	{ route: '/workroom/jobs/[id=id]', path: '/workroom/jobs/999999', expect: { anonymous: 303, shopper: 403, cutter: 404, owner: 404 } },
	{ route: '/workroom/jobs/[id=id]/files.zip', path: '/workroom/jobs/999999/files.zip', expect: { anonymous: 303, shopper: 403, cutter: 404, owner: 404 } },
	{ route: '/workroom/jobs/[id=id]/progress', path: '/workroom/jobs/999999/progress', expect: { anonymous: 303, shopper: 403, cutter: 404, owner: 404 } },
	// Fit reports: the owner, and cutters she allows (the demo cutter is not allowed).
	{ route: '/workroom/fit-reports', path: '/workroom/fit-reports', expect: { anonymous: 303, shopper: 403, cutter: 403, owner: 200 } },
	{ route: '/workroom/fit-reports/[id=id]', path: '/workroom/fit-reports/1', expect: { anonymous: 303, shopper: 403, cutter: 403, owner: 200 } },
	{ route: '/orders/[number=number]/fit', path: '/orders/QL-1001/fit', expect: PRIYAS_ORDER },
	{ route: '/fit-photos/[id=photo]', path: `/fit-photos/${'A'.repeat(43)}`, expect: ALL(404) },
	{ route: '/admin/fit', path: '/admin/fit', expect: OWNER },
	{ route: '/developers/api', path: '/developers/api', expect: ALL(200) },
	{ route: '/api/openapi.json', path: '/api/openapi.json', expect: ALL(200) },
	{ route: '/admin', path: '/admin', expect: OWNER },
	{ route: '/admin/orders', path: '/admin/orders?stage=paid', expect: OWNER },
	{ route: '/admin/orders/[id=id]', path: '/admin/orders/1', expect: OWNER },
	{ route: '/admin/orders.csv', path: '/admin/orders.csv', expect: OWNER },
	{ route: '/admin/rules', path: '/admin/rules', expect: OWNER },
	{ route: '/admin/settings', path: '/admin/settings', expect: OWNER },
	{ route: '/admin/catalogue', path: '/admin/catalogue', expect: OWNER },
	{ route: '/admin/catalogue/styles/new', path: '/admin/catalogue/styles/new', expect: OWNER },
	{ route: '/admin/catalogue/styles/[id=id]', path: '/admin/catalogue/styles/1', expect: OWNER },
	{ route: '/admin/catalogue/fabrics/new', path: '/admin/catalogue/fabrics/new', expect: OWNER },
	{ route: '/admin/catalogue/fabrics/[id=id]', path: '/admin/catalogue/fabrics/1', expect: OWNER },
	{ route: '/admin/staff', path: '/admin/staff', expect: OWNER },
	{ route: '/admin/staff/[id=uuid]', path: '/admin/staff/STAFF_ID', expect: OWNER },
	{ route: '/api/quote', path: '/api/quote', method: 'POST', body: {}, expect: ALL(400) },
	{ route: '/api/orders', path: '/api/orders', method: 'POST', body: {}, expect: ALL(400) },
	{ route: '/api/orders/[number=number]', path: '/api/orders/QL-1001', expect: PRIYAS_ORDER },
	{ route: '/api/webhooks/stripe', path: '/api/webhooks/stripe', method: 'POST', body: {}, expect: ALL(400) },
	{ route: '/api/workroom/queue', path: '/api/workroom/queue', expect: WORKROOM_API },
	{ route: '/api/workroom/summary', path: '/api/workroom/summary', expect: WORKROOM_API },
	{ route: '/api/workroom/orders/[id=id]/stage', path: '/api/workroom/orders/1/stage', method: 'POST', body: { to: 'no-such-stage' }, expect: { anonymous: 401, shopper: 403, cutter: 400, owner: 400 } },
	{ route: '/api/admin/rules/preview', path: '/api/admin/rules/preview', method: 'POST', body: {}, expect: { anonymous: 401, shopper: 403, cutter: 403, owner: 200 } }
];

const cookies: Partial<Record<Audience, string>> = {};
let staffId = '';

beforeAll(async () => {
	for (const role of ['shopper', 'cutter', 'owner'] as const) {
		cookies[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	}
	const { testDb } = await import('../support/db');
	const { users } = await import('../../src/lib/server/db/schema');
	const { eq } = await import('drizzle-orm');
	const [cutter] = await testDb().select({ id: users.id }).from(users).where(eq(users.email, DEMO_SIGN_INS.accounts[1].email));
	staffId = cutter.id;
});

describe('every route, for every audience', () => {
	for (const row of ROUTES) {
		it(`${row.method ?? 'GET'} ${row.route}`, async () => {
			for (const audience of ['anonymous', 'shopper', 'cutter', 'owner'] as const) {
				const cookie = cookies[audience];
				const res = await fetch(`${testEnv.appUrl}${row.path.replace('STAFF_ID', staffId)}`, {
					method: row.method ?? 'GET',
					redirect: 'manual',
					headers: { ...(cookie ? { cookie } : {}), ...(row.body ? { 'content-type': 'application/json', origin: testEnv.appUrl } : {}) },
					body: row.body ? JSON.stringify(row.body) : undefined
				});
				expect({ audience, status: res.status }).toEqual({ audience, status: row.expect[audience] });
			}
		});
	}

	// Route ids without their (group) folders, which do not appear in URLs.
	it('lists every route the app has', () => {
		const root = join(process.cwd(), 'src/routes');
		const found: string[] = [];
		const walk = (dir: string) => {
			for (const f of readdirSync(dir)) {
				const p = join(dir, f);
				if (statSync(p).isDirectory()) walk(p);
				else if (['+page.svelte', '+server.ts', '+page.server.ts'].includes(f)) found.push(`/${relative(root, dir)}`.replace(/\/\([^/]+\)/g, '').replace(/\/$/, '') || '/');
			}
		};
		walk(root);
		const listed = new Set(ROUTES.map((r) => r.route));
		expect([...new Set(found)].filter((r) => !listed.has(r)).sort()).toEqual([]);
	});
});
