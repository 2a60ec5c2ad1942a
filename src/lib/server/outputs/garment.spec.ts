import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { draftSkirt } from '$lib/drafting';
import { garmentView } from '$lib/drafting/drawing/garment';
import { garmentPng } from './garment';

describe('the garment drawing as a PNG for mail', () => {
	it('rasterises the skirt in its cloth colour at the width asked', async () => {
		const draft = draftSkirt({ waist: 68, hip: 94, waistToHip: 20.6, length: 60 }, { style: 'straight' });
		const cloth = { colour: '#26344f', name: 'navy twill' };
		const png = await garmentPng(draft, cloth, 400);
		const meta = await sharp(png).metadata();
		expect(meta.format).toBe('png');
		expect(meta.width).toBe(400);
		// The middle of the front view, half way down the skirt, is the cloth's own colour.
		const d = garmentView(draft, { cloth, labels: false });
		const front = d.marks[0];
		if (front.kind !== 'group') throw new Error('no front view');
		const scale = 400 / d.box.w;
		const x = Math.round((d.box.w / 4 - d.box.x) * scale);
		const y = Math.round((30 - d.box.y) * scale);
		const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
		const at = (y * info.width + x) * info.channels;
		const [r, g, b] = [data[at], data[at + 1], data[at + 2]];
		expect(Math.abs(r - 0x26) + Math.abs(g - 0x34) + Math.abs(b - 0x4f)).toBeLessThan(30);
	});
});
