/**
 * Two-lens beam expanders (Keplerian: both lenses positive, an internal focus; Galilean: one negative
 * lens, no focus) chosen from the inventory for a wanted magnification range.
 *
 * After lens 1 the beam has a waist at p (relative to lens 1) with Rayleigh range zR′. A thin lens f2 at
 * distance s = d − p from that waist makes a new waist at s′ = f2 + (s − f2)·f2²/((s − f2)² + zR′²) with
 * zR″ = f2²·zR′/((s − f2)² + zR′²) (S. A. Self, "Focusing of spherical Gaussian beams", Appl. Opt. 22,
 * 658 (1983), eqs. 9–10). "Collimate" takes the spacing that makes zR″ largest (least divergent output):
 * s = f2, d = p + f2, output waist f2 after lens 2; for a beam whose waist is far away p → f1 and
 * d → f1 + f2. The spacing tolerance is the change of d that raises the output divergence by 10 %:
 * Δd = zR′·sqrt(1.1² − 1).
 */
import { throughLens } from './evaluate';
import type { QHat } from '../beam';
import type { StockLens } from './types';

export interface ExpanderOptions {
	magMin: number;
	magMax: number;
	/** Position of the first lens on the bench, m. */
	lens1At_m: number;
	/** Wanted output waist distance after lens 2, m; null → collimate (least divergence). */
	waistAfter_m: number | null;
}

export interface Expander {
	kind: 'Keplerian' | 'Galilean';
	lens1: string;
	lens2: string;
	f1_m: number;
	f2_m: number;
	/** Nominal magnification |f2/f1|. */
	magnification: number;
	spacing_m: number;
	/** Output waist radius, its distance after lens 2, the far-field half-angle. */
	outputWaist_m: number;
	outputWaistAfter_m: number;
	divergence_rad: number;
	/** ± spacing change that keeps the divergence within 10 % of its least value. */
	spacingTolerance_m: number;
}

/**
 * Expander for one lens pair and one axis beam (q̂ at z = 0, M², λ). Null when the pair cannot do it
 * (spacing ≤ 0, or the wanted waist distance out of reach).
 */
export function expanderFor(q0: QHat, m2: number, wavelength_m: number, f1_m: number, f2_m: number, o: Pick<ExpanderOptions, 'lens1At_m' | 'waistAfter_m'>): Omit<Expander, 'lens1' | 'lens2' | 'kind' | 'magnification'> | null {
	const q1 = throughLens(q0, o.lens1At_m, f1_m);
	const p = -q1.re;
	const zr = q1.im;
	const f = f2_m;
	let x = 0;
	if (o.waistAfter_m !== null && Math.abs(o.waistAfter_m - f) > 1e-15) {
		const D = o.waistAfter_m;
		const disc = f ** 4 - 4 * (D - f) ** 2 * zr * zr;
		if (disc < 0) return null;
		x = (f * f - Math.sqrt(disc)) / (2 * (D - f));
	}
	const spacing = p + f + x;
	if (!(spacing > 0)) return null;
	const zr2 = (f * f * zr) / (x * x + zr * zr);
	const after = f + (x * f * f) / (x * x + zr * zr);
	const w0 = Math.sqrt((m2 * wavelength_m * zr2) / Math.PI);
	return {
		f1_m,
		f2_m,
		spacing_m: spacing,
		outputWaist_m: w0,
		outputWaistAfter_m: after,
		divergence_rad: (m2 * wavelength_m) / (Math.PI * w0),
		spacingTolerance_m: zr * Math.sqrt(1.21 - 1)
	};
}

/** All expanders from the inventory within the magnification range, least divergence first. */
export function findExpanders(q0: QHat, m2: number, wavelength_m: number, inventory: StockLens[], o: ExpanderOptions): Expander[] {
	const out: Expander[] = [];
	for (let i = 0; i < inventory.length; i++) {
		for (let j = 0; j < inventory.length; j++) {
			if (i === j && inventory[i].count < 2) continue;
			const a = inventory[i];
			const b = inventory[j];
			if (a.count < 1 || b.count < 1) continue;
			const mag = Math.abs(b.f_m / a.f_m);
			if (mag < o.magMin || mag > o.magMax) continue;
			if (a.f_m < 0 && b.f_m < 0) continue;
			const e = expanderFor(q0, m2, wavelength_m, a.f_m, b.f_m, o);
			if (!e) continue;
			out.push({ ...e, kind: a.f_m > 0 && b.f_m > 0 ? 'Keplerian' : 'Galilean', lens1: a.label, lens2: b.label, magnification: mag });
		}
	}
	return out.sort((p, q) => p.divergence_rad - q.divergence_rad);
}
