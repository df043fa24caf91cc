import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [sveltekit()],
	worker: { format: 'es' },
	build: {
		rolldownOptions: {
			output: {
				// The framework (Svelte's runtime and SvelteKit's client) in one chunk: left to itself the
				// bundler cut it into pieces of a few hundred bytes, and a page's first load then waited for
				// rounds of requests (a browser opens at most 6 connections to a host over HTTP/1.1).
				codeSplitting: {
					groups: [{ name: 'framework', test: /node_modules[\\/](svelte|@sveltejs[\\/]kit|esm-env|devalue|clsx)[\\/]|preload-helper/ }]
				}
			}
		}
	},
	test: {
		include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts', 'tests/property/**/*.test.ts', 'src/**/*.test.ts'],
		environment: 'node',
		testTimeout: 20000,
		// mathjs takes seconds to load on a busy machine; only the files that test the mathjs route load it.
		hookTimeout: 60000
	}
});
