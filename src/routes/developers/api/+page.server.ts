import { db } from '$lib/server/db';
import { referenceView } from '$lib/server/api/reference';
import { listFabrics, listStyles } from '$lib/server/catalogue/listing';
import type { PageServerLoad } from './$types';

// Public: the API's reference, and the slugs and fabric ids this shop takes today (the catalogue
// the shop pages show anyway).
export const load: PageServerLoad = async () => {
	const [styles, fabrics] = await Promise.all([listStyles(db), listFabrics(db)]);
	return {
		reference: referenceView(),
		styles: styles.map((s) => ({ slug: s.slug, name: s.name, kind: s.kind })),
		fabrics: fabrics.map((f) => ({ id: f.id, name: f.name, colour: f.colour }))
	};
};
