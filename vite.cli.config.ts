// Builds the command line (dist/cli.js, one chunk per command, loaded on demand) and the library
// entry (dist/index.js) from src/cli and src/lib/api.ts as plain Node ES modules. Every runtime
// dependency (mathjs, valibot, fast-png, papaparse) is bundled in, so the packed tarball installs
// with nothing to fetch; mathjs stays in its own chunk and loads only when some input needs it.
import { defineConfig } from 'vite';

export default defineConfig({
	build: {
		ssr: true,
		target: 'node20',
		outDir: 'dist',
		emptyOutDir: true,
		minify: false,
		sourcemap: false,
		copyPublicDir: false,
		rollupOptions: {
			input: { cli: 'src/cli/main.ts', index: 'src/lib/api.ts' },
			output: { format: 'es', entryFileNames: '[name].js', chunkFileNames: 'chunks/[name]-[hash].js' }
		}
	},
	ssr: { noExternal: true, target: 'node' },
	logLevel: 'warn'
});
