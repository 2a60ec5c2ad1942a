import { redirect, type RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { fail, message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { styles } from '$lib/server/db/schema';
import { styleSlugTaken, styleValues } from './forms';
import { styleSchema } from '$lib/forms/catalogue';

function isDuplicate(e: unknown): boolean {
	for (let c: unknown = e; c && typeof c === 'object'; c = (c as { cause?: unknown }).cause) {
		if ((c as { code?: string }).code === 'ER_DUP_ENTRY') return true;
	}
	return false;
}

export async function saveStyle(event: RequestEvent, existing: typeof styles.$inferSelect | null) {
	const form = await superValidate(event.request, zod4(styleSchema));
	if (!form.valid) return fail(400, { form });
	if (await styleSlugTaken(form.data.slug, existing?.id))
		return setError(form, 'slug', 'Another style has this address already: choose another.');
	const values = styleValues(form.data);
	let id = existing?.id ?? 0;
	try {
		if (existing) await db.update(styles).set(values).where(eq(styles.id, existing.id));
		else [{ id }] = await db.insert(styles).values(values).$returningId();
	} catch (e) {
		// Two saves racing for one address: the unique key decides, and the loser hears why.
		if (isDuplicate(e)) return setError(form, 'slug', 'Another style has this address already: choose another.');
		throw e;
	}
	if (!existing) redirect(303, `/admin/catalogue/styles/${id}?added`);
	return message(form, `Saved. The shop shows ${values.name} as it is now.`);
}
