/**
 * Single-mode step-index fibre: normalised frequency and mode-field diameter.
 *
 * V = 2π·a·NA/λ (single mode for V < 2.405). Mode-field radius from Marcuse's fit
 * (D. Marcuse, "Loss analysis of single-mode fiber splices", Bell Syst. Tech. J. 56, 703 (1977), eq. 1):
 * w/a = 0.65 + 1.619·V^−1.5 + 2.879·V^−6, good to about 1 % for 1.2 < V < 2.4.
 */
import { requirePositive, requireThat } from './constants';

/** Cut-off of the LP11 mode: the first zero of J0 (common practice: 2.405). */
export const singleModeCutoffV = 2.405;

/** V = 2π·a·NA/λ. Example: a = 4.1 µm, NA = 0.14, λ = 1550 nm → V = 2.3268. */
export function vNumber(coreRadius_m: number, na: number, wavelength_m: number): number {
	requirePositive(coreRadius_m, 'core radius', 'm');
	requireThat(Number.isFinite(na) && na > 0 && na < 1, 'numerical aperture', '> 0 and < 1', na);
	requirePositive(wavelength_m, 'wavelength', 'm');
	return (2 * Math.PI * coreRadius_m * na) / wavelength_m;
}

export interface FiberMode {
	V: number;
	/** Mode-field diameter 2w (1/e² intensity), m. */
	mfd_m: number;
	singleMode: boolean;
	/** Set when V lies outside the range where the Marcuse fit holds. */
	note: string | null;
}

/**
 * Mode field of a step-index fibre (Marcuse 1977, eq. 1).
 * Example: a = 4.1 µm, NA = 0.14, λ = 1550 nm → V = 2.3268, MFD = 9.220 µm.
 */
export function fiberMode(coreRadius_m: number, na: number, wavelength_m: number): FiberMode {
	const V = vNumber(coreRadius_m, na, wavelength_m);
	requireThat(V >= 0.8, 'V number', '≥ 0.8 for the Marcuse mode-field fit (larger core, NA or shorter wavelength)', V.toPrecision(4));
	const w = coreRadius_m * (0.65 + 1.619 * V ** -1.5 + 2.879 * V ** -6);
	const singleMode = V < singleModeCutoffV;
	let note: string | null = null;
	if (!singleMode) note = `V = ${V.toPrecision(4)} ≥ ${singleModeCutoffV}: the fibre guides more than one mode at this wavelength`;
	else if (V < 1.2) note = `V = ${V.toPrecision(4)} < 1.2: the Marcuse fit is less accurate here`;
	return { V, mfd_m: 2 * w, singleMode, note };
}
