import { requireRole, SIGNED_IN } from '$lib/server/access';
import type { LayoutServerLoad } from './$types';

// The hooks guard the account's routes already; asking again here types the page data with the viewer.
export const load: LayoutServerLoad = (event) => {
	const { name, role } = requireRole(event, SIGNED_IN);
	return { staffUser: { name, role } };
};
