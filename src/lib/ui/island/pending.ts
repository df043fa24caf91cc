/**
 * Islands still waiting for their take-over (see Island.ts), and their take-over on demand.
 *
 * An island's part is taken over in a task of its own, after the page's. Until then its prerendered
 * content is there but has no handlers. So that no input is lost meanwhile, an island that is ready to be
 * taken over (its script is loaded: it is "armed") is taken over at once, inside the event, when the user
 * first points at, focuses, types into or drops onto it: a capturing listener on the document runs the
 * island's take-over before the event reaches its target, whose handlers are then in place (the DOM
 * standard reads a node's listeners when the event gets there). Islands the take-over creates inside it
 * (the Bench plot inside the Bench workspace) are armed as it ends and taken over in the same event when
 * the target is in them.
 *
 * The layout marks the page ready (`<html data-ready>`: it answers input) once every island that takes
 * input is taken over or armed, and shows a returning user's page (hidden until their setup replaces the
 * demo) only once every island, drawing-only ones included, is taken over: a plot still shows the
 * prerendered demo until then.
 */
import { flushSync } from 'svelte';

export type IslandKind = 'input' | 'drawing';

/** One island's part in the page's readiness (holdReady). */
export interface IslandTurn {
	/** Its part can now be taken over at once, on demand: `el` holds the prerendered content, `build` takes it over. */
	arm(el: Element, build: () => void): void;
	/** Its part has been taken over (or the island is gone). */
	done(): void;
}

const open: Record<IslandKind, number> = { input: 0, drawing: 0 };
/** Islands that take input and are neither armed nor taken over. */
let unarmedInput = 0;
let waiting: { settled: () => boolean; done: () => void }[] = [];
const armed = new Map<Element, () => void>();

/** Whatever aims input at a part of the page: pointer, focus, keys, text and file input, drops. */
const EARLY_EVENTS = ['pointerdown', 'mousedown', 'touchstart', 'pointerover', 'focusin', 'keydown', 'beforeinput', 'input', 'change', 'click', 'wheel', 'dragenter', 'dragover', 'drop', 'contextmenu'] as const;
let listening = false;

function check() {
	const still: typeof waiting = [];
	for (const w of waiting) (w.settled() ? w.done() : still.push(w));
	waiting = still;
}

/** Takes over, before the event reaches its target, every armed island the target is in (outermost first). */
function takeOverOnInput(e: Event) {
	const target = e.target;
	if (!(target instanceof Node)) return;
	for (;;) {
		let build: (() => void) | undefined;
		for (const [el, b] of armed)
			if (el.contains(target)) {
				armed.delete(el);
				build = b;
				break;
			}
		if (!build) break;
		build();
		// The part's own mount callbacks: islands inside it arm themselves there.
		flushSync();
	}
	listen();
}

/** The document listens while an island is armed, and not a moment longer. */
function listen() {
	const want = armed.size > 0;
	if (want === listening || typeof document === 'undefined') return;
	listening = want;
	for (const type of EARLY_EVENTS) (want ? document.addEventListener : document.removeEventListener).call(document, type, takeOverOnInput, { capture: true, passive: true } as AddEventListenerOptions);
}

/** An island will take its part of the page over later; tell the returned turn when it can and when it has. */
export function holdReady(kind: IslandKind): IslandTurn {
	open[kind]++;
	if (kind === 'input') unarmedInput++;
	let isArmed = false;
	let isDone = false;
	let armedEl: Element | null = null;
	return {
		arm(el, build) {
			if (isDone || isArmed) return;
			isArmed = true;
			armedEl = el;
			if (kind === 'input') unarmedInput--;
			armed.set(el, build);
			listen();
			check();
		},
		done() {
			if (isDone) return;
			isDone = true;
			open[kind]--;
			if (kind === 'input' && !isArmed) unarmedInput--;
			if (armedEl) armed.delete(armedEl);
			listen();
			check();
		}
	};
}

/**
 * Resolves once every island of the given kinds has taken its part over (at once when there is none):
 * `['input', 'drawing']` for everything the page shows.
 */
export function islandsTakenOver(kinds: IslandKind[]): Promise<void> {
	const settled = () => kinds.every((k) => open[k] === 0);
	return settled() ? Promise.resolve() : new Promise((done) => waiting.push({ settled, done }));
}

/** Resolves once every island that takes input answers it: taken over, or armed to be taken over on demand. */
export function islandsAnswerInput(): Promise<void> {
	const settled = () => unarmedInput === 0;
	return settled() ? Promise.resolve() : new Promise((done) => waiting.push({ settled, done }));
}
