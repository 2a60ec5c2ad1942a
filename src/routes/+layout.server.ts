import { db } from '$lib/server/db';
import { shopSettingsOf } from '$lib/server/house/rules';
import { readBag } from '$lib/server/quote/bag';
import { remakePromise } from '$lib/fit/promise';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals, cookies }) => {
	const settings = await shopSettingsOf(db);
	return {
		// Her name and role for the header; nothing else about the person rides along on every page.
		user: locals.user ? { name: locals.user.name, role: locals.user.role } : null,
		bagCount: readBag(cookies).length,
		// Every amount on every page is written in the shop's currency (a setting).
		currency: settings.currency,
		// Every page's footer states the remake promise, in words built from the settings it is kept by.
		remakePromise: remakePromise(settings)
	};
};
