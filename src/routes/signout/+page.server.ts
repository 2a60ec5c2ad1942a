import { redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	default: async (event) => {
		const body = new FormData();
		body.set('redirectTo', '/');
		const headers = new Headers(event.request.headers);
		headers.delete('content-type');
		headers.delete('content-length');
		await signOut({ ...event, request: new Request(event.url, { method: 'POST', headers, body }) });
	}
};
