import { json, type Handle } from '@sveltejs/kit';
import { areaFor, isApi, requireRole } from '../access';

// The first of two layers (the second is requireRole in each load, action and endpoint): the route
// SvelteKit matched decides. A request that matched no route (route.id null) is left to answer 404,
// or to Auth.js for its own /auth/* paths.
export const guard: Handle = async ({ event, resolve }) => {
	const area = areaFor(event.route.id);
	if (!area) return resolve(event);
	if (isApi(event.route.id)) {
		const user = event.locals.user;
		if (!user) return json({ message: 'Sign in first.' }, { status: 401 });
		if (!area.roles.includes(user.role)) return json({ message: `Your account cannot open ${area.label}.` }, { status: 403 });
	} else {
		requireRole(event, area.roles);
	}
	return resolve(event);
};
