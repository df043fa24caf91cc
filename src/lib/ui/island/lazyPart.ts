// `any` in the constraint: a part's props are its own interface, without an index signature.
import type { Component } from 'svelte';

/**
 * A part whose code the browser loads only once the page answers input: a drawing-only island (a plot
 * without controls) and what it alone needs (the plotting library). Prerendering needs the part itself,
 * so a page passes `of={import.meta.env.SSR ? Part : lazyPart(() => import('./Part.svelte'))}`: the
 * bundler drops the other branch on each side, and with it the browser's static import of the part.
 */
export interface LazyPart<P extends Record<string, any>> {
	readonly load: () => Promise<{ default: Component<P> }>;
}

export function lazyPart<P extends Record<string, any>>(load: () => Promise<{ default: Component<P> }>): LazyPart<P> {
	return { load };
}

export function isLazyPart<P extends Record<string, any>>(of: Component<P> | LazyPart<P>): of is LazyPart<P> {
	return typeof of === 'object' && of !== null && 'load' in of;
}
