/**
 * A part imported for prerendering only (vite.config.ts, prerenderOnly): `null` in the browser's bundle.
 * Its props are checked where the page passes the same part to `lazyPart(() => import(…))`.
 */
declare module '*.svelte?prerender-only' {
	import type { Component } from 'svelte';
	const part: Component<any> | null;
	export default part;
}
