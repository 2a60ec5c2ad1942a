import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { fabricSchema } from '$lib/forms/catalogue';
import { saveFabric } from '$lib/server/catalogue/fabric-save';
import type { Actions, PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = async (event) => {
	requireRole(event, OWNER);
	const form = await superValidate(zod4(fabricSchema));
	// A neutral starting colour and the figures most bolts share, so the owner changes only what differs.
	form.data.swatchHex = '#8a7f72';
	form.data.shrinkagePct = '0';
	return { form };
};

export const actions: Actions = {
	save: (event) => {
		requireRole(event, OWNER);
		return saveFabric(event, null);
	}
};
