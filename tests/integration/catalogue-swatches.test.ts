import { beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { count, eq } from 'drizzle-orm';
import { uploads } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { fabricFields, fabricNamed, filesIn, get, postMultipart, run, signIn } from './catalogue.helpers';

const db = testDb();
let owner = '';
beforeAll(async () => {
	owner = await signIn('owner');
});

const png = (w: number, h: number) =>
	sharp({ create: { width: w, height: h, channels: 3, background: '#6a5acd' } })
		.png()
		.toBuffer();
const jpeg = (w: number, h: number) =>
	sharp({ create: { width: w, height: h, channels: 3, background: '#cdbb9a' } })
		.jpeg()
		.toBuffer();
// The app's upload folder: tests/run.js gives the app and the tests the same UPLOAD_DIR.
const uploadDir = () => process.env.UPLOAD_DIR!;
const uploadRows = async () => (await db.select({ n: count() }).from(uploads))[0].n;

describe('swatch photos', () => {
	let id = 0;
	beforeAll(async () => {
		const res = await postMultipart(
			'/admin/catalogue/fabrics/new?/save',
			fabricFields({ name: `Photo twill ${run}`, fibreContent: '100 % wool' }),
			owner
		);
		expect(res.status).toBe(303);
		id = (await fabricNamed(db, `Photo twill ${run}`)).id;
	});

	async function servedSize(uploadId: number) {
		const res = await get(`/uploads/${uploadId}`);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('image/webp');
		expect(res.headers.get('x-content-type-options')).toBe('nosniff');
		expect(res.headers.get('cache-control')).toContain('max-age=31536000');
		const meta = await sharp(Buffer.from(await res.arrayBuffer())).metadata();
		return [meta.format, meta.width, meta.height];
	}

	it('takes a PNG, resizes it to 800 pixels at most and serves it back as WebP', async () => {
		const files = filesIn(uploadDir()).length;
		const res = await postMultipart(
			`/admin/catalogue/fabrics/${id}?/save`,
			fabricFields({ name: `Photo twill ${run}`, fibreContent: '100 % wool' }),
			owner,
			{ name: 'twill.png', type: 'image/png', bytes: await png(1200, 900) }
		);
		expect(res.status).toBe(200);
		const fabric = await fabricNamed(db, `Photo twill ${run}`);
		expect(fabric.imageUploadId).not.toBeNull();
		const [row] = await db.select().from(uploads).where(eq(uploads.id, fabric.imageUploadId!));
		expect(row).toMatchObject({ purpose: 'swatch', mime: 'image/webp', width: 800, height: 600 });
		expect(row.storageKey).not.toContain('twill');
		expect(filesIn(uploadDir())).toHaveLength(files + 1);
		expect(await servedSize(row.id)).toEqual(['webp', 800, 600]);
		// The shop's style page shows it.
		expect(await (await get('/styles/rue-straight')).text()).toContain(`/uploads/${row.id}`);
	});

	it('takes a JPEG, even named .png, at its own size, and lets go of the photo it replaces', async () => {
		const before = (await fabricNamed(db, `Photo twill ${run}`)).imageUploadId!;
		const files = filesIn(uploadDir()).length;
		const res = await postMultipart(
			`/admin/catalogue/fabrics/${id}?/save`,
			fabricFields({ name: `Photo twill ${run}`, fibreContent: '100 % wool' }),
			owner,
			{ name: 'really-a-jpeg.png', type: 'image/png', bytes: await jpeg(300, 200) }
		);
		expect(res.status).toBe(200);
		const after = (await fabricNamed(db, `Photo twill ${run}`)).imageUploadId!;
		expect(after).not.toBe(before);
		expect(await servedSize(after)).toEqual(['webp', 300, 200]);
		expect(await db.select().from(uploads).where(eq(uploads.id, before))).toHaveLength(0);
		expect((await get(`/uploads/${before}`)).status).toBe(404);
		expect(filesIn(uploadDir())).toHaveLength(files); // one in, one out
	});

	const refusals = [
		{
			what: 'a 6 MB file',
			status: 413,
			file: { name: 'huge.png', type: 'image/png', bytes: new Uint8Array(6 * 1024 * 1024).fill(7) },
			says: 'the limit is 5 MB'
		},
		// Just over 5 MB: small enough for the form to be read, then refused by its size.
		{
			what: 'a file just over 5 MB',
			status: 400,
			file: { name: 'big.jpg', type: 'image/jpeg', bytes: new Uint8Array(5 * 1024 * 1024 + 1000).fill(7) },
			says: 'larger than 5 MB'
		},
		{
			what: 'a text file named .png',
			status: 400,
			file: {
				name: 'notes.png',
				type: 'image/png',
				bytes: new TextEncoder().encode('These are my notes about the linen order, not a picture.')
			},
			says: 'This file is not a picture we can read, whatever its name says.'
		},
		{
			what: 'a GIF named .png',
			status: 400,
			file: null,
			says: 'This file is a GIF inside, whatever its name says. Use a PNG, JPEG or WebP photo.'
		}
	];
	for (const r of refusals) {
		it(`refuses ${r.what} with a clear message and keeps nothing`, async () => {
			const file = r.file ?? {
				name: 'swatch.png',
				type: 'image/png',
				bytes: new Uint8Array(
					await sharp({ create: { width: 40, height: 40, channels: 3, background: '#123456' } })
						.gif()
						.toBuffer()
				)
			};
			const [rows, files, before] = [
				await uploadRows(),
				filesIn(uploadDir()).length,
				(await fabricNamed(db, `Photo twill ${run}`)).imageUploadId
			];
			const res = await postMultipart(
				`/admin/catalogue/fabrics/${id}?/save`,
				fabricFields({ name: `Photo twill ${run}`, fibreContent: '100 % wool', pricePerMetre: '99' }),
				owner,
				file
			);
			expect(res.status).toBe(r.status);
			expect(await res.text()).toContain(r.says);
			expect(await uploadRows()).toBe(rows);
			expect(filesIn(uploadDir())).toHaveLength(files);
			const fabric = await fabricNamed(db, `Photo twill ${run}`);
			expect(fabric.imageUploadId).toBe(before);
			expect(fabric.pricePerMetre).not.toBe(9900); // the refused form changed nothing
		});
	}

	it('keeps no photo when another field of the form is refused', async () => {
		const [rows, files] = [await uploadRows(), filesIn(uploadDir()).length];
		const res = await postMultipart(
			`/admin/catalogue/fabrics/${id}?/save`,
			fabricFields({ name: `Photo twill ${run}`, fibreContent: '100 % wool', widthCm: '' }),
			owner,
			{ name: 'fine.png', type: 'image/png', bytes: await png(200, 200) }
		);
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('Enter the width.');
		expect(await uploadRows()).toBe(rows);
		expect(filesIn(uploadDir())).toHaveLength(files);
	});

	it('answers 404 for an upload that is not there', async () => {
		expect((await get('/uploads/999999')).status).toBe(404);
		expect((await get('/uploads/..%2F..%2Fetc')).status).toBe(404);
	});
});
