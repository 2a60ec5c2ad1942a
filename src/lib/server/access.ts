import { error, redirect } from '@sveltejs/kit';
import type { Role } from './db/schema';
import { signInReturningTo } from './origin';

// Who may open what, decided from the route SvelteKit matched (event.route.id: the folder path under
// src/routes), never from the URL text. The router decodes and normalises the path before it matches,
// so "/%61dmin", "/admin;x" or "/./admin" either reach the admin route, and are guarded as it is, or
// match no route at all and answer 404. Pages, their __data.json, form actions and endpoints (PDF, CSV)
// under one folder share one rule.
export type Area = { route: string; roles: readonly Role[]; label: string };

export const SIGNED_IN: readonly Role[] = ['shopper', 'cutter', 'owner'];
export const STAFF: readonly Role[] = ['cutter', 'owner'];
export const OWNER: readonly Role[] = ['owner'];

export const AREAS: readonly Area[] = [
	{ route: '/admin', roles: OWNER, label: 'the back office' },
	{ route: '/api/admin', roles: OWNER, label: 'the back office' },
	// Fit reports sit in the workroom; beyond the role, their loads and actions ask for the owner's leave
	// (requireFitDecider in server/fit/workroom.ts).
	{ route: '/workroom/fit-reports', roles: STAFF, label: 'the fit reports' },
	{ route: '/workroom', roles: STAFF, label: 'the workroom' },
	{ route: '/api/workroom', roles: STAFF, label: 'the workroom' },
	{ route: '/account', roles: SIGNED_IN, label: 'your account' }
];

// Pages that show one person's orders, measurements or contact details: never kept by a shared cache
// or the browser's back-forward store.
// Fit photos (/fit-photos) are checked per request like an order page: her account, her signed link, or staff.
const PERSONAL = ['/admin', '/api/admin', '/workroom', '/api/workroom', '/account', '/orders', '/api/orders', '/checkout', '/fit-photos'];

/** The route id without its (group) folders, which do not appear in URLs. */
function plain(routeId: string) {
	return routeId.replace(/\/\([^/]*\)/g, '') || '/';
}

const under = (routeId: string, prefix: string) => routeId === prefix || routeId.startsWith(`${prefix}/`);

export function areaFor(routeId: string | null): Area | undefined {
	if (!routeId) return undefined;
	const id = plain(routeId);
	return AREAS.find((a) => under(id, a.route));
}

export function isPersonal(routeId: string | null) {
	if (!routeId) return false;
	const id = plain(routeId);
	return PERSONAL.some((p) => under(id, p));
}

export function isApi(routeId: string | null) {
	return routeId !== null && under(plain(routeId), '/api');
}

type Event = { locals: App.Locals; url: URL; route: { id: string | null } };

/**
 * Asked by every load, form action and endpoint that changes or reveals data, where the work happens:
 * the signed-in user with one of the roles, or a sign-in redirect (pages) / 401 (API) / 403. The hook
 * asks the same question before any of them runs; asking again here means one layer's mistake is
 * caught by the other.
 */
export function requireRole(event: Event, roles: readonly Role[]) {
	const user = event.locals.user;
	if (!user) {
		if (isApi(event.route.id)) error(401, 'Sign in first.');
		redirect(303, signInReturningTo(event.url));
	}
	if (!roles.includes(user.role)) {
		const area = areaFor(event.route.id);
		error(403, `Your account cannot open ${area?.label ?? 'this page'}.`);
	}
	return user;
}
