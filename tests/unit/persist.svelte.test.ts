/**
 * Nothing the user typed or saved is lost: two tabs never overwrite each other's newer autosave, a
 * failed write is reported, every unreadable autosave is kept (even when storage is full), and the
 * undo history is bounded by size. (Behaviour of the app itself; no physics here.)
 */
import { describe, expect, it, vi, afterEach } from 'vitest';
import { SetupStore, STORAGE_KEY } from '../../src/lib/document/store.svelte';
import { BoundedHistory, KEPT_PREFIX, MAX_HISTORY_CHARS, Persistence } from '../../src/lib/document/persist';
import { demoSetup, emptySetup } from '../../src/lib/document';

/** A Map-backed storage with a quota in characters (keys + values), like a browser's. */
class QuotaStorage {
	map = new Map<string, string>();
	constructor(public quota = Infinity) {}
	get used() {
		let n = 0;
		for (const [k, v] of this.map) n += k.length + v.length;
		return n;
	}
	getItem(k: string) {
		return this.map.get(k) ?? null;
	}
	setItem(k: string, v: string) {
		const old = this.map.get(k);
		const next = this.used - (old === undefined ? 0 : k.length + old.length) + k.length + v.length;
		if (next > this.quota) {
			const e = new Error('The quota has been exceeded.');
			e.name = 'QuotaExceededError';
			throw e;
		}
		this.map.set(k, v);
	}
	removeItem(k: string) {
		this.map.delete(k);
	}
	key(i: number) {
		return [...this.map.keys()][i] ?? null;
	}
	get length() {
		return this.map.size;
	}
}

afterEach(() => vi.useRealTimers());

/** Two tabs on one storage: A saves first, then B's own save finds A's newer one (the conflict). */
function tabsInConflict(nameA: string, nameB: string) {
	const storage = new QuotaStorage();
	const a = new SetupStore(storage);
	const b = new SetupStore(storage);
	a.update((d) => (d.name = nameA));
	a.flush();
	b.update((d) => (d.name = nameB));
	b.flush();
	return { storage, a, b };
}

describe('two tabs', () => {
	it('a tab never writes over a newer save of another tab; it is told and chooses', () => {
		const { storage, b } = tabsInConflict('from tab A', 'from tab B');
		// B's save was refused: A's work is still in the slot, B knows why.
		expect(JSON.parse(storage.getItem(STORAGE_KEY)!).name).toBe('from tab A');
		expect(b.conflict).not.toBeNull();
		expect(b.conflict!.mineUnsaved).toBe(true);
		expect(b.savedAt).toBeNull();
		// Keep B's work as a copy: the shared slot stays A's, B's work is stored beside it.
		b.keepMineAsCopy();
		expect(JSON.parse(storage.getItem(STORAGE_KEY)!).name).toBe('from tab A');
		const copies = [...storage.map.keys()].filter((k) => k.startsWith(KEPT_PREFIX));
		expect(copies.length).toBe(1);
		expect(JSON.parse(JSON.parse(storage.getItem(copies[0])!).text).name).toBe('from tab B');
		// A new tab lists the copy and can open it.
		const c = new SetupStore(storage);
		expect(c.doc.name).toBe('from tab A');
		expect(c.kept.map((k) => k.kind)).toEqual(['copy']);
		expect(c.openKept(c.kept[0])).toEqual({ ok: true });
		expect(c.doc.name).toBe('from tab B');
	});

	it('taking the other tab\'s version replaces this one (Undo brings it back) and saving resumes', () => {
		const { storage, b } = tabsInConflict('A', 'B');
		expect(b.takeOtherVersion()).toEqual({ ok: true });
		expect(b.doc.name).toBe('A');
		b.update((d) => (d.name = 'B after taking A'));
		b.flush();
		expect(b.conflict).toBeNull();
		expect(JSON.parse(storage.getItem(STORAGE_KEY)!).name).toBe('B after taking A');
		b.undo();
		b.undo();
		expect(b.doc.name).toBe('B');
	});

	it('read-only: the tab neither changes nor saves', () => {
		const { storage, b } = tabsInConflict('A', 'B');
		b.stayReadOnly();
		b.update((d) => (d.name = 'B again'));
		b.flush();
		expect(b.doc.name).toBe('B');
		expect(JSON.parse(storage.getItem(STORAGE_KEY)!).name).toBe('A');
	});

	it('a tab that only looked (no edits) writes nothing when it is hidden', () => {
		const storage = new QuotaStorage();
		const a = new SetupStore(storage);
		const b = new SetupStore(storage);
		a.update((d) => (d.name = 'A'));
		a.flush();
		b.flush();
		expect(JSON.parse(storage.getItem(STORAGE_KEY)!).name).toBe('A');
		expect(b.conflict).toBeNull();
	});
});

describe('storage full', () => {
	it('a failed autosave is reported and "Autosaved" is not claimed; the work stays in memory', () => {
		vi.useFakeTimers();
		const storage = new QuotaStorage(2000);
		const s = new SetupStore(storage);
		s.update((d) => (d.notes = 'x'.repeat(5000)));
		vi.advanceTimersByTime(1000);
		expect(s.savedAt).toBeNull();
		expect(s.saveError).toMatch(/storage for this app is full/);
		expect(s.doc.notes.length).toBe(5000);
		// Room again: the next change saves and the message goes away.
		storage.quota = Infinity;
		s.update((d) => (d.notes = 'short'));
		vi.advanceTimersByTime(1000);
		expect(s.saveError).toBeNull();
		expect(s.savedAt).not.toBeNull();
	});
});

describe('unreadable autosaves', () => {
	it('each unreadable autosave gets a slot of its own (not one slot overwritten each time)', () => {
		const storage = new QuotaStorage();
		storage.setItem(STORAGE_KEY, 'first broken');
		const a = new SetupStore(storage);
		a.update((d) => (d.name = 'x'));
		a.flush();
		storage.setItem(STORAGE_KEY, 'second broken');
		const b = new SetupStore(storage);
		expect(b.kept.map((k) => k.text).sort()).toEqual(['first broken', 'second broken']);
		expect(b.restoreProblem).toMatch(/could not be read/);
	});

	it('starts even when the unreadable autosave is larger than the free space, and keeps it', () => {
		const big = '{"broken": "' + 'y'.repeat(6000);
		const storage = new QuotaStorage(10_000);
		storage.setItem(STORAGE_KEY, big);
		const s = new SetupStore(storage);
		expect(s.doc).toEqual(demoSetup());
		expect(s.kept.length).toBe(1);
		expect(s.kept[0].text).toBe(big);
		// Not written over until downloaded and removed.
		s.update((d) => (d.name = 'new work'));
		s.flush();
		expect(new SetupStore(storage).kept.map((k) => k.text)).toEqual([big]);
	});

	it('a storage that throws on read does not stop the app', () => {
		const broken = { getItem: () => { throw new Error('SecurityError'); }, setItem: () => { throw new Error('SecurityError'); } };
		const s = new SetupStore(broken);
		expect(s.doc).toEqual(demoSetup());
		expect(s.restoreProblem).toMatch(/could not be read/);
	});
});

describe('undo history is bounded by size', () => {
	it('replacing a 0.4 MB setup 40 times keeps the history under its bound (was: grew by each setup)', () => {
		const s = new SetupStore(null);
		for (let i = 0; i < 40; i++) {
			const doc = emptySetup();
			doc.notes = String(i).padEnd(400_000, 'n');
			s.replace(doc);
		}
		expect(s.historyChars).toBeLessThanOrEqual(MAX_HISTORY_CHARS);
		expect(s.historyChars).toBeGreaterThan(MAX_HISTORY_CHARS / 2);
		expect(s.canUndo).toBe(true);
		s.undo();
		expect(s.doc.notes.startsWith('38')).toBe(true);
	});
	it('BoundedHistory keeps the newest step even when it alone is over the bound', () => {
		const h = new BoundedHistory(10, 100);
		h.push('a'.repeat(50));
		h.push('b'.repeat(60));
		expect(h.length).toBe(1);
		h.push('c'.repeat(500));
		expect(h.length).toBe(1);
		expect(h.pop()).toBe('c'.repeat(500));
	});
	it('Persistence.save refuses a setup larger than the autosave holds, with the size', () => {
		const p = new Persistence(new QuotaStorage());
		const r = p.save('x'.repeat(5_000_000));
		expect(r.ok).toBe(false);
		if (!r.ok && !r.conflict) expect(r.message).toMatch(/5\.0 MB, more than the 4 MB/);
	});
});
