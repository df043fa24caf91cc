/**
 * The objective of the matching search: plain-number q propagation through thin lenses on a rail in
 * air, then the mode overlap with the target (overlap.ts) and the clear-aperture transmission
 * (aperture.ts). 1/q̂′ = 1/q̂ − 1/f at a thin lens, q̂ += d in free space (Kogelnik & Li 1966, eq. 26).
 *
 * Convention (the project's): for M² > 1 the beam is described by its embedded Gaussian, whose q is the
 * beam's q (1/q = 1/R − i·M²λ/(π·w²) = 1/R − i·λ/(π·(w/M)²)). The coupling figure is the TEM00 overlap of
 * that embedded Gaussian with the target (overlap.ts with M² = 1). Free space and thin lenses act on both
 * beams with the same unitary paraxial propagator, so this figure is the same at every plane. Apertures
 * clip the real beam (radius w = M·w_embedded).
 *
 * Beside it the search reports the expected power in the fundamental mode: a partially coherent beam
 * modelled as a Gaussian Schell-model source has Hermite–Gauss coherent modes (those of the embedded
 * Gaussian) with geometric weights (1 − κ)·κⁿ, and M² = (1 + κ)/(1 − κ) per axis, so the fraction of the
 * power in the fundamental mode is 1 − κ = 2/(1 + M²) per axis (F. Gori, "Collett–Wolf sources and
 * multimode lasers", Opt. Commun. 34, 301 (1980); the M² relation written from memory). The fundamental
 * mode's power coupled into the target is that fraction × the embedded-Gaussian coupling.
 */
import type { QHat } from '../beam';
import { axisCoupling } from '../overlap';
import { clippedTransmission } from '../aperture';
import type { InputBeam, TargetMode } from './types';

/** q̂ after free space d then a thin lens f. */
export function throughLens(q: QHat, d_m: number, f_m: number): QHat {
	const re = q.re + d_m;
	const im = q.im;
	const den = re * re + im * im;
	// 1/q = (re − i·im)/den; minus 1/f on the real part.
	const ur = re / den - 1 / f_m;
	const ui = -im / den;
	const d2 = ur * ur + ui * ui;
	return { re: ur / d2, im: -ui / d2 };
}

function radius(q: QHat, m2: number, wavelength_m: number): number {
	return Math.sqrt((m2 * wavelength_m * (q.re * q.re + q.im * q.im)) / (Math.PI * q.im));
}

export interface Evaluation {
	x: number;
	y: number;
	transmitted: number;
	total: number;
}

/** Coupling of the input beam with the target after thin lenses f[i] at z[i] (ascending z). */
export function evaluate(input: InputBeam, target: TargetMode, f_m: ArrayLike<number>, z_m: ArrayLike<number>, diameters_m?: ArrayLike<number | null>): Evaluation {
	let qx = input.x.q;
	let qy = input.y.q;
	let prev = 0;
	let transmitted = 1;
	const lam = input.wavelength_m;
	for (let i = 0; i < f_m.length; i++) {
		const d = z_m[i] - prev;
		if (diameters_m && diameters_m[i] !== null) {
			const ax = { re: qx.re + d, im: qx.im };
			const ay = { re: qy.re + d, im: qy.im };
			transmitted *= clippedTransmission((diameters_m[i] as number) / 2, radius(ax, input.x.m2, lam), radius(ay, input.y.m2, lam));
		}
		qx = throughLens(qx, d, f_m[i]);
		qy = throughLens(qy, d, f_m[i]);
		prev = z_m[i];
	}
	const d = target.z_m - prev;
	const x = axisCoupling({ q: { re: qx.re + d, im: qx.im } }, { q: target.x }, lam);
	const y = axisCoupling({ q: { re: qy.re + d, im: qy.im } }, { q: target.y }, lam);
	return { x, y, transmitted, total: x * y * transmitted };
}

/**
 * Fraction of a Gaussian Schell-model beam's power in its fundamental coherent mode, one axis:
 * 2/(1 + M²) (Gori 1980, see the header). M² = 1 → 1; M² = 1.5 → 0.8; M² = 3 → 0.5.
 */
export function fundamentalFraction(m2: number): number {
	return 2 / (1 + m2);
}

/**
 * The search's fast scorer: the same physics as `evaluate` without allocation. Apertures use the round
 * estimate with the larger of the two radii (never optimistic); one axis is computed when the input and
 * target are round. `describe` re-evaluates the chosen solutions with `evaluate`.
 */
export function makeScorer(input: InputBeam, target: TargetMode, f_m: ArrayLike<number>, diameters_m: ArrayLike<number | null>): (z: ArrayLike<number>) => number {
	const lam = input.wavelength_m;
	const n = f_m.length;
	const invF = Array.from(f_m, (f) => 1 / f);
	const a2 = Array.from(diameters_m, (d) => (d === null ? Infinity : (d / 2) ** 2));
	const round = input.x.q.re === input.y.q.re && input.x.q.im === input.y.q.im && input.x.m2 === input.y.m2 && target.x.re === target.y.re && target.x.im === target.y.im;
	const s = Math.PI / lam;
	const tA = (t: QHat): [number, number] => {
		const den = t.re * t.re + t.im * t.im;
		return [(s * t.im) / den, (s * t.re) / den]; // a = (π/λ)(−Im u + i·Re u), u = 1/q
	};
	const [txr, txi] = tA(target.x);
	const [tyr, tyi] = tA(target.y);
	const zt = target.z_m;
	const axis = (re: number, im: number, m2: number, ar: number, ai: number, z: ArrayLike<number>, wmax2: Float64Array) => {
		let prev = 0;
		for (let i = 0; i < n; i++) {
			re += z[i] - prev;
			prev = z[i];
			const den = re * re + im * im;
			const w2 = (m2 * lam * den) / (Math.PI * im);
			if (w2 > wmax2[i]) wmax2[i] = w2;
			const ur = re / den - invF[i];
			const ui = -im / den;
			const d2 = ur * ur + ui * ui;
			re = ur / d2;
			im = -ui / d2;
		}
		re += zt - prev;
		const den = re * re + im * im;
		const a1r = (s * im) / den; // embedded Gaussian: no M² here (see the header)
		const a1i = (s * re) / den;
		const Ar = a1r + ar;
		const Ai = a1i - ai;
		return (2 * Math.sqrt(a1r * ar)) / Math.sqrt(Ar * Ar + Ai * Ai);
	};
	const wmax2 = new Float64Array(n);
	return (z: ArrayLike<number>) => {
		wmax2.fill(0);
		const ex = axis(input.x.q.re, input.x.q.im, input.x.m2, txr, txi, z, wmax2);
		const eta = round ? ex * ex : ex * axis(input.y.q.re, input.y.q.im, input.y.m2, tyr, tyi, z, wmax2);
		let t = 1;
		for (let i = 0; i < n; i++) {
			const r = a2[i] / wmax2[i];
			if (r < 4.5) t *= 1 - Math.exp(-2 * r);
		}
		return eta * t;
	};
}
