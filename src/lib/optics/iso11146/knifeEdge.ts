/**
 * Beam width from a knife-edge or slit scan: power behind a blade (or through a narrow slit) measured
 * at several blade positions x along one transverse axis.
 *
 * Knife edge. For a beam whose intensity along x is Gaussian with 1/e² radius w, the power passed by a
 * blade whose edge is at x is
 *
 *   P(x) = B + A·½·[1 + erf(√2·(x − x0)/w)]                                   (1)
 *
 * (integrate exp(−2(x−x0)²/w²) from −∞ to x; B is the detector's offset, A the beam power, A < 0 when
 * the blade covers the beam as x grows). Its derivative is the beam's line profile, whose standard
 * deviation is σ = w/2, so the second-moment (D4σ) diameter of a Gaussian is 4σ = 2w.
 *
 * Clip distances. Between the fractions p and 1 − p of the full power the blade travels
 * Δx(p) = 2·σ·Φ⁻¹(1 − p), where Φ is the standard normal distribution (from (1), Φ(t) = ½[1 + erf(t/√2)]).
 * So for a Gaussian D4σ = 4σ = 2·Δx(p)/Φ⁻¹(1 − p):
 *   10/90 %:       D4σ = 2/1.28155·Δx = 1.5606·Δx
 *   15.87/84.13 %: D4σ = 2·Δx (Δx = w, the clip pair at ±σ)
 *   16/84 %:       D4σ = 2/0.99446·Δx = 2.0111·Δx
 * Siegman, Sasnett & Johnston, "Choice of clip levels for beam width measurements using knife-edge
 * techniques", IEEE J. Quantum Electron. 27(4), 1098–1104 (1991), abstract (read): a clip level near
 * 10 % with a matched scale factor converts the clip width to the second-moment width exactly for a
 * TEM00 beam and nearly so for many other profiles; the factors above follow from (1). For beams that
 * are not Gaussian the 10/90 conversion is the better estimate of D4σ, which is why `d4sigma_m` comes
 * from it, while `w_m` is the radius of the best-fitting erf profile.
 *
 * Slit. A slit much narrower than the beam passes P(x) = B + A·exp(−2(x − x0)²/w²); the fit gives w
 * directly and D4σ = 2w for a Gaussian. The slit's own width broadens the profile; it is not removed.
 *
 * Units: SI throughout (x in m, power in W, or any power unit as long as it is the same for every row).
 */

export type ScanKind = 'knife' | 'slit';

export interface ScanPoint {
	x_m: number;
	/** Power passed by the blade or slit (W, or any consistent unit). */
	P_W: number;
}

export interface KnifeEdgeResult {
	kind: ScanKind;
	/** 1/e² radius of the fitted Gaussian profile, m. */
	w_m: number;
	/** Second-moment diameter: 1.5606 × the 10/90 clip distance (knife; fit value 2w when the scan does not reach both clip levels), 2w (slit), m. */
	d4sigma_m: number;
	/** How `d4sigma_m` was obtained. */
	d4sigmaFrom: 'clip10_90' | 'fit';
	/** Beam centre (where the blade passes half the power, or the slit profile peaks), m. */
	center_m: number;
	/** Blade travel between 10 % and 90 % of the fitted power (interpolated in the data), m; null if the scan does not reach both levels or for a slit. */
	clip10_90_m: number | null;
	/** Blade travel between 16 % and 84 %, m; null as above. */
	clip16_84_m: number | null;
	/** Fitted offset B and amplitude A of (1), in the power unit of the input. */
	baseline_W: number;
	amplitude_W: number;
	/** Standard uncertainties (1σ) from the fit covariance scaled by χ²/(n − 4); clip-based values by the noise over the local slope. */
	uncertainty: { w_m: number; d4sigma_m: number; center_m: number; clip10_90_m: number | null };
	/** Root-mean-square of the residuals P − P_fit, same unit as the power. */
	residualRms_W: number;
	points: number;
	/** Things the user should know: scan too short, too few points across the edge, noisy. */
	warnings: string[];
}

/** Points a scan needs at the least (four parameters plus one degree of freedom). */
export const MIN_SCAN_POINTS = 5;

const SQRT2 = Math.SQRT2;
const TWO_OVER_SQRTPI = 2 / Math.sqrt(Math.PI);

/**
 * The error function, to about 1e-14 relative. |x| < 3: its Maclaurin series; beyond, 1 − erfc(x)
 * with erfc from its continued fraction (modified Lentz). Source: Abramowitz & Stegun, "Handbook of
 * Mathematical Functions" 1964, eq. 7.1.5 (series) and 7.1.14 (continued fraction) — from memory.
 * Example: erf(1) = 0.8427007929497149.
 */
export function erf(x: number): number {
	if (Number.isNaN(x)) return NaN;
	const ax = Math.abs(x);
	if (ax < 3) {
		// erf x = 2/√π · Σ (−1)^n x^(2n+1) / (n! (2n+1))
		let term = x;
		let sum = x;
		const x2 = x * x;
		for (let n = 1; n < 200; n++) {
			term *= -x2 / n;
			const add = term / (2 * n + 1);
			sum += add;
			if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
		}
		return TWO_OVER_SQRTPI * sum;
	}
	const r = 1 - erfcLarge(ax);
	return x < 0 ? -r : r;
}

/** erfc(x) for x ≥ 3 by the continued fraction erfc x = e^(−x²)/√π · 1/(x + ½/(x + 1/(x + 3/2/(x + …)))). */
function erfcLarge(x: number): number {
	if (x > 27) return 0;
	// Lentz on b0 + a1/(b1 + a2/(b2 + …)) with b = x, a_k = k/2.
	const tiny = 1e-300;
	let f = x;
	let C = f;
	let D = 0;
	for (let k = 1; k < 500; k++) {
		const a = k / 2;
		D = x + a * D;
		if (Math.abs(D) < tiny) D = tiny;
		C = x + a / C;
		if (Math.abs(C) < tiny) C = tiny;
		D = 1 / D;
		const delta = C * D;
		f *= delta;
		if (Math.abs(delta - 1) < 1e-16) break;
	}
	return Math.exp(-x * x) / Math.sqrt(Math.PI) / f;
}

/**
 * Φ⁻¹(p): the standard normal quantile, by Newton's method on Φ(t) = ½[1 + erf(t/√2)]. 0 < p < 1.
 * Example: normalQuantile(0.9) = 1.2815515655446004.
 */
export function normalQuantile(p: number): number {
	if (!(p > 0 && p < 1)) throw new RangeError(`p must be between 0 and 1 (exclusive) — got ${p}`);
	let t = 0;
	for (let i = 0; i < 100; i++) {
		const F = 0.5 * (1 + erf(t / SQRT2));
		const pdf = Math.exp(-0.5 * t * t) / Math.sqrt(2 * Math.PI);
		const step = (F - p) / pdf;
		t -= Math.max(-2, Math.min(2, step));
		if (Math.abs(step) < 1e-15 * Math.max(1, Math.abs(t))) break;
	}
	return t;
}

/**
 * The factor that turns the blade travel between the fractions p and 1 − p into the second-moment
 * diameter of a Gaussian beam: D4σ = k·Δx with k = 2/Φ⁻¹(1 − p) (see the header).
 * Example: clipFactor(0.1) = 1.5606 (10/90 %), clipFactor(0.16) = 2.0111 (16/84 %).
 */
export function clipFactor(p: number): number {
	if (!(p > 0 && p < 0.5)) throw new RangeError(`clip level must be between 0 and 0.5 (exclusive) — got ${p}`);
	return 2 / normalQuantile(1 - p);
}

type Model = (x: number, p: number[]) => { f: number; grad: number[] };

const knifeModel: Model = (x, [B, A, x0, w]) => {
	const u = (SQRT2 * (x - x0)) / w;
	const e = erf(u);
	const g = TWO_OVER_SQRTPI * Math.exp(-u * u) * 0.5 * A; // A/2 · d erf/du
	return { f: B + 0.5 * A * (1 + e), grad: [1, 0.5 * (1 + e), (-g * SQRT2) / w, (-g * u) / w] };
};

const slitModel: Model = (x, [B, A, x0, w]) => {
	const s = (x - x0) / w;
	const e = Math.exp(-2 * s * s);
	return { f: B + A * e, grad: [1, e, (A * e * 4 * s) / w, (A * e * 4 * s * s) / w] };
};

/** Solve the n × n system M·v = r (row-major M) by Gaussian elimination with partial pivoting; null if singular. */
function solve(M: number[], r: number[], n: number): number[] | null {
	const a = M.slice();
	const b = r.slice();
	for (let c = 0; c < n; c++) {
		let piv = c;
		for (let k = c + 1; k < n; k++) if (Math.abs(a[k * n + c]) > Math.abs(a[piv * n + c])) piv = k;
		if (!(Math.abs(a[piv * n + c]) > 1e-300)) return null;
		if (piv !== c) {
			for (let j = 0; j < n; j++) [a[c * n + j], a[piv * n + j]] = [a[piv * n + j], a[c * n + j]];
			[b[c], b[piv]] = [b[piv], b[c]];
		}
		for (let k = c + 1; k < n; k++) {
			const m = a[k * n + c] / a[c * n + c];
			if (m === 0) continue;
			for (let j = c; j < n; j++) a[k * n + j] -= m * a[c * n + j];
			b[k] -= m * b[c];
		}
	}
	const v = new Array<number>(n).fill(0);
	for (let c = n - 1; c >= 0; c--) {
		let s = b[c];
		for (let j = c + 1; j < n; j++) s -= a[c * n + j] * v[j];
		v[c] = s / a[c * n + c];
	}
	return v;
}

/** Inverse of an n × n matrix via n solves; null if singular. */
function inverse(M: number[], n: number): number[] | null {
	const inv = new Array<number>(n * n).fill(0);
	for (let c = 0; c < n; c++) {
		const e = new Array<number>(n).fill(0);
		e[c] = 1;
		const col = solve(M, e, n);
		if (!col) return null;
		for (let r = 0; r < n; r++) inv[r * n + c] = col[r];
	}
	return inv;
}

interface LmResult {
	p: number[];
	cov: number[] | null;
	chi2: number;
}

/**
 * Levenberg–Marquardt least squares of a 4-parameter model (Press et al., "Numerical Recipes", 3rd ed.
 * 2007, §15.5 — from memory). Parameters are scaled by `scale` so that the normal matrix is well
 * conditioned whatever the units. cov = s²·(JᵀJ)⁻¹ with s² = χ²/(n − 4).
 */
function levenbergMarquardt(xs: number[], ys: number[], model: Model, p0: number[], scale: number[]): LmResult {
	const n = xs.length;
	const np = 4;
	let p = p0.slice();
	const chi2Of = (q: number[]) => {
		let s = 0;
		for (let i = 0; i < n; i++) {
			const d = ys[i] - model(xs[i], q).f;
			s += d * d;
		}
		return s;
	};
	let chi2 = chi2Of(p);
	let lambda = 1e-3;
	const normal = (q: number[]) => {
		const JtJ = new Array<number>(np * np).fill(0);
		const Jtr = new Array<number>(np).fill(0);
		for (let i = 0; i < n; i++) {
			const { f, grad } = model(xs[i], q);
			const g = grad.map((v, k) => v * scale[k]);
			const r = ys[i] - f;
			for (let a = 0; a < np; a++) {
				Jtr[a] += g[a] * r;
				for (let b = 0; b < np; b++) JtJ[a * np + b] += g[a] * g[b];
			}
		}
		return { JtJ, Jtr };
	};
	for (let iter = 0; iter < 200; iter++) {
		const { JtJ, Jtr } = normal(p);
		const M = JtJ.slice();
		for (let a = 0; a < np; a++) M[a * np + a] *= 1 + lambda;
		const step = solve(M, Jtr, np);
		if (!step) break;
		const trial = p.map((v, k) => v + step[k] * scale[k]);
		if (!(trial[3] > 0)) trial[3] = p[3] / 2;
		const c2 = chi2Of(trial);
		if (c2 < chi2) {
			const rel = (chi2 - c2) / Math.max(chi2, 1e-300);
			p = trial;
			chi2 = c2;
			lambda = Math.max(lambda / 10, 1e-12);
			if (rel < 1e-13) break;
		} else {
			lambda *= 10;
			if (lambda > 1e12) break;
		}
	}
	const { JtJ } = normal(p);
	const inv = inverse(JtJ, np);
	let cov: number[] | null = null;
	if (inv && n > np) {
		const s2 = chi2 / (n - np);
		cov = inv.map((v, idx) => v * s2 * scale[Math.floor(idx / np)] * scale[idx % np]);
	}
	return { p, cov, chi2 };
}

/**
 * Where the sorted normalised curve t(x) crosses `level`, nearest the centre (so noise in the far wings
 * cannot pick a spurious crossing). Between the two bracketing points the curve is the cubic through
 * the four nearest points (Lagrange), solved by bisection — far less biased on a coarse scan than a
 * straight line; a straight line is used where the cubic is not monotone there. null if never crossed.
 */
function crossing(xs: number[], t: number[], level: number, center_m: number): number | null {
	let best: number | null = null;
	let bestDist = Infinity;
	const n = xs.length;
	for (let i = 0; i + 1 < n; i++) {
		const a = t[i] - level;
		const b = t[i + 1] - level;
		if (!(a === 0 || a * b < 0 || (b === 0 && i + 2 === n))) continue;
		let x = a === b ? xs[i] : xs[i] + ((xs[i + 1] - xs[i]) * (0 - a)) / (b - a);
		if (a !== 0 && b !== 0 && n >= 4) {
			const j0 = Math.max(0, Math.min(n - 4, i - 1));
			const px = xs.slice(j0, j0 + 4);
			const pt = t.slice(j0, j0 + 4);
			const cubic = (u: number) => {
				let s = 0;
				for (let k = 0; k < 4; k++) {
					let l = 1;
					for (let m = 0; m < 4; m++) if (m !== k) l *= (u - px[m]) / (px[k] - px[m]);
					s += pt[k] * l;
				}
				return s - level;
			};
			// Monotone between the bracketing points? Check on a few interior samples.
			let monotone = true;
			let prev = cubic(xs[i]);
			for (let k = 1; k <= 8; k++) {
				const v = cubic(xs[i] + ((xs[i + 1] - xs[i]) * k) / 8);
				if ((v - prev) * (b - a) < 0) monotone = false;
				prev = v;
			}
			if (monotone) {
				let lo = xs[i], hi = xs[i + 1];
				const up = b > a;
				for (let k = 0; k < 60; k++) {
					const mid = (lo + hi) / 2;
					if (cubic(mid) < 0 === up) lo = mid;
					else hi = mid;
				}
				x = (lo + hi) / 2;
			}
		}
		const d = Math.abs(x - center_m);
		if (d < bestDist) {
			bestDist = d;
			best = x;
		}
	}
	return best;
}

/**
 * Fit a knife-edge (erf) or slit (Gaussian) scan. Throws RangeError for input that cannot be fitted
 * (fewer than MIN_SCAN_POINTS, repeated or non-finite positions, no change in power).
 * Example: a noiseless knife scan of w = 1 mm centred at 2 mm gives w_m = 0.001, center_m = 0.002,
 * clip10_90_m ≈ 1.2816e-3 (interpolation error shrinks with the step) and d4sigma_m ≈ 0.002.
 */
export function fitKnifeEdge(points: readonly ScanPoint[], kind: ScanKind = 'knife'): KnifeEdgeResult {
	if (points.length < MIN_SCAN_POINTS) throw new RangeError(`scan must have at least ${MIN_SCAN_POINTS} points — got ${points.length}`);
	const sorted = points.slice().sort((a, b) => a.x_m - b.x_m);
	const xs = sorted.map((p) => p.x_m);
	const ys = sorted.map((p) => p.P_W);
	for (let i = 0; i < xs.length; i++) {
		if (!Number.isFinite(xs[i]) || !Number.isFinite(ys[i])) throw new RangeError(`scan point ${i + 1} must be finite — got x = ${xs[i]}, P = ${ys[i]}`);
		if (i > 0 && xs[i] === xs[i - 1]) throw new RangeError(`scan positions must differ — x = ${xs[i]} m appears twice`);
	}
	let yMin = Infinity, yMax = -Infinity;
	for (const y of ys) {
		if (y < yMin) yMin = y;
		if (y > yMax) yMax = y;
	}
	if (!(yMax > yMin)) throw new RangeError('scan power must change across the scan — every reading is the same');
	const span = xs[xs.length - 1] - xs[0];
	const n = xs.length;
	const q = Math.max(1, Math.floor(n / 4));
	let head = 0, tail = 0;
	for (let i = 0; i < q; i++) {
		head += ys[i];
		tail += ys[n - 1 - i];
	}
	let p0: number[];
	if (kind === 'knife') {
		const rising = tail >= head;
		const B0 = rising ? yMin : yMax;
		const A0 = rising ? yMax - yMin : yMin - yMax;
		const t0 = ys.map((y) => (y - B0) / A0);
		const x50 = crossing(xs, t0, 0.5, (xs[0] + xs[n - 1]) / 2) ?? (xs[0] + xs[n - 1]) / 2;
		const x16 = crossing(xs, t0, 0.16, x50);
		const x84 = crossing(xs, t0, 0.84, x50);
		const w0 = x16 !== null && x84 !== null && x84 > x16 ? x84 - x16 : span / 4;
		p0 = [B0, A0, x50, w0];
	} else {
		let iMax = 0;
		for (let i = 1; i < n; i++) if (ys[i] > ys[iMax]) iMax = i;
		const B0 = Math.min(ys[0], ys[n - 1]);
		const A0 = yMax - B0;
		// Width from the area under the peak: ∫ A·exp(−2s²/w²) ds = A·w·√(π/2).
		let area = 0;
		for (let i = 0; i + 1 < n; i++) area += 0.5 * (ys[i] + ys[i + 1] - 2 * B0) * (xs[i + 1] - xs[i]);
		const w0 = area > 0 && A0 > 0 ? area / (A0 * Math.sqrt(Math.PI / 2)) : span / 4;
		p0 = [B0, A0, xs[iMax], w0];
	}
	const yScale = yMax - yMin;
	const fit = levenbergMarquardt(xs, ys, kind === 'knife' ? knifeModel : slitModel, p0, [yScale, yScale, p0[3], p0[3]]);
	const [B, A, x0, wFit] = fit.p;
	const w = Math.abs(wFit);
	const residualRms_W = Math.sqrt(fit.chi2 / n);
	const sd = (k: number) => (fit.cov ? Math.sqrt(Math.max(0, fit.cov[k * 4 + k])) : NaN);
	const warnings: string[] = [];
	if (!fit.cov) warnings.push(`only ${n} points: no residual degrees of freedom, so no uncertainty`);
	let clip10_90_m: number | null = null;
	let clip16_84_m: number | null = null;
	let clipSd: number | null = null;
	if (kind === 'knife') {
		const t = ys.map((y) => (y - B) / A);
		const x10 = crossing(xs, t, 0.1, x0);
		const x90 = crossing(xs, t, 0.9, x0);
		const x16 = crossing(xs, t, 0.16, x0);
		const x84 = crossing(xs, t, 0.84, x0);
		if (x10 !== null && x90 !== null) {
			clip10_90_m = Math.abs(x90 - x10);
			// Each crossing moves by the noise over the local slope of (1) there: at t = ±Φ⁻¹(0.9) standard
			// deviations (σ = w/2), dP/dx = |A|·√(2/π)/w·exp(−t²/2); the two crossings add in quadrature.
			const t90 = normalQuantile(0.9);
			const slope = (Math.abs(A) * Math.sqrt(2 / Math.PI) * Math.exp(-0.5 * t90 * t90)) / w;
			clipSd = (Math.SQRT2 * residualRms_W) / slope;
		}
		if (x16 !== null && x84 !== null) clip16_84_m = Math.abs(x84 - x16);
		const tFirst = (ys[0] - B) / A;
		const tLast = (ys[n - 1] - B) / A;
		const lo = Math.min(tFirst, tLast);
		const hi = Math.max(tFirst, tLast);
		if (lo > 0.05 || hi < 0.95) warnings.push(`the scan does not run from below 5 % to above 95 % of the beam power (it spans ${(lo * 100).toFixed(0)}–${(hi * 100).toFixed(0)} %): extend it on both sides; the width is extrapolated by the fit`);
	} else {
		const tFirst = (ys[0] - B) / A;
		const tLast = (ys[n - 1] - B) / A;
		if (Math.max(tFirst, tLast) > 0.05) warnings.push('the slit scan does not reach the wings of the beam (below 5 % of the peak) on both sides: extend it');
	}
	// Points across the edge: within ±w of the centre.
	let across = 0;
	for (const x of xs) if (Math.abs(x - x0) <= w) across++;
	if (across < 5) warnings.push(`only ${across} point${across === 1 ? '' : 's'} lie within one radius of the centre: step finer across the beam (at least 5, better 10)`);
	if (residualRms_W > 0.05 * Math.abs(A)) warnings.push(`noisy scan: residual RMS is ${((residualRms_W / Math.abs(A)) * 100).toFixed(1)} % of the beam power`);
	const useClip = clip10_90_m !== null;
	const d4sigma_m = kind === 'knife' && useClip ? clipFactor(0.1) * clip10_90_m! : 2 * w;
	const d4sigmaSd = kind === 'knife' && useClip && clipSd !== null ? clipFactor(0.1) * clipSd : 2 * sd(3);
	const finiteOr0 = (v: number) => (Number.isFinite(v) ? v : 0);
	return {
		kind,
		w_m: w,
		d4sigma_m,
		d4sigmaFrom: kind === 'knife' && useClip ? 'clip10_90' : 'fit',
		center_m: x0,
		clip10_90_m: kind === 'knife' ? clip10_90_m : null,
		clip16_84_m: kind === 'knife' ? clip16_84_m : null,
		baseline_W: B,
		amplitude_W: A,
		uncertainty: {
			w_m: finiteOr0(sd(3)),
			d4sigma_m: finiteOr0(d4sigmaSd),
			center_m: finiteOr0(sd(2)),
			clip10_90_m: clipSd === null ? null : finiteOr0(clipSd)
		},
		residualRms_W,
		points: n,
		warnings
	};
}
