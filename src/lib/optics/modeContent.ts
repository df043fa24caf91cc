/**
 * Mode content of a beam injected into a cavity: the fraction of its power in each Hermite–Gauss mode
 * HG_mn of the cavity, for waist-size and waist-position mismatch, lateral offset and tilt, per axis
 * (simple astigmatism: P_mn = p_m(x)·p_n(y)).
 *
 * Closed form, one axis. At the cavity mode's waist plane the cavity modes are
 * u_m(x) = N_m·H_m(√2·x/w)·exp(−x²/w²), N_m = (2/π)^¼/sqrt(2^m·m!·w) (Siegman, "Lasers", 1986, eq. 16.54),
 * and the injected beam is E(x) = exp(−a·(x − x0)² − i·k·θ·x) with a = 1/w_b² + i·k/(2·R_b) its Gaussian
 * coefficient at that plane, x0 its offset and θ its tilt (fields ∝ exp(−ikz), so a beam tilted towards +x
 * carries exp(−ikθx) and a diverging wavefront exp(−ikx²/2R); Siegman 1986, §16.4). With the generating function of the Hermite
 * polynomials Σ H_m(s)·t^m/m! = exp(2st − t²) (Abramowitz & Stegun 1964, eq. 22.9.17) the overlaps follow
 * from one Gaussian integral ∫exp(−P·x² + Q·x)dx = sqrt(π/P)·exp(Q²/4P):
 *   c_m = (2/π)^¼·w^−½·G0·d_m,  G0 = sqrt(π/P)·exp(Q0²/(4P) − a·x0²),
 *   P = 1/w² + a, Q0 = 2a·x0 − i·k·θ, α = Q0·√2/(w·P), β = 2/(w²·P) − 1,
 *   d_0 = 1, d_1 = α/√2, d_{m+1} = (α·d_m + 2β·sqrt(m/2)·d_{m−1})/sqrt(2(m + 1)),
 * and p_m = |c_m|²/∫|E|², ∫|E|² = sqrt(π/(2·Re a)). β carries the mismatch (β = 0 when the waists match in
 * size and place; |β| alone fixes the even-mode powers, p_0 = sqrt(1 − |β|²) without misalignment) and α
 * the misalignment. For matched waists α = √2·(x0/w + i·θ/θ0), θ0 = λ/(π·w), and the powers are Poisson,
 * p_m = exp(−|ε|²)·|ε|^{2m}/m! with ε = x0/w − i·θ/θ0; to first order p_1 = (x0/w)² + (θ/θ0)²
 * (D. Z. Anderson, "Alignment of resonant optical cavities", Appl. Opt. 23, 2944 (1984), from memory).
 * These are the misalignment-and-mismatch coupling coefficients of F. Bayer-Helms, "Coupling coefficients
 * of an incident wave and the modes of a spherical optical resonator in the case of mismatching and
 * misalignment", Appl. Opt. 23, 1369 (1984) (from memory), written here through the generating function.
 *
 * M² > 1: the embedded Gaussian (radius w/√M², same wavefront) is decomposed; its q̂ is the beam's q̂.
 * A real beam of M² > 1 is partially coherent or already carries higher-order content, so the TEM00
 * fraction is an upper estimate and the higher-order fractions are too low.
 */
import type { QHat } from './beam';
import { requireThat } from './constants';

/** The beam on one axis as it meets the cavity: its q̂ at the plane of the cavity mode's q̂, and its misalignment at the cavity waist. */
export interface AxisInjection {
	q: QHat;
	m2?: number;
	/** Lateral offset of the beam from the cavity axis at the cavity mode's waist, m. */
	offset_m?: number;
	/** Angle of the beam to the cavity axis, rad (+ towards +offset). */
	tilt_rad?: number;
}

export interface AxisModeContent {
	/** Power fraction in HG_m, m = 0 … maxOrder. */
	fractions: number[];
	/** Mismatch β and misalignment α of the closed form (complex), for read-outs. */
	beta: { re: number; im: number };
	alpha: { re: number; im: number };
	/** Cavity mode waist on this axis and where it is from the plane of q (+ downstream). */
	w0_m: number;
	toWaist_m: number;
}

type C = [number, number];
const cmul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const cdiv = (a: C, b: C): C => {
	const d = b[0] * b[0] + b[1] * b[1];
	return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/**
 * Fractions p_m (m = 0 … maxOrder) of a Gaussian E = exp(−a(x − x0)² − ikθx) in the HG modes of waist w
 * at the waist plane, from the closed form in this file's header. a is complex with Re a > 0.
 */
export function hgFractions(w_m: number, a: C, x0_m: number, tilt_rad: number, k_per_m: number, maxOrder: number): { fractions: number[]; alpha: C; beta: C } {
	requireThat(Number.isFinite(w_m) && w_m > 0, 'cavity mode radius', '> 0 m', w_m, 'm');
	requireThat(Number.isFinite(a[0]) && a[0] > 0 && Number.isFinite(a[1]), 'beam Gaussian coefficient', 'finite with a positive real part (a confined beam)', `${a[0]} + ${a[1]}i`, '1/m²');
	requireThat(Number.isInteger(maxOrder) && maxOrder >= 0 && maxOrder <= 200, 'highest mode order', 'a whole number from 0 to 200', maxOrder);
	const P: C = [1 / (w_m * w_m) + a[0], a[1]];
	const Q0: C = [2 * a[0] * x0_m, 2 * a[1] * x0_m - k_per_m * tilt_rad];
	// exponent Q0²/(4P) − a·x0²
	const Q0sq = cmul(Q0, Q0);
	const e1 = cdiv(Q0sq, [4 * P[0], 4 * P[1]]);
	const ex: C = [e1[0] - a[0] * x0_m * x0_m, e1[1] - a[1] * x0_m * x0_m];
	// |G0|² = |π/P|·exp(2·Re ex); |c_m|² = sqrt(2/π)/w·|G0|²·|d_m|²; norm = sqrt(π/(2 Re a)).
	const absP = Math.hypot(P[0], P[1]);
	const base = (Math.sqrt(2 / Math.PI) / w_m) * (Math.PI / absP) * Math.exp(2 * ex[0]) / Math.sqrt(Math.PI / (2 * a[0]));
	const alpha = cdiv([Q0[0] * Math.SQRT2, Q0[1] * Math.SQRT2], [w_m * P[0], w_m * P[1]]);
	const b0 = cdiv([2, 0], [w_m * w_m * P[0], w_m * w_m * P[1]]);
	const beta: C = [b0[0] - 1, b0[1]];
	const fractions: number[] = [];
	let dPrev: C = [0, 0];
	let d: C = [1, 0];
	for (let m = 0; m <= maxOrder; m++) {
		fractions.push(base * (d[0] * d[0] + d[1] * d[1]));
		const t1 = cmul(alpha, d);
		const t2 = cmul(beta, dPrev);
		const s = 2 * Math.sqrt(m / 2);
		const den = Math.sqrt(2 * (m + 1));
		const next: C = [(t1[0] + s * t2[0]) / den, (t1[1] + s * t2[1]) / den];
		dPrev = d;
		d = next;
	}
	return { fractions, alpha, beta };
}

/**
 * Mode content on one axis. `modeQ` is the cavity mode's q̂ and `beam.q` the beam's q̂ at one common plane
 * in air; the offset and tilt are taken at the cavity mode's waist. Throws for a beam or mode that is not
 * confined (Im q̂ ≤ 0).
 */
export function axisModeContent(modeQ: QHat, beam: AxisInjection, wavelength_m: number, maxOrder = 4): AxisModeContent {
	requireThat(Number.isFinite(wavelength_m) && wavelength_m > 0, 'wavelength', '> 0 m', wavelength_m, 'm');
	requireThat(Number.isFinite(modeQ.re) && modeQ.im > 0, 'cavity mode q̂', 'finite with Im > 0 (a stable cavity)', `${modeQ.re} + ${modeQ.im}i`, 'm');
	requireThat(Number.isFinite(beam.q.re) && beam.q.im > 0, 'beam q̂', 'finite with Im > 0 (a confined beam)', `${beam.q.re} + ${beam.q.im}i`, 'm');
	const offset = beam.offset_m ?? 0;
	const tilt = beam.tilt_rad ?? 0;
	requireThat(Number.isFinite(offset), 'offset', 'a finite length', offset, 'm');
	requireThat(Number.isFinite(tilt) && Math.abs(tilt) < 0.5, 'tilt', 'finite and below 0.5 rad in size', tilt, 'rad');
	const toWaist = -modeQ.re;
	const w = Math.sqrt((wavelength_m * modeQ.im) / Math.PI);
	// Beam at the mode's waist plane: q̂ + d; a = (π/λ)·(−Im u + i·Re u), u = 1/q̂ (embedded Gaussian).
	const qb: C = [beam.q.re + toWaist, beam.q.im];
	const u = cdiv([1, 0], qb);
	const s = Math.PI / wavelength_m;
	const a: C = [-s * u[1], s * u[0]];
	const r = hgFractions(w, a, offset, tilt, (2 * Math.PI) / wavelength_m, maxOrder);
	return { fractions: r.fractions, beta: { re: r.beta[0], im: r.beta[1] }, alpha: { re: r.alpha[0], im: r.alpha[1] }, w0_m: w, toWaist_m: toWaist };
}

export interface ModeFraction {
	m: number;
	n: number;
	power: number;
}

export interface ModeContent {
	x: AxisModeContent;
	y: AxisModeContent;
	/** HG_mn with m + n ≤ maxOrder, largest first. */
	modes: ModeFraction[];
	/** Sum of the listed fractions (1 − this is in higher orders). */
	listed: number;
	/** Set when M² > 1 on an axis: the embedded-Gaussian caveat. */
	caveat: string | null;
}

export const PARTIAL_COHERENCE_CAVEAT =
	'M² > 1: the fractions are those of the embedded Gaussian (radius w/√M²). A real beam of M² > 1 is partially coherent or already carries higher-order modes, so its TEM00 fraction is lower and its higher-order fractions higher than shown.';

/** Mode content of a simply astigmatic beam in a cavity's HG_mn modes (both axes at one common plane). */
export function modeContent(mode: { x: QHat; y: QHat }, beam: { x: AxisInjection; y: AxisInjection }, wavelength_m: number, maxOrder = 4): ModeContent {
	const x = axisModeContent(mode.x, beam.x, wavelength_m, maxOrder);
	const y = axisModeContent(mode.y, beam.y, wavelength_m, maxOrder);
	const modes: ModeFraction[] = [];
	for (let m = 0; m <= maxOrder; m++) for (let n = 0; n + m <= maxOrder; n++) modes.push({ m, n, power: x.fractions[m] * y.fractions[n] });
	modes.sort((p, q) => q.power - p.power || p.m + p.n - (q.m + q.n) || q.m - p.m);
	const listed = modes.reduce((s, p) => s + p.power, 0);
	const m2 = Math.max(beam.x.m2 ?? 1, beam.y.m2 ?? 1);
	return { x, y, modes, listed, caveat: m2 > 1 + 1e-9 ? PARTIAL_COHERENCE_CAVEAT : null };
}

/**
 * Fractions p_0 … p_maxOrder on one axis for a misalignment of size ε (= sqrt((x0/w)² + (θ/θ0)²) for
 * matched waists) and a mismatch of size |β|, taken in quadrature (α = √2·ε, β = i·|β|): the model of the
 * inverse problem, in which the unknown relative phase of misalignment and mismatch is set so that they
 * do not interfere in the second-order peak. Built from the physical beam that has these α and β
 * (w = 1, k = 2, so θ0 = 1).
 */
export function fractionsFromSizes(epsilon: number, betaAbs: number, maxOrder = 2): number[] {
	requireThat(Number.isFinite(epsilon) && epsilon >= 0, 'misalignment', '≥ 0', epsilon);
	requireThat(Number.isFinite(betaAbs) && betaAbs >= 0 && betaAbs < 1, 'mismatch |β|', '≥ 0 and < 1', betaAbs);
	const beta: C = [0, betaAbs];
	// β = 2/P − 1 (w = 1) → P = 2/(1 + β), a = P − 1.
	const P = cdiv([2, 0], [1 + beta[0], beta[1]]);
	const a: C = [P[0] - 1, P[1]];
	// α = √2·Q0/P → Q0 = α·P/√2 with α = √2·ε: Q0 = ε·P; Q0 = 2a·x0 − i·k·θ.
	const Q0: C = [epsilon * P[0], epsilon * P[1]];
	const x0 = Q0[0] / (2 * a[0]);
	const k = 2;
	const theta = -(Q0[1] - 2 * a[1] * x0) / k;
	return hgFractions(1, a, x0, theta, k, maxOrder).fractions;
}

/** Pure waist-size mismatch that gives |β|: beam waist / cavity waist (the larger of the two answers; the other is its inverse). */
export function sizeRatioFromBeta(betaAbs: number): number {
	return Math.sqrt((1 + betaAbs) / (1 - betaAbs));
}

/** Pure waist-position mismatch that gives |β|: distance between the waists, |d| = 2·zR·|β|/sqrt(1 − |β|²). */
export function waistDistanceFromBeta(betaAbs: number, zR_m: number): number {
	return (2 * zR_m * betaAbs) / Math.sqrt(1 - betaAbs * betaAbs);
}

