import { error } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { swatchFile } from '$lib/server/catalogue/uploads';
import type { RequestHandler } from './$types';

// Swatches are public: the shop shows them to everyone. Only the swatch purpose is served here,
// so a future private upload never leaks through this address.
export const GET: RequestHandler = async ({ params }) => {
	const file = await swatchFile(db, Number(params.id));
	if (!file) error(404, 'No such picture.');
	return new Response(file.bytes as Uint8Array<ArrayBuffer>, {
		headers: {
			'content-type': file.mime,
			'content-length': String(file.bytes.byteLength),
			'x-content-type-options': 'nosniff',
			// A new photo always gets a new id, so an id's bytes never change.
			'cache-control': 'public, max-age=31536000, immutable',
			'content-security-policy': "default-src 'none'; sandbox"
		}
	});
};
