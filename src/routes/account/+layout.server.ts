import { requireRole } from '$lib/server/hooks/require';
import type { LayoutServerLoad } from './$types';

// The hooks guard every path under /account already; this keeps the page data typed with the user.
export const load: LayoutServerLoad = ({ locals, url }) => ({ staffUser: requireRole(locals, url, ['shopper', 'cutter', 'owner']) });
