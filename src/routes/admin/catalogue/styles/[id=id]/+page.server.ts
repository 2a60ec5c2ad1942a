import { error, fail } from '@sveltejs/kit';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { styleById, setRetired } from '$lib/server/catalogue/entries';
import { styleSchema } from '$lib/forms/catalogue';
import { idParam, styleFormData } from '$lib/server/catalogue/forms';
import { saveStyle } from '$lib/server/catalogue/style-save';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

async function styleFor(idText: string) {
	const id = idParam(idText);
	const row = await styleById(db, id);
	if (!row) error(404, 'There is no such style in the catalogue.');
	return row;
}

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const { params, url } = event;
	const style = await styleFor(params.id);
	return {
		form: await superValidate(styleFormData(style), zod4(styleSchema), { errors: false }),
		style: { id: style.id, name: style.name, slug: style.slug, retiredAt: style.retiredAt },
		added: url.searchParams.has('added')
	};
};

export const actions: Actions = {
	save: async (event) => {
		requireRole(event, OWNER);
		return saveStyle(event, await styleFor(event.params.id));
	},
	retire: (event) => retireOrRestore(event, true),
	restore: (event) => retireOrRestore(event, false)
};

async function retireOrRestore(event: Parameters<Actions['retire']>[0], retire: boolean) {
	requireRole(event, OWNER);
	const done = await setRetired(db, { kind: 'style', row: await styleFor(event.params.id) }, retire);
	return done.ok ? { notice: done.notice } : fail(done.status, { message: done.message });
}
