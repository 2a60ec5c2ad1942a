import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createLocalStore } from './local';

const root = mkdtempSync(join(tmpdir(), 'ql-store-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
const store = createLocalStore(root);

describe('the local upload folder', () => {
	it('keeps bytes under a random key and gives them back', async () => {
		const bytes = new Uint8Array([1, 2, 3, 250]);
		const { key } = await store.save(bytes, { mime: 'image/webp', ext: 'webp' });
		expect(key).toMatch(/^[0-9a-f]{32}\.webp$/);
		expect(await store.read(key)).toEqual(bytes);
		const second = await store.save(bytes, { mime: 'image/webp', ext: 'webp' });
		expect(second.key).not.toBe(key);
	});

	it('forgets a deleted key and leaves no file behind', async () => {
		const { key } = await store.save(new Uint8Array([9]), { mime: 'image/webp', ext: 'webp' });
		await store.delete(key);
		expect(await store.read(key)).toBeNull();
		expect(readdirSync(join(root, key.slice(0, 2)))).not.toContain(key);
		await expect(store.delete(key)).resolves.toBeUndefined();
	});

	it('never turns a made-up key into a path outside its folder', async () => {
		expect(await store.read('../../etc/passwd')).toBeNull();
		expect(await store.read('0123456789abcdef0123456789abcdef.webp/../x')).toBeNull();
		await expect(store.save(new Uint8Array([1]), { mime: 'text/plain', ext: '../x' })).rejects.toThrow();
	});
});
