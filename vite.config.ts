import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { host: '127.0.0.1' },
	preview: { host: '127.0.0.1' },
	test: {
		testTimeout: 30_000,
		hookTimeout: 60_000,
		// the global set-ups' teardowns wait for the app servers they started to stop (SIGTERM, SIGKILL
		// after 10 s): Vitest must not end the run with process.exit before they are done
		teardownTimeout: 30_000,
		benchmark: { include: ['src/**/*.bench.ts', 'tests/bench/**/*.bench.ts'] },
		projects: [
			{
				extends: true,
				test: {
					name: 'unit',
					include: ['src/**/*.test.ts', 'tests/unit/**/*.test.ts'],
					environment: 'node'
				}
			},
			{
				extends: true,
				test: {
					name: 'integration',
					include: ['tests/integration/**/*.test.ts'],
					environment: 'node',
					globalSetup: ['tests/integration/global-setup.ts'],
					fileParallelism: false
				}
			},
			{
				extends: true,
				test: {
					name: 'browser',
					include: ['tests/browser/**/*.test.ts'],
					environment: 'node',
					globalSetup: ['tests/browser/global-setup.ts'],
					fileParallelism: false,
					testTimeout: 60_000
				}
			}
		]
	}
});
