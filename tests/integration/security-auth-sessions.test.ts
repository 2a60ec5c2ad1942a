// Where sign-in sends the browser, how long a session lives, what a failed sign-in looks like, and
// how guessing is throttled.
import { beforeAll, describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { hashPassword } from '../../src/lib/server/auth/password';
import { signInAttempts, users, verificationTokens } from '../../src/lib/server/db/schema';
import { startAppInstance } from '../support/app';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { eventually, mailsTo } from '../support/shop';

const db = testDb();
const run = Date.now().toString(36);
// Client addresses of this run (IPv6 documentation prefix, RFC 3849), so a re-run against a kept
// database starts from fresh counts.
const net = `2001:db8:${(Date.now() % 0xffff).toString(16)}`;
const PASSWORD = 'a long test password';
const ownerAccount = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;

/** A shopper of our own, so the demo accounts other files sign in with stay as they are. */
async function shopper(label: string) {
	const email = `${label}-${run}@example.com`;
	await db
		.insert(users)
		.values({ email, name: `Test ${label}`, role: 'shopper', passwordHash: await hashPassword(PASSWORD) });
	const [u] = await db.select().from(users).where(eq(users.email, email));
	return u as typeof u & { email: string };
}

const get = (path: string, cookie = '') =>
	fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: { cookie, accept: 'text/html' } });
/** Where the browser would go: the Location resolved the way a browser resolves it (WHATWG URL). */
const landsOn = (res: Response) => new URL(res.headers.get('location') ?? '', testEnv.appUrl);
const sessionCookie = (res: Response) =>
	res.headers
		.getSetCookie()
		.find((c) => c.startsWith('authjs.session-token='))
		?.split(';')[0];

// Each of these leaves the shop in some browser; the URL standard decides, so the test does too.
const HOSTILE_NEXT = [
	'/\t/evil.example',
	'//evil.example',
	'/\\evil.example',
	'https://evil.example/',
	'/%09/evil.example',
	'\\/evil.example',
	' //evil.example',
	'/\n/evil.example'
];

describe('after sign-in the browser stays on the shop', () => {
	it('the sign-in page of a signed-in person, the password action and registering never send it elsewhere', async () => {
		const u = await shopper('next');
		const cookie = await signInCookie(u.email, PASSWORD);
		for (const next of HOSTILE_NEXT) {
			const q = `next=${encodeURIComponent(next)}`;
			const page = await get(`/signin?${q}`, cookie);
			expect(page.status, next).toBe(303);
			expect(landsOn(page).origin, `GET /signin ${JSON.stringify(next)}`).toBe(testEnv.appUrl);
			const action = await postForm(`/signin?/password&${q}`, { email: u.email, password: PASSWORD });
			expect(action.status, next).toBe(303);
			expect(landsOn(action).origin, `password ${JSON.stringify(next)}`).toBe(testEnv.appUrl);
			const reg = await postForm(`/register?${q}`, {
				name: 'Reg Next',
				email: `reg-${run}-${HOSTILE_NEXT.indexOf(next)}@example.com`,
				password: PASSWORD
			});
			expect(reg.status, next).toBe(303);
			expect(landsOn(reg).origin, `register ${JSON.stringify(next)}`).toBe(testEnv.appUrl);
		}
		// A path on the shop is still followed.
		const ok = await postForm(`/signin?/password&next=${encodeURIComponent('/account/orders?from=mail')}`, {
			email: u.email,
			password: PASSWORD
		});
		expect(ok.headers.get('location')).toBe('/account/orders?from=mail');
	});
});

describe('signing out ends the session everywhere', () => {
	it('a copy of the session cookie no longer opens the account after sign-out', async () => {
		const u = await shopper('signout');
		const cookie = await signInCookie(u.email, PASSWORD);
		expect((await get('/account', cookie)).status).toBe(200);
		const out = await postForm('/signout', {}, cookie);
		expect([302, 303]).toContain(out.status);
		const again = await get('/account', cookie);
		expect(again.status).toBe(303);
		expect(landsOn(again).pathname).toBe('/signin');
		const [after] = await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, u.id));
		expect(after.v).toBe(u.sessionVersion + 1);
	});

	it('switching an account off ends its sessions for good, even once it is switched back on', async () => {
		const u = await shopper('switched');
		const cookie = await signInCookie(u.email, PASSWORD);
		const owner = await signInCookie(ownerAccount.email, DEMO_SIGN_INS.password);
		expect((await postForm(`/admin/staff/${u.id}?/disable`, { confirm: 'on' }, owner)).status).toBe(200);
		expect((await postForm(`/admin/staff/${u.id}?/enable`, {}, owner)).status).toBe(200);
		const res = await get('/account', cookie);
		expect(res.status).toBe(303);
		expect(landsOn(res).pathname).toBe('/signin');
		const [after] = await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, u.id));
		expect(after.v).toBeGreaterThan(u.sessionVersion);
		// A fresh sign-in works again.
		expect((await get('/account', await signInCookie(u.email, PASSWORD))).status).toBe(200);
	});
});

describe('a failed sign-in lands on the sign-in page with a plain message', () => {
	async function follow(res: Response) {
		expect(res.status, `${res.status} ${res.headers.get('location')}`).toBeGreaterThanOrEqual(300);
		expect(res.status).toBeLessThan(400);
		const where = landsOn(res);
		expect(where.origin).toBe(testEnv.appUrl);
		expect(where.pathname).toBe('/signin');
		const page = await get(where.pathname + where.search);
		expect(page.status).toBe(200);
		return page.text();
	}
	const LINK_PROBLEM = 'That sign-in link has expired or was used already';

	it('a forged, a used and an expired sign-in link', async () => {
		const forged = await get(
			`/auth/callback/nodemailer?token=${'f'.repeat(64)}&email=priya%40example.com&callbackUrl=%2Faccount`
		);
		expect(await follow(forged)).toContain(LINK_PROBLEM);

		const email = `used-link-${run}@example.com`;
		await postForm('/signin?/link', { email });
		const mail = await eventually(async () => (await mailsTo(email))[0]);
		const link = mail.text.match(/https?:\/\/\S+\/auth\/callback\/nodemailer\S+/)![0];
		expect(sessionCookie(await fetch(link, { redirect: 'manual' }))).toBeTruthy();
		expect(await follow(await fetch(link, { redirect: 'manual' }))).toContain(LINK_PROBLEM);

		const late = `late-link-${run}@example.com`;
		await postForm('/signin?/link', { email: late });
		const lateMail = await eventually(async () => (await mailsTo(late))[0]);
		await db
			.update(verificationTokens)
			.set({ expires: new Date(Date.now() - 60_000) })
			.where(eq(verificationTokens.identifier, late));
		const lateLink = lateMail.text.match(/https?:\/\/\S+\/auth\/callback\/nodemailer\S+/)![0];
		const opened = await fetch(lateLink, { redirect: 'manual' });
		expect(sessionCookie(opened)).toBeUndefined();
		expect(await follow(opened)).toContain(LINK_PROBLEM);
	});

	it('a wrong password at the Auth.js endpoint, and its provider page opened directly', async () => {
		const u = await shopper('direct-wrong');
		const wrong = await postForm('/auth/callback/credentials', {
			email: u.email,
			password: 'not the password',
			callbackUrl: '/'
		});
		expect(sessionCookie(wrong)).toBeUndefined();
		expect(await follow(wrong)).toContain('That e-mail and password do not match an account');
		const page = await follow(await get('/auth/signin/nodemailer'));
		expect(page).toContain('Sign in');
	});
});

describe('guessing passwords is throttled exactly', () => {
	// A second app server that takes the client address from X-Forwarded-For (adapter-node's
	// ADDRESS_HEADER, as behind a proxy), so these tests can play many clients, and the loopback
	// client the other test files sign in from is not throttled by them.
	let app: Awaited<ReturnType<typeof startAppInstance>>;
	beforeAll(async () => {
		app = await startAppInstance({ ADDRESS_HEADER: 'x-forwarded-for', XFF_DEPTH: '1' });
	});
	const postAs = (client: string, path: string, fields: Record<string, string>) =>
		fetch(`${app.url}${path}`, {
			method: 'POST',
			redirect: 'manual',
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				accept: 'text/html',
				origin: app.origin,
				'x-forwarded-for': client
			},
			body: new URLSearchParams(fields)
		});
	const attempts = async (email: string) =>
		(await db.select({ n: count() }).from(signInAttempts).where(eq(signInAttempts.email, email)))[0].n;

	it('thirty concurrent wrong passwords for one e-mail get exactly five tries, on our form and on Auth.js', async () => {
		for (const path of ['/signin?/password', '/auth/callback/credentials']) {
			const email = `burst-${path.length}-${run}@example.com`;
			const answers = await Promise.all(
				Array.from({ length: 30 }, (_, i) =>
					postAs(`${net}::b:${i + 1}`, path, { email, password: `guess-${i}`, callbackUrl: '/' })
				)
			);
			expect(
				answers.filter((r) => r.status === 429),
				path
			).toHaveLength(25);
			expect(await attempts(email), path).toBe(5);
		}
	});

	it('one client trying many e-mails is stopped after twenty wrong passwords; another client is not', async () => {
		const client = `${net}::7`;
		for (let i = 0; i < 20; i++) {
			expect(
				(await postAs(client, '/signin?/password', { email: `spray-${i}-${run}@example.com`, password: 'guess' }))
					.status
			).toBe(400);
		}
		const stopped = await postAs(client, '/signin?/password', {
			email: `spray-20-${run}@example.com`,
			password: 'guess'
		});
		expect(stopped.status).toBe(429);
		expect(await stopped.text()).toContain('Too many sign-in attempts from your network');
		expect(stopped.headers.get('retry-after')).toMatch(/^\d+$/);
		const direct = await postAs(client, '/auth/callback/credentials', {
			email: `spray-21-${run}@example.com`,
			password: 'guess',
			callbackUrl: '/'
		});
		expect(direct.status).toBe(429);
		expect(await attempts(`spray-20-${run}@example.com`)).toBe(0);
		expect(
			(await postAs(`${net}::8`, '/signin?/password', { email: `spray-0-${run}@example.com`, password: 'guess' }))
				.status
		).toBe(400);
	});
});
