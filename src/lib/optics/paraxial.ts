/**
 * The paraxial range of the Gaussian-beam model. The q-parameter and ABCD description assume small
 * angles; a waist smaller than M²λ0/(π·n) has a far-field half-angle θ = M²λ0/(π·n·w0) above 1 rad,
 * where the model's numbers no longer describe a real beam (Siegman, "Lasers", 1986, §16.1: the
 * paraxial wave equation needs w0 ≫ λ; the 1 rad bound is our stated limit, common practice).
 * Such beams are refused with the smallest waist allowed, never printed as valid.
 */

/** Largest far-field half-angle the engine accepts, rad. */
export const MAX_PARAXIAL_HALF_ANGLE_rad = 1;

/** Smallest waist radius the paraxial model accepts: M²·λ0 / (π·n·θmax), m. */
export function minParaxialWaist_m(wavelength_m: number, m2 = 1, index = 1): number {
	return (m2 * wavelength_m) / (Math.PI * index * MAX_PARAXIAL_HALF_ANGLE_rad);
}

/** Why this waist lies outside the paraxial range, or null when it is inside. */
export function paraxialProblem(w0_m: number, wavelength_m: number, m2 = 1, index = 1, what = 'waist radius'): string | null {
	const min = minParaxialWaist_m(wavelength_m, m2, index);
	if (Number.isFinite(w0_m) && w0_m >= min) return null;
	const theta = (m2 * wavelength_m) / (Math.PI * index * w0_m);
	const fmt = (x: number) => (Number.isFinite(x) ? String(+x.toPrecision(4)) : 'beyond any finite value');
	const len = (x: number) => (!Number.isFinite(x) ? fmt(x) : x >= 1e-3 ? `${fmt(x * 1e3)} mm` : `${fmt(x * 1e6)} µm`);
	return `${what} must be ≥ M²·λ/(π·n) = ${len(min)} (far-field half-angle ≤ ${MAX_PARAXIAL_HALF_ANGLE_rad} rad, the paraxial range of the Gaussian-beam model) — got ${len(w0_m)} (θ would be ${fmt(theta)} rad)`;
}

/** Throws a RangeError when the waist lies outside the paraxial range. */
export function requireParaxial(w0_m: number, wavelength_m: number, m2 = 1, index = 1, what = 'waist radius'): void {
	const p = paraxialProblem(w0_m, wavelength_m, m2, index, what);
	if (p) throw new RangeError(p);
}
