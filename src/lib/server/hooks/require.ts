import { error, redirect } from '@sveltejs/kit';
import type { Role } from '../db/schema';

/** For layouts and actions: the signed-in user with one of the roles, or a redirect / 403. */
export function requireRole(locals: App.Locals, url: URL, roles: readonly Role[]) {
	const user = locals.user;
	if (!user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	if (!roles.includes(user.role)) error(403, 'Your account cannot open this page.');
	return user;
}
