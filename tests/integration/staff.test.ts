import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { hashPassword } from '../../src/lib/server/auth/password';
import { users } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';
import { eventually, mailsTo } from '../support/shop';

const db = testDb();
const account = (role: string) => DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
const run = Date.now().toString(36);
let owner = '';
let cutter = '';
let ownerId = '';

const cookieNames = (res: Response) =>
	res.headers
		.getSetCookie()
		.map((c) => c.split('=')[0])
		.sort();

const get = (path: string, cookie?: string) =>
	fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
const userByEmail = async (email: string) => (await db.select().from(users).where(eq(users.email, email)))[0];

/** An account of our own with a password, so the demo accounts other files use stay as they are. */
async function makeAccount(role: 'shopper' | 'cutter', label: string) {
	const email = `${label}-${run}@example.com`;
	const password = 'a long test password';
	await db.insert(users).values({ email, name: `Test ${label}`, role, passwordHash: await hashPassword(password) });
	const u = await userByEmail(email);
	return { ...u, email, password };
}

/** Whether the credentials endpoint hands out a session cookie for this e-mail and password. */
async function credentialsGiveSession(email: string, password: string) {
	const res = await postForm('/auth/callback/credentials', { email, password, callbackUrl: '/' });
	return res.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token='));
}

beforeAll(async () => {
	owner = await signInCookie(account('owner').email, DEMO_SIGN_INS.password);
	cutter = await signInCookie(account('cutter').email, DEMO_SIGN_INS.password);
	ownerId = (await userByEmail(account('owner').email)).id;
});

describe('inviting a cutter', () => {
	it('makes a cutter account and e-mails a link that signs them in to the workroom', async () => {
		const email = `new-cutter-${run}@example.com`;
		const res = await postForm('/admin/staff?/invite', { email, name: 'Noor Haddad' }, owner);
		expect(res.status).toBe(200);
		expect(await res.text()).toContain(`Invitation on its way to ${email}`);
		// The owner's own session is left alone: the invite sets no cookie that an ordinary page
		// of hers does not (Auth.js refreshes her own session token on each request), and the
		// refreshed token is still hers.
		const plain = await get('/admin/staff', owner);
		expect(cookieNames(res).every((n) => cookieNames(plain).includes(n))).toBe(true);
		const refreshed =
			res.headers
				.getSetCookie()
				.find((c) => c.startsWith('authjs.session-token='))
				?.split(';')[0] ?? owner;
		const admin = await get('/admin/staff', refreshed);
		expect(admin.status).toBe(200);
		// The staff list marks the viewer's own row "(you)": it is still Margit's.
		const html = await admin.text();
		const you = html.indexOf('(you)');
		expect(you).toBeGreaterThan(0);
		expect(html.slice(you - 200, you)).toContain('Margit Solberg');

		const u = await userByEmail(email);
		expect(u).toMatchObject({ role: 'cutter', name: 'Noor Haddad', disabledAt: null });
		const [mail] = await eventually(async () => {
			const list = await mailsTo(email);
			return list.length ? list : null;
		});
		expect(mail.subject).toBe('Your sign-in link');
		const link = mail.text.match(/https?:\/\/\S+\/auth\/callback\/nodemailer\S+/)![0];
		expect(new URL(new URL(link).searchParams.get('callbackUrl')!).pathname).toBe('/workroom');
		const open = await fetch(link, { redirect: 'manual' });
		expect(open.status).toBe(302);
		expect(new URL(open.headers.get('location')!).pathname).toBe('/workroom');
		const session = open.headers
			.getSetCookie()
			.find((c) => c.startsWith('authjs.session-token='))!
			.split(';')[0];
		expect((await get('/workroom', session)).status).toBe(200);
		expect((await get('/admin', session)).status).toBe(403);
	});

	it('makes an existing shopper a cutter, and refuses to invite an owner or a bad address', async () => {
		const shopper = await makeAccount('shopper', 'invited-shopper');
		const res = await postForm('/admin/staff?/invite', { email: shopper.email, name: '' }, owner);
		expect(res.status).toBe(200);
		expect(await res.text()).toContain('Their shopper account is a cutter account now');
		expect((await userByEmail(shopper.email)).role).toBe('cutter');

		const again = await postForm('/admin/staff?/invite', { email: account('owner').email, name: '' }, owner);
		expect(again.status).toBe(409);
		expect(await again.text()).toContain('is an owner already');
		expect((await userByEmail(account('owner').email)).role).toBe('owner');

		const bad = await postForm('/admin/staff?/invite', { email: 'not an address', name: '' }, owner);
		expect(bad.status).toBe(400);
		expect(await bad.text()).toContain('Enter an e-mail address such as name@example.com.');
	});

	it('lists the staff, and finds any account by e-mail', async () => {
		const html = await (await get('/admin/staff', owner)).text();
		expect(html).toContain('Tomasz Weller');
		expect(html).toContain('Noor Haddad');
		expect(html).not.toContain('priya@example.com'); // a shopper is not staff
		const found = await (await get('/admin/staff?q=priya', owner)).text();
		expect(found).toContain('priya@example.com');
		// Addresses compare byte for byte now; the search still finds one typed in capitals.
		expect(await (await get('/admin/staff?q=PRIYA%40Example', owner)).text()).toContain('priya@example.com');
	});
});

describe('roles and switching accounts off', () => {
	it('changes a role once confirmed, and the new role counts at once', async () => {
		const u = await makeAccount('shopper', 'promoted');
		const session = await signInCookie(u.email, u.password);
		expect((await get('/workroom', session)).status).toBe(403);

		const unconfirmed = await postForm(`/admin/staff/${u.id}?/role`, { role: 'cutter' }, owner);
		expect(unconfirmed.status).toBe(400);
		expect(await unconfirmed.text()).toContain('Tick the box to confirm the change.');
		expect((await userByEmail(u.email)).role).toBe('shopper');

		const unknown = await postForm(`/admin/staff/${u.id}?/role`, { role: 'queen', confirm: 'on' }, owner);
		expect(unknown.status).toBe(400);
		expect(await unknown.text()).toContain('Choose a role.');

		const res = await postForm(`/admin/staff/${u.id}?/role`, { role: 'cutter', confirm: 'on' }, owner);
		expect(res.status).toBe(200);
		expect(await res.text()).toContain('is a cutter now');
		expect((await userByEmail(u.email)).role).toBe('cutter');
		expect((await get('/workroom', session)).status).toBe(200);
	});

	it('does not let the owner demote or switch off herself', async () => {
		const demote = await postForm(`/admin/staff/${ownerId}?/role`, { role: 'shopper', confirm: 'on' }, owner);
		expect(demote.status).toBe(403);
		expect(await demote.text()).toContain('This is your own account');
		const off = await postForm(`/admin/staff/${ownerId}?/disable`, { confirm: 'on' }, owner);
		expect(off.status).toBe(403);
		const me = await userByEmail(account('owner').email);
		expect(me.role).toBe('owner');
		expect(me.disabledAt).toBeNull();
		expect((await get('/admin', owner)).status).toBe(200);
	});

	it('switches an account off once confirmed: signed out at once, no new session; and back on', async () => {
		const u = await makeAccount('cutter', 'switched-off');
		const session = await signInCookie(u.email, u.password);
		expect((await get('/workroom', session)).status).toBe(200);

		const unconfirmed = await postForm(`/admin/staff/${u.id}?/disable`, {}, owner);
		expect(unconfirmed.status).toBe(400);
		expect(await unconfirmed.text()).toContain('Tick the box to confirm');
		expect((await userByEmail(u.email)).disabledAt).toBeNull();

		const res = await postForm(`/admin/staff/${u.id}?/disable`, { confirm: 'on' }, owner);
		expect(res.status).toBe(200);
		expect(await res.text()).toContain('Switched off.');
		expect((await userByEmail(u.email)).disabledAt).toBeInstanceOf(Date);
		// The old cookie no longer counts, and the password no longer gives a session.
		const after = await get('/workroom', session);
		expect(after.status).toBe(303);
		expect(after.headers.get('location')).toContain('/signin');
		expect(await credentialsGiveSession(u.email, u.password)).toBe(false);
		const form = await postForm('/signin?/password', { email: u.email, password: u.password });
		expect(form.status).toBe(403);
		expect(await form.text()).toContain('This account has been switched off');

		expect((await postForm(`/admin/staff/${u.id}?/enable`, {}, owner)).status).toBe(200);
		expect((await userByEmail(u.email)).disabledAt).toBeNull();
		expect(await credentialsGiveSession(u.email, u.password)).toBe(true);
	});

	it('refuses to invite a switched-off account', async () => {
		const u = await makeAccount('cutter', 'off-invite');
		await postForm(`/admin/staff/${u.id}?/disable`, { confirm: 'on' }, owner);
		const res = await postForm('/admin/staff?/invite', { email: u.email, name: '' }, owner);
		expect(res.status).toBe(409);
		expect(await res.text()).toContain('is switched off');
		expect(await mailsTo(u.email)).toEqual([]);
	});
});

describe('who may open staff', () => {
	it('gives a cutter 403 on every staff page and action, and changes nothing', async () => {
		const target = await makeAccount('shopper', 'target');
		const paths = ['/admin/staff', '/admin/staff?q=a', `/admin/staff/${target.id}`, `/admin/staff/${ownerId}`];
		for (const p of paths) expect((await get(p, cutter)).status, `GET ${p}`).toBe(403);
		const posts: [string, Record<string, string>][] = [
			['/admin/staff?/invite', { email: `cutter-invite-${run}@example.com`, name: '' }],
			[`/admin/staff/${target.id}?/role`, { role: 'owner', confirm: 'on' }],
			[`/admin/staff/${target.id}?/disable`, { confirm: 'on' }],
			[`/admin/staff/${target.id}?/enable`, {}],
			[`/admin/staff/${ownerId}?/disable`, { confirm: 'on' }]
		];
		for (const [p, fields] of posts) expect((await postForm(p, fields, cutter)).status, `POST ${p}`).toBe(403);
		expect(await userByEmail(`cutter-invite-${run}@example.com`)).toBeUndefined();
		expect(await userByEmail(target.email)).toMatchObject({ role: 'shopper', disabledAt: null });
		expect((await userByEmail(account('owner').email)).disabledAt).toBeNull();
	});

	it('sends a stranger to sign in', async () => {
		const res = await get('/admin/staff');
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toBe('/signin?next=%2Fadmin%2Fstaff');
	});
});
