// Fit photos: re-encoded with every metadata field removed (checked with an independent reader,
// Debian's exiftool), hostile or oversized files refused, served only to her and the atelier's staff,
// and gone, file and all, when she deletes one.
import { describe, expect, it, beforeAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { fitPhotos, fitReports } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { TIGHT_WAIST, deliveredOrder, postReport, tokenFor, type Photo } from '../support/fit';

const db = testDb();
const account = (role: string, i = 0) => DEMO_SIGN_INS.accounts.filter((a) => a.role === role)[i];
const cookies: Record<string, string> = {};
const fileOf = (key: string) => join(process.env.UPLOAD_DIR!, key.slice(0, 2), key);
const exif = (path: string) => JSON.parse(execFileSync('exiftool', ['-json', '-a', '-G1', path], { encoding: 'utf8' }))[0] as Record<string, unknown>;
const get = (path: string, cookie?: string) => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });

/** A JPEG from a "camera": GPS position, make, model and the time it was taken, written by exiftool. */
async function cameraJpeg(): Promise<Photo> {
	const dir = mkdtempSync(join(tmpdir(), 'fit-photo-'));
	const path = join(dir, 'IMG_2041.jpg');
	writeFileSync(path, await sharp({ create: { width: 900, height: 1200, channels: 3, background: '#8a6f5a' } }).jpeg().toBuffer());
	execFileSync('exiftool', ['-q', '-overwrite_original', '-GPSLatitude=53.2707', '-GPSLatitudeRef=N', '-GPSLongitude=9.0568', '-GPSLongitudeRef=W', '-Make=Canon', '-Model=EOS R6', '-SerialNumber=0123456789', '-DateTimeOriginal=2026:11:28 10:41:00', '-Artist=Edda Lind', path]);
	return { name: 'IMG_2041.jpg', type: 'image/jpeg', bytes: new Uint8Array(readFileSync(path)) };
}

const gpsOrCamera = (tags: Record<string, unknown>) => Object.keys(tags).filter((k) => /GPS|Make|Model|Serial|DateTimeOriginal|Artist|Software/i.test(k));

beforeAll(async () => {
	cookies.owner = await signInCookie(account('owner').email, DEMO_SIGN_INS.password);
	cookies.cutter = await signInCookie(account('cutter').email, DEMO_SIGN_INS.password);
	cookies.shopper = await signInCookie(account('shopper').email, DEMO_SIGN_INS.password);
});

describe('fit photos', () => {
	it('keeps a re-encoded photo with no GPS, camera or other metadata (exiftool)', async () => {
		const photo = await cameraJpeg();
		// The test's own photo carries what must go: otherwise this test could not fail.
		const dir = mkdtempSync(join(tmpdir(), 'fit-in-'));
		writeFileSync(join(dir, 'in.jpg'), photo.bytes);
		expect(gpsOrCamera(exif(join(dir, 'in.jpg'))).length).toBeGreaterThanOrEqual(6);

		const o = await deliveredOrder(db);
		const res = await postReport(o.number, { ...TIGHT_WAIST(o.lineId), photoConsent: 'on' }, { token: tokenFor(o.number), photo });
		expect(res.status).toBe(303);
		const [report] = await db.select().from(fitReports).where(eq(fitReports.orderId, o.id));
		const [row] = await db.select().from(fitPhotos).where(eq(fitPhotos.reportId, report.id));
		expect(row.publicId).toMatch(/^[A-Za-z0-9_-]{43}$/);
		const tags = exif(fileOf(row.storageKey));
		expect(tags['File:FileType']).toBe('JPEG');
		expect(gpsOrCamera(tags)).toEqual([]);
		// No EXIF, XMP, IPTC or ICC block at all (exiftool's group names).
		expect(Object.keys(tags).filter((k) => /^(IFD0|ExifIFD|GPS|XMP|IPTC|ICC|Photoshop|MakerNotes)/.test(k))).toEqual([]);
		expect([row.width, row.height]).toEqual([900, 1200]);

		// She (by her link), the owner: the photo. Anyone else: the same 404 as for no photo.
		const url = `/fit-photos/${row.publicId}`;
		const hers = await get(`${url}?t=${tokenFor(o.number)}`);
		expect(hers.status).toBe(200);
		expect(hers.headers.get('cache-control')).toBe('private, no-store');
		expect((await get(url, cookies.owner)).status).toBe(200);
		expect((await get(url)).status).toBe(404);
		expect((await get(url, cookies.shopper)).status).toBe(404);
		expect((await get(url, cookies.cutter)).status).toBe(404);
		const other = await deliveredOrder(db);
		expect((await get(`${url}?t=${tokenFor(other.number)}`)).status).toBe(404);
		expect((await get(`/fit-photos/${'A'.repeat(43)}`, cookies.owner)).status).toBe(404);

		// She deletes it: the row, the file and the address go.
		const del = await postReport(o.number, { report: String(report.id), photo: row.publicId }, { token: tokenFor(o.number), action: 'deletePhoto' });
		expect(del.status).toBe(200);
		expect(await db.select().from(fitPhotos).where(eq(fitPhotos.id, row.id))).toHaveLength(0);
		expect(existsSync(fileOf(row.storageKey))).toBe(false);
		expect((await get(url, cookies.owner)).status).toBe(404);
	});

	const refusals: { what: string; photo: Photo; status: number; says: string; consent?: boolean }[] = [
		{ what: 'an SVG with a script, named .jpg', photo: { name: 'me.jpg', type: 'image/jpeg', bytes: new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>') }, status: 400, says: 'SVG drawing' },
		{ what: 'an HTML page, named .png', photo: { name: 'me.png', type: 'image/png', bytes: new TextEncoder().encode('<!doctype html><script>alert(1)</script>') }, status: 400, says: 'not a picture we can read' },
		{ what: 'a file over 10 MB', photo: { name: 'big.jpg', type: 'image/jpeg', bytes: new Uint8Array(10 * 1024 * 1024 + 200_000).fill(7) }, status: 413, says: 'the limit is 10 MB' },
		{ what: 'a photo without the consent ticked', photo: { name: 'ok.jpg', type: 'image/jpeg', bytes: new Uint8Array() }, status: 400, says: 'consent', consent: false }
	];
	for (const r of refusals) {
		it(`refuses ${r.what} and keeps nothing`, async () => {
			const photo = r.consent === false ? await cameraJpeg() : r.photo;
			const o = await deliveredOrder(db);
			const res = await postReport(o.number, { ...TIGHT_WAIST(o.lineId), ...(r.consent === false ? {} : { photoConsent: 'on' }) }, { token: tokenFor(o.number), photo });
			expect(res.status).toBe(r.status);
			expect(await res.text()).toContain(r.says);
			expect(await db.select().from(fitReports).where(eq(fitReports.orderId, o.id))).toHaveLength(0);
		});
	}

	it('refuses a pixel bomb: a small PNG that unpacks to 56 megapixels (the limit is 50)', async () => {
		const bomb = await sharp({ create: { width: 7500, height: 7500, channels: 3, background: '#000' } }).png({ compressionLevel: 9 }).toBuffer();
		const o = await deliveredOrder(db);
		const res = await postReport(o.number, { ...TIGHT_WAIST(o.lineId), photoConsent: 'on' }, { token: tokenFor(o.number), photo: { name: 'x.png', type: 'image/png', bytes: new Uint8Array(bomb) } });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('megapixels');
	});
});
