import { env } from '$env/dynamic/private';
import { createLocalStore } from './local';
import type { StoredMeta, UploadStore } from './types';

export type { StoredMeta, UploadStore } from './types';

let store: UploadStore | null = null;

// Chosen on first use, so UPLOAD_DIR is read at run time (the Node adapter), not at build time.
function current() {
	store ??= createLocalStore(env.UPLOAD_DIR || '.data/uploads');
	return store;
}

/** Lets a deployment (or a test) put another store in place, e.g. an object store. */
export function useStore(next: UploadStore) {
	store = next;
}

export function saveUpload(bytes: Uint8Array, meta: StoredMeta) {
	return current().save(bytes, meta);
}

export function readUpload(key: string) {
	return current().read(key);
}

export function deleteUpload(key: string) {
	return current().delete(key);
}
