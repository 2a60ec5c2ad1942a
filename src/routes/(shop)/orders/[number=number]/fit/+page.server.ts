import { error, fail, redirect } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { fitLink } from '$lib/server/fit/links';
import { atelierAddress, fitPageData, orderForFit, readReportForm, submitReport } from '$lib/server/fit/report';
import { deletePhoto, keepPhoto, photosOf, photoTooLarge, preparePhoto, PHOTO_LIMITS, purgeExpiredPhotos } from '$lib/server/fit/photos';
import { shopSettingsOf } from '$lib/server/house/rules';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const NOT_FOUND = 'We could not find that order. Open it from the link in your e-mail, or sign in to the account you ordered with.';
// Room for the answers beside one photo; a larger body is refused before it is read.
const MAX_BODY = PHOTO_LIMITS.bytes + 64 * 1024;

async function opened(event: RequestEvent, write: boolean) {
	const token = event.url.searchParams.get('t');
	const found = await orderForFit(db, event.params.number, event.locals.user, token);
	if (!found || (write && !found.canWrite)) error(404, NOT_FOUND);
	return { ...found, token };
}

async function readBody(event: RequestEvent): Promise<{ body: FormData; tooLarge: '' } | { body: null; tooLarge: string }> {
	const declared = Number(event.request.headers.get('content-length') ?? 0);
	if (declared > MAX_BODY) return { body: null, tooLarge: photoTooLarge(declared - 64 * 1024) };
	const body = await event.request.formData().catch(() => null);
	return body ? { body, tooLarge: '' } : { body: null, tooLarge: 'The form did not arrive whole. Please try again, with one photo of at most 10 MB.' };
}

const photoOf = (form: FormData) => {
	const f = form.get('photo');
	return f instanceof File && f.size > 0 ? f : null;
};

export const load: PageServerLoad = async (event) => {
	const { order, canWrite, token } = await opened(event, false);
	await purgeExpiredPhotos(db, (await shopSettingsOf(db)).photoRetentionDays);
	const data = await fitPageData(db, order);
	return {
		number: order.number,
		status: order.status,
		token,
		canWrite,
		contact: atelierAddress(),
		...data,
		lines: data.lines.map((l) => ({ id: l.id, style: l.style, styleKind: l.styleKind, fabric: l.fabric, colour: l.colour }))
	};
};

export const actions: Actions = {
	report: async (event) => {
		const { order, token } = await opened(event, true);
		const read = await readBody(event);
		if (!read.body) return fail(413, { message: read.tooLarge, errors: { photo: read.tooLarge } as Record<string, string> });
		const form = read.body;
		const parsed = readReportForm(form);
		if (!parsed.ok) return fail(400, { message: 'Some answers need another look.', errors: parsed.errors });
		const file = photoOf(form);
		const consent = form.get('photoConsent') === 'on';
		const photos = [];
		if (file) {
			if (!consent) return fail(400, { message: 'Tick the consent for your photo, or send the report without it.', errors: { photoConsent: 'Tick this to send your photo, or remove the photo.' } as Record<string, string> });
			const p = await preparePhoto(new Uint8Array(await file.arrayBuffer()));
			if (!p.ok) return fail(400, { message: p.message, errors: { photo: p.message } as Record<string, string> });
			photos.push(p);
		}
		const result = await submitReport(db, order.id, { ...parsed.value, photos, photoConsent: consent }, fitLink(order.number, '/fit'));
		if (!result.ok) return fail(result.status, { message: result.message, errors: {} as Record<string, string> });
		void deliverQueued(result.mailIds);
		redirect(303, `/orders/${encodeURIComponent(order.number)}/fit?sent=1${token ? `&t=${encodeURIComponent(token)}` : ''}`);
	},

	addPhoto: async (event) => {
		const { order } = await opened(event, true);
		const read = await readBody(event);
		if (!read.body) return fail(413, { message: read.tooLarge, errors: { photo: read.tooLarge } as Record<string, string> });
		const report = (await fitPageData(db, order)).reports.find((r) => r.id === Number(read.body.get('report')));
		if (!report) return fail(404, { message: 'We found no report of yours with that number.', errors: {} as Record<string, string> });
		if (report.photos.length >= PHOTO_LIMITS.perReport) return fail(400, { message: `Up to ${PHOTO_LIMITS.perReport} photos, please: delete one first.`, errors: {} as Record<string, string> });
		const file = photoOf(read.body);
		if (!file) return fail(400, { message: 'Choose a photo first.', errors: { photo: 'Choose a photo first.' } as Record<string, string> });
		if (read.body.get('photoConsent') !== 'on') return fail(400, { message: 'Tick the consent for your photo.', errors: { photoConsent: 'Tick this to send your photo.' } as Record<string, string> });
		const p = await preparePhoto(new Uint8Array(await file.arrayBuffer()));
		if (!p.ok) return fail(400, { message: p.message, errors: { photo: p.message } as Record<string, string> });
		// Counted again after the work: two tabs adding at once may pass the first check together.
		if ((await photosOf(db, report.id)).length >= PHOTO_LIMITS.perReport) return fail(400, { message: `Up to ${PHOTO_LIMITS.perReport} photos, please.`, errors: {} as Record<string, string> });
		await keepPhoto(db, report.id, p, new Date());
		return { message: 'Photo added.' };
	},

	deletePhoto: async (event) => {
		const { order } = await opened(event, true);
		const form = await event.request.formData();
		const reportId = Number(form.get('report'));
		const report = (await fitPageData(db, order)).reports.find((r) => r.id === reportId);
		const gone = report ? await deletePhoto(db, report.id, String(form.get('photo') ?? '')) : false;
		if (!gone) return fail(404, { message: 'We found no photo of yours with that address: nothing was deleted.', errors: {} as Record<string, string> });
		return { message: 'Photo deleted: it is gone from the atelier too.' };
	}
};
