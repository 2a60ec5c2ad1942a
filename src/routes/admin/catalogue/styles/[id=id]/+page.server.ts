import { error, fail } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { styles } from '$lib/server/db/schema';
import { styleSchema } from '$lib/forms/catalogue';
import { idParam, styleFormData } from '../../catalogue.server';
import { saveStyle } from '../../style-save.server';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

async function styleFor(idText: string) {
	const id = idParam(idText);
	const [row] = id ? await db.select().from(styles).where(eq(styles.id, id)).limit(1) : [];
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
	retire: async (event) => {
		requireRole(event, OWNER);
		const { params } = event;
		const style = await styleFor(params.id);
		if (style.retiredAt) return fail(409, { message: 'This style is retired already.' });
		await db.update(styles).set({ retiredAt: new Date() }).where(eq(styles.id, style.id));
		return { notice: `Retired. ${style.name} is no longer in the shop; orders already placed keep it.` };
	},
	restore: async (event) => {
		requireRole(event, OWNER);
		const { params } = event;
		const style = await styleFor(params.id);
		if (!style.retiredAt) return fail(409, { message: 'This style is in the shop already.' });
		await db.update(styles).set({ retiredAt: null }).where(eq(styles.id, style.id));
		return { notice: `Back in the shop: ${style.name}.` };
	}
};
