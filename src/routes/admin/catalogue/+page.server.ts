import { catalogueLists } from '$lib/server/catalogue/forms';
import type { PageServerLoad } from './$types';
import { OWNER, requireRole } from '$lib/server/access';

export const load: PageServerLoad = (event) => {
	requireRole(event, OWNER);
	return catalogueLists();
};
