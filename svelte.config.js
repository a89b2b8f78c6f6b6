import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter(),
		// The Content-Security-Policy of every page SvelteKit renders, with a fresh nonce on its own inline
		// scripts. Styles allow 'unsafe-inline' because Svelte writes style attributes (transitions, style:
		// directives); images allow data: and blob: (canvas exports, previews). The object store's origin
		// (fitting photos) is known only when the app runs: src/lib/server/hooks/security-headers.ts adds it
		// to img-src, and gives responses SvelteKit did not render a policy of their own.
		csp: {
			mode: 'nonce',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'worker-src': ['self', 'blob:'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		},
		typescript: {
			config: (tsconfig) => {
				tsconfig.include.push('../migrations/**/*.js', '../tests/**/*.ts', '../tests/**/*.js', '../scripts/**/*.ts');
				return tsconfig;
			}
		}
	}
};

export default config;
