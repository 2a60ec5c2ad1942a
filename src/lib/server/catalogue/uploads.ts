// Swatch photos the owner uploads for a fabric. The file's name and declared type are the
// visitor's word only: the bytes decide what it is, and only a PNG, JPEG or WebP photo is kept,
// re-drawn by sharp as a WebP of at most 800 × 800 (which also drops EXIF data such as GPS).
import sharp from 'sharp';
import { and, eq } from 'drizzle-orm';
import { db } from '../db';
import type { Db } from '../db/client';
import { uploads } from '../db/schema';
import { deleteUpload, readUpload, saveUpload } from './storage';
import { failure, type Failure } from '$lib/failure';

export const SWATCH_LIMITS = {
	bytes: 5 * 1024 * 1024,
	side: 800,
	// A small file can still unpack into a huge picture; refuse before decoding it.
	pixels: 40_000_000
} as const;

const ACCEPTED: Record<string, string> = { png: 'PNG', jpeg: 'JPEG', webp: 'WebP' };
const NAMES: Record<string, string> = {
	gif: 'a GIF',
	svg: 'an SVG drawing',
	tiff: 'a TIFF',
	heif: 'a HEIF/HEIC photo',
	avif: 'an AVIF',
	pdf: 'a PDF',
	jp2: 'a JPEG 2000'
};
const USE = 'Use a PNG, JPEG or WebP photo.';

/** A refused file: 400, or 413 when it is too large. */
export type Refusal = Failure;
export type PreparedSwatch = { ok: true; bytes: Uint8Array; width: number; height: number; from: string };

const mb = (n: number) => `${(n / (1024 * 1024)).toFixed(1)} MB`;

/** Decides by content whether the bytes are a photo we take, and re-encodes them. Stores nothing. */
export async function prepareSwatch(input: Uint8Array): Promise<PreparedSwatch | Refusal> {
	if (input.byteLength === 0) return failure(400, `The file is empty. ${USE}`);
	if (input.byteLength > SWATCH_LIMITS.bytes) return failure(413, tooLarge(input.byteLength));
	let format: string | undefined;
	let pixels = 0;
	try {
		const meta = await sharp(input).metadata();
		format = meta.format;
		pixels = (meta.width ?? 0) * (meta.height ?? 0);
	} catch {
		return failure(400, `This file is not a picture we can read, whatever its name says. ${USE}`);
	}
	if (!format || !ACCEPTED[format]) {
		const what = (format && NAMES[format]) ?? (format ? `a ${format.toUpperCase()} file` : 'not a photo');
		return failure(400, `This file is ${what} inside, whatever its name says. ${USE}`);
	}
	if (pixels > SWATCH_LIMITS.pixels)
		return {
			ok: false,
			status: 400,
			message: `This picture is ${Math.round(pixels / 1e6)} megapixels: at most ${SWATCH_LIMITS.pixels / 1e6} are taken. Save it smaller and try again.`
		};
	try {
		const { data, info } = await sharp(input, { limitInputPixels: SWATCH_LIMITS.pixels })
			// Turn the photo upright first: the orientation tag goes with the rest of the metadata.
			.rotate()
			.resize(SWATCH_LIMITS.side, SWATCH_LIMITS.side, { fit: 'inside', withoutEnlargement: true })
			.webp({ quality: 82 })
			.toBuffer({ resolveWithObject: true });
		return { ok: true, bytes: new Uint8Array(data), width: info.width, height: info.height, from: ACCEPTED[format] };
	} catch {
		return {
			ok: false,
			status: 400,
			message: `This ${ACCEPTED[format]} file seems damaged: we could not read the picture in it. Save it again and retry.`
		};
	}
}

export function tooLarge(bytes: number) {
	return `This photo is ${mb(bytes)}: the limit is 5 MB. Save it smaller (${SWATCH_LIMITS.side} pixels a side is plenty for a swatch) and try again.`;
}

export type AcceptedSwatch = {
	ok: true;
	upload: { id: number; mime: 'image/webp'; bytes: number; width: number; height: number };
};

/**
 * Checks, re-encodes and keeps a swatch photo: the file in the store and a row in `upload`.
 * When it is refused nothing is kept; when the row cannot be written the file goes again.
 */
export async function acceptSwatch(file: File, ownerId: string | null = null): Promise<AcceptedSwatch | Refusal> {
	// File.size is known before the bytes are read into memory for sharp.
	if (file.size > SWATCH_LIMITS.bytes) return failure(413, tooLarge(file.size));
	const prepared = await prepareSwatch(new Uint8Array(await file.arrayBuffer()));
	if (!prepared.ok) return prepared;
	const { key } = await saveUpload(prepared.bytes, { mime: 'image/webp', ext: 'webp' });
	try {
		const row = {
			purpose: 'swatch',
			storageKey: key,
			mime: 'image/webp',
			bytes: prepared.bytes.byteLength,
			width: prepared.width,
			height: prepared.height,
			ownerId
		};
		const [{ id }] = await db.insert(uploads).values(row).$returningId();
		return { ok: true, upload: { id, mime: 'image/webp', bytes: row.bytes, width: row.width, height: row.height } };
	} catch (e) {
		await deleteUpload(key).catch(() => {});
		throw e;
	}
}

/** Removes an upload that nothing shows any more: the row first, then its file. */
export async function discardUpload(id: number) {
	const [row] = await db.select({ key: uploads.storageKey }).from(uploads).where(eq(uploads.id, id)).limit(1);
	if (!row) return;
	await db.delete(uploads).where(eq(uploads.id, id));
	await deleteUpload(row.key).catch(() => {
		/* an orphan file harms nobody: the row, which serves it, is gone */
	});
}

/** A swatch's stored file and type, or null. Only swatches are public; other uploads never come out here. */
export async function swatchFile(db: Db, id: number) {
	const [row] = await db
		.select({ key: uploads.storageKey, mime: uploads.mime })
		.from(uploads)
		.where(and(eq(uploads.id, id), eq(uploads.purpose, 'swatch')))
		.limit(1);
	const bytes = row ? await readUpload(row.key) : null;
	return row && bytes ? { mime: row.mime, bytes } : null;
}
