import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { checkOrderToken } from '$lib/server/order/link';
import { orderOfReport } from '$lib/server/fit/report';
import { photoBytes } from '$lib/server/fit/photos';
import { hasFitLeave } from '$lib/server/fit/workroom';
import type { RequestHandler } from './$types';

// A fit photo shows a body: never public, never cached by anyone else. Checked on every request: the
// shopper whose order it is (signed in, or holding the order's signed link as ?t=), the owner, or a
// cutter she allows to decide fit reports. Everyone else gets the same 404 as for a photo that
// does not exist, so addresses cannot be probed.
export const GET: RequestHandler = async ({ params, locals, url }) => {
	const photo = await photoBytes(db, params.id);
	if (!photo) error(404, 'No such photo.');
	const [owner] = await orderOfReport(db, [photo.reportId]);
	const viewer = locals.user;
	const allowed = !!owner && ((viewer && owner.userId === viewer.id) || checkOrderToken(owner.number, url.searchParams.get('t')) || (viewer ? await hasFitLeave(db, viewer) : false));
	if (!allowed) error(404, 'No such photo.');
	return new Response(photo.bytes as Uint8Array<ArrayBuffer>, {
		headers: {
			'content-type': photo.mime,
			'content-length': String(photo.bytes.byteLength),
			'x-content-type-options': 'nosniff',
			'cache-control': 'private, no-store',
			'content-security-policy': "default-src 'none'; sandbox"
		}
	});
};
