import type { Handle } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { db } from '../db';
import { users } from '../db/schema';

// The session cookie only says who signed in and with which session version; role, standing and the
// current version are read from the database on each request, so a changed role, a disabled account
// or a sign-out (which raises the version) counts at once on every app server.
export const currentUser: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	const session = await event.locals.auth();
	const id = session?.user?.id;
	if (id) {
		const [row] = await db
			.select({
				id: users.id,
				email: users.email,
				name: users.name,
				role: users.role,
				disabledAt: users.disabledAt,
				sessionVersion: users.sessionVersion
			})
			.from(users)
			.where(eq(users.id, id))
			.limit(1);
		if (row && !row.disabledAt && row.email && row.sessionVersion === session.sessionVersion) {
			event.locals.user = { id: row.id, email: row.email, name: row.name ?? row.email, role: row.role };
		}
	}
	return resolve(event);
};
