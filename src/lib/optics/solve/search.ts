/**
 * Mode matching from a lens inventory: every ordered combination of 1, 2 or 3 stock lenses is placed on
 * the rail by a coarse grid over the allowed positions followed by a pattern search (coordinate steps,
 * halved until 10 µm), maximising the coupling of evaluate.ts. Combinations with the same focal lengths
 * are solved once. The best solutions get a tolerance read-out (efficiency lost for ±1 mm of each lens
 * and ±1 % of each focal length) and are ranked.
 *
 * The search runs in slices (`step(budget_ms)`) so a worker can report progress and accept a cancel.
 */
import { requireThat } from '../constants';
import { evaluate, makeScorer } from './evaluate';
import type { InputBeam, Interval, LensPlacement, MatchConstraints, MatchSolution, StockLens, TargetMode } from './types';

export type RankBy = 'robust' | 'efficiency' | 'tolerance' | 'length';

export interface MatchProblem {
	input: InputBeam;
	target: TargetMode;
	inventory: StockLens[];
	constraints: MatchConstraints;
	/** How many ranked solutions to keep (default 20). */
	keep?: number;
	rankBy?: RankBy;
}

interface Raw {
	idx: number[];
	z: number[];
	eta: number;
}

const gridFor: Record<number, number> = { 1: 64, 2: 16, 3: 8 };

/** Ranges each lens slot may use, clipped to the rail and to the target plane. */
function slotRanges(c: MatchConstraints, n: number, targetZ: number): Interval[] {
	const out: Interval[] = [];
	for (let i = 0; i < n; i++) {
		const s = c.slots[i] ?? c.rail;
		out.push({ from_m: Math.max(s.from_m, c.rail.from_m), to_m: Math.min(s.to_m, c.rail.to_m, targetZ) });
	}
	return out;
}

function combos(inv: StockLens[], n: number): number[][] {
	const res: number[][] = [];
	const seen = new Set<string>();
	const used = new Array(inv.length).fill(0);
	const cur: number[] = [];
	const rec = () => {
		if (cur.length === n) {
			const key = cur.map((i) => inv[i].f_m + '/' + inv[i].diameter_m).join('|');
			if (!seen.has(key)) {
				seen.add(key);
				res.push([...cur]);
			}
			return;
		}
		for (let i = 0; i < inv.length; i++) {
			if (used[i] >= inv[i].count) continue;
			used[i]++;
			cur.push(i);
			rec();
			cur.pop();
			used[i]--;
		}
	};
	rec();
	return res;
}

export interface Search {
	/** Work for about `budget_ms`; returns true when the search is complete. */
	step(budget_ms: number): boolean;
	progress(): { done: number; total: number };
	/** Ranked solutions found so far (final once step() returned true). */
	results(): MatchSolution[];
}

/** Validate a problem and prepare a sliced search over it. */
export function createSearch(p: MatchProblem): Search {
	const c = p.constraints;
	requireThat(p.inventory.length > 0, 'lens inventory', 'at least one lens', 0);
	for (const l of p.inventory) {
		requireThat(Number.isFinite(l.f_m) && l.f_m !== 0, `focal length of ${l.label}`, 'a non-zero length', l.f_m, 'm');
		requireThat(Number.isInteger(l.count) && l.count >= 0, `count of ${l.label}`, 'a whole number ≥ 0', l.count);
	}
	requireThat(c.rail.to_m > c.rail.from_m, 'rail end', `> rail start (${c.rail.from_m} m)`, c.rail.to_m, 'm');
	requireThat(c.minSpacing_m >= 0, 'minimum lens spacing', '≥ 0 m', c.minSpacing_m, 'm');
	requireThat(c.lensCounts.length > 0 && c.lensCounts.every((n) => n === 1 || n === 2 || n === 3), 'lens counts', '1, 2 or 3', c.lensCounts.join(', '));
	const jobs: number[][] = [];
	for (const n of [...new Set(c.lensCounts)].sort()) jobs.push(...combos(p.inventory, n));
	const total = jobs.length;
	let done = 0;
	const raws: Raw[] = [];
	const inv = p.inventory;
	const { input, target } = p;

	const bestSoFar: Record<number, number> = { 1: 0, 2: 0, 3: 0 };
	const blocked = (z: number) => {
		for (const k of c.keepOut) if (z >= k.from_m && z <= k.to_m) return true;
		return false;
	};

	function solveCombo(idx: number[]) {
		const n = idx.length;
		const f = idx.map((i) => inv[i].f_m);
		const dia = idx.map((i) => inv[i].diameter_m);
		const ranges = slotRanges(c, n, target.z_m);
		if (ranges.some((r) => r.to_m < r.from_m)) return;
		const feasible = (z: number[]) => {
			for (let i = 0; i < n; i++) {
				if (z[i] < ranges[i].from_m || z[i] > ranges[i].to_m || blocked(z[i])) return false;
				if (i > 0 && z[i] - z[i - 1] < c.minSpacing_m) return false;
			}
			return true;
		};
		const fast = makeScorer(input, target, f, dia);
		const score = (z: number[]) => (feasible(z) ? fast(z) : -1);
		const G = gridFor[n];
		const steps = ranges.map((r) => (r.to_m - r.from_m) / (G - 1));
		// Coarse grid: keep the two best cells.
		let best1 = { s: -1, z: [] as number[] };
		let best2 = { s: -1, z: [] as number[] };
		const z = new Array(n).fill(0);
		const walk = (i: number) => {
			if (i === n) {
				const s = score(z);
				if (s > best1.s) {
					best2 = best1;
					best1 = { s, z: [...z] };
				} else if (s > best2.s) best2 = { s, z: [...z] };
				return;
			}
			for (let g = 0; g < G; g++) {
				z[i] = ranges[i].from_m + g * steps[i];
				if (i > 0 && z[i] - z[i - 1] < c.minSpacing_m) continue;
				walk(i + 1);
			}
		};
		walk(0);
		// Refine only cells that can still reach the ranked list.
		if (best1.s < bestSoFar[n] * 0.6) return;
		const far = best2.z.length === n && best2.z.some((v, i) => Math.abs(v - best1.z[i]) > 1.5 * steps[i]);
		const starts = n === 3 || !far ? [best1] : [best1, best2];
		const found: Raw[] = [];
		for (const st of starts) {
			if (st.s < 0) continue;
			const zz = [...st.z];
			let s = st.s;
			let h = Math.max(...steps) / 2 || 1e-3;
			let evals = 0;
			while (h > 2e-5 && evals < (n === 3 ? 90 : 140)) {
				let improved = false;
				for (let i = 0; i < n; i++) {
					for (const dir of [1, -1]) {
						const keep = zz[i];
						zz[i] = keep + dir * h;
						const t = score(zz);
						evals++;
						if (t > s) {
							s = t;
							improved = true;
							break;
						}
						zz[i] = keep;
					}
				}
				if (!improved) h /= 2;
			}
			if (s > bestSoFar[n]) bestSoFar[n] = s;
			if (!found.some((o) => o.z.every((v, i) => Math.abs(v - zz[i]) < 5e-3))) found.push({ idx, z: zz, eta: s });
		}
		raws.push(...found);
	}

	let finished: MatchSolution[] | null = null;
	const keep = p.keep ?? 20;
	function finish(): MatchSolution[] {
		raws.sort((a, b) => b.eta - a.eta);
		const top = raws.slice(0, Math.max(keep * 3, 30)).map((r) => describe(p, r.idx, r.z));
		return rankSolutions(top, p.rankBy ?? 'robust').slice(0, keep);
	}

	return {
		step(budget_ms: number) {
			if (finished) return true;
			const t0 = Date.now();
			while (done < total) {
				solveCombo(jobs[done]);
				done++;
				if ((done & 7) === 0 && Date.now() - t0 >= budget_ms) return false;
			}
			finished = finish();
			return true;
		},
		progress: () => ({ done, total }),
		results: () => finished ?? finish()
	};
}

/** Run a whole search synchronously (CLI, bench, tests). */
export function searchMatches(p: MatchProblem): MatchSolution[] {
	const s = createSearch(p);
	while (!s.step(1e9));
	return s.results();
}

/** Efficiency, losses and tolerances of lenses (inventory indices) placed at z. */
export function describe(p: MatchProblem, idx: number[], z: number[]): MatchSolution {
	const f = idx.map((i) => p.inventory[i].f_m);
	const dia = idx.map((i) => p.inventory[i].diameter_m);
	const e = evaluate(p.input, p.target, f, z, dia);
	const eta = e.total;
	const lenses: LensPlacement[] = idx.map((li, i) => {
		const at = (dz: number, scale: number) => {
			const zz = [...z];
			const ff = [...f];
			zz[i] += dz;
			ff[i] *= scale;
			return evaluate(p.input, p.target, ff, zz, dia).total;
		};
		const positionLoss = Math.max(0, eta - Math.min(at(1e-3, 1), at(-1e-3, 1)));
		const focalLoss = Math.max(0, eta - Math.min(at(0, 1.01), at(0, 0.99)));
		return { label: p.inventory[li].label, f_m: f[i], z_m: z[i], diameter_m: dia[i], positionLoss, focalLoss };
	});
	const sensitivity = lenses.reduce((s, l) => s + l.positionLoss + l.focalLoss, 0);
	return { lenses, couplingX: e.x, couplingY: e.y, transmitted: e.transmitted, efficiency: eta, sensitivity, length_m: p.target.z_m - z[0] };
}

/**
 * Rank solutions. 'robust' (default): by the efficiency left in the worst case of the ±1 mm / ±1 %
 * errors (efficiency − sensitivity), ties (within 0.1 %) broken by the shorter length;
 * 'efficiency', 'tolerance' (smallest sensitivity among solutions within 1 % of the best efficiency first)
 * and 'length' sort by that figure alone.
 */
export function rankSolutions(list: MatchSolution[], by: RankBy): MatchSolution[] {
	const s = [...list];
	const robust = (m: MatchSolution) => m.efficiency - m.sensitivity;
	if (by === 'efficiency') s.sort((a, b) => b.efficiency - a.efficiency);
	else if (by === 'length') s.sort((a, b) => a.length_m - b.length_m);
	else if (by === 'tolerance') {
		const best = Math.max(...s.map((m) => m.efficiency), 0);
		s.sort((a, b) => Number(b.efficiency >= best - 0.01) - Number(a.efficiency >= best - 0.01) || a.sensitivity - b.sensitivity);
	} else s.sort((a, b) => (Math.abs(robust(a) - robust(b)) > 1e-3 ? robust(b) - robust(a) : a.length_m - b.length_m));
	return s;
}
