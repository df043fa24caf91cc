/**
 * The setup store: the one live setup document of the app, with autosave, undo/redo and file
 * import/export. Results that depend on it are `$derived`, so every workspace reads the same beam.
 *
 * Storage is passed in (localStorage in the browser, a Map-backed fake in tests).
 */
import { compileSetup, type FieldError } from './compile';
import { demoSetup } from './demo';
import { parseSetupJson, type SetupDoc } from './schema';
import { propagate, type Propagation } from '../optics/train';
import { loadUnitEngine, onUnitEngineReady, unitEngineReady } from '../units/parse';

export interface KeyValueStorage {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
}

export const STORAGE_KEY = 'beamwright.setup.v1';

export type Outcome = { ok: true; result: Propagation } | { ok: false; errors: FieldError[]; engineError?: string };

export class SetupStore {
	doc = $state<SetupDoc>(demoSetup());
	#undo: string[] = [];
	#redo: string[] = [];
	#lastCoalesce: string | null = null;
	#saveTimer: ReturnType<typeof setTimeout> | null = null;
	#storage: KeyValueStorage | null;
	/** Set when the stored document could not be read on start-up (kept aside, never overwritten silently). */
	restoreProblem = $state<string | null>(null);
	canUndo = $state(false);
	canRedo = $state(false);
	savedAt = $state<number | null>(null);

	/** Bumped when the lazily loaded unit engine arrives, so pending fields are read again. */
	unitsVersion = $state(0);

	outcome: Outcome = $derived.by(() => {
		void this.unitsVersion;
		const c = compileSetup(this.doc);
		if (!c.ok) return { ok: false, errors: c.errors };
		try {
			return { ok: true, result: propagate(c.input) };
		} catch (e) {
			return { ok: false, errors: [], engineError: (e as Error).message };
		}
	});

	#lastErrors: Record<string, string> = {};
	#lastErrorsKey = '';
	/**
	 * Field path → message, for showing each error beside its input. The same object is returned while
	 * the messages are unchanged, so a drag does not re-render every field of the page.
	 */
	fieldErrors: Record<string, string> = $derived.by(() => {
		const list = this.outcome.ok ? [] : this.outcome.errors;
		const key = list.map((e) => e.path + '\u0000' + e.message).join('\u0001');
		if (key !== this.#lastErrorsKey) {
			this.#lastErrorsKey = key;
			this.#lastErrors = Object.fromEntries(list.map((e) => [e.path, e.message]));
		}
		return this.#lastErrors;
	});

	constructor(storage: KeyValueStorage | null) {
		this.#storage = storage;
		if (!unitEngineReady()) onUnitEngineReady(() => this.unitsVersion++);
		const saved = storage?.getItem(STORAGE_KEY);
		if (saved) {
			const r = parseSetupJson(saved);
			if (r.ok) this.doc = r.doc;
			else {
				this.restoreProblem = `The autosaved setup could not be read (${r.reason}); the demo setup is shown and the old text is kept under "${STORAGE_KEY}.unreadable".`;
				storage!.setItem(STORAGE_KEY + '.unreadable', saved);
			}
		}
	}

	/**
	 * Change the document. `coalesce` merges consecutive edits with the same key into one undo step
	 * (a drag, or typing in one field).
	 */
	update(mutate: (doc: SetupDoc) => void, coalesce?: string): void {
		if (!coalesce || coalesce !== this.#lastCoalesce) {
			this.#undo.push(JSON.stringify($state.snapshot(this.doc)));
			if (this.#undo.length > 200) this.#undo.shift();
			this.#redo = [];
		}
		this.#lastCoalesce = coalesce ?? null;
		mutate(this.doc);
		this.#changed();
	}

	/** Replace the whole document (import, demo, new); one undo step. */
	replace(doc: SetupDoc): void {
		this.#undo.push(JSON.stringify($state.snapshot(this.doc)));
		this.#redo = [];
		this.#lastCoalesce = null;
		this.doc = doc;
		this.#changed();
	}

	undo(): void {
		const prev = this.#undo.pop();
		if (!prev) return;
		this.#redo.push(JSON.stringify($state.snapshot(this.doc)));
		this.doc = JSON.parse(prev);
		this.#lastCoalesce = null;
		this.#changed();
	}

	redo(): void {
		const next = this.#redo.pop();
		if (!next) return;
		this.#undo.push(JSON.stringify($state.snapshot(this.doc)));
		this.doc = JSON.parse(next);
		this.#lastCoalesce = null;
		this.#changed();
	}

	/** Import a setup file's text. A rejected file leaves the current work untouched and says why. */
	importJson(text: string): { ok: true } | { ok: false; reason: string } {
		const r = parseSetupJson(text);
		if (!r.ok) return r;
		this.replace(r.doc);
		return { ok: true };
	}

	exportJson(): string {
		return JSON.stringify($state.snapshot(this.doc), null, 2) + '\n';
	}

	/** Write now (also called on page hide so a closing tab loses nothing). */
	flush(): void {
		if (this.#saveTimer) clearTimeout(this.#saveTimer);
		this.#saveTimer = null;
		if (!this.#storage) return;
		try {
			this.#storage.setItem(STORAGE_KEY, JSON.stringify($state.snapshot(this.doc)));
			this.savedAt = Date.now();
		} catch {
			// Storage full or blocked: keep working; the export button still saves a file.
		}
	}

	#changed(): void {
		this.canUndo = this.#undo.length > 0;
		this.canRedo = this.#redo.length > 0;
		if (this.#saveTimer) clearTimeout(this.#saveTimer);
		this.#saveTimer = setTimeout(() => this.flush(), 150);
	}
}

let shared: SetupStore | null = null;

/**
 * Create a store whose derivations belong to no component. The first caller is usually a page's
 * `<script>`; a `$derived` created there would belong to that page's effect and stop following the
 * document once the user navigates away (Svelte then reads it as an inert, frozen value). An effect
 * root is never destroyed with a component, so the store's derivations stay live for the whole app,
 * whichever page created it and whatever pages come and go.
 */
export function createDetachedStore(storage: KeyValueStorage | null): SetupStore {
	let store: SetupStore | null = null;
	$effect.root(() => {
		store = new SetupStore(storage);
	});
	// On the server (prerender) an effect root does not run its function, and no component outlives
	// another there, so a plain store is right.
	return store ?? new SetupStore(storage);
}

/** The app's one store (browser: localStorage; server-side prerender: no storage). */
export function getSetupStore(): SetupStore {
	if (!shared) {
		const storage = typeof localStorage !== 'undefined' ? localStorage : null;
		shared = createDetachedStore(storage);
		if (typeof window !== 'undefined') {
			// Fetch the full unit engine at the user's first key press, or 1.5 s after start, whichever
			// comes first — never on the path to the first view.
			const load = () => void loadUnitEngine();
			document.addEventListener('keydown', load, { once: true });
			setTimeout(load, 1500);
			window.addEventListener('pagehide', () => shared?.flush());
			document.addEventListener('visibilitychange', () => {
				if (document.visibilityState === 'hidden') shared?.flush();
			});
		}
	}
	return shared;
}
