import { readBag } from '$lib/server/shop/bag';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = ({ locals, cookies }) => ({
	user: locals.user ? { name: locals.user.name, email: locals.user.email, role: locals.user.role } : null,
	bagCount: readBag(cookies).length
});
