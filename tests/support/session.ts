import { testEnv } from './env';

/** Signs in through Auth.js's credentials endpoint and returns the session cookie header. */
export async function signInCookie(email: string, password: string) {
	const res = await fetch(`${testEnv.appUrl}/auth/callback/credentials`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: testEnv.appUrl },
		body: new URLSearchParams({ email, password, callbackUrl: '/' })
	});
	const cookies = res.headers.getSetCookie().map((c) => c.split(';')[0]);
	const session = cookies.find((c) => c.startsWith('authjs.session-token='));
	if (!session) throw new Error(`sign-in as ${email} gave no session cookie (status ${res.status})`);
	return session;
}

/** Posts a form to a page action the way a browser without JavaScript would. */
export function postForm(path: string, fields: Record<string, string>, cookie?: string) {
	return fetch(`${testEnv.appUrl}${path}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: testEnv.appUrl, ...(cookie ? { cookie } : {}) },
		body: new URLSearchParams(fields)
	});
}
