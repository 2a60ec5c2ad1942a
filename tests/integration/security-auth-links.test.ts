// Sign-in links and the addresses they go to: every link in mail comes from the configured ORIGIN
// whatever the request's headers say, and an address is normalised one way everywhere, compared
// exactly, and refused when the mail server could not deliver to it.
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { orders, outbox, users, verificationTokens } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { eventually, mailsTo } from '../support/shop';

const db = testDb();
const run = Date.now().toString(36);
const priya = DEMO_SIGN_INS.accounts.find((a) => a.email.startsWith('priya'))!;
const ownerAccount = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
let owner = '';

beforeAll(async () => {
	owner = await signInCookie(ownerAccount.email, DEMO_SIGN_INS.password);
});

const FORWARDED = {
	'x-forwarded-host': 'evil.example',
	'x-forwarded-proto': 'https',
	forwarded: 'host=evil.example;proto=https'
};

function post(path: string, fields: Record<string, string>, headers: Record<string, string> = {}) {
	return fetch(`${testEnv.appUrl}${path}`, {
		method: 'POST',
		redirect: 'manual',
		headers: {
			'content-type': 'application/x-www-form-urlencoded',
			accept: 'text/html',
			origin: testEnv.appUrl,
			...headers
		},
		body: new URLSearchParams(fields)
	});
}

/** The one mail to `address`, waiting for the outbox. */
const mailTo = (address: string) => eventually(async () => (await mailsTo(address))[0]);
/** Every link in a mail's text and html. */
const linksIn = (m: { text: string; html: string }) =>
	[...`${m.text} ${m.html}`.matchAll(/https?:\/\/[^\s"<>]+/g)].map((x) => new URL(x[0].replace(/&amp;/g, '&')));
const tokensFor = (identifier: string) =>
	db.select().from(verificationTokens).where(eq(verificationTokens.identifier, identifier));

describe('links in mail come from ORIGIN only', () => {
	const origin = () => new URL(testEnv.appUrl).origin;

	it('a sign-in link asked for with X-Forwarded-Host points at the shop, and so does its callbackUrl', async () => {
		const email = `fwd-link-${run}@example.com`;
		const res = await post('/signin?/link', { email }, FORWARDED);
		expect(res.status).toBe(303);
		const links = linksIn(await mailTo(email));
		expect(links.length).toBeGreaterThan(0);
		for (const link of links) {
			expect(link.origin).toBe(origin());
			const callback = link.searchParams.get('callbackUrl');
			if (callback) expect(new URL(callback, origin()).origin).toBe(origin());
		}
	});

	it('the same holds when the Auth.js endpoint is posted to directly', async () => {
		const email = `fwd-direct-${run}@example.com`;
		await post('/auth/signin/nodemailer', { email, callbackUrl: '/account' }, FORWARDED);
		for (const link of linksIn(await mailTo(email))) expect(link.origin).toBe(origin());
	});

	it('a staff invitation sent with a forwarded host links to the shop', async () => {
		const email = `fwd-invite-${run}@example.com`;
		const res = await post('/admin/staff?/invite', { email, name: 'Ada Fenn' }, { ...FORWARDED, cookie: owner });
		expect(res.status).toBe(200);
		for (const link of linksIn(await mailTo(email))) expect(link.origin).toBe(origin());
	});
});

describe('one rule for e-mail addresses', () => {
	it('refuses a link for a look-alike address with a non-ASCII local part: no mail, no token, a clear message', async () => {
		const lookAlike = 'priyá@example.com';
		const res = await postForm('/signin?/link', { email: lookAlike });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('plain letters');
		// Straight to Auth.js as well: it lands on the sign-in page, never mails the look-alike.
		const direct = await post('/auth/signin/nodemailer', { email: lookAlike, callbackUrl: '/account' });
		expect(direct.status).toBeLessThan(500);
		expect(new URL(direct.headers.get('location') ?? '', testEnv.appUrl).pathname).toBe('/signin');
		await new Promise((r) => setTimeout(r, 800));
		expect(await mailsTo(lookAlike)).toHaveLength(0);
		expect(await tokensFor(lookAlike)).toHaveLength(0);
		expect(await tokensFor(lookAlike.normalize('NFD'))).toHaveLength(0);
	});

	it('a link for the same address typed in capitals with spaces goes to the one account, lower-cased', async () => {
		const res = await postForm('/signin?/link', { email: `  ${priya.email.toUpperCase()} ` });
		expect(res.status).toBe(303);
		expect((await tokensFor(priya.email)).length).toBeGreaterThan(0);
	});

	it('an internationalised domain is stored in its ASCII form and is another account than the plain one', async () => {
		const email = `priya.${run}@Exämple.com`;
		const ascii = `priya.${run}@xn--exmple-cua.com`;
		const res = await postForm('/signin?/link', { email });
		expect(res.status).toBe(303);
		// Sent to the ASCII form (the outbox row); the mail fake shows the domain decoded back to Unicode.
		expect(await db.select({ id: outbox.id }).from(outbox).where(eq(outbox.toAddress, ascii))).toHaveLength(1);
		const mail = await mailTo(email.toLowerCase());
		const link = linksIn(mail).find((l) => l.pathname === '/auth/callback/nodemailer')!;
		expect(link.searchParams.get('email')).toBe(ascii);
		const open = await fetch(link, { redirect: 'manual' });
		expect(open.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='))).toBe(true);
		const [u] = await db.select().from(users).where(eq(users.email, ascii));
		expect(u.role).toBe('shopper');
		expect(u.id).not.toBe((await db.select().from(users).where(eq(users.email, priya.email)))[0].id);
	});

	it('registering stores the normalised address', async () => {
		const res = await postForm('/register', {
			name: 'Wren Tally',
			email: ` Wren.${run}@Exämple.COM`,
			password: 'a long enough sentence'
		});
		expect(res.status).toBe(303);
		expect(
			await db
				.select()
				.from(users)
				.where(eq(users.email, `wren.${run}@xn--exmple-cua.com`))
		).toHaveLength(1);
	});

	it('refuses addresses the mail server could not deliver to, with a message, everywhere', async () => {
		for (const bad of [
			'zoë@example.com',
			'anna@localhost',
			'anna@exa mple.com',
			'anna@-example.com',
			'a@b@example.com',
			'anna@example.com,bob@example.com'
		]) {
			const link = await postForm('/signin?/link', { email: bad });
			expect(link.status, bad).toBe(400);
			const reg = await postForm('/register', { name: 'Anna', email: bad, password: 'a long enough sentence' });
			expect(reg.status, bad).toBe(400);
			expect(await reg.text()).toMatch(/e-mail address|plain letters|domain/);
		}
	});

	it('a staff invitation and an order store the normalised address', async () => {
		const invited = await post(
			'/admin/staff?/invite',
			{ email: `Neu.${run}@EXÄMPLE.com`, name: 'Neu' },
			{ cookie: owner }
		);
		expect(invited.status).toBe(200);
		const [cutter] = await db
			.select()
			.from(users)
			.where(eq(users.email, `neu.${run}@xn--exmple-cua.com`));
		expect(cutter.role).toBe('cutter');
		const email = `  Order.${run}@EXAMPLE.com `;
		const res = await fetch(`${testEnv.appUrl}/api/orders`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({
				items: [{ measurements: { waist: 70, hip: 96, length: 60 }, style: 'rue-straight', fabricId: 1 }],
				shopper: {
					email,
					name: 'Ola Order',
					line1: 'Kaistraße 1',
					line2: '',
					city: 'Kiel',
					postcode: '24103',
					country: 'DE',
					measurementConsent: true,
					madeToMeasure: true
				}
			})
		});
		expect(res.status).toBe(201);
		const { number } = await res.json();
		const [order] = await db.select({ email: orders.email }).from(orders).where(eq(orders.number, number));
		expect(order.email).toBe(`order.${run}@example.com`);
	});
});

describe('registering with an address that has an account', () => {
	it('does not say so on screen, changes nothing, and mails the owner of the address instead', async () => {
		const [before] = await db.select().from(users).where(eq(users.email, priya.email));
		const res = await postForm('/register', {
			name: 'Someone Else',
			email: priya.email.toUpperCase(),
			password: 'another long sentence'
		});
		const html = await res.text();
		expect(res.status).toBeLessThan(500);
		expect(html).not.toMatch(/exists|already|has an account/i);
		expect(html).toContain('We sent a message to');
		expect(res.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='))).toBe(false);
		const [after] = await db.select().from(users).where(eq(users.email, priya.email));
		expect(after.passwordHash).toBe(before.passwordHash);
		expect(after.name).toBe(before.name);
		const mail = await eventually(async () =>
			(await mailsTo(priya.email)).find((m) => /tried to make an account/.test(m.subject))
		);
		expect(mail.text).toContain('nothing has changed');
		for (const link of linksIn(mail)) expect(link.origin).toBe(new URL(testEnv.appUrl).origin);
	});
});
