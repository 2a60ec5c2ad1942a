import { error, fail } from '@sveltejs/kit';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { fabricById, setRetired } from '$lib/server/catalogue/entries';
import { fabricSchema } from '$lib/forms/catalogue';
import { fabricFormData, idParam } from '$lib/server/catalogue/forms';
import { saveFabric } from '$lib/server/catalogue/fabric-save';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

async function fabricFor(idText: string) {
	const id = idParam(idText);
	const row = await fabricById(db, id);
	if (!row) error(404, 'There is no such fabric in the catalogue.');
	return row;
}

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const { params, url } = event;
	const fabric = await fabricFor(params.id);
	return {
		form: await superValidate(fabricFormData(fabric), zod4(fabricSchema), { errors: false }),
		fabric: {
			id: fabric.id,
			name: fabric.name,
			colour: fabric.colour,
			retiredAt: fabric.retiredAt,
			imageUrl: fabric.imageUploadId ? `/uploads/${fabric.imageUploadId}` : null
		},
		added: url.searchParams.has('added')
	};
};

export const actions: Actions = {
	save: async (event) => {
		requireRole(event, OWNER);
		return saveFabric(event, await fabricFor(event.params.id));
	},
	retire: (event) => retireOrRestore(event, true),
	restore: (event) => retireOrRestore(event, false)
};

async function retireOrRestore(event: Parameters<Actions['retire']>[0], retire: boolean) {
	requireRole(event, OWNER);
	const done = await setRetired(db, { kind: 'fabric', row: await fabricFor(event.params.id) }, retire);
	return done.ok ? { notice: done.notice } : fail(done.status, { message: done.message });
}
