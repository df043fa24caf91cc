import { sveltekit } from '@sveltejs/kit/vite';
import type { Plugin } from 'vite';
import { defineConfig } from 'vitest/config';

/**
 * `import Part from './Part.svelte?prerender-only'`: the part itself when prerendering (the server
 * build), nothing (`null`) in the browser's bundle, so that a part the browser loads later
 * (src/lib/ui/island/lazyPart.ts) and what it alone needs stay out of the page's first load. A plain
 * import dropped only by `import.meta.env.SSR` still put the part in the page's chunk.
 */
function prerenderOnly(): Plugin {
	const SUFFIX = '?prerender-only';
	const EMPTY = '\0beamwright:prerender-only';
	return {
		name: 'beamwright:prerender-only',
		enforce: 'pre',
		async resolveId(source, importer, options) {
			if (!source.endsWith(SUFFIX)) return null;
			const server = options?.ssr || this.environment?.config.consumer === 'server';
			if (!server) return EMPTY;
			return this.resolve(source.slice(0, -SUFFIX.length), importer, { ...options, skipSelf: true });
		},
		load(id) {
			return id === EMPTY ? 'export default null;' : null;
		}
	};
}

// Shared by several pages but never needed by the Bench, and each pulling a library in with it (the
// plots' axes: layercake and d3; the CSV reader: papaparse; the section repair: its schemas).
const NOT_CORE = /src[\\/]lib[\\/](ui[\\/]plot[\\/]Axis[XY]\.svelte|io[\\/]csv\.ts|document[\\/]repair\.ts)$/;

export default defineConfig({
	plugins: [prerenderOnly(), sveltekit()],
	worker: { format: 'es' },
	build: {
		rolldownOptions: {
			output: {
				// Fewer, larger files for a page's first load: left to itself the bundler cut the framework
				// (Svelte's runtime, SvelteKit's client) and the library code every workspace shares into pieces
				// of a few hundred bytes, and a first load waited for rounds of requests (a browser opens at most
				// 6 connections to a host over HTTP/1.1). 'framework': Svelte and SvelteKit. 'core': modules of
				// src/lib used by 3 or more of the app's entries (routes, workers, lazy imports), with what they
				// import, except NOT_CORE (check with `npm run bench -- browser bytes` that the Bench loads
				// neither layercake nor papaparse).
				codeSplitting: {
					groups: [
						{ name: 'framework', test: /node_modules[\\/](svelte|@sveltejs[\\/]kit|esm-env|devalue|clsx)[\\/]|preload-helper/, priority: 2 },
						{ name: 'core', test: (id) => /src[\\/]lib[\\/]/.test(id) && !NOT_CORE.test(id), minShareCount: 3, priority: 1 }
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
