import { readdirSync, readFileSync, statSync } from 'node:fs';
import { request } from 'node:http';
import { join, relative } from 'node:path';
import { testEnv } from './env';

// The app's routes read from the file tree, so a route added tomorrow is walked by the access tests
// without anyone editing them.
export type FoundRoute = { id: string; dir: string; page: boolean; endpoint: string[]; actions: string[] };

const ROOT = join(process.cwd(), 'src/routes');

/** Action names of a +page.server.ts: the keys of its `export const actions` object (one tab in). */
function actionNames(file: string) {
	const text = readFileSync(file, 'utf8');
	const start = text.indexOf('export const actions');
	if (start < 0) return [];
	const body = text.slice(start, text.indexOf('\n};', start));
	return [...body.matchAll(/^\t([A-Za-z]\w*)\s*:/gm)].map((m) => m[1]);
}

export function findRoutes(): FoundRoute[] {
	const found: FoundRoute[] = [];
	const walk = (dir: string) => {
		const files = readdirSync(dir);
		const page = files.includes('+page.svelte');
		const endpoint = files.includes('+server.ts') ? [...readFileSync(join(dir, '+server.ts'), 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]) : [];
		const actions = files.includes('+page.server.ts') ? actionNames(join(dir, '+page.server.ts')) : [];
		if (page || endpoint.length) found.push({ id: `/${relative(ROOT, dir)}`.replace(/\/$/, '') || '/', dir, page, endpoint, actions });
		for (const f of files) if (statSync(join(dir, f)).isDirectory()) walk(join(dir, f));
	};
	walk(ROOT);
	return found;
}

/** A URL path for a route id, each [param=matcher] filled from the samples. */
export function pathFor(id: string, samples: Record<string, string>) {
	return id
		.replace(/\/\([^/]+\)/g, '')
		.replace(/\[(\w+)(?:=(\w+))?\]/g, (_, name: string, matcher?: string) => {
			const v = samples[`${name}=${matcher ?? ''}`] ?? samples[name];
			if (!v) throw new Error(`no sample value for [${name}${matcher ? `=${matcher}` : ''}] in ${id}`);
			return v;
		}) || '/';
}

/**
 * The same path spelled other ways a client can send it: each reaches the same route after the
 * router decodes it, or matches none. Sent byte for byte (no client-side normalising).
 */
export function spellings(path: string): string[] {
	const segs = path.split('/').filter(Boolean);
	if (!segs.length) return [];
	const [first, ...rest] = segs;
	const tail = rest.length ? `/${rest.join('/')}` : '';
	const hex = (c: string) => `%${c.charCodeAt(0).toString(16).padStart(2, '0')}`;
	const last = segs[segs.length - 1];
	const head = segs.slice(0, -1).map((s) => `/${s}`).join('');
	return [
		`/${hex(first[0])}${first.slice(1)}${tail}`, // one letter percent-encoded
		`/${[...first].map(hex).join('').toUpperCase()}${tail}`, // every letter, upper-case hex
		`${head}/${hex(last[0])}${last.slice(1)}`, // a letter of the last segment
		`/%25${hex(first[0]).slice(1)}${first.slice(1)}${tail}`, // double encoding
		`/x/../${first}${tail}`, // dot segments
		`/./${first}${tail}`,
		`//${first}${tail}`, // double slash
		`/${first}//${rest.join('/')}`,
		`/${first};x=1${tail}`, // ;parameters
		`${path};jsessionid=1`,
		`${path}/`, // trailing slash
		`/${first.toUpperCase()}${tail}`, // mixed case
		`/${first[0].toUpperCase()}${first.slice(1)}${tail}`,
		`/${first}%2f${rest.join('%2f')}`, // encoded slash
		`/${first}%5c${rest.join('%5c')}` // encoded backslash
	].filter((p) => p !== path);
}

export type Raw = { status: number; location: string | null; body: string; headers: Record<string, string | string[] | undefined> };

/** One HTTP request with the path exactly as given. */
export function raw(method: string, path: string, headers: Record<string, string> = {}, body?: string): Promise<Raw> {
	const url = new URL(testEnv.appUrl);
	return new Promise((resolve, reject) => {
		const req = request({ host: url.hostname, port: url.port, method, path, headers: { ...headers, ...(body !== undefined ? { 'content-length': String(Buffer.byteLength(body)) } : {}) } }, (res) => {
			let text = '';
			res.setEncoding('utf8');
			res.on('data', (d) => (text += d));
			res.on('end', () => resolve({ status: res.statusCode ?? 0, location: (res.headers.location as string) ?? null, body: text, headers: res.headers }));
		});
		req.on('error', reject);
		if (body !== undefined) req.write(body);
		req.end();
	});
}
