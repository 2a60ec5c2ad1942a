import { redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import { endSessions } from '$lib/server/auth/sessions';
import { db } from '$lib/server/db';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	default: async (event) => {
		// Deleting the cookie in this browser is not enough: a copy of it would stay valid for 30 days.
		if (event.locals.user) await endSessions(db, event.locals.user.id);
		const body = new FormData();
		body.set('redirectTo', '/');
		const headers = new Headers(event.request.headers);
		headers.delete('content-type');
		headers.delete('content-length');
		await signOut({ ...event, request: new Request(event.url, { method: 'POST', headers, body }) });
	}
};
