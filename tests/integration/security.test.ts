import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';

function filesUnder(dir: string): string[] {
	return readdirSync(dir).flatMap((f) => {
		const p = join(dir, f);
		return statSync(p).isDirectory() ? filesUnder(p) : [p];
	});
}

describe('what reaches the browser', () => {
	it('ships no server secret in the client build', () => {
		const secrets = [process.env.AUTH_SECRET!, testEnv.stripeKey, testEnv.webhookSecret, decodeURIComponent(new URL(testEnv.databaseUrl).password)];
		const client = join(process.env.QL_BUILD_DIR!, 'client');
		const files = filesUnder(client).filter((f) => /\.(js|css|html|json)$/.test(f));
		expect(files.length).toBeGreaterThan(5);
		for (const f of files) {
			const text = readFileSync(f, 'utf8');
			for (const s of secrets) expect(text.includes(s), `${s.slice(0, 6)}… found in ${f}`).toBe(false);
			expect(text).not.toMatch(/DATABASE_URL|mysql:\/\//);
		}
	});

	it('sends a content-security policy and the usual protective headers', async () => {
		const res = await fetch(`${testEnv.appUrl}/`);
		const csp = res.headers.get('content-security-policy') ?? '';
		expect(csp).toContain("default-src 'self'");
		expect(csp).toContain("frame-ancestors 'none'");
		expect(csp).toMatch(/script-src 'self' ('nonce-|'sha256-)/);
		expect(res.headers.get('x-content-type-options')).toBe('nosniff');
		expect(res.headers.get('referrer-policy')).toBe('same-origin');
	});

	it('marks the session cookie HttpOnly and SameSite', async () => {
		const owner = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
		const res = await fetch(`${testEnv.appUrl}/auth/callback/credentials`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl }, body: new URLSearchParams({ email: owner.email, password: DEMO_SIGN_INS.password, callbackUrl: '/' }) });
		const cookie = res.headers.getSetCookie().find((c) => c.startsWith('authjs.session-token='))!;
		expect(cookie).toMatch(/HttpOnly/i);
		expect(cookie).toMatch(/SameSite=Lax/i);
	});

	it('refuses a form posted from another site', async () => {
		const res = await fetch(`${testEnv.appUrl}/signin?/password`, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://evil.example' }, body: 'email=a@b.c&password=x' });
		expect(res.status).toBe(403);
	});
});

describe('stored text', () => {
	it('renders a hostile name escaped on the order pages', async () => {
		const name = '<img src=x onerror=alert(1)>"Ro\'se';
		const res = await fetch(`${testEnv.appUrl}/api/orders`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ items: [{ measurements: { waist: 70, hip: 96, length: 60 }, style: 'rue-straight', fabricId: 1 }], shopper: { email: `xss-${Date.now()}@example.com`, name, line1: '<script>alert(2)</script>', line2: '', city: 'Riga', postcode: 'LV-1050', country: 'DE', measurementConsent: true, madeToMeasure: true } })
		});
		expect(res.status).toBe(201);
		const { number } = await res.json();
		const owner = await signInCookie(DEMO_SIGN_INS.accounts[0].email, DEMO_SIGN_INS.password);
		const list = await (await fetch(`${testEnv.appUrl}/admin/orders?q=${number}`, { headers: { cookie: owner } })).text();
		expect(list).toContain('&lt;img src=x onerror=alert(1)>');
		expect(list).not.toContain('<img src=x');
		const id = list.match(/\/admin\/orders\/(\d+)/)![1];
		const page = await (await fetch(`${testEnv.appUrl}/admin/orders/${id}`, { headers: { cookie: owner } })).text();
		expect(page).not.toContain('<img src=x');
		expect(page).not.toContain('<script>alert(2)');
	});
});
