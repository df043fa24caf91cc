/**
 * Caustic fit per ISO 11146-1:2005, clause 9 (from memory): the squared second-moment diameter of
 * one axis along z is fitted by the hyperbola d²(z) = a + b·z + c·z², and
 *
 *   z0 = −b/(2c)                       waist location
 *   d0 = √(4ac − b²)/(2√c)             waist diameter
 *   Θ  = √c                            full far-field divergence angle
 *   zR = √(4ac − b²)/(2c) = d0/Θ       Rayleigh length
 *   M² = π/(8λ)·√(4ac − b²) = π·d0·Θ/(4λ)
 *
 * Conventions (DEVELOPERS.md): d is the second-moment (D4σ) diameter = 2w, SI units (m, rad), x and y
 * are fitted independently (simple astigmatism). Each figure carries a standard uncertainty
 * propagated from the covariance of (a, b, c) to first order (GUM, JCGM 100:2008, eq. 13).
 *
 * Weighting: ISO 11146-1 asks for a least-squares fit of d²(z). Because d² near the waist and far
 * from it differ by one or two orders of magnitude, the default here ('relative') weights each plane
 * by 1/d⁴, so every plane counts by its relative deviation in d²; 'plain' weights all planes
 * equally. The choice is ours and is reported with each result.
 */
import { fitQuadratic } from './lsq';

export type Weighting = 'relative' | 'plain';

export interface CausticPoint {
	z_m: number;
	d_m: number;
}

/** The five figures of one axis; also used for their standard uncertainties. */
export interface BeamFigures {
	d0_m: number;
	z0_m: number;
	fullDivergence_rad: number;
	zR_m: number;
	/** null when no wavelength was given. */
	m2: number | null;
}

export interface FitResidual {
	z_m: number;
	d_m: number;
	dFit_m: number;
	/** d − d_fit, m. */
	residual_m: number;
}

export interface FitOptions {
	/** Vacuum wavelength, m; needed for M² only. */
	wavelength_m?: number;
	weighting?: Weighting;
}

interface FitCommon {
	n: number;
	weighting: Weighting;
	/** Coefficients of d²(z) = a + b·z + c·z² (a in m², b in m, c dimensionless), z in m. */
	a_m2: number;
	b_m: number;
	c: number;
}

export interface PhysicalFit extends FitCommon, BeamFigures {
	physical: true;
	/** Set when the fitted M² lies below 1 but within two standard uncertainties of it (noise can do that). */
	note?: string;
	/** Standard uncertainties (1σ) from the fit covariance; null when n = 3 (no residual degrees of freedom). */
	uncertainty: { [K in keyof BeamFigures]: number | null } | null;
	residuals: FitResidual[];
	/** Root-mean-square of (d − d_fit)/d_fit over the planes. */
	rmsRelativeResidual: number;
}

export interface UnphysicalFit extends FitCommon {
	physical: false;
	/** Why the fitted hyperbola is not a beam caustic (c ≤ 0, 4ac − b² ≤ 0, or M² below 1). */
	reason: string;
	/** For M² < 1: the likely causes, in words. */
	likelyCauses?: string[];
	/** For M² < 1: the figures the hyperbola gives, for diagnosis only (not a real beam), with their uncertainties. */
	figures?: BeamFigures;
	figureUncertainty?: { [K in keyof BeamFigures]: number | null } | null;
}

/**
 * Likely causes of a fitted M² below 1, which no real beam has (ISO 11146-1:2005, clause 3: M² ≥ 1,
 * equal to 1 for a TEM00 Gaussian beam; from memory).
 */
export const M2_BELOW_ONE_CAUSES: readonly string[] = [
	'wrong wavelength (M² scales as 1/λ)',
	'widths that are not second-moment (D4σ) diameters, e.g. FWHM or 1/e² clip widths of a beam that is not Gaussian, or moments cut short by a small integration area',
	'a scale error in z or in the widths (pixel pitch, magnification of imaging optics, z unit): M² scales with d0·Θ'
];

export type CausticFit = PhysicalFit | UnphysicalFit;

/**
 * Fitted diameter d(z) = √(a + b·z + c·z²), m (z in m), or 0 where the quadratic dips below zero
 * (possible only for a fit that is not physical).
 * Example: a = 1e-6 m², b = 0, c = 1e-6, z = 1 m → d = 1.414 mm.
 * Source: ISO 11146-1:2005, clause 9 (from memory).
 */
export function fittedDiameter_m(fit: FitCommon, z_m: number): number {
	const v = fit.a_m2 + fit.b_m * z_m + fit.c * z_m * z_m;
	return v > 0 ? Math.sqrt(v) : 0;
}

function quadForm(g: number[], cov: number[]): number {
	let s = 0;
	for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) s += g[i] * cov[3 * i + j] * g[j];
	return Math.sqrt(Math.max(0, s));
}

function finiteOrNull(v: number): number | null {
	return Number.isFinite(v) ? v : null;
}

/**
 * Fit the hyperbola d²(z) = a + b·z + c·z² to measured second-moment diameters of one axis
 * (ISO 11146-1:2005, clause 9, from memory) and derive d0, z0, Θ, zR and M² with uncertainties.
 *
 * Units: z_m and d_m in m; wavelength_m in m. Planes must have finite z, d > 0, and at least three
 * different z. A hyperbola with c ≤ 0 or 4ac − b² ≤ 0 is returned as `physical: false` with the reason,
 * and so is one whose M² lies below 1 by more than two standard uncertainties (with the likely causes).
 *
 * Worked example: a beam with d0 = 1 mm at z0 = 0.2 m, M² = 1.3, λ = 1064 nm has
 * Θ = 4·M²·λ/(π·d0) = 1.761 mrad and zR = d0/Θ = 0.5678 m; ten planes on that hyperbola give back
 * d0 = 1.000 mm, z0 = 0.2000 m, M² = 1.300 with zero uncertainty.
 *
 * Source: ISO 11146-1:2005, clause 9 (hyperbolic fit and eqs. for z0, d0, Θ, zR, M²), from memory;
 * uncertainty propagation per JCGM 100:2008 (GUM), eq. 13.
 */
export function fitCaustic(points: readonly CausticPoint[], options: FitOptions = {}): CausticFit {
	const weighting = options.weighting ?? 'relative';
	const lambda = options.wavelength_m;
	if (lambda !== undefined && !(Number.isFinite(lambda) && lambda > 0)) {
		throw new RangeError(`wavelength must be > 0 m — got ${lambda} m`);
	}
	points.forEach((p, i) => {
		if (!Number.isFinite(p.z_m)) throw new RangeError(`plane ${i + 1}: z must be a finite number of metres — got ${p.z_m}`);
		if (!(Number.isFinite(p.d_m) && p.d_m > 0)) throw new RangeError(`plane ${i + 1}: diameter must be > 0 m — got ${p.d_m} m`);
	});
	const n = points.length;
	const distinct = new Set(points.map((p) => p.z_m)).size;
	if (distinct < 3) throw new RangeError(`planes at different z must number at least 3 for a caustic fit — got ${distinct}`);

	// Centre and scale z, scale d², so the normal matrix is of order 1 at any lab scale.
	let zMin = Infinity, zMax = -Infinity, yMax = 0;
	for (const p of points) {
		zMin = Math.min(zMin, p.z_m);
		zMax = Math.max(zMax, p.z_m);
		yMax = Math.max(yMax, p.d_m * p.d_m);
	}
	const zm = 0.5 * (zMin + zMax);
	const zs = 0.5 * (zMax - zMin);
	const u = new Float64Array(n);
	const y = new Float64Array(n);
	const w = new Float64Array(n);
	for (let k = 0; k < n; k++) {
		u[k] = (points[k].z_m - zm) / zs;
		y[k] = (points[k].d_m * points[k].d_m) / yMax;
		w[k] = weighting === 'relative' ? 1 / (y[k] * y[k]) : 1;
	}
	const q = fitQuadratic(u, y, w);
	if (!q) throw new RangeError(`planes at different z must number at least 3 for a caustic fit — got ${distinct}`);

	// Coefficients in the centred, unscaled abscissa t = z − zm: d² = a' + b'·t + c'·t².
	const sc = [yMax, yMax / zs, yMax / (zs * zs)];
	const [a1, b1, c1] = q.coef.map((v, i) => v * sc[i]);
	const cov = q.cov.map((v, k) => v * sc[Math.floor(k / 3)] * sc[k % 3]);
	// Back to the caller's z: a = a' − b'·zm + c'·zm², b = b' − 2c'·zm, c = c'.
	const common: FitCommon = { n, weighting, a_m2: a1 - b1 * zm + c1 * zm * zm, b_m: b1 - 2 * c1 * zm, c: c1 };

	const D = 4 * a1 * c1 - b1 * b1; // invariant under a shift of z
	if (!(c1 > 0)) {
		return { ...common, physical: false, reason: `the fitted d²(z) does not open upwards (c = ${c1.toPrecision(3)} ≤ 0): the planes do not show a beam that widens away from a waist` };
	}
	if (!(D > 0)) {
		return { ...common, physical: false, reason: `the fitted hyperbola has 4ac − b² = ${D.toPrecision(3)} m² ≤ 0, so its waist diameter would be imaginary: the planes do not constrain the waist` };
	}
	const sD = Math.sqrt(D);
	const d0 = sD / (2 * Math.sqrt(c1));
	const theta = Math.sqrt(c1);
	const zR = sD / (2 * c1);
	const z0 = zm - b1 / (2 * c1);
	const m2 = lambda === undefined ? null : (Math.PI / (8 * lambda)) * sD;

	// Gradients with respect to (a', b', c').
	const g = {
		z0_m: [0, -1 / (2 * c1), b1 / (2 * c1 * c1)],
		d0_m: [1 / (2 * d0), -b1 / (4 * c1 * d0), (b1 * b1) / (8 * c1 * c1 * d0)],
		fullDivergence_rad: [0, 0, 1 / (2 * theta)],
		zR_m: [1 / sD, -b1 / (2 * c1 * sD), a1 / (c1 * sD) - sD / (2 * c1 * c1)],
		m2: lambda === undefined ? null : [2 * c1, -b1, 2 * a1].map((v) => ((Math.PI / (8 * lambda)) * v) / sD)
	};
	const uncertainty =
		q.dof > 0
			? {
					d0_m: finiteOrNull(quadForm(g.d0_m, cov)),
					z0_m: finiteOrNull(quadForm(g.z0_m, cov)),
					fullDivergence_rad: finiteOrNull(quadForm(g.fullDivergence_rad, cov)),
					zR_m: finiteOrNull(quadForm(g.zR_m, cov)),
					m2: g.m2 ? finiteOrNull(quadForm(g.m2, cov)) : null
				}
			: null;

	// M² below 1 is not a real beam (ISO 11146-1:2005, clause 3, from memory). Within two standard
	// uncertainties of 1 it is taken as noise and noted (within 1e-6, rounding: nothing said); further
	// below, not physical.
	let note: string | undefined;
	if (m2 !== null && m2 < 1 - 1e-6) {
		const u = uncertainty?.m2 ?? 0;
		const fig = (v: number) => v.toFixed(3);
		if (m2 < 1 - 2 * u) {
			return {
				...common,
				physical: false,
				reason: `the fitted M² = ${fig(m2)}${u ? ` ± ${fig(u)}` : ''} is below 1, which no real beam has (a Gaussian beam has M² = 1): likely causes — ${M2_BELOW_ONE_CAUSES.join('; ')}`,
				likelyCauses: [...M2_BELOW_ONE_CAUSES],
				figures: { d0_m: d0, z0_m: z0, fullDivergence_rad: theta, zR_m: zR, m2 },
				figureUncertainty: uncertainty
			};
		}
		note = `the fitted M² = ${fig(m2)} ± ${fig(u)} lies below 1 but within two standard uncertainties of it: consistent with a diffraction-limited beam`;
	}

	const residuals: FitResidual[] = [];
	let rr = 0;
	for (const p of points) {
		const dFit = fittedDiameter_m(common, p.z_m);
		residuals.push({ z_m: p.z_m, d_m: p.d_m, dFit_m: dFit, residual_m: p.d_m - dFit });
		const rel = dFit > 0 ? (p.d_m - dFit) / dFit : 1;
		rr += rel * rel;
	}
	return {
		...common,
		physical: true,
		d0_m: d0,
		z0_m: z0,
		fullDivergence_rad: theta,
		zR_m: zR,
		m2,
		uncertainty,
		residuals,
		rmsRelativeResidual: Math.sqrt(rr / n),
		...(note ? { note } : {})
	};
}
