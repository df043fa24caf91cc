/**
 * Web Worker for the matching search (comlink). The search runs in ~30 ms slices; between slices the
 * worker yields so a `cancel()` message is handled and progress is reported through the callback.
 * Usage (page): const api = wrap<MatchWorkerApi>(new Worker(new URL('$lib/workers/match.worker.ts', import.meta.url), { type: 'module' }));
 *               await api.run(problem, proxy((done, total) => …)); api.cancel();
 */
import { expose } from 'comlink';
import { createSearch, type MatchProblem, type MatchSolution } from '../optics/solve';

let cancelled = false;

const api = {
	async run(problem: MatchProblem, onProgress?: (done: number, total: number) => void): Promise<{ cancelled: boolean; solutions: MatchSolution[] }> {
		cancelled = false;
		const search = createSearch(problem);
		for (;;) {
			const finished = search.step(30);
			const p = search.progress();
			onProgress?.(p.done, p.total);
			if (finished) return { cancelled: false, solutions: search.results() };
			await new Promise((r) => setTimeout(r, 0));
			if (cancelled) return { cancelled: true, solutions: search.results() };
		}
	},
	cancel(): void {
		cancelled = true;
	}
};

export type MatchWorkerApi = typeof api;
expose(api);
