/**
 * Source beams: turn what a datasheet or a measurement gives into a waist (w0, z0) per axis.
 * z is measured from the source's reference plane (the laser's exit aperture, z = 0), +z downstream.
 */
import { requireParaxial } from './paraxial';
import { farFieldHalfAngle_rad, rayleighRange_m } from './beam';
import { requireFinite, requirePositive, requireThat } from './constants';

export type AxisSourceSpec =
	| { kind: 'waist'; w0_m: number; z0_m: number }
	/** 1/e² diameter at a plane plus the full far-field divergence; the waist is behind the plane unless `converging`. */
	| { kind: 'divergence'; d_m: number; at_m: number; fullDivergence_rad: number; converging?: boolean }
	/** Two 1/e² diameters at two planes; M² and wavelength fix the divergence. */
	| { kind: 'twoDiameters'; d1_m: number; z1_m: number; d2_m: number; z2_m: number };

export interface AxisSource {
	m2: number;
	spec: AxisSourceSpec;
}

export interface SourceSpec {
	wavelength_m: number;
	/** Refractive index of the medium the source emits into. */
	index: number;
	x: AxisSource;
	y: AxisSource;
}

/** The resolved waist of one axis, plus any note on an ambiguous input. */
export interface AxisWaist {
	w0_m: number;
	z0_m: number;
	m2: number;
	note?: string;
}

/**
 * Waist from a diameter d at plane z_p and full divergence Θ: w0 = M²λ/(π·n·Θ/2)... here M² is
 * already inside Θ, so w0 = λ_eff/(π·n·θ) with θ = Θ/2 and λ_eff = M²λ (Siegman 1986, eq. 17.16),
 * then |z_p − z0| = zR·sqrt((w/w0)² − 1) (Kogelnik & Li 1966, eq. 20, number from memory).
 * Example: d = 2 mm, Θ = 1 mrad, λ = 1064 nm, M² = 1 → w0 = 0.6773 mm, waist 1.4713 m behind the plane.
 */
export function waistFromDivergence(
	d_m: number,
	at_m: number,
	fullDivergence_rad: number,
	wavelength_m: number,
	m2: number,
	index = 1,
	converging = false
): AxisWaist {
	requirePositive(d_m, 'beam diameter', 'm');
	requirePositive(fullDivergence_rad, 'full divergence', 'rad');
	requireFinite(at_m, 'plane position', 'm');
	const theta = fullDivergence_rad / 2;
	const w0 = (m2 * wavelength_m) / (Math.PI * index * theta);
	const w = d_m / 2;
	if (w < w0 * (1 - 1e-12)) {
		throw new RangeError(
			`beam diameter must be ≥ the waist diameter implied by the divergence (${(2 * w0).toPrecision(4)} m for this M² and wavelength) — got ${d_m} m; lower M² or raise the divergence`
		);
	}
	const zR = rayleighRange_m(w0, wavelength_m, m2, index);
	const dz = zR * Math.sqrt(Math.max(0, (w / w0) ** 2 - 1));
	return { w0_m: w0, z0_m: converging ? at_m + dz : at_m - dz, m2 };
}

/**
 * Waist from two diameters at two planes for a beam of known M² and wavelength.
 * Solves w(z)² = w0² + θ²·(z − z0)², θ = M²λ/(π·n·w0), for (w0, z0). Subtracting the two equations
 * gives z0 as a function of w0; the remaining equation is solved by bisection on w0 ∈ (0, min w].
 * Where two waists fit, the larger (the less divergent beam) is returned with a note.
 */
export function waistFromTwoDiameters(d1_m: number, z1_m: number, d2_m: number, z2_m: number, wavelength_m: number, m2: number, index = 1): AxisWaist {
	requirePositive(d1_m, 'first diameter', 'm');
	requirePositive(d2_m, 'second diameter', 'm');
	requireThat(Number.isFinite(z1_m) && Number.isFinite(z2_m) && z1_m !== z2_m, 'the two plane positions', 'finite and different', `${z1_m} m and ${z2_m} m`);
	const w1 = d1_m / 2;
	const w2 = d2_m / 2;
	const k = ((m2 * wavelength_m) / (Math.PI * index)) ** 2; // θ²·w0²
	// For a trial a = w0²: θ² = k/a; from w1² − w2² = (k/a)·(z1 − z2)·(z1 + z2 − 2·z0):
	const z0Of = (a: number) => (z1_m + z2_m) / 2 - ((w1 * w1 - w2 * w2) * a) / (2 * k * (z1_m - z2_m));
	const residual = (a: number) => {
		const z0 = z0Of(a);
		return a + (k / a) * (z1_m - z0) ** 2 - w1 * w1;
	};
	const aMax = Math.min(w1, w2) ** 2;
	// Scan for sign changes on a log grid, then bisect each; keep the largest root.
	const roots: number[] = [];
	const n = 400;
	let prevA = aMax * 1e-12;
	let prevR = residual(prevA);
	for (let i = 1; i <= n; i++) {
		const a = aMax * Math.pow(1e-12, 1 - i / n);
		const r = residual(a);
		if (prevR === 0) roots.push(prevA);
		else if (prevR * r < 0) {
			let lo = prevA;
			let hi = a;
			let rlo = prevR;
			for (let j = 0; j < 200 && hi - lo > 1e-15 * hi; j++) {
				const mid = 0.5 * (lo + hi);
				const rm = residual(mid);
				if (rlo * rm <= 0) hi = mid;
				else {
					lo = mid;
					rlo = rm;
				}
			}
			roots.push(0.5 * (lo + hi));
		}
		prevA = a;
		prevR = r;
	}
	if (Math.abs(residual(aMax)) <= 1e-12 * aMax && !roots.some((r) => Math.abs(r - aMax) < 1e-9 * aMax)) roots.push(aMax);
	if (roots.length === 0) {
		throw new RangeError(
			`the two diameters cannot belong to one beam of this M² and wavelength — got ${d1_m} m at ${z1_m} m and ${d2_m} m at ${z2_m} m; check M², the wavelength or the planes`
		);
	}
	const a = Math.max(...roots);
	const res: AxisWaist = { w0_m: Math.sqrt(a), z0_m: z0Of(a), m2 };
	if (roots.length > 1) {
		const other = Math.min(...roots);
		res.note = `two beams fit these diameters; using the larger waist (${(2 * Math.sqrt(a)).toPrecision(4)} m diameter), the other has ${(2 * Math.sqrt(other)).toPrecision(4)} m at ${z0Of(other).toPrecision(4)} m`;
	}
	return res;
}

/** Resolve one axis of a source to its waist; a waist outside the paraxial range is refused (paraxial.ts). */
export function resolveAxis(axis: AxisSource, wavelength_m: number, index: number): AxisWaist {
	const w = resolveAxisUnchecked(axis, wavelength_m, index);
	requireParaxial(w.w0_m, wavelength_m, w.m2, index, 'source waist radius');
	return w;
}

function resolveAxisUnchecked(axis: AxisSource, wavelength_m: number, index: number): AxisWaist {
	requirePositive(wavelength_m, 'wavelength', 'm');
	requireThat(Number.isFinite(axis.m2) && axis.m2 >= 1, 'M²', '≥ 1', axis.m2);
	requireThat(Number.isFinite(index) && index >= 1, 'source medium index', '≥ 1', index);
	const s = axis.spec;
	switch (s.kind) {
		case 'waist':
			requirePositive(s.w0_m, 'waist radius', 'm');
			requireFinite(s.z0_m, 'waist location', 'm');
			return { w0_m: s.w0_m, z0_m: s.z0_m, m2: axis.m2 };
		case 'divergence':
			return waistFromDivergence(s.d_m, s.at_m, s.fullDivergence_rad, wavelength_m, axis.m2, index, s.converging);
		case 'twoDiameters':
			return waistFromTwoDiameters(s.d1_m, s.z1_m, s.d2_m, s.z2_m, wavelength_m, axis.m2, index);
	}
}

export { farFieldHalfAngle_rad };
