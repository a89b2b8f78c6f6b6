import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter(),
		typescript: {
			config: (tsconfig) => {
				tsconfig.include.push('../migrations/**/*.js', '../tests/**/*.ts', '../tests/**/*.js', '../scripts/**/*.ts');
				return tsconfig;
			}
		}
	}
};

export default config;
