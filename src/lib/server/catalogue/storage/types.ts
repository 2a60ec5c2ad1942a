// What the app needs from a place that keeps uploaded files. The local folder is the default; an
// object store (any S3-like service) can take its place by implementing the same four calls.

export type StoredMeta = { mime: string; ext: string };

export interface UploadStore {
	/** Keeps the bytes under a new random key and returns it. */
	save(bytes: Uint8Array, meta: StoredMeta): Promise<{ key: string }>;
	/** The bytes kept under a key, or null when there are none. */
	read(key: string): Promise<Uint8Array | null>;
	/** Forgets a key; deleting what is not there is not an error. */
	delete(key: string): Promise<void>;
}

// Keys are made by us only (random hex + a short extension), never from a visitor's file name,
// so a key can be checked strictly before it touches a path or a bucket.
export const KEY_PATTERN = /^[0-9a-f]{32}\.[a-z0-9]{2,5}$/;

export function newKey(ext: string) {
	if (!/^[a-z0-9]{2,5}$/.test(ext)) throw new Error(`Unusable file extension: ${ext}`);
	const bytes = crypto.getRandomValues(new Uint8Array(16));
	return `${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}.${ext}`;
}
