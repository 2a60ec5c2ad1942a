import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		// npm test and npm run bench build into folders of their own, so two builds never clash.
		outDir: process.env.QL_KIT_DIR ?? '.svelte-kit',
		// Tests build into their own folder so they can run beside a running npm start.
		adapter: adapter({ out: process.env.QL_BUILD_DIR ?? 'build' }),
		// The shop sends no request off the machine: fonts, scripts and images are all ours.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'form-action': ['self', 'http://127.0.0.1:*', 'http://localhost:*'],
				'frame-ancestors': ['none'],
				'base-uri': ['self'],
				'object-src': ['none']
			}
		}
	}
};

export default config;
