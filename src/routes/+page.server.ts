import { db } from '$lib/server/db';
import { listStyles } from '$lib/server/catalogue';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const styles = await listStyles(db);
	return {
		styles: styles.map((s) => ({
			slug: s.slug,
			name: s.name,
			kind: s.kind,
			description: s.description,
			makingPrice: s.makingPrice,
			leadDays: s.leadDays
		}))
	};
};
