/**
 * The caustic of a beam of quality M²: second-moment diameter along z, and ready-made arrays for plots.
 */
import { fittedDiameter_m, type CausticFit } from './fit';

/**
 * Second-moment diameter of a beam of quality M² at z:
 *   d(z)² = d0² + Θ²·(z − z0)²,  Θ = 4·M²·λ/(π·d0)  (full divergence).
 * Units: d0_m, z0_m, wavelength_m, z_m in m; returns m.
 * Example: d0 = 1 mm, z0 = 0, M² = 1, λ = 1064 nm, z = 1 m → Θ = 1.3547 mrad, d = 1.6822 mm.
 * Source: ISO 11146-1:2005, clause 3 definitions of Θ and M² (from memory); for M² = 1 this is
 * w(z) = w0·√(1 + (z/zR)²) of H. Kogelnik, T. Li, "Laser Beams and Resonators", Appl. Opt. 5 (1966), eq. 20 (number from memory).
 */
export function causticDiameter_m(d0_m: number, z0_m: number, m2: number, wavelength_m: number, z_m: number): number {
	if (!(d0_m > 0)) throw new RangeError(`waist diameter must be > 0 m — got ${d0_m} m`);
	if (!(m2 > 0)) throw new RangeError(`M² must be > 0 — got ${m2}`);
	if (!(wavelength_m > 0)) throw new RangeError(`wavelength must be > 0 m — got ${wavelength_m} m`);
	const theta = (4 * m2 * wavelength_m) / (Math.PI * d0_m);
	return Math.sqrt(d0_m * d0_m + theta * theta * (z_m - z0_m) ** 2);
}

export interface CausticSamples {
	z_m: Float64Array;
	d_m: Float64Array;
}

/**
 * Sample the fitted caustic d(z) = √(a + b·z + c·z²) at n evenly spaced z in [zFrom_m, zTo_m], for plots.
 * Units: m. Example: for a fit with a = 1e-6 m², b = 0, c = 1e-6, sampling [−1, 1] m at n = 3 gives
 * d = [1.414, 1, 1.414] mm.
 * Source: the hyperbola of ISO 11146-1:2005, clause 9 (from memory).
 */
export function sampleCaustic(fit: CausticFit, zFrom_m: number, zTo_m: number, n = 200): CausticSamples {
	if (!(Number.isFinite(zFrom_m) && Number.isFinite(zTo_m) && zTo_m > zFrom_m)) {
		throw new RangeError(`plot range must be finite with end > start — got ${zFrom_m} m to ${zTo_m} m`);
	}
	if (!(Number.isInteger(n) && n >= 2)) throw new RangeError(`sample count must be an integer ≥ 2 — got ${n}`);
	const z = new Float64Array(n);
	const d = new Float64Array(n);
	for (let k = 0; k < n; k++) {
		z[k] = zFrom_m + ((zTo_m - zFrom_m) * k) / (n - 1);
		d[k] = fittedDiameter_m(fit, z[k]);
	}
	return { z_m: z, d_m: d };
}
