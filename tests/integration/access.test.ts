import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { count } from 'drizzle-orm';
import { orders } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';

type Audience = 'anonymous' | 'shopper' | 'cutter' | 'owner';
const cookies: Partial<Record<Audience, string>> = {};
const db = testDb();

beforeAll(async () => {
	for (const role of ['shopper', 'cutter', 'owner'] as const) {
		const account = DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
		cookies[role] = await signInCookie(account.email, DEMO_SIGN_INS.password);
	}
});

// Expected status for each audience: pages redirect strangers to sign-in (303) and refuse the
// wrong role (403); the API answers 401 / 403 as JSON.
const MATRIX: { path: string; expect: Record<Audience, number> }[] = [
	{ path: '/account', expect: { anonymous: 303, shopper: 200, cutter: 200, owner: 200 } },
	{ path: '/workroom', expect: { anonymous: 303, shopper: 403, cutter: 200, owner: 200 } },
	{ path: '/admin', expect: { anonymous: 303, shopper: 403, cutter: 403, owner: 200 } },
	{ path: '/api/workroom/summary', expect: { anonymous: 401, shopper: 403, cutter: 200, owner: 200 } }
];

describe('who may open what', () => {
	for (const row of MATRIX) {
		for (const audience of ['anonymous', 'shopper', 'cutter', 'owner'] as const) {
			it(`${audience} → ${row.path} answers ${row.expect[audience]}`, async () => {
				const cookie = cookies[audience];
				const res = await fetch(`${testEnv.appUrl}${row.path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
				expect(res.status).toBe(row.expect[audience]);
				if (res.status === 303) expect(res.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(row.path)}`);
				if (row.path.startsWith('/api/') && res.status >= 400) expect((await res.json()).message).toMatch(/sign in|cannot open/i);
			});
		}
	}

	it('shows the workroom figures from the database to a cutter', async () => {
		const res = await fetch(`${testEnv.appUrl}/api/workroom/summary`, { headers: { cookie: cookies.cutter! } });
		const body = await res.json();
		// Other test files add orders, so the figures are checked against MariaDB itself.
		const rows = await db.select({ status: orders.status, n: count() }).from(orders).groupBy(orders.status);
		for (const r of rows) expect(body.stages[r.status]).toBe(r.n);
		expect(body.stages.cutting).toBeGreaterThanOrEqual(2); // the demo seed's two orders on the cutting table
		expect(body.lowStock.map((f: { name: string }) => f.name)).toContain('Silk and wool crepe'); // 90 cm in the seed
	});
});
