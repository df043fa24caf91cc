/**
 * Hazard distances and eyewear: the far-field NOHD formula, aided viewing, diffuse reflections and the
 * optical density required. SI throughout; a pulse train enters as its average power with the
 * matching average-irradiance limit (per-pulse energy·f and per-pulse limit·f scale alike, so the
 * distances are the same as comparing one pulse with the per-pulse limit).
 *
 * Beam sizes: the formula forms of IEC TR 60825-14 and ANSI Z136.1 use the 1/e diameter a and the
 * 1/e full divergence φ; our inputs are 1/e² (DEVELOPERS.md, conventions), so a = d/√2 and φ = Θ/√2. With these,
 * 4P/(π·a²) is the peak (on-axis) irradiance of a Gaussian beam.
 */
import { apertureAveragedIrradiance_W_m2, peakIrradiance_W_m2 } from './aperture';

export interface FormulaNohdInput {
	power_W: number;
	mpe_W_m2: number;
	/** 1/e² beam diameter at the exit aperture, m. */
	diameter_m: number;
	/** 1/e² full-angle divergence, rad. */
	fullDivergence_rad: number;
	/** Optical gain of a viewing aid (1 for the naked eye). */
	gain?: number;
}

export interface FormulaNohd {
	nohd_m: number;
	/** 1/e diameter and full divergence used in the formula. */
	a_m: number;
	phi_rad: number;
	formula: string;
}

function requirePositive(v: number, name: string, unit: string) {
	if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a finite number > 0 ${unit} — got ${v} ${unit}`.trim());
}

/**
 * NOHD = (√(4·P·K/(π·E_MPE)) − a)/φ, zero when the beam is already below the limit at the exit.
 * Formula form of IEC TR 60825-14 and ANSI Z136.1 (K = 1 for the naked eye).
 * Example: 5 W, E_MPE = 25.46 W/m², d = 2.83 mm, Θ = 1.41 mrad (a = 2.001 mm, φ = 0.9970 mrad) → 499.5 m.
 */
export function nohdFormula(input: FormulaNohdInput): FormulaNohd {
	const { power_W, mpe_W_m2, diameter_m, fullDivergence_rad, gain = 1 } = input;
	requirePositive(power_W, 'power', 'W');
	requirePositive(mpe_W_m2, 'exposure limit', 'W/m²');
	requirePositive(fullDivergence_rad, 'beam divergence', 'rad');
	requirePositive(gain, 'optical gain', '');
	if (!(Number.isFinite(diameter_m) && diameter_m >= 0)) throw new RangeError(`beam diameter must be ≥ 0 m — got ${diameter_m} m`);
	const a = diameter_m / Math.SQRT2;
	const phi = fullDivergence_rad / Math.SQRT2;
	const root = Math.sqrt((4 * power_W * gain) / (Math.PI * mpe_W_m2));
	return { nohd_m: Math.max(0, (root - a) / phi), a_m: a, phi_rad: phi, formula: 'NOHD = (√(4·P·K/(π·E_MPE)) − a)/φ, a and φ at 1/e' };
}

export interface ViewingOptic {
	/** Objective (entrance) diameter, m. */
	objective_m: number;
	magnification: number;
	/** Transmission of the optic at the wavelength, 0–1. */
	transmission: number;
}

/** Check a viewing optic; RangeError naming the value and the rule. */
export function checkOptic(o: ViewingOptic): void {
	requirePositive(o.objective_m, 'optic objective diameter', 'm');
	requirePositive(o.magnification, 'optic magnification', '');
	if (!(o.transmission > 0 && o.transmission <= 1)) throw new RangeError(`optic transmission must be within (0, 1] — got ${o.transmission}`);
}

/**
 * Optical gain of binoculars or a telescope for a beam wider than the objective:
 * K = τ·min(M², (D_o/D_pupil)²) — the power collected by the objective, of which the eye's aperture
 * takes all when the exit pupil D_o/M is smaller than it. Form of IEC TR 60825-14 (aided viewing).
 * Example: 7×50, τ = 0.9, 7 mm pupil → 0.9·min(49, 51.0) = 44.1.
 */
export function opticalGain(optic: ViewingOptic, pupil_m: number): number {
	checkOptic(optic);
	requirePositive(pupil_m, 'limiting aperture', 'm');
	const ratio = optic.objective_m / pupil_m;
	return optic.transmission * Math.min(optic.magnification ** 2, ratio * ratio);
}

/**
 * Hazard distance for a diffuse (Lambertian) reflection of the whole beam, viewed at angle θ from the
 * surface normal: E(r) = ρ·P·cosθ/(π·r²) ⇒ r = √(ρ·P·cosθ/(π·E_MPE)). Form of ANSI Z136.1 (diffuse
 * reflection NHZ). The reflecting spot is treated as a point source (C_E = 1), which is stricter.
 * Example: 5 W, ρ = 0.9, θ = 0, E_MPE = 25.46 W/m² → √(0.9·5/(π·25.46)) = 0.2372 m.
 */
export function diffuseHazardDistance_m(input: { power_W: number; mpe_W_m2: number; reflectance: number; viewingAngle_rad: number }): number {
	const { power_W, mpe_W_m2, reflectance, viewingAngle_rad } = input;
	requirePositive(power_W, 'power', 'W');
	requirePositive(mpe_W_m2, 'exposure limit', 'W/m²');
	if (!(reflectance >= 0 && reflectance <= 1)) throw new RangeError(`reflectance must be within 0–1 — got ${reflectance}`);
	if (!(viewingAngle_rad >= 0 && viewingAngle_rad <= Math.PI / 2)) throw new RangeError(`viewing angle must be within 0–90° from the surface normal — got ${viewingAngle_rad} rad`);
	return Math.sqrt((reflectance * power_W * Math.cos(viewingAngle_rad)) / (Math.PI * mpe_W_m2));
}

export interface OpticalDensity {
	/** log10(exposure/limit), not rounded; 0 when the exposure is already below the limit. */
	od: number;
	/** The next whole number at or above `od`. */
	odWhole: number;
}

/**
 * Eyewear optical density required: OD = log10(H/H_MPE) (or E/E_MPE), IEC TR 60825-14 and ANSI
 * Z136.1 form; the whole number at or above it is the one eyewear is marked with.
 * Example: exposure 1.299·10⁵ W/m², limit 25.46 W/m² → OD 3.708, whole 4.
 */
export function requiredOpticalDensity(exposure: number, limit: number): OpticalDensity {
	requirePositive(limit, 'exposure limit', '');
	if (!(Number.isFinite(exposure) && exposure >= 0)) throw new RangeError(`exposure must be a finite number ≥ 0 — got ${exposure}`);
	const od = exposure <= limit ? 0 : Math.log10(exposure / limit);
	return { od, odWhole: Math.max(0, Math.ceil(od - 1e-9)) };
}

export interface AtDistance {
	/** On-axis (peak) value: 2·Q/(π·w²). */
	peak: number;
	/** Averaged over the limiting aperture: Q·(1 − exp(−2(D/2)²/w²))/(π(D/2)²). */
	averaged: number;
	/** 1/e² beam radius there, m. */
	w_m: number;
}

/**
 * Exposure at a distance z from the exit aperture (waist there): w(z) = √((d/2)² + (Θz/2)²), then
 * peak and aperture-averaged values. Give a power (W → W/m²) or a pulse energy (J → J/m²).
 * Example: 5 W, d = 2.83 mm, Θ = 1.41 mrad, z = 100 m, D = 7 mm → w = 70.51 mm, peak 640.2 W/m²,
 * averaged 638.6 W/m².
 */
export function exposureAtDistance(input: { amount: number; diameter_m: number; fullDivergence_rad: number; distance_m: number; aperture_m: number }): AtDistance {
	const { amount, diameter_m, fullDivergence_rad, distance_m, aperture_m } = input;
	requirePositive(amount, 'power or energy', '');
	requirePositive(diameter_m, 'beam diameter', 'm');
	requirePositive(aperture_m, 'limiting aperture', 'm');
	if (!(Number.isFinite(fullDivergence_rad) && fullDivergence_rad >= 0)) throw new RangeError(`beam divergence must be ≥ 0 rad — got ${fullDivergence_rad} rad`);
	if (!(Number.isFinite(distance_m) && distance_m >= 0)) throw new RangeError(`distance must be ≥ 0 m — got ${distance_m} m`);
	const w = Math.hypot(diameter_m / 2, (fullDivergence_rad * distance_m) / 2);
	return { peak: peakIrradiance_W_m2(amount, w), averaged: apertureAveragedIrradiance_W_m2(amount, aperture_m, w), w_m: w };
}
