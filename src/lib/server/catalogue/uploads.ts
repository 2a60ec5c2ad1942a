// Swatch photos the owner uploads for a fabric. The file's name and declared type are the
// visitor's word only: the bytes decide what it is, and only a PNG, JPEG or WebP photo is kept,
// re-drawn by sharp as a WebP of at most 800 × 800 (which also drops EXIF data such as GPS): pictures.ts.
import { and, eq } from 'drizzle-orm';
import { db } from '../db';
import type { Db } from '../db/client';
import { uploads } from '../db/schema';
import { deleteUpload, readUpload, saveUpload } from './storage';
import { failure, type Failure } from '$lib/failure';
import { megabytes, preparePicture, type PictureRules, type PreparedPicture } from '../pictures';

export const SWATCH_LIMITS = {
	bytes: 5 * 1024 * 1024,
	side: 800,
	// A small file can still unpack into a huge picture; refuse before decoding it.
	pixels: 40_000_000
} as const;

/** A refused file: 400, or 413 when it is too large. */
export type Refusal = Failure;
export type PreparedSwatch = PreparedPicture;

export function tooLarge(bytes: number) {
	return `This photo is ${megabytes(bytes)}: the limit is 5 MB. Save it smaller (${SWATCH_LIMITS.side} pixels a side is plenty for a swatch) and try again.`;
}

const SWATCH_RULES: PictureRules = { ...SWATCH_LIMITS, accepted: { png: 'PNG', jpeg: 'JPEG', webp: 'WebP' }, use: 'Use a PNG, JPEG or WebP photo.', tooLarge, encode: 'webp' };

/** Decides by content whether the bytes are a photo we take, and re-encodes them as WebP. Stores nothing. */
export const prepareSwatch = (input: Uint8Array): Promise<PreparedSwatch | Refusal> => preparePicture(input, SWATCH_RULES);

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
