// Photos with a fit report: a body in a skirt, so sensitive personal data. Like the swatches
// (uploads.ts), the bytes decide what a file is and sharp re-draws it, but photos keep more pixels
// (the workroom reads drag lines from them), take 10 MB, may be HEIF where this build of libvips reads
// it, are never public, and carry no metadata at all: sharp writes none unless asked (no EXIF, no GPS,
// no ICC profile, no XMP), which the integration test checks with exiftool.
import { megabytes, preparePicture, type PictureRules, type PreparedPicture } from '../pictures';
import type { Failure } from '$lib/failure';
import { randomBytes } from 'node:crypto';
import { and, asc, eq, lt } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fitPhotos } from '../db/schema';
import { deleteUpload, readUpload, saveUpload } from '../catalogue/storage';

export const PHOTO_LIMITS = { bytes: 10 * 1024 * 1024, side: 1600, pixels: 50_000_000, perReport: 4 } as const;

export type PreparedPhoto = PreparedPicture;

export function photoTooLarge(bytes: number) {
	return `This photo is ${megabytes(bytes)}: the limit is 10 MB. Save it smaller and try again.`;
}

const PHOTO_RULES: PictureRules = { ...PHOTO_LIMITS, accepted: { png: 'PNG', jpeg: 'JPEG', webp: 'WebP', heif: 'HEIF' }, use: 'Use a JPEG, PNG or WebP photo.', tooLarge: photoTooLarge, encode: 'jpeg', heicHint: true };

/** Decides by content whether the bytes are a photo we take and re-encodes them as a bare JPEG. */
export const preparePhoto = (input: Uint8Array): Promise<PreparedPhoto | Failure> => preparePicture(input, PHOTO_RULES);

/** A random id of 256 bits: a photo's address cannot be guessed, and it is checked on every request too. */
const publicId = () => randomBytes(32).toString('base64url');

/** Keeps a prepared photo for a report: the file first, then its row (the file goes again if the row fails). */
export async function keepPhoto(db: Pick<Db, 'insert'>, reportId: number, photo: PreparedPhoto, consentAt: Date) {
	const { key } = await saveUpload(photo.bytes, { mime: 'image/jpeg', ext: 'jpg' });
	try {
		const id = publicId();
		await db.insert(fitPhotos).values({ publicId: id, reportId, storageKey: key, mime: 'image/jpeg', bytes: photo.bytes.byteLength, width: photo.width, height: photo.height, consentAt });
		return id;
	} catch (e) {
		await deleteUpload(key).catch(() => {});
		throw e;
	}
}

export async function photosOf(db: Db, reportId: number) {
	return db.select({ id: fitPhotos.publicId, width: fitPhotos.width, height: fitPhotos.height, at: fitPhotos.createdAt }).from(fitPhotos).where(eq(fitPhotos.reportId, reportId)).orderBy(asc(fitPhotos.id));
}

/** Deletes one photo of a report: the row, then the file. False when there is no such photo. */
export async function deletePhoto(db: Db, reportId: number, id: string) {
	const [row] = await db.select().from(fitPhotos).where(and(eq(fitPhotos.reportId, reportId), eq(fitPhotos.publicId, id))).limit(1);
	if (!row) return false;
	await db.delete(fitPhotos).where(eq(fitPhotos.id, row.id));
	await deleteUpload(row.storageKey).catch(() => {
		/* the row that served it is gone; a stray file is found by no address */
	});
	return true;
}

/** Photos past the shop's retention days go on their own (run when fit pages are opened: no timer needed). */
export async function purgeExpiredPhotos(db: Db, retentionDays: number, now = new Date()) {
	const before = new Date(now.getTime() - retentionDays * 86_400_000);
	const old = await db.select({ id: fitPhotos.id, key: fitPhotos.storageKey }).from(fitPhotos).where(lt(fitPhotos.createdAt, before));
	for (const p of old) {
		await db.delete(fitPhotos).where(eq(fitPhotos.id, p.id));
		await deleteUpload(p.key).catch(() => {});
	}
	return old.length;
}

export async function photoBytes(db: Db, id: string) {
	const [row] = await db.select({ key: fitPhotos.storageKey, mime: fitPhotos.mime, reportId: fitPhotos.reportId }).from(fitPhotos).where(eq(fitPhotos.publicId, id)).limit(1);
	if (!row) return null;
	const bytes = await readUpload(row.key);
	return bytes ? { ...row, bytes } : null;
}
