// Photos with a fit report: a body in a skirt, so sensitive personal data. Like the swatches
// (uploads.ts), the bytes decide what a file is and sharp re-draws it, but photos keep more pixels
// (the workroom reads drag lines from them), take 10 MB, may be HEIF where this build of libvips reads
// it, are never public, and carry no metadata at all: sharp writes none unless asked (no EXIF, no GPS,
// no ICC profile, no XMP), which the integration test checks with exiftool.
import sharp from 'sharp';
import { randomBytes } from 'node:crypto';
import { and, asc, eq, lt } from 'drizzle-orm';
import type { Db } from '../db/client';
import { fitPhotos } from '../db/schema';
import { deleteUpload, readUpload, saveUpload } from '../catalogue/storage';

export const PHOTO_LIMITS = { bytes: 10 * 1024 * 1024, side: 1600, pixels: 50_000_000, perReport: 4 } as const;

const ACCEPTED: Record<string, string> = { png: 'PNG', jpeg: 'JPEG', webp: 'WebP', heif: 'HEIF' };
const NAMES: Record<string, string> = { gif: 'a GIF', svg: 'an SVG drawing', tiff: 'a TIFF', pdf: 'a PDF', jp2: 'a JPEG 2000' };
const USE = 'Use a JPEG, PNG or WebP photo.';
const mb = (n: number) => `${(n / (1024 * 1024)).toFixed(1)} MB`;

export type PhotoRefusal = { ok: false; message: string };
export type PreparedPhoto = { ok: true; bytes: Uint8Array; width: number; height: number };

export function photoTooLarge(bytes: number) {
	return `This photo is ${mb(bytes)}: the limit is 10 MB. Save it smaller and try again.`;
}

/** Decides by content whether the bytes are a photo we take and re-encodes them as a bare JPEG. */
export async function preparePhoto(input: Uint8Array): Promise<PreparedPhoto | PhotoRefusal> {
	if (input.byteLength === 0) return { ok: false, message: `The file is empty. ${USE}` };
	if (input.byteLength > PHOTO_LIMITS.bytes) return { ok: false, message: photoTooLarge(input.byteLength) };
	let format: string | undefined;
	let pixels = 0;
	try {
		const meta = await sharp(input).metadata();
		format = meta.format;
		pixels = (meta.width ?? 0) * (meta.height ?? 0);
	} catch {
		// An iPhone HEIC is HEVC inside: this build of libvips reads HEIF only with AV1 inside.
		const heic = input.byteLength > 12 && Buffer.from(input.subarray(4, 12)).toString('latin1').startsWith('ftyphei');
		if (heic) return { ok: false, message: `We cannot read this HEIC photo here. On an iPhone choose Settings → Camera → Formats → Most Compatible, or share it as JPEG. ${USE}` };
		return { ok: false, message: `This file is not a picture we can read, whatever its name says. ${USE}` };
	}
	if (!format || !ACCEPTED[format]) {
		const what = (format && NAMES[format]) ?? (format ? `a ${format.toUpperCase()} file` : 'not a photo');
		return { ok: false, message: `This file is ${what} inside, whatever its name says. ${USE}` };
	}
	// A small file can unpack into a huge picture: refuse before decoding it.
	if (pixels > PHOTO_LIMITS.pixels) return { ok: false, message: `This picture is ${Math.round(pixels / 1e6)} megapixels: at most ${PHOTO_LIMITS.pixels / 1e6} are taken. Save it smaller and try again.` };
	try {
		const { data, info } = await sharp(input, { limitInputPixels: PHOTO_LIMITS.pixels })
			.rotate() // upright first: the orientation tag goes with the rest of the metadata
			.resize(PHOTO_LIMITS.side, PHOTO_LIMITS.side, { fit: 'inside', withoutEnlargement: true })
			.jpeg({ quality: 85, mozjpeg: true })
			.toBuffer({ resolveWithObject: true });
		return { ok: true, bytes: new Uint8Array(data), width: info.width, height: info.height };
	} catch {
		return { ok: false, message: `This ${ACCEPTED[format]} file seems damaged: we could not read the picture in it. Save it again and retry.` };
	}
}

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
