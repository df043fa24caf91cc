import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [sveltekit()],
	worker: { format: 'es' },
	test: {
		include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts', 'tests/property/**/*.test.ts', 'src/**/*.test.ts'],
		environment: 'node',
		setupFiles: ['tests/setup.ts'],
		testTimeout: 30000
	}
});
