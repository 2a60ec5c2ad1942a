import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { KEY_PATTERN, newKey, type UploadStore } from './types';

/**
 * Files in a folder on this machine: `<root>/<first two characters>/<key>`. The two-character
 * folders keep any one directory small once the atelier has uploaded thousands of swatches.
 */
export function createLocalStore(root: string): UploadStore {
	const base = resolve(root);
	const pathOf = (key: string) => {
		if (!KEY_PATTERN.test(key)) throw new Error('Not an upload key');
		return join(base, key.slice(0, 2), key);
	};
	return {
		async save(bytes, meta) {
			const key = newKey(meta.ext);
			const path = pathOf(key);
			await mkdir(dirname(path), { recursive: true });
			// Written beside and renamed, so a reader never sees half a file.
			const partial = `${path}.partial`;
			await writeFile(partial, bytes, { flag: 'wx' });
			await rename(partial, path);
			return { key };
		},
		async read(key) {
			if (!KEY_PATTERN.test(key)) return null;
			try {
				return new Uint8Array(await readFile(pathOf(key)));
			} catch (e) {
				if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
				throw e;
			}
		},
		async delete(key) {
			if (!KEY_PATTERN.test(key)) return;
			await rm(pathOf(key), { force: true });
		}
	};
}
