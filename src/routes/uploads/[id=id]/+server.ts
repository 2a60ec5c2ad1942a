import { error } from '@sveltejs/kit';
import { and, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { uploads } from '$lib/server/db/schema';
import { readUpload } from '$lib/server/catalogue/storage';
import type { RequestHandler } from './$types';

// Swatches are public: the shop shows them to everyone. Only the swatch purpose is served here,
// so a future private upload never leaks through this address.
export const GET: RequestHandler = async ({ params }) => {
	const id = Number(params.id);
	const [row] = await db
		.select({ key: uploads.storageKey, mime: uploads.mime })
		.from(uploads)
		.where(and(eq(uploads.id, id), eq(uploads.purpose, 'swatch')))
		.limit(1);
	const bytes = row ? await readUpload(row.key) : null;
	if (!row || !bytes) error(404, 'No such picture.');
	return new Response(bytes as Uint8Array<ArrayBuffer>, {
		headers: {
			'content-type': row.mime,
			'content-length': String(bytes.byteLength),
			'x-content-type-options': 'nosniff',
			// A new photo always gets a new id, so an id's bytes never change.
			'cache-control': 'public, max-age=31536000, immutable',
			'content-security-policy': "default-src 'none'; sandbox"
		}
	});
};
