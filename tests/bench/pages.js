// @ts-check
// What each page sends to the browser on first load, from the build the bench started (QL_BUILD_DIR):
// the start and app entries every page needs, plus each layout's and the page's own node with the
// chunks they import, as SvelteKit lists them in the server's copy of the client manifest (these are
// the files a page names in its HTML and in the Link preload header SvelteKit sends with it). Sizes
// are those of the .gz files adapter-node precompressed, i.e. the bytes sent to a browser that accepts
// gzip; a file without one is gzipped here at level 9. Fonts load on demand and are not counted.
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { gzipSync } from 'node:zlib';

/** The routes the bench reports, with a real path for the cross-check against served HTML. */
export const PAGE_ROUTES = [
	'/',
	'/styles/[slug=slug]',
	'/styles/[slug=slug]/make',
	'/bag',
	'/checkout',
	'/orders/[number=number]',
	'/workroom',
	'/admin',
	'/signin/check-mail'
];

/**
 * @param {string} buildDir
 * @returns {Promise<{ client: { imports: string[], stylesheets: string[] }, routes: any[], nodes: Map<number, { imports: string[], stylesheets: string[] }> }>}
 */
export async function readBuild(buildDir) {
	const chunks = join(buildDir, 'server', 'chunks');
	const manifestFile = readdirSync(chunks).find((f) => /^manifest\.js-.*\.js$/.test(f));
	if (!manifestFile) throw new Error(`no server manifest in ${chunks}`);
	// The manifest chunk imports nothing, so loading it runs no app code.
	const mod = await import(pathToFileURL(join(chunks, manifestFile)).href);
	const manifest = mod.m ?? mod.manifest ?? Object.values(mod)[0];
	/** @type {Map<number, { imports: string[], stylesheets: string[] }>} */
	const nodes = new Map();
	const nodeDir = join(chunks, 'nodes');
	for (const f of readdirSync(nodeDir).filter((f) => f.endsWith('.js'))) {
		const src = readFileSync(join(nodeDir, f), 'utf8');
		const index = src.match(/\bconst index = (\d+);/);
		if (!index) continue;
		const list = (/** @type {string} */ name) => {
			const m = src.match(new RegExp(`\\bconst ${name} = (\\[[^\\]]*\\]);`));
			return m ? /** @type {string[]} */ (JSON.parse(m[1])) : [];
		};
		nodes.set(Number(index[1]), { imports: list('imports'), stylesheets: list('stylesheets') });
	}
	return { client: manifest._.client, routes: manifest._.routes, nodes };
}

/** @param {string} clientDir @param {string} file */
function gzSize(clientDir, file) {
	const path = join(clientDir, file);
	if (existsSync(`${path}.gz`)) return readFileSync(`${path}.gz`).length;
	return gzipSync(readFileSync(path), { level: 9 }).length;
}

/**
 * @param {Awaited<ReturnType<typeof readBuild>>} build
 * @param {number[]} nodeIds layouts then leaf
 */
function filesOf(build, nodeIds) {
	const js = new Set(build.client.imports);
	const css = new Set(build.client.stylesheets ?? []);
	for (const id of nodeIds) {
		const n = build.nodes.get(id);
		if (!n) throw new Error(`node ${id} missing from the build`);
		n.imports.forEach((f) => js.add(f));
		n.stylesheets.forEach((f) => css.add(f));
	}
	return { js: [...js], css: [...css] };
}

/** @param {string} buildDir */
export async function measurePages(buildDir) {
	const build = await readBuild(buildDir);
	const clientDir = join(buildDir, 'client');
	const kb = (/** @type {string[]} */ files) => files.reduce((s, f) => s + gzSize(clientDir, f), 0) / 1024;
	const size = (/** @type {number[]} */ nodeIds) => {
		const f = filesOf(build, nodeIds);
		return { jsKB: kb(f.js), cssKB: kb(f.css), jsFiles: f.js.length, cssFiles: f.css.length, files: f };
	};
	// Route groups such as (shop) are not part of the URL: a route is found by its id without them.
	const ungrouped = (/** @type {string} */ id) => id.replace(/\/\([^)]+\)/g, '') || '/';
	const byId = new Map(build.routes.map((r) => [ungrouped(r.id), r]));
	// The floor: what every page sends, i.e. the entries and the root layout alone (node 0).
	const rootLayout =
		build.routes.find((r) => r.page)?.page.layouts.find((/** @type {unknown} */ x) => x !== undefined) ?? 0;
	const floor = size([rootLayout]);
	/** @type {Record<string, ReturnType<typeof size> & { nodes: number[] } | { missing: true }>} */
	const routes = {};
	for (const id of PAGE_ROUTES) {
		const r = byId.get(id);
		if (!r?.page) {
			routes[id] = { missing: true };
			continue;
		}
		const nodeIds = [...r.page.layouts.filter((/** @type {unknown} */ x) => x !== undefined), r.page.leaf];
		routes[id] = { nodes: nodeIds, ...size(nodeIds) };
	}
	return { floor: { nodes: [rootLayout], ...floor }, routes, routeIds: build.routes.map((r) => r.id) };
}

/**
 * Checks the build-output figures against a served page: the scripts and stylesheets it names (in its
 * HTML and in the Link preload header SvelteKit sends) must be exactly the files counted for its route.
 * @param {string} html
 * @param {string} linkHeader
 * @param {{ js: string[], css: string[] }} counted
 */
export function compareWithHtml(html, linkHeader, counted) {
	const inHtml = [...html.matchAll(/["'(<]\.?\.?\/?((?:\.\.\/)*_app\/immutable\/[^"'>)\s]+\.(?:js|css))/g)].map(
		(m) => m[1]
	);
	const inHeader = [...linkHeader.matchAll(/<([^>]+)>/g)].map((m) => m[1]);
	const named = new Set(
		[...inHtml, ...inHeader]
			.filter((f) => /_app\/immutable\/.*\.(js|css)$/.test(f))
			.map((f) => f.replace(/^.*?(_app\/immutable\/)/, '$1'))
	);
	const want = new Set([...counted.js, ...counted.css]);
	const extra = [...named].filter((f) => !want.has(f));
	const missing = [...want].filter((f) => !named.has(f));
	return { agree: extra.length === 0 && missing.length === 0, named: named.size, extra, missing };
}
