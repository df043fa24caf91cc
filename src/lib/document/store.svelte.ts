/**
 * The setup store: the one live setup document of the app, with autosave, undo/redo and file
 * import/export. Results that depend on it are `$derived`, so every workspace reads the same beam.
 *
 * Storage is passed in (localStorage in the browser, a Map-backed fake in tests). What keeps work from
 * being lost (other tabs, full storage, unreadable autosaves, bounded undo) is in `persist.ts`.
 */
import { compileSetup, type FieldError } from './compile';
import { demoSetup } from './demo';
import { parseSetupJson, type SetupDoc } from './schema';
import { propagate, type Propagation } from '../optics/train';
import { onUnitEngineReady, unitEngineReady, unitEngineWasNeeded } from '../units/parse';
import { BoundedHistory, Persistence, type KeptCopy, type KeyValueStorage } from './persist';

export { STORAGE_KEY, type KeyValueStorage } from './persist';

/** Another tab saved the setup after this tab last read it. */
export interface TabConflict {
	otherSavedAt: number | null;
	/** This tab had changes of its own that are not saved. */
	mineUnsaved: boolean;
}

export type Outcome = { ok: true; result: Propagation } | { ok: false; errors: FieldError[]; engineError?: string };

export class SetupStore {
	doc = $state<SetupDoc>(demoSetup());
	#undo = new BoundedHistory();
	#redo = new BoundedHistory();
	#lastCoalesce: string | null = null;
	#saveTimer: ReturnType<typeof setTimeout> | null = null;
	#persist: Persistence;
	#dirty = false;
	/** A gesture (a drag) is under way: autosave waits for its end, then writes once. */
	#holding = false;
	/** Set when the stored document could not be read on start-up (kept aside, never overwritten silently). */
	restoreProblem = $state<string | null>(null);
	/** Why the last autosave failed (storage full…); null while autosave works. */
	saveError = $state<string | null>(null);
	/** Another tab saved newer work; autosave waits until the user chooses. */
	conflict = $state<TabConflict | null>(null);
	/** Another tab of the app is open in this browser. */
	otherTabOpen = $state(false);
	/** This tab neither saves nor changes the setup (chosen after a conflict). */
	readOnly = $state(false);
	/** This tab saves into a copy of its own, leaving the shared autosave to the other tab. */
	savingToCopy = $state(false);
	/** Kept copies: unreadable autosaves and copies a tab kept; listed on every page until dealt with. */
	kept = $state<KeptCopy[]>([]);
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

	#restored = false;

	/**
	 * `deferRestore`: start from the demo setup and read the autosave only when `restoreSaved()` is
	 * called. The app does this on a page whose first view was prerendered (the demo): the page's
	 * scripts first take over the prerendered view as it is, then the user's own setup replaces it,
	 * which the page keeps hidden until then (app.html), so the demo's numbers are never shown as theirs.
	 */
	constructor(storage: KeyValueStorage | null, deferRestore = false) {
		this.#persist = new Persistence(storage);
		// Re-read the fields only when some text was waiting for the unit engine (no re-validation storm otherwise).
		if (!unitEngineReady()) onUnitEngineReady(() => {
			if (unitEngineWasNeeded()) this.unitsVersion++;
		});
		if (!deferRestore) this.restoreSaved();
	}

	/** Read the autosaved setup (once): it becomes the document, with no undo step and no save. */
	restoreSaved(): void {
		if (this.#restored) return;
		this.#restored = true;
		const loaded = this.#persist.load((text) => {
			const r = parseSetupJson(text);
			return r.ok ? null : r.reason;
		});
		if (loaded.text !== null) {
			const r = parseSetupJson(loaded.text);
			if (r.ok) this.doc = r.doc;
		}
		this.restoreProblem = loaded.problem;
		this.kept = this.#persist.listKept();
	}

	/** Start watching the other tabs of this browser (the app calls this once). */
	watchOtherTabs(): () => void {
		return this.#persist.watch(
			() => {
				if (this.readOnly || this.savingToCopy) return;
				this.conflict = { otherSavedAt: this.#persist.readShared().savedAt, mineUnsaved: this.#dirty };
			},
			() => (this.otherTabOpen = true)
		);
	}

	/** Conflict: take the other tab's saved setup here (one undo step brings this tab's back). */
	takeOtherVersion(): { ok: true } | { ok: false; reason: string } {
		const other = this.#persist.readShared();
		const r = other.text === null ? ({ ok: false, reason: 'the other tab saved nothing readable' } as const) : parseSetupJson(other.text);
		if (!r.ok) return r;
		this.#persist.adoptShared();
		this.conflict = null;
		this.readOnly = false;
		this.replace(r.doc);
		this.#dirty = false;
		return { ok: true };
	}

	/** Conflict: keep working here, saving into a copy of our own (listed as a kept copy next time). */
	keepMineAsCopy(): void {
		this.#persist.saveToOwnCopy();
		this.savingToCopy = true;
		this.conflict = null;
		this.readOnly = false;
		this.#dirty = true;
		this.flush();
	}

	/** Conflict: stay in this tab without saving or changing anything. */
	stayReadOnly(): void {
		this.readOnly = true;
		this.conflict = null;
	}

	/** Open a kept copy as the setup (one undo step); refused with the reason when it cannot be read. */
	openKept(copy: KeptCopy): { ok: true } | { ok: false; reason: string } {
		const r = this.importJson(copy.text);
		if (r.ok) this.dropKept(copy);
		return r;
	}

	/** Forget a kept copy (after it was downloaded). */
	dropKept(copy: KeptCopy): void {
		this.#persist.dropKept(copy.key);
		this.kept = this.#persist.listKept();
		if (copy.key === null) this.flush();
	}

	/** Characters held by the undo and redo history (bounded, see persist.ts). */
	get historyChars(): number {
		return this.#undo.chars + this.#redo.chars;
	}

	/**
	 * Change the document. `coalesce` merges consecutive edits with the same key into one undo step
	 * (a drag, or typing in one field).
	 */
	update(mutate: (doc: SetupDoc) => void, coalesce?: string): void {
		if (this.readOnly) return;
		if (!coalesce || coalesce !== this.#lastCoalesce) {
			this.#undo.push(JSON.stringify($state.snapshot(this.doc)));
			this.#redo.clear();
		}
		this.#lastCoalesce = coalesce ?? null;
		mutate(this.doc);
		this.#changed();
	}

	/**
	 * A continuous gesture (an element dragged) begins: its edits still go into the document and the
	 * undo history at once, but autosave waits until `endGesture`, so no pointer event pays for a write.
	 * A page hide still writes at once (`flush`).
	 */
	beginGesture(): void {
		this.#holding = true;
		if (this.#saveTimer) clearTimeout(this.#saveTimer);
		this.#saveTimer = null;
	}

	/** The gesture ended: autosave as after any edit. */
	endGesture(): void {
		if (!this.#holding) return;
		this.#holding = false;
		if (this.#dirty) this.#scheduleSave();
	}

	/** Replace the whole document (import, demo, new); one undo step. */
	replace(doc: SetupDoc): void {
		if (this.readOnly) return;
		this.#undo.push(JSON.stringify($state.snapshot(this.doc)));
		this.#redo.clear();
		this.#lastCoalesce = null;
		this.doc = doc;
		this.#changed();
	}

	undo(): void {
		if (this.readOnly) return;
		const prev = this.#undo.pop();
		if (!prev) return;
		this.#redo.push(JSON.stringify($state.snapshot(this.doc)));
		this.doc = JSON.parse(prev);
		this.#lastCoalesce = null;
		this.#changed();
	}

	redo(): void {
		if (this.readOnly) return;
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

	/**
	 * Write now (also called on page hide so a closing tab loses nothing). Writes only when something
	 * changed; never over another tab's newer save (that becomes a `conflict`); a failed write is shown
	 * (`saveError`) and the work stays in memory.
	 */
	flush(): void {
		if (this.#saveTimer) clearTimeout(this.#saveTimer);
		this.#saveTimer = null;
		if (!this.#persist.available || !this.#dirty || this.readOnly || this.conflict) return;
		const r = this.#persist.save(JSON.stringify($state.snapshot(this.doc)));
		if (r.ok) {
			this.#dirty = false;
			this.savedAt = r.savedAt;
			this.saveError = null;
		} else if (r.conflict) {
			this.conflict = { otherSavedAt: r.otherSavedAt, mineUnsaved: true };
		} else {
			this.savedAt = null;
			this.saveError = r.message;
		}
	}

	#changed(): void {
		this.#dirty = true;
		this.canUndo = this.#undo.length > 0;
		this.canRedo = this.#redo.length > 0;
		if (!this.#holding) this.#scheduleSave();
	}

	#scheduleSave(): void {
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
export function createDetachedStore(storage: KeyValueStorage | null, deferRestore = false): SetupStore {
	let store: SetupStore | null = null;
	$effect.root(() => {
		store = new SetupStore(storage, deferRestore);
	});
	// On the server (prerender) an effect root does not run its function, and no component outlives
	// another there, so a plain store is right.
	return store ?? new SetupStore(storage, deferRestore);
}

/**
 * Whether this page arrived with its first view prerendered (a `<main>` in the HTML before any script
 * ran). Read when this module is first evaluated, which is before the app starts: a page rendered in
 * the browser has an empty body then.
 */
const PRERENDERED = typeof document !== 'undefined' && document.querySelector('body main') !== null;

/** The app's one store (browser: localStorage; server-side prerender: no storage). */
export function getSetupStore(): SetupStore {
	if (!shared) {
		const storage = typeof localStorage !== 'undefined' ? localStorage : null;
		// A prerendered page shows the demo: the scripts take it over as rendered, and the root layout
		// then calls restoreSaved() (see the constructor).
		shared = createDetachedStore(storage, PRERENDERED);
		if (typeof window !== 'undefined') {
			// The full unit engine (mathjs) is fetched and parsed only when some text needs it: a parse
			// that the fast path cannot read comes back `pending` and starts the load (units/parse.ts).
			// Nothing loads it on a timer, so no long task follows the first view of a setup in everyday units.
			window.addEventListener('pagehide', () => shared?.flush());
			shared.watchOtherTabs();
			document.addEventListener('visibilitychange', () => {
				if (document.visibilityState === 'hidden') shared?.flush();
			});
		}
	}
	return shared;
}
