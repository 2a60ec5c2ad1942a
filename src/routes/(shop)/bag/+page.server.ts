import { redirect } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { readBag, writeBag } from '$lib/server/quote/bag';
import { viewBag } from '$lib/server/quote/bag-view';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ cookies }) => ({ bag: await viewBag(db, readBag(cookies)) });

export const actions: Actions = {
	remove: async ({ request, cookies }) => {
		const id = String((await request.formData()).get('id') ?? '');
		writeBag(cookies, readBag(cookies).filter((i) => i.id !== id));
		redirect(303, '/bag');
	}
};
