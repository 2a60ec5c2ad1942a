import { describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { signInAttempts, users } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { postForm } from '../support/session';
import { eventually, mailsTo } from '../support/shop';

const db = testDb();
const owner = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;

describe('signing in with a password', () => {
	it('sends the owner to the back office with a session cookie', async () => {
		const res = await postForm('/signin?/password', { email: owner.email, password: DEMO_SIGN_INS.password });
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toBe('/admin');
		expect(res.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='))).toBe(true);
	});

	it('answers a wrong password with a clear message and no session', async () => {
		const res = await postForm('/signin?/password', { email: owner.email, password: 'not-the-password' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('That e-mail and password do not match an account');
		expect(res.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='))).toBe(false);
	});

	it('answers an unknown e-mail the same way and creates no user', async () => {
		const email = 'nobody-here@example.com';
		const res = await postForm('/signin?/password', { email, password: 'whatever-it-is' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('do not match an account');
		expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
	});

	it('refuses a malformed e-mail on the form without a server error', async () => {
		const res = await postForm('/signin?/password', { email: 'not an e-mail', password: '' });
		expect(res.status).toBe(400);
		const html = await res.text();
		expect(html).toContain('Enter an e-mail address');
		expect(html).toContain('Enter your password');
	});

	it('throttles the sixth try within ten minutes with 429, on our form and on the Auth.js endpoint', async () => {
		const email = `guess-${Date.now()}@example.com`;
		for (let i = 0; i < 5; i++) {
			expect((await postForm('/signin?/password', { email, password: `guess-${i}` })).status).toBe(400);
		}
		const sixth = await postForm('/signin?/password', { email, password: 'guess-6' });
		expect(sixth.status).toBe(429);
		expect(await sixth.text()).toContain('Too many attempts for this e-mail');
		const direct = await postForm('/auth/callback/credentials', { email, password: 'guess-7', callbackUrl: '/' });
		expect(direct.status).toBe(429);
		const [row] = await db.select({ n: count() }).from(signInAttempts).where(eq(signInAttempts.email, email));
		expect(row.n).toBe(5); // throttled tries are not even checked
	});
});

describe('registering', () => {
	it('makes a shopper account with an argon2id hash and signs her in', async () => {
		const email = `new-${Date.now()}@example.com`;
		const res = await postForm('/register', { name: 'Wren Tally', email, password: 'a long enough sentence' });
		expect(res.status).toBe(303);
		const [u] = await db.select().from(users).where(eq(users.email, email));
		expect(u.role).toBe('shopper');
		expect(u.passwordHash).toMatch(/^\$argon2id\$/);
	});

	it('makes no second account for the same e-mail, and does not say on screen that it exists', async () => {
		const res = await postForm('/register', {
			name: 'Margit again',
			email: owner.email,
			password: 'a long enough sentence'
		});
		expect(res.status).toBe(200);
		const html = await res.text();
		expect(html).toContain(`We sent a message to ${owner.email}`);
		expect(html).not.toContain('exists');
		const [row] = await db.select({ n: count() }).from(users).where(eq(users.email, owner.email));
		expect(row.n).toBe(1);
	});
});

describe('sign-in link by e-mail', () => {
	it('sends a link through the mail fake that signs the shopper in', async () => {
		const email = `link-${Date.now()}@example.com`;
		const res = await postForm('/signin?/link', { email });
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toContain('/signin/check-mail');
		const messages = await eventually(async () => {
			const found = await mailsTo(email);
			return found.length ? found : null;
		});
		expect(messages[0].subject).toBe('Your sign-in link');
		const link = (messages[0].text as string).match(/https?:\/\/\S+\/auth\/callback\/nodemailer\S+/)![0];
		const open = await fetch(link, { redirect: 'manual' });
		expect(open.status).toBe(302);
		expect(open.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='))).toBe(true);
		const [u] = await db.select().from(users).where(eq(users.email, email));
		expect(u.role).toBe('shopper');
	});
});
