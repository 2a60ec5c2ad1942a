import { requireRole, STAFF } from '$lib/server/access';
import type { LayoutServerLoad } from './$types';

// The hooks guard the workroom's routes already; asking again here types the page data with the viewer.
export const load: LayoutServerLoad = (event) => {
	const { name, role } = requireRole(event, STAFF);
	return { staffUser: { name, role } };
};
