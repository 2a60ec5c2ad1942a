// Saving a fabric, new or edited, with its optional swatch photo. The photo is checked and kept
// only once every other field is valid, so a refused form never leaves a file behind.
import { redirect, type RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { fail, message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { db } from '$lib/server/db';
import { fabrics } from '$lib/server/db/schema';
import { acceptSwatch, discardUpload, tooLarge } from '$lib/server/catalogue/uploads';
import { fabricFormData, fabricValues, newFabricSlug } from './forms';
import { fabricSchema, MAX_SWATCH_BYTES } from '$lib/forms/catalogue';

type Fabric = typeof fabrics.$inferSelect;

// Room for the text fields beside the photo; anything larger is refused before it is read.
const MAX_BODY = MAX_SWATCH_BYTES + 64 * 1024;

export async function saveFabric(event: RequestEvent, existing: Fabric | null) {
	const declared = Number(event.request.headers.get('content-length') ?? 0);
	let body: FormData | null = null;
	if (!(declared > MAX_BODY)) {
		// A body over the server's own limit fails here while it streams in.
		body = await event.request.formData().catch(() => null);
	}
	if (!body) {
		const form = await superValidate(existing ? fabricFormData(existing) : undefined, zod4(fabricSchema), {
			errors: false
		});
		return setError(
			form,
			'image',
			declared > 0 ? tooLarge(declared) : 'The form did not arrive whole. Please try again.',
			{ status: 413 }
		);
	}
	const form = await superValidate(body, zod4(fabricSchema));
	if (!form.valid) return fail(400, { form });

	let uploadId: number | null = null;
	if (form.data.image) {
		const swatch = await acceptSwatch(form.data.image, event.locals.user?.id ?? null);
		if (!swatch.ok) return setError(form, 'image', swatch.message);
		uploadId = swatch.upload.id;
	}
	const before = existing?.imageUploadId ?? null;
	const imageUploadId = uploadId ?? (form.data.removeImage ? null : before);
	const values = { ...fabricValues(form.data), imageUploadId };
	let id = existing?.id ?? 0;
	try {
		if (existing) await db.update(fabrics).set(values).where(eq(fabrics.id, existing.id));
		else
			[{ id }] = await db
				.insert(fabrics)
				.values({ ...values, slug: await newFabricSlug(values.name, values.colour) })
				.$returningId();
	} catch (e) {
		if (uploadId) await discardUpload(uploadId);
		throw e;
	}
	// The photo it replaced is shown nowhere any more.
	if (before && before !== imageUploadId) await discardUpload(before);
	if (!existing) redirect(303, `/admin/catalogue/fabrics/${id}?added`);
	form.data.removeImage = false;
	return message(form, `Saved. The shop shows ${values.name}, ${values.colour} as it is now.`);
}
