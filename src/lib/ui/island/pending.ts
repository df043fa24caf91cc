/**
 * Islands still waiting for their take-over (see Island.ts). The layout marks the page ready
 * (`<html data-ready>`: it answers input) once no island that takes input is left, and shows a
 * returning user's page (hidden until their setup replaces the demo) once no island at all is left:
 * a drawing-only island (a plot without controls) still shows the prerendered demo until then.
 */
export type IslandKind = 'input' | 'drawing';

const open: Record<IslandKind, number> = { input: 0, drawing: 0 };
let waiting: { kinds: IslandKind[]; done: () => void }[] = [];

const settled = (kinds: IslandKind[]) => kinds.every((k) => open[k] === 0);

/** An island will take its part of the page over later; call the returned function once it has. */
export function holdReady(kind: IslandKind): () => void {
	open[kind]++;
	let released = false;
	return () => {
		if (released) return;
		released = true;
		open[kind]--;
		const still: typeof waiting = [];
		for (const w of waiting) (settled(w.kinds) ? w.done() : still.push(w));
		waiting = still;
	};
}

/**
 * Resolves once every island of the given kinds has taken its part over (at once when there is none):
 * `['input']` for the page to answer input, `['input', 'drawing']` for everything it shows.
 */
export function islandsTakenOver(kinds: IslandKind[]): Promise<void> {
	return settled(kinds) ? Promise.resolve() : new Promise((done) => waiting.push({ kinds, done }));
}
