import { db } from '$lib/server/db';
import { listStyles } from '$lib/server/catalogue/listing';
import { currentRules } from '$lib/server/house/rules';
import { sampleDrawing } from '$lib/server/quote/sample';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const [styles, { id, rules }] = await Promise.all([listStyles(db), currentRules(db)]);
	return {
		styles: styles.map((s) => ({
			slug: s.slug,
			name: s.name,
			kind: s.kind,
			description: s.description,
			makingPrice: s.makingPrice,
			leadDays: s.leadDays,
			drawing: sampleDrawing(s.kind, rules, id, 'pieces')
		}))
	};
};
