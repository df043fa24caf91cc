/**
 * The SetupStore uses Svelte runes ($state, $derived), so this file is named *.svelte.test.ts and is
 * compiled by the Svelte plugin like the store itself.
 */
import { describe, it, expect, vi, afterEach } from 'vitest';
import { SetupStore, STORAGE_KEY, type KeyValueStorage } from '../../src/lib/document/store.svelte';
import { demoSetup, emptySetup, validateSetup } from '../../src/lib/document';

class FakeStorage implements KeyValueStorage {
	map = new Map<string, string>();
	writes = 0;
	getItem(key: string) {
		return this.map.get(key) ?? null;
	}
	setItem(key: string, value: string) {
		this.writes++;
		this.map.set(key, value);
	}
	removeItem(key: string) {
		this.map.delete(key);
	}
	key(i: number) {
		return [...this.map.keys()][i] ?? null;
	}
	get length() {
		return this.map.size;
	}
}

afterEach(() => {
	vi.useRealTimers();
});

describe('SetupStore', () => {
	it('starts from the demo setup when storage is empty, and its outcome propagates', () => {
		const s = new SetupStore(new FakeStorage());
		expect(s.doc).toEqual(demoSetup());
		expect(s.outcome.ok).toBe(true);
		expect(s.canUndo).toBe(false);
	});

	it('on a prerendered page, holds the demo until restoreSaved(), then shows the saved setup with no undo step and no write', () => {
		vi.useFakeTimers();
		const storage = new FakeStorage();
		const first = new SetupStore(storage);
		first.update((d) => {
			d.source.wavelength = '633 nm';
		});
		vi.advanceTimersByTime(1000);
		const writes = storage.writes;
		const s = new SetupStore(storage, true);
		expect(s.doc.source.wavelength).toBe(demoSetup().source.wavelength);
		s.restoreSaved();
		expect(s.doc.source.wavelength).toBe('633 nm');
		expect(s.canUndo).toBe(false);
		s.restoreSaved(); // a second call changes nothing
		vi.advanceTimersByTime(5000);
		expect(storage.writes).toBe(writes);
		expect(s.doc.source.wavelength).toBe('633 nm');
	});

	it('autosaves an edit to storage shortly after the change', () => {
		vi.useFakeTimers();
		const storage = new FakeStorage();
		const s = new SetupStore(storage);
		s.update((d) => {
			d.source.wavelength = '532 nm';
		});
		expect(storage.getItem(STORAGE_KEY)).toBeNull();
		vi.advanceTimersByTime(1000);
		const saved = storage.getItem(STORAGE_KEY);
		expect(saved).not.toBeNull();
		const v = validateSetup(JSON.parse(saved!));
		expect(v.ok && v.doc.source.wavelength).toBe('532 nm');
		expect(s.savedAt).not.toBeNull();
	});

	it('writes nothing while a drag is under way, then saves the dragged position once it ends (one undo step)', () => {
		vi.useFakeTimers();
		const storage = new FakeStorage();
		const s = new SetupStore(storage);
		const original = s.doc.elements[1].at;
		s.beginGesture();
		for (const at of ['301 mm', '302 mm', '303 mm']) {
			s.update((d) => (d.elements[1].at = at), 'drag.e2');
			vi.advanceTimersByTime(400);
		}
		expect(storage.writes).toBe(0);
		expect(s.outcome.ok && s.outcome.result.elements.find((e) => e.id === s.doc.elements[1].id)?.z_m).toBeCloseTo(0.303, 12);
		s.endGesture();
		vi.advanceTimersByTime(1000);
		expect(storage.writes).toBeGreaterThan(0);
		const v = validateSetup(JSON.parse(storage.getItem(STORAGE_KEY)!));
		expect(v.ok && v.doc.elements[1].at).toBe('303 mm');
		s.undo();
		expect(s.doc.elements[1].at).toBe(original);
	});

	it('a page hide during a drag still writes at once', () => {
		const storage = new FakeStorage();
		const s = new SetupStore(storage);
		s.beginGesture();
		s.update((d) => (d.elements[1].at = '321 mm'), 'drag.e2');
		s.flush();
		const v = validateSetup(JSON.parse(storage.getItem(STORAGE_KEY)!));
		expect(v.ok && v.doc.elements[1].at).toBe('321 mm');
		s.endGesture();
	});

	it('restores the saved setup in a new store (a reload loses nothing)', () => {
		const storage = new FakeStorage();
		const a = new SetupStore(storage);
		a.update((d) => {
			d.name = 'after reload';
			d.elements[0].at = '260 mm';
		});
		a.flush();
		const b = new SetupStore(storage);
		expect(b.doc.name).toBe('after reload');
		expect(b.doc.elements[0].at).toBe('260 mm');
		expect(b.restoreProblem).toBeNull();
	});

	it('keeps an unreadable autosave aside and says why, instead of overwriting it silently', () => {
		const storage = new FakeStorage();
		storage.setItem(STORAGE_KEY, '{"format":"beamwright-setup","version":1}');
		const s = new SetupStore(storage);
		expect(s.doc).toEqual(demoSetup());
		expect(s.restoreProblem).toMatch(/could not be read/);
		expect(s.kept.map((k) => k.text)).toEqual(['{"format":"beamwright-setup","version":1}']);
	});

	it('refuses a bad import with a reason and leaves the document unchanged', () => {
		const s = new SetupStore(new FakeStorage());
		s.update((d) => {
			d.name = 'my work';
		});
		const before = JSON.stringify(s.doc);
		const undoBefore = s.canUndo;
		for (const text of ['not json', '{"format":"beamwright-setup","version":1}', JSON.stringify({ ...demoSetup(), version: 7 })]) {
			const r = s.importJson(text);
			expect(r.ok).toBe(false);
			if (!r.ok) expect(r.reason.length).toBeGreaterThan(0);
			expect(JSON.stringify(s.doc)).toBe(before);
			expect(s.canUndo).toBe(undoBefore);
		}
	});

	it('imports a good file and exports it back unchanged', () => {
		const s = new SetupStore(new FakeStorage());
		const doc = emptySetup();
		expect(s.importJson(JSON.stringify(doc))).toEqual({ ok: true });
		expect(s.doc).toEqual(doc);
		expect(JSON.parse(s.exportJson())).toEqual(doc);
	});

	it('undoes and redoes edits, and coalesces a drag into one undo step', () => {
		const s = new SetupStore(new FakeStorage());
		const original = s.doc.elements[1].at;
		s.update((d) => (d.name = 'renamed'));
		for (const at of ['301 mm', '302 mm', '303 mm']) s.update((d) => (d.elements[1].at = at), 'drag:e2');
		expect(s.doc.elements[1].at).toBe('303 mm');
		s.undo();
		expect(s.doc.elements[1].at).toBe(original);
		expect(s.doc.name).toBe('renamed');
		expect(s.canRedo).toBe(true);
		s.undo();
		expect(s.doc.name).toBe(demoSetup().name);
		expect(s.canUndo).toBe(false);
		s.redo();
		s.redo();
		expect(s.doc.name).toBe('renamed');
		expect(s.doc.elements[1].at).toBe('303 mm');
		expect(s.canRedo).toBe(false);
		// A new edit clears the redo stack.
		s.undo();
		s.update((d) => (d.notes = 'x'));
		expect(s.canRedo).toBe(false);
	});

	it('derives field errors by path from the current document', () => {
		const s = new SetupStore(new FakeStorage());
		s.update((d) => (d.source.x.waist = '-3 mm'));
		expect(s.outcome.ok).toBe(false);
		expect(s.fieldErrors['source.x.waist']).toMatch(/Waist radius must be > 0 m/);
		s.undo();
		expect(s.outcome.ok).toBe(true);
		expect(s.fieldErrors).toEqual({});
	});
});
