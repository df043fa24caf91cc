/**
 * Resonance spectrum of a passive optical cavity: free spectral range, round-trip Gouy phase per axis,
 * transverse-mode spacing, the frequencies of the Hermite–Gauss modes TEM_mn, finesse and linewidth,
 * and warnings for near-degenerate cavities.
 *
 * - Free spectral range: FSR = c / (optical round-trip path); a linear cavity of length L has the path 2L,
 *   a ring the perimeter (Siegman, "Lasers", 1986, §11.2 and §19.1).
 * - Round-trip Gouy phase θ per axis from the round-trip reduced matrix M = [A B; C D] of a stable
 *   cavity: cos θ = (A + D)/2, with sin θ of the sign of B, θ in (0, 2π) (Siegman 1986, §21.1, eqs.
 *   21.8–21.12: the eigenvalues of M are exp(±iθ)). For a two-mirror cavity θ = 2·arccos(±sqrt(g1·g2))
 *   (Siegman 1986, eq. 19.19; Kogelnik & Li, Appl. Opt. 5, 1550 (1966), eq. 66).
 * - Frequencies: ν_qmn = FSR·(q + (m + ½)·θx/2π + (n + ½)·θy/2π) (Siegman 1986, eq. 19.18 per axis);
 *   relative to TEM00 of the same order, Δν_mn = FSR·(m·θx + n·θy)/2π. In a ring of an odd number of
 *   reflections the image flips in the plane of the ring each round trip, which adds π to the round-trip
 *   phase of modes odd in the tangential index m (Siegman 1986, §21.4, from memory).
 * - Airy lines: the round-trip field factor r = sqrt(R1·R2·(1 − loss)); the transmitted fraction at
 *   round-trip phase δ is T1·T2/((1 − r)² + 4r·sin²(δ/2)), full width at half maximum
 *   Δν = FSR·(2/π)·arcsin((1 − r)/(2·sqrt(r))), finesse F = FSR/Δν ≈ π·sqrt(r)/(1 − r) (Siegman 1986,
 *   §11.3, eqs. 11.20–11.25). The round-trip loss besides the two mirrors' transmissions is lumped at
 *   mirror 2 (common practice); T_i = 1 − R_i (lossless coatings).
 */
import { requireThat, speedOfLight_m_s } from './constants';
import type { Mat2 } from './elements';

export type CavityKind = 'linear' | 'ring';

export interface SpectrumInput {
	kind: CavityKind;
	/** Optical path of one round trip (2L for a linear cavity of length L), m. */
	roundTrip_m: number;
	/** Round-trip reduced matrices per axis. */
	matrices: { x: Mat2; y: Mat2 };
	/** Power reflectivity of the input mirror (1) and the output mirror (2), each ≥ 0 and < 1. */
	reflectivity1: number;
	reflectivity2: number;
	/** Fractional power lost per round trip besides the two mirrors' transmissions (≥ 0, < 1). */
	roundTripLoss?: number;
	/** Number of reflections per round trip (ring: image flip when odd); default 2 for linear, 4 for ring. */
	reflections?: number;
	/** Highest mode order m + n listed (default 4). */
	maxOrder?: number;
	/** A mode of order ≤ this that falls within `degeneracyLinewidths` of TEM00 is reported (default 10). */
	degeneracyOrder?: number;
	degeneracyLinewidths?: number;
}

export interface SpectrumMode {
	m: number;
	n: number;
	/** Frequency above TEM00 of the same longitudinal order, Hz. */
	frequency_Hz: number;
	/** The same, folded into [0, FSR): where the line appears in a scan over one FSR from TEM00. */
	folded_Hz: number;
}

export interface Degeneracy {
	axis: 'x' | 'y';
	/** The mode order N (TEM_N0 on x, TEM_0N on y) that falls near TEM00. */
	order: number;
	/** Its distance from the nearest TEM00 line, Hz, and in linewidths. */
	offset_Hz: number;
	linewidths: number;
	/** θ/2π written as the nearby ratio of small integers, e.g. "1/2". */
	ratio: string;
}

export interface CavitySpectrum {
	fsr_Hz: number;
	gouy_rad: { x: number; y: number };
	transverseSpacing_Hz: { x: number; y: number };
	/** Round-trip field factor r, finesse, linewidth (FWHM). */
	roundTripFactor: number;
	finesse: number;
	linewidth_Hz: number;
	/** Peak transmitted and reflected fractions of a mode-matched input on resonance. */
	peakTransmission: number;
	resonantReflection: number;
	modes: SpectrumMode[];
	degeneracies: Degeneracy[];
	warnings: string[];
}

/**
 * Round-trip Gouy phase θ in (0, 2π) of one axis (Siegman 1986, §21.1): cos θ = (A + D)/2, sin θ with the
 * sign of B. The confocal-like round trip M = ±1 (every ray retraces itself) gives θ = π (M = −1) and is
 * accepted; any other |(A + D)/2| ≥ 1 has no confined mode and throws.
 */
export function roundTripGouy_rad(m: Mat2, axis = 'x'): number {
	const [A, B, C, D] = m;
	const half = (A + D) / 2;
	const tol = 1e-12;
	if (Math.abs(half) >= 1 - tol) {
		const scale = Math.max(1, Math.abs(A), Math.abs(D));
		const minusOne = Math.abs(A + 1) < 1e-9 && Math.abs(D + 1) < 1e-9 && Math.abs(B) < 1e-9 * scale && Math.abs(C) < 1e-9 * scale;
		if (minusOne) return Math.PI;
		throw new RangeError(`cavity (${axis} axis) must be stable: (A + D)/2 of the round trip must lie strictly between −1 and 1 — got ${half.toPrecision(6)}${Math.abs(half) <= 1 + tol ? ' (on the stability boundary)' : ' (unstable)'}`);
	}
	const t = Math.acos(half);
	return B >= 0 ? t : 2 * Math.PI - t;
}

/** Nearest ratio p/q (q ≤ maxDen) to x in [0, 1), as text. */
function nearRatio(x: number, maxDen = 12): string {
	let best = { p: 0, q: 1, e: Math.abs(x) };
	for (let q = 1; q <= maxDen; q++) {
		const p = Math.round(x * q);
		const e = Math.abs(x - p / q);
		if (e < best.e - 1e-15) best = { p, q, e };
	}
	return `${best.p}/${best.q}`;
}

/** Round-trip field factor and Airy-line figures of a cavity (checks the reflectivities). */
export function airyFigures(reflectivity1: number, reflectivity2: number, roundTripLoss = 0): { r: number; finesse: number; linewidthFraction: number; peakTransmission: number; resonantReflection: number } {
	requireThat(Number.isFinite(reflectivity1) && reflectivity1 >= 0 && reflectivity1 < 1, 'mirror 1 reflectivity', '≥ 0 and < 1', reflectivity1);
	requireThat(Number.isFinite(reflectivity2) && reflectivity2 >= 0 && reflectivity2 < 1, 'mirror 2 reflectivity', '≥ 0 and < 1', reflectivity2);
	requireThat(Number.isFinite(roundTripLoss) && roundTripLoss >= 0 && roundTripLoss < 1, 'round-trip loss', '≥ 0 and < 1', roundTripLoss);
	const r = Math.sqrt(reflectivity1 * reflectivity2 * (1 - roundTripLoss));
	const s = (1 - r) / (2 * Math.sqrt(r));
	requireThat(r > 0 && s < 1, 'round-trip power R1·R2·(1 − loss)', '> 0.0295 (below it the resonance lines merge and have no half width)', (r * r).toPrecision(4));
	const linewidthFraction = (2 / Math.PI) * Math.asin(s);
	const r1 = Math.sqrt(reflectivity1);
	const rRest = Math.sqrt(reflectivity2 * (1 - roundTripLoss));
	return {
		r,
		finesse: 1 / linewidthFraction,
		linewidthFraction,
		peakTransmission: ((1 - reflectivity1) * (1 - reflectivity2)) / ((1 - r) * (1 - r)),
		resonantReflection: ((rRest - r1) * (rRest - r1)) / ((1 - r) * (1 - r))
	};
}

/**
 * Transmitted and reflected power fractions of one mode at round-trip phase detuning δ (rad) from its
 * resonance (Siegman 1986, eqs. 11.20–11.22): T = T1·T2/((1 − r)² + 4r·sin²(δ/2)),
 * R = ((r2′ − r1)² + 4·r1·r2′·sin²(δ/2))/((1 − r)² + 4r·sin²(δ/2)) with r1 = sqrt(R1), r2′ = sqrt(R2·(1 − loss)).
 */
export function airyLine(delta_rad: number, reflectivity1: number, reflectivity2: number, roundTripLoss = 0): { transmitted: number; reflected: number } {
	return airyLineAt(reflectivity1, reflectivity2, roundTripLoss)(delta_rad);
}

/**
 * airyLine for one cavity, with what does not depend on the detuning worked out once: for loops over
 * thousands of detunings (the predicted scan). Writes the fractions into `out` when given (no object
 * per call).
 */
export function airyLineAt(reflectivity1: number, reflectivity2: number, roundTripLoss = 0): (delta_rad: number, out?: { transmitted: number; reflected: number }) => { transmitted: number; reflected: number } {
	const r1 = Math.sqrt(reflectivity1);
	const r2 = Math.sqrt(reflectivity2 * (1 - roundTripLoss));
	const r = r1 * r2;
	const tNum = (1 - reflectivity1) * (1 - reflectivity2);
	const rNum = (r2 - r1) * (r2 - r1);
	const rSin = 4 * r1 * r2;
	const dConst = (1 - r) * (1 - r);
	const dSin = 4 * r;
	return (delta_rad, out = { transmitted: 0, reflected: 0 }) => {
		const s2 = Math.sin(delta_rad / 2) ** 2;
		const den = dConst + dSin * s2;
		out.transmitted = tNum / den;
		out.reflected = (rNum + rSin * s2) / den;
		return out;
	};
}

/** The spectrum of a cavity; throws a RangeError naming the field for bad input or an unstable cavity. */
export function cavitySpectrum(input: SpectrumInput): CavitySpectrum {
	requireThat(Number.isFinite(input.roundTrip_m) && input.roundTrip_m > 0, 'round-trip path', '> 0 m', input.roundTrip_m, 'm');
	const maxOrder = input.maxOrder ?? 4;
	requireThat(Number.isInteger(maxOrder) && maxOrder >= 0 && maxOrder <= 40, 'highest mode order', 'a whole number from 0 to 40', maxOrder);
	const loss = input.roundTripLoss ?? 0;
	const airy = airyFigures(input.reflectivity1, input.reflectivity2, loss);
	const fsr = speedOfLight_m_s / input.roundTrip_m;
	const gx = roundTripGouy_rad(input.matrices.x, 'x');
	const gy = roundTripGouy_rad(input.matrices.y, 'y');
	const reflections = input.reflections ?? (input.kind === 'linear' ? 2 : 4);
	const flip = input.kind === 'ring' && reflections % 2 === 1;
	const spacingX = (fsr * gx) / (2 * Math.PI);
	const spacingY = (fsr * gy) / (2 * Math.PI);
	const fold = (f: number) => {
		const r = f - fsr * Math.floor(f / fsr);
		return r >= fsr * (1 - 1e-12) ? 0 : r;
	};
	const modes: SpectrumMode[] = [];
	for (let order = 0; order <= maxOrder; order++) {
		for (let m = order; m >= 0; m--) {
			const n = order - m;
			const f = m * spacingX + n * spacingY + (flip && m % 2 === 1 ? fsr / 2 : 0);
			modes.push({ m, n, frequency_Hz: f, folded_Hz: fold(f) });
		}
	}
	const linewidth = fsr * airy.linewidthFraction;
	const degeneracies: Degeneracy[] = [];
	const maxDeg = input.degeneracyOrder ?? 10;
	const within = input.degeneracyLinewidths ?? 3;
	for (const [axis, spacing, g] of [['x', spacingX, gx], ['y', spacingY, gy]] as const) {
		for (let N = 1; N <= maxDeg; N++) {
			const f = fold(N * spacing + (axis === 'x' && flip && N % 2 === 1 ? fsr / 2 : 0));
			const off = Math.min(f, fsr - f);
			if (off <= within * linewidth) {
				degeneracies.push({ axis, order: N, offset_Hz: off, linewidths: off / linewidth, ratio: nearRatio(g / (2 * Math.PI)) });
				break;
			}
		}
	}
	const warnings = degeneracies.map(
		(d) =>
			`Near-degenerate cavity (${d.axis} axis): Gouy phase/2π is close to ${d.ratio}; modes of order ${d.order} on ${d.axis} fall ${d.linewidths < 0.05 ? 'on' : `${d.linewidths.toPrecision(2)} linewidths from`} TEM00, so their peaks overlap the fundamental.`
	);
	return {
		fsr_Hz: fsr,
		gouy_rad: { x: gx, y: gy },
		transverseSpacing_Hz: { x: spacingX, y: spacingY },
		roundTripFactor: airy.r,
		finesse: airy.finesse,
		linewidth_Hz: linewidth,
		peakTransmission: airy.peakTransmission,
		resonantReflection: airy.resonantReflection,
		modes,
		degeneracies,
		warnings
	};
}
