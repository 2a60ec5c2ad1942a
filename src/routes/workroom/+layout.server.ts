import { count, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { fitReports, users } from '$lib/server/db/schema';
import { requireRole, STAFF } from '$lib/server/access';
import type { LayoutServerLoad } from './$types';

// The hooks guard the workroom's routes already; asking again here types the page data with the viewer.
export const load: LayoutServerLoad = async (event) => {
	const { id, name, role } = requireRole(event, STAFF);
	// Fit reports are for the owner and the cutters she allows: the others are not shown the link.
	const [row] = role === 'owner' ? [{ leave: true }] : await db.select({ leave: users.fitDecider }).from(users).where(eq(users.id, id));
	const [fresh] = row?.leave ? await db.select({ n: count() }).from(fitReports).where(eq(fitReports.status, 'new')) : [{ n: 0 }];
	return { staffUser: { name, role }, fitReports: row?.leave ? { fresh: Number(fresh.n) } : null };
};
