// One check for every picture a person uploads (the owner's swatches, a shopper's fit photos). The
// file's name and declared type are the visitor's word only: the bytes decide what it is, a picture
// that would unpack too large is refused before it is decoded, and sharp draws it again upright, within
// a size, with no metadata at all (sharp writes no EXIF, GPS, ICC or XMP unless asked).
import sharp from 'sharp';
import { failure, type Failure } from '$lib/failure';

export interface PictureRules {
	/** Largest file taken, in bytes (refused with 413 above it). */
	bytes: number;
	/** Longest side kept, in pixels. */
	side: number;
	/** Most pixels a picture may unpack into. */
	pixels: number;
	/** The formats taken (sharp's names) and how people call them. */
	accepted: Record<string, string>;
	/** What to use instead ("Use a PNG, JPEG or WebP photo."). */
	use: string;
	/** The sentence for a file over `bytes`. */
	tooLarge: (bytes: number) => string;
	encode: 'webp' | 'jpeg';
	/** Say how to turn an iPhone's HEIC into a JPEG when this build of libvips cannot read it. */
	heicHint?: boolean;
}

export type PreparedPicture = { ok: true; bytes: Uint8Array; width: number; height: number; from: string };

const NAMES: Record<string, string> = { gif: 'a GIF', svg: 'an SVG drawing', tiff: 'a TIFF', heif: 'a HEIF/HEIC photo', avif: 'an AVIF', pdf: 'a PDF', jp2: 'a JPEG 2000' };

export const megabytes = (n: number) => `${(n / (1024 * 1024)).toFixed(1)} MB`;

/** Decides by content whether the bytes are a picture these rules take, and re-encodes it. Stores nothing. */
export async function preparePicture(input: Uint8Array, r: PictureRules): Promise<PreparedPicture | Failure> {
	if (input.byteLength === 0) return failure(400, `The file is empty. ${r.use}`);
	if (input.byteLength > r.bytes) return failure(413, r.tooLarge(input.byteLength));
	let format: string | undefined;
	let pixels = 0;
	try {
		const meta = await sharp(input).metadata();
		format = meta.format;
		pixels = (meta.width ?? 0) * (meta.height ?? 0);
	} catch {
		// An iPhone HEIC is HEVC inside: this build of libvips reads HEIF only with AV1 inside.
		const heic = input.byteLength > 12 && Buffer.from(input.subarray(4, 12)).toString('latin1').startsWith('ftyphei');
		if (heic && r.heicHint) return failure(400, `We cannot read this HEIC photo here. On an iPhone choose Settings → Camera → Formats → Most Compatible, or share it as JPEG. ${r.use}`);
		return failure(400, `This file is not a picture we can read, whatever its name says. ${r.use}`);
	}
	if (!format || !r.accepted[format]) {
		const what = (format && NAMES[format]) ?? (format ? `a ${format.toUpperCase()} file` : 'not a photo');
		return failure(400, `This file is ${what} inside, whatever its name says. ${r.use}`);
	}
	// A small file can unpack into a huge picture: refuse before decoding it.
	if (pixels > r.pixels) return failure(400, `This picture is ${Math.round(pixels / 1e6)} megapixels: at most ${r.pixels / 1e6} are taken. Save it smaller and try again.`);
	try {
		const drawn = sharp(input, { limitInputPixels: r.pixels })
			// Upright first: the orientation tag goes with the rest of the metadata.
			.rotate()
			.resize(r.side, r.side, { fit: 'inside', withoutEnlargement: true });
		const { data, info } = await (r.encode === 'webp' ? drawn.webp({ quality: 82 }) : drawn.jpeg({ quality: 85, mozjpeg: true })).toBuffer({ resolveWithObject: true });
		return { ok: true, bytes: new Uint8Array(data), width: info.width, height: info.height, from: r.accepted[format] };
	} catch {
		return failure(400, `This ${r.accepted[format]} file seems damaged: we could not read the picture in it. Save it again and retry.`);
	}
}
