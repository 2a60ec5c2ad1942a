// Shared by the catalogue tests: the owner's forms as a browser without JavaScript posts them.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fabrics } from '../../src/lib/server/db/schema';
import type { Db } from '../../src/lib/server/db/client';
import { testEnv } from '../support/env';
import { postForm, signInCookie } from '../support/session';

export { postForm };

export const signIn = (role: string) => {
	const a = DEMO_SIGN_INS.accounts.find((x) => x.role === role)!;
	return signInCookie(a.email, DEMO_SIGN_INS.password);
};

export const get = (path: string, cookie?: string) =>
	fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });

// As tests/support/session.ts postForm does: a browser without JavaScript asks for HTML (without
// it SvelteKit answers a form action as JSON, the way use:enhance reads it).
const browser = (cookie?: string) => ({ origin: testEnv.appUrl, accept: 'text/html', ...(cookie ? { cookie } : {}) });

export type Upload = { name: string; type: string; bytes: Uint8Array };

/** Posts a form as a browser does with enctype="multipart/form-data". */
export function postMultipart(path: string, fields: Record<string, string>, cookie: string, file?: Upload) {
	const body = new FormData();
	for (const [k, v] of Object.entries(fields)) body.set(k, v);
	if (file) body.set('image', new File([file.bytes as Uint8Array<ArrayBuffer>], file.name, { type: file.type }));
	return fetch(`${testEnv.appUrl}${path}`, { method: 'POST', redirect: 'manual', headers: browser(cookie), body });
}

export const run = Date.now().toString(36);

export const fabricFields = (over: Record<string, string> = {}) => ({
	name: `Test crepe ${run}`,
	colour: 'Heather',
	swatchHex: '#7a6c8f',
	fibreContent: '98 % cotton, 2 % elastane',
	careText: 'Machine wash at 30 °C, do not bleach, dry flat, cool iron.',
	widthCm: '140,5',
	pricePerMetre: '24,50',
	stockMetres: '12.345',
	shrinkagePct: '4.5',
	nap: 'on',
	...over
});

export async function fabricNamed(db: Db, name: string) {
	const [row] = await db.select().from(fabrics).where(eq(fabrics.name, name));
	return row;
}

/** Every file under a folder (the upload store), for checking that nothing was kept. */
export function filesIn(dir: string): string[] {
	try {
		return readdirSync(dir, { recursive: true, withFileTypes: true })
			.filter((d) => d.isFile())
			.map((d) => join(d.parentPath, d.name));
	} catch {
		return [];
	}
}
