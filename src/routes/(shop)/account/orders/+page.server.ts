import { db } from '$lib/server/db';
import { ordersOfShopper } from '$lib/server/order/view';
import type { PageServerLoad } from './$types';
import { requireRole, SIGNED_IN } from '$lib/server/access';

export const load: PageServerLoad = async (event) => ({ orders: await ordersOfShopper(db, requireRole(event, SIGNED_IN).id) });
