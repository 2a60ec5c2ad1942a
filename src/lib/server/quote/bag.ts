import type { Cookies } from '@sveltejs/kit';
import { z } from 'zod';
import { bagItemSchema, type BagItem } from '$lib/forms/quote';
import { servedOverHttps } from '../origin';

// The bag lives in the shopper's own browser as an httpOnly cookie: nothing is stored for her on the
// server until she checks out, and the server prices every item again from the database then.
const COOKIE = 'ql_bag';
const MAX_ITEMS = 6;
const bagSchema = z.array(bagItemSchema).max(MAX_ITEMS);

export function readBag(cookies: Cookies): BagItem[] {
	const raw = cookies.get(COOKIE);
	if (!raw) return [];
	try {
		const parsed = bagSchema.safeParse(JSON.parse(raw));
		return parsed.success ? parsed.data : [];
	} catch {
		return [];
	}
}

export function writeBag(cookies: Cookies, items: BagItem[]) {
	cookies.set(COOKIE, JSON.stringify(items.slice(0, MAX_ITEMS)), { path: '/', httpOnly: true, sameSite: 'lax', secure: servedOverHttps(), maxAge: 60 * 60 * 24 * 30 });
}

export function clearBag(cookies: Cookies) {
	cookies.delete(COOKIE, { path: '/', secure: servedOverHttps() });
}

export { MAX_ITEMS };
