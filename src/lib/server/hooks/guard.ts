import { error, json, redirect, type Handle } from '@sveltejs/kit';
import type { Role } from '../db/schema';

// Who may open what, by path prefix. Pages and endpoints alike pass through here, so a PDF or a CSV
// under /workroom or /admin is guarded exactly like the page that links to it.
export const ACCESS: { prefix: string; roles: readonly Role[]; label: string }[] = [
	{ prefix: '/admin', roles: ['owner'], label: 'the back office' },
	{ prefix: '/api/admin', roles: ['owner'], label: 'the back office' },
	{ prefix: '/workroom', roles: ['cutter', 'owner'], label: 'the workroom' },
	{ prefix: '/api/workroom', roles: ['cutter', 'owner'], label: 'the workroom' },
	{ prefix: '/account', roles: ['shopper', 'cutter', 'owner'], label: 'your account' },
	{ prefix: '/api/account', roles: ['shopper', 'cutter', 'owner'], label: 'your account' }
];

const matches = (path: string, prefix: string) => path === prefix || path.startsWith(`${prefix}/`);

export function ruleFor(path: string) {
	return ACCESS.find((r) => matches(path, r.prefix));
}

export const guard: Handle = async ({ event, resolve }) => {
	const path = event.url.pathname;
	const rule = ruleFor(path);
	if (!rule) return resolve(event);
	const user = event.locals.user;
	const isApi = matches(path, '/api');
	if (!user) {
		if (isApi) return json({ message: 'Sign in first.' }, { status: 401 });
		redirect(303, `/signin?next=${encodeURIComponent(path + event.url.search)}`);
	}
	if (!rule.roles.includes(user.role)) {
		const message = `Your account cannot open ${rule.label}.`;
		if (isApi) return json({ message }, { status: 403 });
		error(403, message);
	}
	return resolve(event);
};
