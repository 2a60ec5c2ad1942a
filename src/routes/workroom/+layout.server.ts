import { db } from '$lib/server/db';
import { hasFitLeave, newReportCount } from '$lib/server/fit/workroom';
import { requireRole, STAFF } from '$lib/server/access';
import type { LayoutServerLoad } from './$types';

// The hooks guard the workroom's routes already; asking again here types the page data with the viewer.
export const load: LayoutServerLoad = async (event) => {
	const user = requireRole(event, STAFF);
	// Fit reports are for the owner and the cutters she allows: the others are not shown the link.
	const leave = await hasFitLeave(db, user);
	return { staffUser: { name: user.name, role: user.role }, fitReports: leave ? { fresh: await newReportCount(db) } : null };
};
