import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { prepareSwatch, SWATCH_LIMITS } from './uploads';

const photo = (w: number, h: number) => sharp({ create: { width: w, height: h, channels: 3, background: '#9c4a2c' } });

describe('what a swatch upload takes', () => {
	it('re-encodes a large PNG as a WebP of at most 800 pixels a side, keeping its shape', async () => {
		const r = await prepareSwatch(new Uint8Array(await photo(1600, 1000).png().toBuffer()));
		expect(r.ok && [r.width, r.height, r.from]).toEqual([800, 500, 'PNG']);
		if (r.ok) expect((await sharp(r.bytes).metadata()).format).toBe('webp');
	});

	it('keeps a small JPEG at its own size and drops its EXIF data, GPS position included', async () => {
		const jpeg = await photo(120, 90)
			.jpeg()
			.withExif({ IFD0: { Artist: 'Somebody' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '54/1 19/1 0/1' } })
			.toBuffer();
		expect((await sharp(jpeg).metadata()).exif).toBeDefined();
		const r = await prepareSwatch(new Uint8Array(jpeg));
		expect(r.ok && [r.width, r.height]).toEqual([120, 90]);
		if (r.ok) expect((await sharp(r.bytes).metadata()).exif).toBeUndefined();
	});

	it('refuses a GIF, an SVG and plain text by what is inside them', async () => {
		const gif = await photo(10, 10).gif().toBuffer();
		const svg = Buffer.from(
			'<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>'
		);
		const text = Buffer.from('just some words in a file');
		expect(await prepareSwatch(new Uint8Array(gif))).toEqual({
			ok: false,
			status: 400,
			message: expect.stringContaining('This file is a GIF inside')
		});
		expect(await prepareSwatch(new Uint8Array(svg))).toEqual({
			ok: false,
			status: 400,
			message: expect.stringContaining('an SVG drawing')
		});
		expect(await prepareSwatch(new Uint8Array(text))).toEqual({
			ok: false,
			status: 400,
			message: expect.stringContaining('not a picture we can read')
		});
	});

	it('refuses more than 5 MB and an empty file', async () => {
		const big = await prepareSwatch(new Uint8Array(SWATCH_LIMITS.bytes + 1));
		expect(big).toEqual({ ok: false, status: 413, message: expect.stringContaining('the limit is 5 MB') });
		expect(await prepareSwatch(new Uint8Array(0))).toEqual({ ok: false, status: 400, message: expect.stringContaining('empty') });
	});

	it('refuses a PNG cut short', async () => {
		const png = await photo(300, 300).png().toBuffer();
		const r = await prepareSwatch(new Uint8Array(png.subarray(0, 120)));
		expect(r.ok).toBe(false);
	});
});
