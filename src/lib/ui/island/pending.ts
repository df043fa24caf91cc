/**
 * Islands still waiting for their take-over (see Island.ts). The layout marks the page ready
 * (`<html data-ready>`: it answers input) only once none is left.
 */
let open = 0;
let waiting: (() => void)[] = [];

/** An island will take its part of the page over later; call the returned function once it has. */
export function holdReady(): () => void {
	open++;
	let done = false;
	return () => {
		if (done) return;
		done = true;
		open--;
		if (open === 0) {
			const run = waiting;
			waiting = [];
			for (const f of run) f();
		}
	};
}

/** Resolves once every island of the page has taken its part over (at once when there is none). */
export function islandsTakenOver(): Promise<void> {
	return open === 0 ? Promise.resolve() : new Promise((r) => waiting.push(r));
}
