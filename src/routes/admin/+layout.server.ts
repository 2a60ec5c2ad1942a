import { OWNER, requireRole } from '$lib/server/access';
import type { LayoutServerLoad } from './$types';

// The hooks guard the back office's routes already; asking again here types the page data with the viewer.
export const load: LayoutServerLoad = (event) => {
	const { name, role } = requireRole(event, OWNER);
	return { staffUser: { name, role } };
};
