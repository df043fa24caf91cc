import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [sveltekit()],
	worker: { format: 'es' },
	build: {
		rolldownOptions: {
			output: {
				// The CSV reader (csv.ts and its parser) in a chunk of its own: only the pages that read CSV
				// load it. Left to itself the bundler put it with the cell helpers that the Bench's first view
				// needs to write CSV, and the parser then ran on every Bench load.
				// (The cell helpers, which the reader also uses, keep a chunk of their own.)
				codeSplitting: {
					groups: [
						{ name: 'csv-cells', test: /src[\\/]lib[\\/]io[\\/]cells\.ts$/, priority: 2 },
						{ name: 'csv-reader', test: /node_modules[\\/]papaparse[\\/]|src[\\/]lib[\\/]io[\\/]csv\.ts$/, priority: 1 }
					]
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
