import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { styleSchema } from '$lib/forms/catalogue';
import { saveStyle } from '$lib/server/catalogue/style-save';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const form = await superValidate(zod4(styleSchema));
	// Options cost nothing extra until the owner says otherwise; most styles take about a week.
	Object.assign(form.data, {
		priceLining: '0',
		pricePockets: '0',
		priceBand: '0',
		priceFacing: '0',
		priceInvisibleZip: '0',
		leadDays: '7',
		sortOrder: '10'
	});
	return { form };
};

export const actions: Actions = {
	save: (event) => {
		requireRole(event, OWNER);
		return saveStyle(event, null);
	}
};
