import { error, fail } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { fabrics } from '$lib/server/db/schema';
import { fabricSchema } from '$lib/forms/catalogue';
import { fabricFormData, idParam } from '../../catalogue.server';
import { saveFabric } from '../../fabric-save.server';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

async function fabricFor(idText: string) {
	const id = idParam(idText);
	const [row] = id ? await db.select().from(fabrics).where(eq(fabrics.id, id)).limit(1) : [];
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
	retire: async (event) => {
		requireRole(event, OWNER);
		const { params } = event;
		const fabric = await fabricFor(params.id);
		if (fabric.retiredAt) return fail(409, { message: 'This fabric is retired already.' });
		await db.update(fabrics).set({ retiredAt: new Date() }).where(eq(fabrics.id, fabric.id));
		return {
			notice: `Retired. Shoppers no longer see ${fabric.name}, ${fabric.colour}; orders already placed keep it.`
		};
	},
	restore: async (event) => {
		requireRole(event, OWNER);
		const { params } = event;
		const fabric = await fabricFor(params.id);
		if (!fabric.retiredAt) return fail(409, { message: 'This fabric is in the shop already.' });
		await db.update(fabrics).set({ retiredAt: null }).where(eq(fabrics.id, fabric.id));
		return { notice: `Back in the shop: ${fabric.name}, ${fabric.colour}.` };
	}
};
