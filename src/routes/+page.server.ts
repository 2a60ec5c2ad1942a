import { db } from '$lib/server/db';
import { listStyles } from '$lib/server/catalogue';
import { currentRules } from '$lib/server/shop/rules';
import { sampleDrawing } from '$lib/server/shop/sample';
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
			drawing: sampleDrawing(s.kind, rules, id, 'garment')
		}))
	};
};
