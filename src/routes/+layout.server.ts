import { readBag } from '$lib/server/quote/bag';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = ({ locals, cookies }) => ({
	// Her name and role for the header; nothing else about the person rides along on every page.
	user: locals.user ? { name: locals.user.name, role: locals.user.role } : null,
	bagCount: readBag(cookies).length
});
