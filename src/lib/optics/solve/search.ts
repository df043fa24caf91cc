/**
 * Mode matching from a lens inventory with 1, 2 or 3 stock lenses on a rail.
 *
 * The figure that places and ranks is the embedded-Gaussian coupling of evaluate.ts (the same at every
 * plane). At a lens plane z, with u = 1/q̂ of the arriving beam (b) and of the target traced back to z (t),
 * A = −Im u_b, B = −Im u_t and g(z) = Re u_b − Re u_t, the coupling on one axis after a lens f is
 *   η = 2·sqrt(A·B) / sqrt((A + B)² + (g(z) − 1/f)²)
 * (the overlap of overlap.ts written at the lens plane; Joyce & DeLoach 1984, Kogelnik 1964). A and B vary
 * slowly along the rail, g(z) − 1/f changes sign where the last lens brings the curvatures together, so
 * the best place of the last lens, given the lenses before it, is next to a root of g(z) = 1/f — a 1-D
 * root, however sharp the focus (a fibre's peak is a few tens of µm wide). The search therefore:
 *  1. scans the lenses before the last on a coarse grid and puts the last lens at the roots of
 *     g(z) = 1/f (one lens: every lens type; two lenses: every ordered pair); for three lenses the first
 *     two are scanned for every ordered pair and the third lens is not scanned at all: where the widths of
 *     the arriving beam and of the target are equal (a quadratic in z), g(z) is the power a lens there needs;
 *     the nearest shelf powers (binary search) are placed at their own roots. The work grows as N² in the
 *     number of lens types, never N³;
 *  2. keeps the best candidates (bounded pool) and refines them continuously: the last lens by a
 *     bracketed root and Brent's maximisation over the peak around it, the lenses before it by Brent
 *     line searches (R. P. Brent, "Algorithms for Minimization without Derivatives", 1973, ch. 5), to 1 µm;
 *  3. reads out tolerances on the same figure (±1 mm, ±1 % f, the shift that costs 1 %, and the target's
 *     lateral, tilt and axial tolerances) and ranks.
 *
 * The search runs in slices (`step(budget_ms)`) so a worker can report progress and accept a cancel.
 * Nothing here spreads an array into arguments: inventories of any length are safe.
 */
import { requireThat } from '../constants';
import { alignmentTolerance } from '../overlap';
import { evaluate, fundamentalFraction, makeScorer } from './evaluate';
import type { InputBeam, Interval, LensPlacement, MatchConstraints, MatchSolution, StockLens, TargetMode, TargetTolerance } from './types';

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

/** Grid sizes of the scan: one lens (last-lens roots), two lenses (first lens × last-lens roots), three lenses (first two). */
const GRID1 = 64;
const GRID2_FIRST = 20;
const GRID2_LAST = 16;
const GRID3 = 7;
/** Ranges each lens slot may use, clipped to the rail and to the target plane. */
function slotRanges(c: MatchConstraints, n: number, targetZ: number): Interval[] {
	const out: Interval[] = [];
	for (let i = 0; i < n; i++) {
		const s = c.slots[i] ?? c.rail;
		out.push({ from_m: Math.max(s.from_m, c.rail.from_m), to_m: Math.min(s.to_m, c.rail.to_m, targetZ) });
	}
	return out;
}

/** A lens type: inventory entries with the same focal length and diameter share one (counts added). */
interface LensType {
	f: number;
	dia: number | null;
	count: number;
	/** First inventory index (its label names the type). */
	idx: number;
}

interface Candidate {
	t: number[];
	z: number[];
	est: number;
}

interface Raw {
	t: number[];
	z: number[];
	eta: number;
}

/** Brent's one-dimensional maximisation on [a, b] (golden section with parabolic steps; Brent 1973, ch. 5). */
export function brentMax(f: (x: number) => number, a: number, b: number, tol: number, maxIt = 40): { x: number; fx: number } {
	const C = 0.381966011250105;
	let x = a + C * (b - a);
	let w = x;
	let v = x;
	let fx = -f(x);
	let fw = fx;
	let fv = fx;
	let d = 0;
	let e = 0;
	for (let it = 0; it < maxIt; it++) {
		const m = 0.5 * (a + b);
		const tol1 = 1e-10 * Math.abs(x) + tol / 3;
		const tol2 = 2 * tol1;
		if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) break;
		let golden = true;
		if (Math.abs(e) > tol1) {
			let r = (x - w) * (fx - fv);
			let q = (x - v) * (fx - fw);
			let p = (x - v) * q - (x - w) * r;
			q = 2 * (q - r);
			if (q > 0) p = -p;
			else q = -q;
			const eOld = e;
			e = d;
			if (!(Math.abs(p) >= Math.abs(0.5 * q * eOld) || p <= q * (a - x) || p >= q * (b - x))) {
				d = p / q;
				const u = x + d;
				if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
				golden = false;
			}
		}
		if (golden) {
			e = (x >= m ? a : b) - x;
			d = C * e;
		}
		const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
		const fu = -f(u);
		if (fu <= fx) {
			if (u >= x) a = x;
			else b = x;
			v = w;
			fv = fw;
			w = x;
			fw = fx;
			x = u;
			fx = fu;
		} else {
			if (u < x) a = u;
			else b = u;
			if (fu <= fw || w === x) {
				v = w;
				fv = fw;
				w = u;
				fw = fu;
			} else if (fu <= fv || v === x || v === w) {
				v = u;
				fv = fu;
			}
		}
	}
	return { x, fx: -fx };
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
	const { input, target } = p;
	const lam = input.wavelength_m;
	const minS = c.minSpacing_m;
	const zt = target.z_m;

	// Lens types (same f and diameter solved once), and their order by optical power for the nearest-power look-up.
	const types: LensType[] = [];
	const byKey = new Map<string, number>();
	p.inventory.forEach((l, i) => {
		if (l.count < 1) return;
		const key = `${l.f_m}/${l.diameter_m}`;
		const k = byKey.get(key);
		if (k === undefined) {
			byKey.set(key, types.length);
			types.push({ f: l.f_m, dia: l.diameter_m, count: l.count, idx: i });
		} else types[k].count += l.count;
	});
	const NT = types.length;
	const byPower = Array.from({ length: NT }, (_, i) => i).sort((a, b) => 1 / types[a].f - 1 / types[b].f);
	const powers = byPower.map((i) => 1 / types[i].f);

	const round = input.x.q.re === input.y.q.re && input.x.q.im === input.y.q.im && target.x.re === target.y.re && target.x.im === target.y.im;
	const nAx = round ? 1 : 2;
	const inRe = [input.x.q.re, input.y.q.re];
	const inIm = [input.x.q.im, input.y.q.im];
	const tRe = [target.x.re, target.y.re];
	const tIm = [target.x.im, target.y.im];

	const blocked = (z: number) => {
		for (const k of c.keepOut) if (z >= k.from_m && z <= k.to_m) return true;
		return false;
	};
	const available = (t: number[]) => {
		for (let i = 0; i < t.length; i++) {
			let used = 0;
			for (let j = 0; j < t.length; j++) if (t[j] === t[i]) used++;
			if (used > types[t[i]].count) return false;
		}
		return true;
	};

	// Beam just after the lenses before the last one: per-axis q̂ (re, im) at plane zp. Shared scratch.
	const bRe = [0, 0];
	const bIm = [0, 0];
	let zp = 0;
	const prefix = (t: ArrayLike<number>, z: ArrayLike<number>, m: number) => {
		for (let a = 0; a < nAx; a++) {
			let re = inRe[a];
			let im = inIm[a];
			let prev = 0;
			for (let i = 0; i < m; i++) {
				re += z[i] - prev;
				prev = z[i];
				const den = re * re + im * im;
				const ur = re / den - 1 / types[t[i]].f;
				const ui = -im / den;
				const d2 = ur * ur + ui * ui;
				re = ur / d2;
				im = -ui / d2;
			}
			bRe[a] = re;
			bIm[a] = im;
		}
		zp = m > 0 ? z[m - 1] : 0;
	};
	/** Mean over the axes of g(z) = Re u_b − Re u_t for the beam in the scratch (before the last lens). */
	const gOf = (z: number) => {
		let s = 0;
		for (let a = 0; a < nAx; a++) {
			const r = bRe[a] + (z - zp);
			const t = tRe[a] - (zt - z);
			s += r / (r * r + bIm[a] * bIm[a]) - t / (t * t + tIm[a] * tIm[a]);
		}
		return s / nAx;
	};
	/** dg/dz (mean over axes): d Re(1/q)/dz = −Re(1/q²). */
	const dgOf = (z: number) => {
		let s = 0;
		for (let a = 0; a < nAx; a++) {
			const r = bRe[a] + (z - zp);
			const db = r * r + bIm[a] * bIm[a];
			const t = tRe[a] - (zt - z);
			const dt = t * t + tIm[a] * tIm[a];
			s += -(r * r - bIm[a] * bIm[a]) / (db * db) + (t * t - tIm[a] * tIm[a]) / (dt * dt);
		}
		return s / nAx;
	};
	/** A + B (mean over axes) at z: the peak half-width of η along z is (A + B)/|g′|. */
	const abOf = (z: number) => {
		let s = 0;
		for (let a = 0; a < nAx; a++) {
			const r = bRe[a] + (z - zp);
			const t = tRe[a] - (zt - z);
			s += bIm[a] / (r * r + bIm[a] * bIm[a]) + tIm[a] / (t * t + tIm[a] * tIm[a]);
		}
		return s / nAx;
	};
	/** Embedded-Gaussian coupling (both axes, apertures left out) with the last lens 1/f at z: the scan's estimate. */
	const etaOf = (z: number, invF: number) => {
		let eta = 1;
		for (let a = 0; a < nAx; a++) {
			const r = bRe[a] + (z - zp);
			const db = r * r + bIm[a] * bIm[a];
			const t = tRe[a] - (zt - z);
			const dt = t * t + tIm[a] * tIm[a];
			const A = bIm[a] / db;
			const B = tIm[a] / dt;
			const g = r / db - invF - t / dt;
			eta *= (2 * Math.sqrt(A * B)) / Math.sqrt((A + B) * (A + B) + g * g);
		}
		return round ? eta * eta : eta;
	};
	/**
	 * Where the widths of the arriving beam and of the traced-back target are equal on axis a (a quadratic
	 * in z); when they never are in [lo, hi], the vertex (closest approach) or the middle, and returns false.
	 */
	const equalWidths = (a: number, lo: number, hi: number, out: number[]): boolean => {
		out.length = 0;
		// |q_b(z)|²/Im q_b = |q_t(z)|²/Im q_t with q_b = (z + p) + i·bi, q_t = (z + s) + i·ti.
		const pp = bRe[a] - zp;
		const ss = tRe[a] - zt;
		const bi = bIm[a];
		const ti = tIm[a];
		const A2 = ti - bi;
		const B1 = 2 * (pp * ti - ss * bi);
		const C0 = (pp * pp + bi * bi) * ti - (ss * ss + ti * ti) * bi;
		if (Math.abs(A2) <= 1e-12 * (ti + bi)) {
			if (B1 !== 0) {
				const z = -C0 / B1;
				if (z >= lo && z <= hi) out.push(z);
			}
		} else {
			const disc = B1 * B1 - 4 * A2 * C0;
			if (disc >= 0) {
				const sq = Math.sqrt(disc);
				const za = (-B1 + sq) / (2 * A2);
				const zb = (-B1 - sq) / (2 * A2);
				if (za >= lo && za <= hi) out.push(za);
				if (zb >= lo && zb <= hi) out.push(zb);
			}
			if (out.length === 0) {
				out.push(Math.min(hi, Math.max(lo, -B1 / (2 * A2))));
				return false;
			}
		}
		if (out.length === 0) {
			out.push(0.5 * (lo + hi));
			return false;
		}
		return true;
	};
	/** Upper bound of the coupling with any lens at z: the curvature term at its best (zero), widths as they are. */
	const boundOf = (z: number) => {
		let eta = 1;
		for (let a = 0; a < nAx; a++) {
			const r = bRe[a] + (z - zp);
			const t = tRe[a] - (zt - z);
			const A = bIm[a] / (r * r + bIm[a] * bIm[a]);
			const B = tIm[a] / (t * t + tIm[a] * tIm[a]);
			eta *= (2 * Math.sqrt(A * B)) / (A + B);
		}
		return round ? eta * eta : eta;
	};
	let best3 = 0;
	/** Newton steps on g(z) = 1/f from z, kept in [lo, hi]. */
	const newtonRoot = (z: number, invF: number, lo: number, hi: number, steps: number) => {
		for (let i = 0; i < steps; i++) {
			const d = dgOf(z);
			if (d === 0) break;
			let nz = z - (gOf(z) - invF) / d;
			if (!(nz >= lo)) nz = 0.5 * (z + lo);
			if (!(nz <= hi)) nz = 0.5 * (z + hi);
			if (Math.abs(nz - z) < 1e-9) return nz;
			z = nz;
		}
		return z;
	};

	// Scan jobs: one per (lens count, first lens type). Candidates per lens count.
	const counts = [...new Set(c.lensCounts)].sort();
	const scanJobs: { n: number; i: number }[] = [];
	for (const n of counts) for (let i = 0; i < NT; i++) scanJobs.push({ n, i });
	const cands: Record<number, Candidate[]> = { 1: [], 2: [], 3: [] };
	const rangesFor: Record<number, Interval[]> = {};
	for (const n of counts) rangesFor[n] = slotRanges(c, n, zt);

	/** Roots of g(z) = 1/f on a grid of `G` points over [lo, hi] (linear interpolation in the cell), each with its estimate; plus the grid's best point. */
	const rootsOnGrid = (invF: number, lo: number, hi: number, G: number, found: (z: number, est: number) => void) => {
		const h = (hi - lo) / (G - 1 || 1);
		let prevZ = lo;
		let prevG = gOf(lo) - invF;
		let any = false;
		for (let g = 1; g < G; g++) {
			const z = g === G - 1 ? hi : lo + g * h;
			const v = gOf(z) - invF;
			if ((v <= 0 && prevG > 0) || (v >= 0 && prevG < 0)) {
				const r = prevZ + ((z - prevZ) * prevG) / (prevG - v);
				found(r, etaOf(r, invF));
				any = true;
			}
			prevZ = z;
			prevG = v;
		}
		if (any) return;
		// No root: the last lens cannot bring the curvatures together here; offer the grid's best point.
		let bestZ = lo;
		let bestE = -1;
		for (let g = 0; g < G; g++) {
			const z = g === G - 1 ? hi : lo + g * h;
			if (blocked(z)) continue;
			const e = etaOf(z, invF);
			if (e > bestE) {
				bestE = e;
				bestZ = z;
			}
		}
		if (bestE >= 0) found(bestZ, bestE);
	};

	function scan1(ti: number) {
		const R = rangesFor[1][0];
		if (R.to_m < R.from_m) return;
		prefix([], [], 0);
		const list: Candidate[] = [];
		rootsOnGrid(1 / types[ti].f, R.from_m, R.to_m, GRID1, (z, est) => list.push({ t: [ti], z: [z], est }));
		for (const k of list) cands[1].push(k);
	}

	function scan2(ti: number) {
		const R = rangesFor[2];
		if (R[0].to_m < R[0].from_m || R[1].to_m < R[1].from_m) return;
		const h1 = (R[0].to_m - R[0].from_m) / (GRID2_FIRST - 1);
		const t = [ti, 0];
		const z = [0, 0];
		// Best and second best (first lens at least two cells away) of the current pair.
		let e1 = -1;
		let z11 = 0;
		let z12 = 0;
		let e2 = -1;
		let z21 = 0;
		let z22 = 0;
		let z1 = 0;
		const found = (z2: number, est: number) => {
			if (est > e1) {
				if (e1 >= 0 && Math.abs(z11 - z1) > 2 * h1) {
					e2 = e1;
					z21 = z11;
					z22 = z12;
				}
				e1 = est;
				z11 = z1;
				z12 = z2;
			} else if (Math.abs(z11 - z1) > 2 * h1 && est > e2) {
				e2 = est;
				z21 = z1;
				z22 = z2;
			}
		};
		for (let tj = 0; tj < NT; tj++) {
			t[1] = tj;
			if (!available(t)) continue;
			const invF = 1 / types[tj].f;
			e1 = -1;
			e2 = -1;
			for (let g = 0; g < GRID2_FIRST; g++) {
				z1 = R[0].from_m + g * h1;
				if (blocked(z1)) continue;
				const lo = Math.max(R[1].from_m, z1 + minS);
				const hi = R[1].to_m;
				if (hi < lo) continue;
				z[0] = z1;
				prefix(t, z, 1);
				rootsOnGrid(invF, lo, hi, GRID2_LAST, found);
			}
			if (e1 >= 0) cands[2].push({ t: [ti, tj], z: [z11, z12], est: e1 });
			if (e2 >= 0) cands[2].push({ t: [ti, tj], z: [z21, z22], est: e2 });
		}
	}

	const roots: number[] = [];
	function scan3(ti: number) {
		const R = rangesFor[3];
		if (R.some((r) => r.to_m < r.from_m)) return;
		const h1 = (R[0].to_m - R[0].from_m) / (GRID3 - 1);
		const t = [ti, 0, 0];
		const z = [0, 0, 0];
		const pair = [ti, 0];
		const s1Re = [0, 0];
		const s1Im = [0, 0];
		// Best and second best (another third lens) of the current pair: estimate, third type, positions.
		let e1 = -1;
		let k1 = -1;
		const p1 = [0, 0, 0];
		let e2 = -1;
		let k2 = -1;
		const p2 = [0, 0, 0];
		for (let tj = 0; tj < NT; tj++) {
			pair[1] = tj;
			if (!available(pair)) continue;
			t[1] = tj;
			const inv2 = 1 / types[tj].f;
			e1 = -1;
			e2 = -1;
			for (let g1 = 0; g1 < GRID3; g1++) {
				const z1 = R[0].from_m + g1 * h1;
				if (blocked(z1)) continue;
				const lo2 = Math.max(R[1].from_m, z1 + minS);
				if (R[1].to_m < lo2) continue;
				const h2 = (R[1].to_m - lo2) / (GRID3 - 1);
				z[0] = z1;
				prefix(t, z, 1);
				s1Re[0] = bRe[0];
				s1Re[1] = bRe[1];
				s1Im[0] = bIm[0];
				s1Im[1] = bIm[1];
				for (let g2 = 0; g2 < GRID3; g2++) {
					const z2 = lo2 + g2 * h2;
					if (blocked(z2)) continue;
					const lo3 = Math.max(R[2].from_m, z2 + minS);
					const hi3 = R[2].to_m;
					if (hi3 < lo3) continue;
					// The beam after lens 2 from the beam after lens 1 (kept per z1).
					for (let a = 0; a < nAx; a++) {
						const re = s1Re[a] + (z2 - z1);
						const im = s1Im[a];
						const den = re * re + im * im;
						const ur = re / den - inv2;
						const ui = -im / den;
						const d2 = ur * ur + ui * ui;
						bRe[a] = ur / d2;
						bIm[a] = -ui / d2;
					}
					zp = z2;
					for (let a = 0; a < nAx; a++) {
						const exact = equalWidths(a, lo3, hi3, roots);
						for (let r = 0; r < roots.length; r++) {
							const zs = roots[r];
							// Prune by bound: widths that never meet cap the coupling whatever the third lens.
							if (!exact && boundOf(zs) < 0.5 * best3) continue;
							const need = gOf(zs);
							// Nearest shelf powers on both sides (binary search in the power order), skipping types already used up.
							let lo = 0;
							let hi = NT;
							while (lo < hi) {
								const mid = (lo + hi) >> 1;
								if (powers[mid] < need) lo = mid + 1;
								else hi = mid;
							}
							for (let side = 0; side < 2; side++) {
								const dir = side === 0 ? -1 : 1;
								for (let k = side === 0 ? lo - 1 : lo, tries = 0; k >= 0 && k < NT && tries < 4; k += dir, tries++) {
									t[2] = byPower[k];
									if (!available(t)) continue;
									const invF = powers[k];
									const z3 = newtonRoot(zs, invF, lo3, hi3, 3);
									const est = blocked(z3) ? 0 : etaOf(z3, invF);
									if (est > best3) best3 = est;
									if (est > e1) {
										if (e1 >= 0 && k1 !== t[2]) {
											e2 = e1;
											k2 = k1;
											p2[0] = p1[0];
											p2[1] = p1[1];
											p2[2] = p1[2];
										}
										e1 = est;
										k1 = t[2];
										p1[0] = z1;
										p1[1] = z2;
										p1[2] = z3;
									} else if (k1 !== t[2] && est > e2) {
										e2 = est;
										k2 = t[2];
										p2[0] = z1;
										p2[1] = z2;
										p2[2] = z3;
									}
									break;
								}
							}
						}
					}
				}
			}
			if (e1 >= 0) cands[3].push({ t: [ti, tj, k1], z: [p1[0], p1[1], p1[2]], est: e1 });
			if (e2 >= 0) cands[3].push({ t: [ti, tj, k2], z: [p2[0], p2[1], p2[2]], est: e2 });
		}
	}

	// Refinement of one candidate: continuous, the last lens at its root and peak, the others by Brent line searches.
	function refine(cd: Candidate): Raw | null {
		const n = cd.t.length;
		const R = rangesFor[n];
		const f = cd.t.map((i) => types[i].f);
		const dia = cd.t.map((i) => types[i].dia);
		const invLast = 1 / f[n - 1];
		const scorer = makeScorer(input, target, f, dia);
		const z = Float64Array.from(cd.z);
		const feasible = () => {
			for (let i = 0; i < n; i++) {
				if (!(z[i] >= R[i].from_m - 1e-12 && z[i] <= R[i].to_m + 1e-12) || blocked(z[i])) return false;
				if (i > 0 && z[i] - z[i - 1] < minS - 1e-12) return false;
			}
			return true;
		};
		const score = () => (feasible() ? scorer(z) : -1);
		const lastStep = (R[n - 1].to_m - R[n - 1].from_m) / 16 || 1e-3;
		let guess = z[n - 1];
		let best = -1;
		const bestZ = Float64Array.from(z);
		const keepBest = (s: number) => {
			if (s > best) {
				best = s;
				bestZ.set(z);
			}
			return s;
		};
		const at = (x: number) => {
			z[n - 1] = x;
			return score();
		};
		// The best point of the last lens's line search; `extra` tries points the search may step over.
		let bx = 0;
		let bs = -1;
		const extra = (x: number, lo: number, hi: number) => {
			if (x >= lo && x <= hi) {
				const s = at(x);
				if (s > bs) {
					bs = s;
					bx = x;
				}
			}
		};
		/** Place the last lens for the lenses before it as they are in z; returns the score. */
		const placeLast = () => {
			const lo = n > 1 ? Math.max(R[n - 1].from_m, z[n - 2] + minS) : R[n - 1].from_m;
			const hi = R[n - 1].to_m;
			if (hi < lo) return -1;
			prefix(cd.t, z, n - 1);
			let a = Math.max(lo, guess - lastStep);
			let b = Math.min(hi, guess + lastStep);
			if (b < a) {
				a = lo;
				b = hi;
			}
			// A sign change of g(z) − 1/f in [a, b], the one nearest the guess.
			let root = NaN;
			const S = 8;
			let pz = a;
			let pv = gOf(a) - invLast;
			let nearest = Infinity;
			let ra = 0;
			let rb = 0;
			for (let i = 1; i <= S; i++) {
				const zz = a + ((b - a) * i) / S;
				const v = gOf(zz) - invLast;
				if ((v <= 0 && pv > 0) || (v >= 0 && pv < 0)) {
					const dist = Math.abs(0.5 * (pz + zz) - guess);
					if (dist < nearest) {
						nearest = dist;
						ra = pz;
						rb = zz;
					}
				}
				pz = zz;
				pv = v;
			}
			let wa = a;
			let wb = b;
			if (nearest < Infinity) {
				let va = gOf(ra) - invLast;
				for (let i = 0; i < 60 && rb - ra > 1e-8; i++) {
					const m = 0.5 * (ra + rb);
					const vm = gOf(m) - invLast;
					if ((vm > 0) === (va > 0)) {
						ra = m;
						va = vm;
					} else rb = m;
				}
				root = 0.5 * (ra + rb);
				const w = Math.min(b - a, Math.max(2e-6, (6 * abOf(root)) / Math.abs(dgOf(root) || 1e-300)));
				wa = Math.max(a, root - w);
				wb = Math.min(b, root + w);
			}
			const r = brentMax(at, wa, wb, 5e-7, 60);
			bx = r.x;
			bs = r.fx;
			if (Number.isFinite(root)) extra(root, lo, hi);
			for (const k of c.keepOut) {
				if (k.to_m >= wa && k.from_m <= wb) {
					extra(k.from_m - 1e-9, lo, hi);
					extra(k.to_m + 1e-9, lo, hi);
				}
			}
			z[n - 1] = bx;
			if (bs >= 0) guess = bx;
			return keepBest(bs);
		};
		placeLast();
		if (n >= 2) {
			const steps = [(R[0].to_m - R[0].from_m) / (n === 2 ? GRID2_FIRST - 1 : GRID3 - 1)];
			steps.push(n === 3 ? (R[1].to_m - R[1].from_m) / (GRID3 - 1) : 0);
			const cycles = n === 2 ? 1 : 3;
			for (let cyc = 0; cyc < cycles; cyc++) {
				for (let i = 0; i < n - 1; i++) {
					z.set(bestZ);
					guess = bestZ[n - 1];
					const h = steps[i] * (n === 2 ? 1 : Math.pow(0.5, cyc));
					const lo = Math.max(R[i].from_m, i > 0 ? z[i - 1] + minS : -Infinity, z[i] - h);
					const hi = Math.min(R[i].to_m, z[i] + h, i < n - 2 ? z[i + 1] - minS : Infinity);
					if (!(hi > lo)) continue;
					brentMax(
						(x) => {
							z[i] = x;
							return placeLast();
						},
						lo,
						hi,
						1e-6,
						n === 2 ? 40 : 25
					);
				}
			}
		}
		z.set(bestZ);
		if (!(best >= 0) || !feasible()) return null;
		return { t: cd.t, z: Array.from(bestZ), eta: best };
	}

	let raws: Raw[] = [];
	const keep = p.keep ?? 20;
	const poolSize = Math.max(keep * 3, 40);
	let refineJobs: Candidate[] | null = null;
	let done = 0;
	let refined = 0;
	let finished: MatchSolution[] | null = null;

	/** The bounded pool: per lens count the best candidates by estimate, at most two per combination. */
	function pool(): Candidate[] {
		const out: Candidate[] = [];
		for (const n of counts) {
			const list = cands[n].sort((a, b) => b.est - a.est);
			const per = new Map<string, number>();
			let taken = 0;
			const limit = n === 1 ? Infinity : poolSize;
			for (const cd of list) {
				if (taken >= limit) break;
				const key = cd.t.join(',');
				const k = per.get(key) ?? 0;
				if (k >= 2) continue;
				per.set(key, k + 1);
				out.push(cd);
				taken++;
			}
			cands[n] = [];
		}
		return out;
	}

	function finish(): MatchSolution[] {
		const list = raws.slice().sort((a, b) => b.eta - a.eta);
		const top: MatchSolution[] = [];
		const limit = Math.max(keep * 3, 30);
		for (const r of list) {
			if (top.length >= limit) break;
			top.push(describeCore(p, r.t.map((i) => types[i].idx), r.z));
		}
		return rankSolutions(top, p.rankBy ?? 'robust')
			.slice(0, keep)
			.map((m) => withTolerances(p, m));
	}

	function addRaw(r: Raw) {
		for (const o of raws) if (o.t.length === r.t.length && o.t.every((v, i) => v === r.t[i]) && o.z.every((v, i) => Math.abs(v - r.z[i]) < 5e-4)) {
			if (r.eta > o.eta) {
				o.z = r.z;
				o.eta = r.eta;
			}
			return;
		}
		raws.push(r);
	}

	return {
		step(budget_ms: number) {
			if (finished) return true;
			const t0 = Date.now();
			while (done < scanJobs.length) {
				const j = scanJobs[done];
				if (j.n === 1) scan1(j.i);
				else if (j.n === 2) scan2(j.i);
				else scan3(j.i);
				done++;
				if (Date.now() - t0 >= budget_ms) return false;
			}
			if (!refineJobs) refineJobs = pool();
			while (refined < refineJobs.length) {
				const r = refine(refineJobs[refined]);
				if (r) addRaw(r);
				refined++;
				if ((refined & 7) === 0 && Date.now() - t0 >= budget_ms) return false;
			}
			finished = finish();
			raws = [];
			return true;
		},
		progress: () => ({ done: done + refined, total: scanJobs.length + (refineJobs ? refineJobs.length : poolSize) }),
		results: () => finished ?? finish()
	};
}

/** Run a whole search synchronously (CLI, bench, tests). */
export function searchMatches(p: MatchProblem): MatchSolution[] {
	const s = createSearch(p);
	while (!s.step(1e9));
	return s.results();
}

/** Where η(x) falls to `goal` on one side of x0 (bisection after doubling steps from `h`); Infinity when it never does within `limit`. */
function lossPoint(eta: (x: number) => number, goal: number, h: number, limit: number): number {
	let a = 0;
	let b = h;
	while (eta(b) > goal) {
		a = b;
		b *= 2;
		if (b > limit) return Infinity;
	}
	for (let i = 0; i < 30 && b - a > 1e-4 * b; i++) {
		const m = 0.5 * (a + b);
		if (eta(m) > goal) a = m;
		else b = m;
	}
	return 0.5 * (a + b);
}

/** Efficiency, losses and tolerances of lenses (inventory indices) placed at z. */
export function describe(p: MatchProblem, idx: number[], z: number[]): MatchSolution {
	return withTolerances(p, describeCore(p, idx, z));
}

/** Efficiency and the ±1 mm / ±1 % losses that ranking needs (the 1 % tolerances left at 0). */
function describeCore(p: MatchProblem, idx: number[], z: number[]): MatchSolution {
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
		return { label: p.inventory[li].label, f_m: f[i], z_m: z[i], diameter_m: dia[i], positionLoss, focalLoss, shiftFor1pct_m: 0 };
	});
	const sensitivity = lenses.reduce((s, l) => s + l.positionLoss + l.focalLoss, 0);
	const fraction = fundamentalFraction(p.input.x.m2) * fundamentalFraction(p.input.y.m2);
	return {
		lenses,
		couplingX: e.x,
		couplingY: e.y,
		transmitted: e.transmitted,
		efficiency: eta,
		fundamentalFraction: fraction,
		fundamentalModePower: eta * fraction,
		targetTolerance: { offset_m: 0, tilt_rad: 0, axial_m: 0, axial_zR: 0 },
		sensitivity,
		length_m: p.target.z_m - z[0]
	};
}

/** Add the shift of each lens and the target misalignments that cost 1 % (relative). */
function withTolerances(p: MatchProblem, m: MatchSolution): MatchSolution {
	const f = m.lenses.map((l) => l.f_m);
	const z = m.lenses.map((l) => l.z_m);
	const dia = m.lenses.map((l) => l.diameter_m);
	const goal = 0.99 * m.efficiency;
	const lenses = m.lenses.map((l, i) => {
		const at = (dz: number) => {
			const zz = [...z];
			zz[i] += dz;
			return evaluate(p.input, p.target, f, zz, dia).total;
		};
		const shift = Math.min(lossPoint(at, goal, 1e-7, 1), lossPoint((d) => at(-d), goal, 1e-7, 1));
		return { ...l, shiftFor1pct_m: Number.isFinite(shift) ? shift : 1 };
	});
	return { ...m, lenses, targetTolerance: targetTolerance(p, f, z, dia) };
}

/**
 * Misalignments of the target that each cost 1 % of the coupling (relative): lateral offset and tilt
 * from the Gaussian factors of the overlap (Joyce & DeLoach 1984; overlap.ts alignmentTolerance), axial
 * shift by moving the target plane (bisection on the coupling), also in Rayleigh ranges of the target.
 */
function targetTolerance(p: MatchProblem, f: number[], z: number[], dia: (number | null)[]): TargetTolerance {
	const lam = p.input.wavelength_m;
	let qx = p.input.x.q;
	let qy = p.input.y.q;
	let prev = 0;
	for (let i = 0; i < f.length; i++) {
		const d = z[i] - prev;
		prev = z[i];
		for (const a of [0, 1]) {
			const q = a === 0 ? qx : qy;
			const re = q.re + d;
			const den = re * re + q.im * q.im;
			const ur = re / den - 1 / f[i];
			const ui = -q.im / den;
			const d2 = ur * ur + ui * ui;
			const out = { re: ur / d2, im: -ui / d2 };
			if (a === 0) qx = out;
			else qy = out;
		}
	}
	const d = p.target.z_m - prev;
	const bx = { re: qx.re + d, im: qx.im };
	const by = { re: qy.re + d, im: qy.im };
	const ax = alignmentTolerance({ q: bx }, { q: p.target.x }, lam, 0.01);
	const ay = alignmentTolerance({ q: by }, { q: p.target.y }, lam, 0.01);
	const eta0 = evaluate(p.input, p.target, f, z, dia).total;
	const zr = Math.min(p.target.x.im, p.target.y.im);
	// The target moves with its plane: the same q, given at z_t + dz.
	const shiftMode = (dz: number) => evaluate(p.input, { ...p.target, z_m: p.target.z_m + dz }, f, z, dia).total;
	const axial = Math.min(lossPoint(shiftMode, 0.99 * eta0, zr * 1e-3, 1e3), lossPoint((dz) => shiftMode(-dz), 0.99 * eta0, zr * 1e-3, 1e3));
	const axial_m = Number.isFinite(axial) ? axial : 1e3;
	return { offset_m: Math.min(ax.offset_m, ay.offset_m), tilt_rad: Math.min(ax.tilt_rad, ay.tilt_rad), axial_m, axial_zR: axial_m / zr };
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
		let best = 0;
		for (const m of s) if (m.efficiency > best) best = m.efficiency;
		s.sort((a, b) => Number(b.efficiency >= best - 0.01) - Number(a.efficiency >= best - 0.01) || a.sensitivity - b.sensitivity);
	} else s.sort((a, b) => (Math.abs(robust(a) - robust(b)) > 1e-3 ? robust(b) - robust(a) : a.length_m - b.length_m));
	return s;
}
