import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [sveltekit()],
	worker: { format: 'es' },
	test: {
		include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts', 'tests/property/**/*.test.ts', 'src/**/*.test.ts'],
		environment: 'node',
		testTimeout: 20000,
		// mathjs takes seconds to load on a busy machine; only the files that test the mathjs route load it.
		hookTimeout: 60000
	}
});
