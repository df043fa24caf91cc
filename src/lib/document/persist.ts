/**
 * Where the setup lives between visits, and what keeps it from being lost: the autosave slot in the
 * browser's storage, guarded against the other tabs of the same browser, against full storage and
 * against unreadable content; and the undo history, bounded by size. The store
 * (`store.svelte.ts`) calls this module; it holds no reactive state itself.
 *
 * Rules:
 * - Every autosave carries a revision (`META_KEY`). A tab writes only over the revision it last read or
 *   wrote; when another tab saved in between, the save is refused as a conflict and the user chooses:
 *   take the other tab's version, keep this tab's work as a separate copy, or stay read-only here.
 * - Other tabs are noticed at once through the `storage` event and a BroadcastChannel ("hello").
 * - A failed write (storage full, blocked) is reported, never swallowed; the work stays in memory.
 * - An unreadable autosave is never overwritten before it is kept: each one goes to a slot of its own
 *   (`KEPT_PREFIX` + time), and when there is no room for the copy the autosave is left where it is and
 *   saving waits until the user has downloaded it.
 * - Undo/redo history is bounded by its total size (characters of the kept snapshots), not only by
 *   count, so replacing large documents again and again cannot grow memory without bound.
 */

export interface KeyValueStorage {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
	removeItem?(key: string): void;
	key?(index: number): string | null;
	readonly length?: number;
}

export const STORAGE_KEY = 'beamwright.setup.v1';
/** Revision of the autosave: `{ rev, tab, savedAt }`. */
export const META_KEY = STORAGE_KEY + '.meta';
/** Kept copies (unreadable autosaves, a tab's own copy after a conflict): one key each. */
export const KEPT_PREFIX = 'beamwright.kept.';
/** Largest setup written to the autosave slot (characters); larger ones ask for Save file… instead. */
export const MAX_AUTOSAVE_CHARS = 4_000_000;
/** Undo history: at most this many steps … */
export const MAX_HISTORY_STEPS = 200;
/** … and at most this many characters of snapshots in total (≈ 16 MB as UTF-16). */
export const MAX_HISTORY_CHARS = 8_000_000;

export interface KeptCopy {
	/** Storage key, or null for a copy held only in memory (there was no room to store it). */
	key: string | null;
	kind: 'unreadable' | 'copy';
	savedAt: number;
	/** Why it was kept, in words. */
	reason: string;
	text: string;
}

export type SaveResult =
	| { ok: true; savedAt: number }
	| { ok: false; conflict: true; otherText: string | null; otherSavedAt: number | null }
	| { ok: false; conflict: false; message: string };

interface Meta {
	rev: string;
	tab: string;
	savedAt: number;
}

function randomId(): string {
	return Math.random().toString(36).slice(2, 10) + Date.now().toString(36);
}

function readMeta(storage: KeyValueStorage): Meta | null {
	try {
		const m = JSON.parse(storage.getItem(META_KEY) ?? 'null');
		return m && typeof m.rev === 'string' ? m : null;
	} catch {
		return null;
	}
}

function describeWriteError(e: unknown, chars: number): string {
	const name = (e as { name?: string })?.name ?? '';
	const size = `${(chars / 1e6).toFixed(chars < 1e5 ? 3 : 1)} MB`;
	if (name === 'QuotaExceededError' || /quota/i.test(String((e as Error)?.message)))
		return `the browser's storage for this app is full (the setup is ${size})`;
	return `the browser refused to store it (${(e as Error)?.message ?? String(e)})`;
}

/** Undo or redo stack bounded by step count and total characters. */
export class BoundedHistory {
	#items: string[] = [];
	#chars = 0;
	constructor(
		readonly maxSteps = MAX_HISTORY_STEPS,
		readonly maxChars = MAX_HISTORY_CHARS
	) {}
	push(snapshot: string): void {
		this.#items.push(snapshot);
		this.#chars += snapshot.length;
		// Drop the oldest steps; the newest one always stays (so the last change can be undone).
		while (this.#items.length > 1 && (this.#items.length > this.maxSteps || this.#chars > this.maxChars)) {
			this.#chars -= this.#items.shift()!.length;
		}
	}
	pop(): string | undefined {
		const s = this.#items.pop();
		if (s !== undefined) this.#chars -= s.length;
		return s;
	}
	clear(): void {
		this.#items = [];
		this.#chars = 0;
	}
	get length(): number {
		return this.#items.length;
	}
	/** Characters held (the memory the history costs, about twice this in bytes). */
	get chars(): number {
		return this.#chars;
	}
}

export interface LoadResult {
	/** The stored text when it was read (the caller validates it), else null. */
	text: string | null;
	/** Said to the user on start-up, or null. */
	problem: string | null;
}

/** The autosave slot of one tab. */
export class Persistence {
	readonly tab = randomId();
	#storage: KeyValueStorage | null;
	#lastRev: string | null = null;
	/** Where this tab saves: the shared slot, or its own copy after "keep mine as a copy". */
	#target: string = STORAGE_KEY;
	/** An unreadable autosave that could not be copied aside: it stays in the slot until downloaded. */
	#held: KeptCopy | null = null;
	#channel: BroadcastChannel | null = null;

	constructor(storage: KeyValueStorage | null) {
		this.#storage = storage;
	}

	get available(): boolean {
		return this.#storage !== null;
	}
	get savingToCopy(): boolean {
		return this.#target !== STORAGE_KEY;
	}

	/**
	 * Read the autosave. `validate` says whether the text is a usable setup (and why not). An unreadable
	 * text is kept in a slot of its own before anything can overwrite it. Never throws.
	 */
	load(validate: (text: string) => string | null): LoadResult {
		const st = this.#storage;
		if (!st) return { text: null, problem: null };
		let saved: string | null;
		try {
			saved = st.getItem(STORAGE_KEY);
			this.#lastRev = readMeta(st)?.rev ?? null;
		} catch (e) {
			return { text: null, problem: `The autosaved setup could not be read from this browser's storage (${(e as Error).message}); the demo setup is shown.` };
		}
		if (saved === null) return { text: null, problem: null };
		const reason = validate(saved);
		if (reason === null) return { text: saved, problem: null };
		const copy: KeptCopy = { key: KEPT_PREFIX + Date.now() + '.' + randomId().slice(0, 4), kind: 'unreadable', savedAt: readMeta(st)?.savedAt ?? Date.now(), reason, text: saved };
		if (this.#writeKept(copy)) {
			return { text: null, problem: `The autosaved setup could not be read (${reason}); the demo setup is shown. The old text is kept — download it from the list of kept copies.` };
		}
		// No room even after moving it: leave it in the slot and hold saving until it is downloaded.
		this.#held = { ...copy, key: null };
		return {
			text: null,
			problem: `The autosaved setup could not be read (${reason}) and there is no room to copy it aside; it stays in storage, and autosave waits until you have downloaded it.`
		};
	}

	/** Store a kept copy; when there is no room, try moving the autosave slot's text there instead. */
	#writeKept(copy: KeptCopy): boolean {
		const st = this.#storage!;
		const value = JSON.stringify({ kind: copy.kind, savedAt: copy.savedAt, reason: copy.reason, text: copy.text });
		try {
			st.setItem(copy.key!, value);
			return true;
		} catch {
			// Full: free the autosave slot (it holds the same text) and write the copy in its place.
			if (copy.kind !== 'unreadable' || !st.removeItem) return false;
			try {
				st.removeItem(STORAGE_KEY);
				st.setItem(copy.key!, value);
				return true;
			} catch {
				try {
					st.removeItem(copy.key!);
					st.setItem(STORAGE_KEY, copy.text);
				} catch {
					/* the text is still in memory (#held) and can be downloaded */
				}
				return false;
			}
		}
	}

	/** Every kept copy, newest first (including one held only in memory). */
	listKept(): KeptCopy[] {
		const st = this.#storage;
		const out: KeptCopy[] = this.#held ? [this.#held] : [];
		if (!st || typeof st.length !== 'number' || !st.key) return out;
		try {
			for (let i = 0; i < st.length; i++) {
				const key = st.key(i);
				if (!key?.startsWith(KEPT_PREFIX)) continue;
				const raw = st.getItem(key) ?? '';
				try {
					const v = JSON.parse(raw);
					out.push({ key, kind: v.kind === 'copy' ? 'copy' : 'unreadable', savedAt: Number(v.savedAt) || 0, reason: String(v.reason ?? ''), text: String(v.text ?? '') });
				} catch {
					out.push({ key, kind: 'unreadable', savedAt: 0, reason: 'the kept copy itself is damaged', text: raw });
				}
			}
		} catch {
			/* storage blocked: show what we have */
		}
		return out.sort((a, b) => b.savedAt - a.savedAt);
	}

	/** Forget a kept copy (after the user downloaded or opened it). A held copy releases the slot. */
	dropKept(key: string | null): void {
		if (key === null) {
			this.#held = null;
			return;
		}
		try {
			this.#storage?.removeItem?.(key);
		} catch {
			/* nothing to do */
		}
	}

	/**
	 * Write the setup. Refused (conflict) when another tab saved since this tab last read or wrote the
	 * slot; refused with a message when the browser cannot store it. Never throws.
	 */
	save(json: string): SaveResult {
		const st = this.#storage;
		if (!st) return { ok: false, conflict: false, message: 'this browser gives the app no storage' };
		if (this.#held && this.#target === STORAGE_KEY)
			return { ok: false, conflict: false, message: 'the unreadable autosave is still in storage — download it from the kept copies first' };
		if (json.length > MAX_AUTOSAVE_CHARS)
			return { ok: false, conflict: false, message: `the setup is ${(json.length / 1e6).toFixed(1)} MB, more than the ${MAX_AUTOSAVE_CHARS / 1e6} MB the autosave holds` };
		try {
			if (this.#target === STORAGE_KEY) {
				const meta = readMeta(st);
				if (meta && meta.rev !== this.#lastRev && meta.tab !== this.tab) {
					return { ok: false, conflict: true, otherText: st.getItem(STORAGE_KEY), otherSavedAt: meta.savedAt };
				}
			}
			const savedAt = Date.now();
			if (this.#target === STORAGE_KEY) {
				const rev = randomId();
				st.setItem(STORAGE_KEY, json);
				st.setItem(META_KEY, JSON.stringify({ rev, tab: this.tab, savedAt } satisfies Meta));
				this.#lastRev = rev;
				this.#channel?.postMessage({ type: 'saved', tab: this.tab });
			} else {
				st.setItem(this.#target, JSON.stringify({ kind: 'copy', savedAt, reason: 'kept from a tab that was open beside another one', text: json }));
			}
			return { ok: true, savedAt };
		} catch (e) {
			return { ok: false, conflict: false, message: describeWriteError(e, json.length) };
		}
	}

	/** The other tab's autosave, as it is now. */
	readShared(): { text: string | null; savedAt: number | null } {
		try {
			return { text: this.#storage?.getItem(STORAGE_KEY) ?? null, savedAt: this.#storage ? (readMeta(this.#storage)?.savedAt ?? null) : null };
		} catch {
			return { text: null, savedAt: null };
		}
	}

	/** Accept the shared slot as it is now: the next save writes over it. */
	adoptShared(): void {
		if (this.#storage) this.#lastRev = readMeta(this.#storage)?.rev ?? null;
		this.#target = STORAGE_KEY;
	}

	/** From now on this tab saves into a copy of its own and leaves the shared slot to the other tab. */
	saveToOwnCopy(): string {
		this.#target = KEPT_PREFIX + Date.now() + '.' + this.tab.slice(0, 4);
		return this.#target;
	}

	/**
	 * Watch for other tabs: `onSaved` when another tab wrote the autosave (storage event or channel),
	 * `onPresent` when another tab of the app is open. Returns a function that stops watching.
	 */
	watch(onSaved: () => void, onPresent: () => void): () => void {
		if (typeof window === 'undefined') return () => {};
		const onStorage = (e: StorageEvent) => {
			if (e.key === META_KEY && e.newValue) {
				try {
					const m = JSON.parse(e.newValue) as Meta;
					if (m.tab !== this.tab && m.rev !== this.#lastRev) onSaved();
				} catch {
					/* ignore */
				}
			}
		};
		window.addEventListener('storage', onStorage);
		if (typeof BroadcastChannel !== 'undefined') {
			const ch = new BroadcastChannel('beamwright');
			this.#channel = ch;
			ch.onmessage = (e: MessageEvent) => {
				const m = e.data as { type?: string; tab?: string };
				if (!m || m.tab === this.tab) return;
				if (m.type === 'hello') ch.postMessage({ type: 'here', tab: this.tab });
				if (m.type === 'hello' || m.type === 'here') onPresent();
			};
			ch.postMessage({ type: 'hello', tab: this.tab });
		}
		return () => {
			window.removeEventListener('storage', onStorage);
			this.#channel?.close();
			this.#channel = null;
		};
	}
}
