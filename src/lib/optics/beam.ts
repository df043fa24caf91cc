/**
 * The complex beam parameter q for real (M² ≥ 1) Gaussian beams, one transverse axis at a time.
 *
 * Conventions (written once here, followed everywhere in the engine):
 * - w is the 1/e² intensity radius; the diameter d = 2w equals the second-moment D4σ width of a Gaussian.
 * - Embedded-Gaussian model: a beam of quality M² propagates like a Gaussian of wavelength M²·λ0
 *   (Siegman, "Lasers", 1986, ch. 17; ISO 11146-1:2005 clause 3). x and y are independent (simple astigmatism).
 * - 1/q = 1/R − i·M²·λ0/(π·n·w²); R > 0 for a diverging wavefront; the beam travels +z
 *   (Kogelnik & Li, Appl. Opt. 5, 1550 (1966), eq. 19 with λ → M²λ0/n).
 * - The engine carries the reduced parameter q̂ = q/n so that reduced ABCD matrices (determinant 1) work
 *   across media and interfaces (Siegman 1986, §15.2 and §20.1). Then q̂ = (z − z0)/n + i·zR/n.
 * - θ is the far-field half-angle; a full angle says so in its name (`fullDivergence_rad`).
 *
 * q̂ is stored as two plain numbers (re, im) — no complex objects in the hot path.
 */
import { requirePositive, requireThat } from './constants';

/** Reduced complex beam parameter q̂ = q/n, in metres. */
export interface QHat {
	re: number;
	im: number;
}

/** What a beam is made of on one axis, besides its q̂: the vacuum wavelength and the beam quality. */
export interface AxisBeamProps {
	wavelength_m: number;
	m2: number;
}

/** The beam on one axis at one plane. R_m is Infinity for a flat wavefront (JSON writers map it to null). */
export interface BeamAt {
	w_m: number;
	R_m: number;
	/** Distance from this plane to the waist of the current segment, positive when the waist lies downstream. */
	toWaist_m: number;
	w0_m: number;
	zR_m: number;
	gouy_rad: number;
	q: QHat;
	index: number;
}

/**
 * Rayleigh range of a real beam: zR = π·n·w0² / (M²·λ0).
 * Example: w0 = 0.5 mm, λ0 = 632.8 nm, M² = 1, n = 1 → zR = 1.2411 m. (Siegman 1986, eq. 17.5 with M²)
 */
export function rayleighRange_m(w0_m: number, wavelength_m: number, m2 = 1, index = 1): number {
	requirePositive(w0_m, 'waist radius', 'm');
	requirePositive(wavelength_m, 'wavelength', 'm');
	requireThat(Number.isFinite(m2) && m2 >= 1, 'M²', '≥ 1', m2);
	requirePositive(index, 'refractive index');
	return (Math.PI * index * w0_m * w0_m) / (m2 * wavelength_m);
}

/**
 * Far-field half-angle divergence θ = M²·λ0 / (π·n·w0) (Siegman 1986, eq. 17.16 with M²).
 * Example: w0 = 0.5 mm, λ0 = 632.8 nm → θ = 0.40285 mrad.
 */
export function farFieldHalfAngle_rad(w0_m: number, wavelength_m: number, m2 = 1, index = 1): number {
	return (m2 * wavelength_m) / (Math.PI * index * w0_m);
}

/** q̂ of a beam whose waist w0 sits `toWaist_m` downstream of the plane (negative: waist behind). */
export function qFromWaist(w0_m: number, toWaist_m: number, props: AxisBeamProps, index = 1): QHat {
	const zR = rayleighRange_m(w0_m, props.wavelength_m, props.m2, index);
	return { re: -toWaist_m / index, im: zR / index };
}

/**
 * Read the beam out of a reduced q̂ on one axis, in a medium of index n.
 * w² = −M²λ0 / (π·Im(1/q̂)), R = n / Re(1/q̂) (Kogelnik & Li 1966, eq. 19, reduced form).
 * gouy_rad is the Gouy phase relative to the segment's waist: atan((z − z0)/zR).
 */
export function beamFromQ(q: QHat, props: AxisBeamProps, index = 1): BeamAt {
	const den = q.re * q.re + q.im * q.im;
	// 1/q̂ = (re − i·im)/|q̂|²
	const invRe = q.re / den;
	const invIm = -q.im / den;
	const w2 = (-props.m2 * props.wavelength_m) / (Math.PI * invIm);
	const R = invRe === 0 ? Infinity : index / invRe;
	const zR = index * q.im;
	const w0sq = (props.m2 * props.wavelength_m * zR) / (Math.PI * index);
	return {
		w_m: Math.sqrt(w2),
		R_m: R,
		toWaist_m: -index * q.re,
		w0_m: Math.sqrt(w0sq),
		zR_m: zR,
		gouy_rad: Math.atan2(q.re, q.im),
		q: { re: q.re, im: q.im },
		index
	};
}

/**
 * Beam radius at distance z from the waist: w(z) = w0·sqrt(1 + (z/zR)²) (Kogelnik & Li 1966, eq. 20, number from memory).
 */
export function radiusAt_m(w0_m: number, z_m: number, zR_m: number): number {
	const u = z_m / zR_m;
	return w0_m * Math.sqrt(1 + u * u);
}

/**
 * Wavefront radius at z from the waist: R(z) = z·(1 + (zR/z)²); Infinity at the waist (Kogelnik & Li 1966, eq. 21).
 */
export function curvatureAt_m(z_m: number, zR_m: number): number {
	if (z_m === 0) return Infinity;
	return z_m * (1 + (zR_m / z_m) ** 2);
}
