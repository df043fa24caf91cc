import { untrack } from 'svelte';

/** One prop of an island, kept as a derived: its readers re-run only when its own value changes. */
class Memo {
	constructor(private readonly read: () => unknown) {}
	readonly value = $derived.by(() => this.read());
}

/**
 * The props an island's part reads (IslandClient.svelte): each key goes to the current `props()` (the
 * object the page passes, built afresh with every read), through a derived per key. Without it every
 * prop would depend on everything the page's object reads: moving the read-out cursor made the Bench plot
 * sample its caustic again. Writes go to the object's setters (bindable props). Call it while the island
 * is being created.
 */
export function liveProps<P extends Record<string, unknown>>(props: () => P): P {
	// Made now, while the island is being created (so they live as long as it does), for the keys the
	// page passes; a key it adds later is read directly.
	const memos = new Map<string | symbol, Memo>(Reflect.ownKeys(untrack(props)).map((k) => [k, new Memo(() => Reflect.get(props(), k))]));
	const read = (k: string | symbol) => {
		const m = memos.get(k);
		return m ? m.value : Reflect.get(props(), k);
	};
	return new Proxy({} as P, {
		get: (_, k) => read(k),
		set: (_, k, v) => Reflect.set(props(), k, v),
		has: (_, k) => Reflect.has(props(), k),
		ownKeys: () => Reflect.ownKeys(props()),
		getOwnPropertyDescriptor: (_, k) =>
			Reflect.has(props(), k) ? { enumerable: true, configurable: true, get: () => read(k), set: (v: unknown) => Reflect.set(props(), k, v) } : undefined
	});
}
