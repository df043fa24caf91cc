/**
 * From a cavity scan back to what is wrong, and what to turn.
 *
 * Inverse problem. The user reads the heights of the TEM00, TEM10, TEM01, TEM20 and TEM02 peaks (and
 * optionally TEM11 and the total of all peaks). The model is P_mn = S·p_m(εx, |βx|)·p_n(εy, |βy|) with the
 * closed-form fractions of modeContent.ts (fractionsFromSizes): ε the size of the misalignment
 * (sqrt((x0/w0)² + (θ/θ0)²), θ0 = λ/(π·w0)) and |β| the size of the mismatch on each axis, S the power
 * that a perfectly matched beam would put into TEM00. Fitted by damped Gauss–Newton (Levenberg–Marquardt)
 * on (ε², |β|², S) with each height given the standard uncertainty σ = noise × the largest height; the
 * covariance is (JᵀJ)⁻¹ of the σ-weighted residuals (Press et al., "Numerical Recipes", 3rd ed. 2007,
 * §15.5).
 *
 * What a power measurement cannot tell (stated with every estimate): the sign of the offset, of the tilt
 * and of the waist-position error; offset from tilt on the same axis (both feed the one first-order
 * peak); and waist-size from waist-position error (both feed the second-order peaks through |β| only).
 * The estimate therefore gives each as "if it were all offset / all tilt" and "if it were all size /
 * all position", and the corrections come with a ± sign: try one way, and reverse if the peak grows.
 *
 * Beam walking: two steering mirrors before the cavity; turning mirror i by φ_i turns the beam by g·φ_i
 * (g = 2 in the plane of incidence, 2·cos(angle of incidence) out of it — law of reflection, common
 * practice). With the ray matrix [A_i B_i; C_i D_i] from mirror i to the cavity waist, the offset and
 * tilt at the waist change by g·(B_i, D_i)·φ_i; the two angles that cancel (x0, θ) solve the 2 × 2 system
 * g·[B1 B2; D1 D2]·(φ1, φ2) = −(x0, θ) (Siegman, "Lasers", 1986, §15.1 for ray matrices acting on
 * (position, slope)).
 */
import { requireThat } from './constants';
import type { Mat2 } from './elements';
import { fractionsFromSizes } from './modeContent';

export interface MeasuredPeaks {
	p00: number;
	p10: number;
	p01: number;
	p20: number;
	p02: number;
	p11?: number | null;
	/** Total of all peaks in one FSR (the input as seen by the detector), when known. */
	sum?: number | null;
	/** Standard uncertainty of each height as a fraction of the largest height (default 0.01). */
	noise?: number;
}

export interface Estimate {
	value: number;
	sigma: number;
}

export interface PeakDiagnosis {
	/** Misalignment size ε per axis (in units of the waist and of the far-field angle). */
	misalignment: { x: Estimate; y: Estimate };
	/** Mismatch size |β| per axis (0 matched, → 1 no overlap). */
	mismatch: { x: Estimate; y: Estimate };
	/** Fitted power of a perfectly coupled TEM00 peak (same unit as the heights). */
	scale: Estimate;
	/** The fitted heights against the entered ones. */
	fitted: { p00: number; p10: number; p01: number; p20: number; p02: number; p11: number };
	/** Root of the mean squared σ-weighted residual (about 1 for a good fit). */
	residualRms: number;
	/** TEM00 coupling of the fitted state. */
	coupling: number;
	ambiguity: string;
}

export const AMBIGUITY_TEXT =
	'Peak heights fix only the sizes of the errors: the sign of each offset, tilt and waist-position error is unknown, offset and tilt on one axis feed the same first-order peak, and waist size and waist position feed the same second-order peaks. Each estimate is given as if it were all one kind; try a correction one way and reverse it if the peak grows.';

function requireHeight(v: number | null | undefined, name: string, optional = false): void {
	if (optional && (v === undefined || v === null)) return;
	requireThat(typeof v === 'number' && Number.isFinite(v) && v >= 0, `peak height ${name}`, '≥ 0 (a finite number)', v);
}

/** Invert a small symmetric positive matrix (row-major, n × n) by Gauss–Jordan; null when singular. */
function invert(m: number[], n: number): number[] | null {
	const a = m.slice();
	const inv: number[] = Array.from({ length: n * n }, (_, i) => (i % (n + 1) === 0 ? 1 : 0));
	for (let c = 0; c < n; c++) {
		let p = c;
		for (let r = c + 1; r < n; r++) if (Math.abs(a[r * n + c]) > Math.abs(a[p * n + c])) p = r;
		const piv = a[p * n + c];
		if (!(Math.abs(piv) > 1e-300)) return null;
		if (p !== c)
			for (let k = 0; k < n; k++) {
				[a[p * n + k], a[c * n + k]] = [a[c * n + k], a[p * n + k]];
				[inv[p * n + k], inv[c * n + k]] = [inv[c * n + k], inv[p * n + k]];
			}
		for (let k = 0; k < n; k++) {
			a[c * n + k] /= piv;
			inv[c * n + k] /= piv;
		}
		for (let r = 0; r < n; r++) {
			if (r === c) continue;
			const f = a[r * n + c];
			if (f === 0) continue;
			for (let k = 0; k < n; k++) {
				a[r * n + k] -= f * a[c * n + k];
				inv[r * n + k] -= f * inv[c * n + k];
			}
		}
	}
	return inv;
}

const BETA2_MAX = 0.96;

/** Model heights for parameters [εx², εy², |βx|², |βy|², S]. */
function model(p: number[]): number[] {
	const fx = fractionsFromSizes(Math.sqrt(Math.max(0, p[0])), Math.sqrt(Math.min(BETA2_MAX, Math.max(0, p[2]))), 2);
	const fy = fractionsFromSizes(Math.sqrt(Math.max(0, p[1])), Math.sqrt(Math.min(BETA2_MAX, Math.max(0, p[3]))), 2);
	const S = p[4];
	return [S * fx[0] * fy[0], S * fx[1] * fy[0], S * fx[0] * fy[1], S * fx[2] * fy[0], S * fx[0] * fy[2], S * fx[1] * fy[1], S];
}

/**
 * Least-squares estimate of misalignment and mismatch per axis from peak heights (any one unit).
 * Throws a RangeError for a negative or missing height, a TEM00 height of 0, or heights that add up
 * to more than the given total.
 */
export function diagnosePeaks(peaks: MeasuredPeaks): PeakDiagnosis {
	requireHeight(peaks.p00, 'TEM00');
	requireHeight(peaks.p10, 'TEM10');
	requireHeight(peaks.p01, 'TEM01');
	requireHeight(peaks.p20, 'TEM20');
	requireHeight(peaks.p02, 'TEM02');
	requireHeight(peaks.p11, 'TEM11', true);
	requireHeight(peaks.sum, 'sum of all peaks', true);
	requireThat(peaks.p00 > 0, 'peak height TEM00', '> 0 (the fundamental peak must be seen)', peaks.p00);
	const noise = peaks.noise ?? 0.01;
	requireThat(Number.isFinite(noise) && noise > 0 && noise < 0.5, 'noise', '> 0 and < 0.5 (fraction of the largest peak)', noise);
	const hasP11 = typeof peaks.p11 === 'number';
	const hasSum = typeof peaks.sum === 'number';
	const entered = peaks.p00 + peaks.p10 + peaks.p01 + peaks.p20 + peaks.p02 + (hasP11 ? (peaks.p11 as number) : 0);
	if (hasSum) requireThat(entered <= (peaks.sum as number) * (1 + 1e-9), 'peak heights', `no more in total than the sum of all peaks (${peaks.sum})`, `a total of ${+entered.toPrecision(6)}`);
	const obs = [peaks.p00, peaks.p10, peaks.p01, peaks.p20, peaks.p02, hasP11 ? (peaks.p11 as number) : 0, hasSum ? (peaks.sum as number) : 0];
	const use = [true, true, true, true, true, hasP11, hasSum];
	const top = Math.max(peaks.p00, peaks.p10, peaks.p01, peaks.p20, peaks.p02, hasP11 ? (peaks.p11 as number) : 0);
	const sigma = noise * top;
	const resid = (p: number[]) => {
		const mdl = model(p);
		const out: number[] = [];
		for (let i = 0; i < 7; i++) if (use[i]) out.push((mdl[i] - obs[i]) / sigma);
		return out;
	};
	const clamp = (p: number[]) => [Math.max(0, p[0]), Math.max(0, p[1]), Math.min(BETA2_MAX, Math.max(0, p[2])), Math.min(BETA2_MAX, Math.max(0, p[3])), Math.max(1e-300, p[4])];
	// Start from the small-error ratios: p1/p0 ≈ ε², p2/p0 ≈ |β|²/2 + ε⁴/2.
	const ux = peaks.p10 / peaks.p00;
	const uy = peaks.p01 / peaks.p00;
	let p = clamp([ux, uy, 2 * peaks.p20 / peaks.p00 - (ux * ux) / 2, 2 * peaks.p02 / peaks.p00 - (uy * uy) / 2, 0]);
	const m0 = model([p[0], p[1], p[2], p[3], 1]);
	p[4] = peaks.p00 / m0[0];
	const jac = (p: number[]) => {
		const r0 = resid(p);
		const J: number[][] = [];
		for (let j = 0; j < 5; j++) {
			const h = j === 4 ? Math.max(1e-7 * p[4], 1e-300) : 1e-7;
			const up = p.slice();
			up[j] += h;
			const r1 = resid(up);
			J.push(r1.map((v, i) => (v - r0[i]) / h));
		}
		return { r0, J };
	};
	const cost = (r: number[]) => r.reduce((s, v) => s + v * v, 0);
	let lambda = 1e-3;
	let r = resid(p);
	let c = cost(r);
	for (let it = 0; it < 200; it++) {
		const { r0, J } = jac(p);
		const n = 5;
		const JTJ = new Array(n * n).fill(0);
		const JTr = new Array(n).fill(0);
		for (let a = 0; a < n; a++) {
			for (let i = 0; i < r0.length; i++) JTr[a] += J[a][i] * r0[i];
			for (let b = 0; b < n; b++) for (let i = 0; i < r0.length; i++) JTJ[a * n + b] += J[a][i] * J[b][i];
		}
		let improved = false;
		for (let tries = 0; tries < 12; tries++) {
			const A = JTJ.slice();
			for (let a = 0; a < n; a++) A[a * n + a] += lambda * (JTJ[a * n + a] || 1);
			const inv = invert(A, n);
			if (!inv) {
				lambda *= 10;
				continue;
			}
			const step = Array.from({ length: n }, (_, a) => -inv.slice(a * n, a * n + n).reduce((s, v, b) => s + v * JTr[b], 0));
			const pn = clamp(p.map((v, a) => v + step[a]));
			const rn = resid(pn);
			const cn = cost(rn);
			if (cn < c) {
				const rel = (c - cn) / Math.max(c, 1e-30);
				p = pn;
				r = rn;
				c = cn;
				lambda = Math.max(lambda / 10, 1e-12);
				improved = true;
				if (rel < 1e-14 || c < 1e-24) it = 1e9;
				break;
			}
			lambda *= 10;
		}
		if (!improved) break;
	}
	// Covariance (JᵀJ)⁻¹ at the solution (residuals already σ-weighted).
	const { J } = jac(p);
	const JTJ = new Array(25).fill(0);
	for (let a = 0; a < 5; a++) for (let b = 0; b < 5; b++) for (let i = 0; i < J[a].length; i++) JTJ[a * 5 + b] += J[a][i] * J[b][i];
	const cov = invert(JTJ, 5);
	const varOf = (j: number) => (cov && cov[j * 5 + j] > 0 ? cov[j * 5 + j] : Infinity);
	const rootEst = (u: number, varU: number): Estimate => {
		const su = Math.sqrt(varU);
		const v = Math.sqrt(Math.max(0, u));
		// Delta method away from 0; near 0 the square root of the variance's width.
		return { value: v, sigma: Number.isFinite(su) ? (v > 0 && u > su ? su / (2 * v) : Math.sqrt(u + su) - v) : Infinity };
	};
	const mdl = model(p);
	const fx = fractionsFromSizes(Math.sqrt(p[0]), Math.sqrt(p[2]), 0);
	const fy = fractionsFromSizes(Math.sqrt(p[1]), Math.sqrt(p[3]), 0);
	return {
		misalignment: { x: rootEst(p[0], varOf(0)), y: rootEst(p[1], varOf(1)) },
		mismatch: { x: rootEst(p[2], varOf(2)), y: rootEst(p[3], varOf(3)) },
		scale: { value: p[4], sigma: Math.sqrt(varOf(4)) },
		fitted: { p00: mdl[0], p10: mdl[1], p01: mdl[2], p20: mdl[3], p02: mdl[4], p11: mdl[5] },
		residualRms: Math.sqrt(c / Math.max(1, r.length)),
		coupling: fx[0] * fy[0],
		ambiguity: AMBIGUITY_TEXT
	};
}

export interface SteeringSolution {
	/** Mirror turns that cancel the given offset and tilt, rad. */
	mirror1_rad: number;
	mirror2_rad: number;
}

/**
 * Angles of two steering mirrors that cancel an offset x0 and tilt θ at the cavity waist on one axis.
 * toWaist1/toWaist2: ray matrices (plain, not reduced: the path is in air) from each mirror to the waist;
 * gain: beam turn per mirror turn (2 in the plane of incidence). Throws when the two mirrors cannot
 * separate offset from tilt (|det| ≈ 0, e.g. both at one place).
 */
export function walkBeam(toWaist1: Mat2, toWaist2: Mat2, offset_m: number, tilt_rad: number, gain = 2): SteeringSolution {
	requireThat(Number.isFinite(offset_m) && Number.isFinite(tilt_rad), 'offset and tilt', 'finite', `${offset_m} m, ${tilt_rad} rad`);
	requireThat(Number.isFinite(gain) && gain > 0, 'steering gain', '> 0', gain);
	const [, B1, , D1] = toWaist1;
	const [, B2, , D2] = toWaist2;
	const det = gain * gain * (B1 * D2 - B2 * D1);
	const scale = gain * gain * (Math.abs(B1 * D2) + Math.abs(B2 * D1)) + 1e-300;
	requireThat(Math.abs(det) > 1e-9 * scale, 'steering mirrors', 'far enough apart (with the optics between them and the cavity) to set offset and tilt independently', `det = ${det.toPrecision(3)}`);
	// g·[B1 B2; D1 D2]·(φ1, φ2) = −(x0, θ)
	const phi1 = (-(offset_m * gain * D2) + tilt_rad * gain * B2) / det;
	const phi2 = (-(tilt_rad * gain * B1) + offset_m * gain * D1) / det;
	return { mirror1_rad: phi1, mirror2_rad: phi2 };
}

/** Knob turns for an angle, given the mount's angle per turn (rad per turn, > 0). */
export function knobTurns(angle_rad: number, anglePerTurn_rad: number): number {
	requireThat(Number.isFinite(anglePerTurn_rad) && anglePerTurn_rad > 0, 'mount angle per turn', '> 0', anglePerTurn_rad, 'rad');
	return angle_rad / anglePerTurn_rad;
}

/**
 * Lens moves that reproduce a measured mismatch: `mismatchAt(δ)` gives |β| per axis with the lens moved
 * by δ from where it is; the candidates δ (one each side, within ±range) are where the summed squared
 * difference to the measured |β| is least. The correction is −δ: move the lens back by it.
 */
export function lensMoveFor(mismatchAt: (delta_m: number) => { x: number; y: number }, measured: { x: number; y: number }, range_m: number, samples = 81): { minus: number | null; plus: number | null; misfit: { minus: number; plus: number } } {
	requireThat(Number.isFinite(range_m) && range_m > 0, 'lens move range', '> 0 m', range_m, 'm');
	const f = (d: number) => {
		const b = mismatchAt(d);
		return (b.x - measured.x) ** 2 + (b.y - measured.y) ** 2;
	};
	const best = (lo: number, hi: number) => {
		let bd = lo;
		let bf = Infinity;
		for (let i = 0; i < samples; i++) {
			const d = lo + ((hi - lo) * i) / (samples - 1);
			const v = f(d);
			if (v < bf) [bd, bf] = [d, v];
		}
		// Golden-section refinement around the best sample (one new evaluation per step).
		const h = (hi - lo) / (samples - 1);
		let a = Math.max(lo, bd - h);
		let b = Math.min(hi, bd + h);
		const g = (Math.sqrt(5) - 1) / 2;
		let c1 = b - g * (b - a);
		let c2 = a + g * (b - a);
		let f1 = f(c1);
		let f2 = f(c2);
		for (let k = 0; k < 30; k++) {
			if (f1 < f2) {
				b = c2;
				c2 = c1;
				f2 = f1;
				c1 = b - g * (b - a);
				f1 = f(c1);
			} else {
				a = c1;
				c1 = c2;
				f1 = f2;
				c2 = a + g * (b - a);
				f2 = f(c2);
			}
		}
		const d = (a + b) / 2;
		return { d, v: f(d) };
	};
	const neg = best(-range_m, 0);
	const pos = best(0, range_m);
	return { minus: neg.d < 0 ? neg.d : null, plus: pos.d > 0 ? pos.d : null, misfit: { minus: neg.v, plus: pos.v } };
}
