/**
 * Caustic fit checks against published formulas.
 * Sources:
 * - ISO 11146-1:2005, clause 9 (hyperbolic fit d²(z) = a + b·z + c·z², z0 = −b/(2c),
 *   d0 = √(4ac − b²)/(2√c), Θ = √c, zR = √(4ac − b²)/(2c), M² = π/(8λ)·√(4ac − b²)); from memory.
 * - ISO 11146-1:2005, clause 3 (definitions: Θ = 4·M²·λ/(π·d0) for the embedded-Gaussian caustic
 *   d(z)² = d0² + Θ²·(z − z0)²); from memory.
 * - H. Kogelnik, T. Li, "Laser Beams and Resonators", Applied Optics 5(10), 1550–1567 (1966),
 *   eq. 20 (number from memory): w(z) = w0·√(1 + (z/zR)²), with zR = π·w0²/λ.
 * - JCGM 100:2008 (GUM), eq. 13: first-order propagation of the covariance.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { causticDiameter_m, fitCaustic, sampleCaustic, seededNormal, type PhysicalFit } from '../../src/lib/optics/iso11146/index';
import { fitQuadratic } from '../../src/lib/optics/iso11146/lsq';
import { caustic } from '../beams';

const lambda = 1064e-9;

/** Planes z0 + k·zR for the given multiples k (the ISO plan: half within zR, half beyond 2zR). */
function planes(d0: number, z0: number, m2: number, lam: number, ks: number[]) {
	const theta = (4 * m2 * lam) / (Math.PI * d0);
	const zR = d0 / theta;
	return ks.map((k) => {
		const z = z0 + k * zR;
		return { z_m: z, d_m: caustic(d0, z0, m2, lam, z) };
	});
}

const isoPlan = [-0.9, -0.5, -0.1, 0.3, 0.8, 2.2, 2.6, 3.1, 3.7, 4.5];

describe('fit covariance: s²·(XᵀWX)⁻¹ with s² = χ²/(n − 3) (N. R. Draper, H. Smith, "Applied Regression Analysis", 3rd ed. 1998, ch. 5; from memory)', () => {
	// Worked by hand: u = −1, −1, 0, 0, 1, 1 and y = 1, 3, 0, 2, 1, 3 (w = 1). The pairs average 2, 1, 2,
	// so the fit is y = 1 + 0·u + 1·u² with residuals ±1: χ² = 6, n − 3 = 3 degrees of freedom, s² = 2.
	// XᵀX = [[6, 0, 4], [0, 4, 0], [4, 0, 4]]; its inverse is [[1/2, 0, −1/2], [0, 1/4, 0], [−1/2, 0, 3/4]].
	// Covariance = 2 × that: var A = 1, var B = 1/2, var C = 3/2, cov(A, C) = −1.
	it('scales by χ²/(n − 3), not χ²/n, on a six-point case worked by hand', () => {
		const q = fitQuadratic([-1, -1, 0, 0, 1, 1], [1, 3, 0, 2, 1, 3], [1, 1, 1, 1, 1, 1])!;
		expect(q).not.toBeNull();
		expectClose(q.coef[0], 1, 1e-12, 'A');
		expect(Math.abs(q.coef[1])).toBeLessThan(1e-12);
		expectClose(q.coef[2], 1, 1e-12, 'C');
		expectClose(q.chi2, 6, 1e-12, 'χ²');
		expect(q.dof).toBe(3);
		const expected = [1, 0, -1, 0, 0.5, 0, -1, 0, 1.5];
		for (let k = 0; k < 9; k++) {
			if (expected[k] === 0) expect(Math.abs(q.cov[k]), `cov[${k}]`).toBeLessThan(1e-12);
			else expectClose(q.cov[k], expected[k], 1e-12, `cov[${k}]`);
		}
	});
	it('an exact fit through three planes carries no residual information: zero covariance', () => {
		const q = fitQuadratic([-1, 0, 1], [2, 1, 2], [1, 1, 1])!;
		expect(q.dof).toBe(0);
		expect(q.cov.every((v) => v === 0)).toBe(true);
	});
});

describe('fitCaustic', () => {
	it('returns the parameters of an exact hyperbola (ISO 11146-1:2005, clause 9; from memory)', () => {
		const d0 = 1e-3, z0 = 0.2, m2 = 1.3;
		for (const weighting of ['relative', 'plain'] as const) {
			const f = fitCaustic(planes(d0, z0, m2, lambda, isoPlan), { wavelength_m: lambda, weighting }) as PhysicalFit;
			expect(f.physical).toBe(true);
			const theta = (4 * m2 * lambda) / (Math.PI * d0); // ISO 11146-1 clause 3, from memory
			expectClose(f.d0_m, d0, 1e-9, `${weighting} d0`);
			expectClose(f.z0_m, z0, 1e-9, `${weighting} z0`);
			expectClose(f.fullDivergence_rad, theta, 1e-9, `${weighting} Θ`);
			expectClose(f.zR_m, d0 / theta, 1e-9, `${weighting} zR`);
			expectClose(f.m2!, m2, 1e-9, `${weighting} M²`);
			expect(f.weighting).toBe(weighting);
		}
	});

	it('gives a, b, c of d² = d0² + Θ²(z − z0)² expanded: a = d0² + Θ²z0², b = −2Θ²z0, c = Θ² (ISO 11146-1 clause 9, from memory)', () => {
		const d0 = 250e-6, z0 = -0.05, m2 = 2.4, lam = 532e-9;
		const f = fitCaustic(planes(d0, z0, m2, lam, isoPlan), { wavelength_m: lam });
		const theta = (4 * m2 * lam) / (Math.PI * d0);
		expectClose(f.a_m2, d0 * d0 + theta * theta * z0 * z0, 1e-8, 'a');
		expectClose(f.b_m, -2 * theta * theta * z0, 1e-8, 'b');
		expectClose(f.c, theta * theta, 1e-8, 'c');
	});

	it('finds M² = 1 and zR = π·w0²/λ for a TEM00 caustic w(z) = w0·√(1 + (z/zR)²) (Kogelnik & Li 1966, eq. 20, number from memory)', () => {
		const w0 = 0.3e-3, lam = 632.8e-9;
		const zR = (Math.PI * w0 * w0) / lam;
		const pts = [-3.5, -2.8, -2.1, -0.8, -0.4, 0, 0.3, 0.7, 2.4, 3.3].map((k) => ({ z_m: 1 + k * zR, d_m: 2 * w0 * Math.sqrt(1 + k * k) }));
		const f = fitCaustic(pts, { wavelength_m: lam }) as PhysicalFit;
		expectClose(f.m2!, 1, 1e-9, 'M²');
		expectClose(f.zR_m, zR, 1e-9, 'zR');
		expectClose(f.d0_m, 2 * w0, 1e-9, 'd0');
		expectClose(f.z0_m, 1, 1e-9, 'z0');
	});

	it('leaves M² out without a wavelength but still fits the waist', () => {
		const f = fitCaustic(planes(1e-3, 0, 1.5, lambda, isoPlan)) as PhysicalFit;
		expect(f.m2).toBeNull();
		expect(f.uncertainty!.m2).toBeNull();
		expectClose(f.d0_m, 1e-3, 1e-9);
	});

	it('reports zero uncertainty for exact data and none (null) with only three planes', () => {
		const f = fitCaustic(planes(1e-3, 0.2, 1.3, lambda, isoPlan), { wavelength_m: lambda }) as PhysicalFit;
		for (const v of Object.values(f.uncertainty!)) expect(v!).toBeLessThan(1e-9 * 1e-3 + 1e-12);
		const three = fitCaustic(planes(1e-3, 0.2, 1.3, lambda, [-1, 0, 3]), { wavelength_m: lambda }) as PhysicalFit;
		expect(three.physical).toBe(true);
		expect(three.uncertainty).toBeNull();
	});

	it('gives uncertainties that match the scatter of repeated noisy fits (GUM JCGM 100:2008, eq. 13)', () => {
		// 400 simulated measurements of one beam, each plane with 1 % Gaussian scatter in d.
		const d0 = 0.8e-3, z0 = 0.3, m2 = 1.2;
		const truth = planes(d0, z0, m2, lambda, isoPlan);
		const g = seededNormal(42);
		const fits: PhysicalFit[] = [];
		for (let k = 0; k < 400; k++) {
			const pts = truth.map((p) => ({ z_m: p.z_m, d_m: p.d_m * (1 + 0.01 * g()) }));
			const f = fitCaustic(pts, { wavelength_m: lambda });
			if (f.physical) fits.push(f);
		}
		expect(fits.length).toBe(400);
		for (const key of ['d0_m', 'z0_m', 'fullDivergence_rad', 'zR_m', 'm2'] as const) {
			const vals = fits.map((f) => f[key] as number);
			const mean = vals.reduce((a, b) => a + b, 0) / vals.length;
			const sd = Math.sqrt(vals.reduce((a, b) => a + (b - mean) ** 2, 0) / (vals.length - 1));
			const reported = fits.reduce((a, f) => a + (f.uncertainty![key] as number), 0) / fits.length;
			// First-order propagation with a residual-scaled covariance: agreement within 30 % is expected at 10 planes.
			expectClose(reported, sd, 0.3, `σ(${key})`);
		}
	});

	it('reports a hyperbola that does not open upwards (c ≤ 0) as not physical', () => {
		const pts = [0, 0.1, 0.2, 0.3, 0.4].map((z) => ({ z_m: z, d_m: Math.sqrt(1e-6 * (1 - z * z)) }));
		const f = fitCaustic(pts, { wavelength_m: lambda });
		expect(f.physical).toBe(false);
		if (!f.physical) expect(f.reason).toMatch(/c = .* ≤ 0/);
	});

	it('reports 4ac − b² ≤ 0 (an imaginary waist) as not physical', () => {
		// d² = z² − 1e-4 m² on z = 0.1 … 0.5 m: a = −1e-4, b = 0, c = 1 → 4ac − b² < 0.
		const pts = [0.1, 0.2, 0.3, 0.4, 0.5].map((z) => ({ z_m: z, d_m: Math.sqrt(z * z - 1e-4) }));
		const f = fitCaustic(pts, { wavelength_m: lambda });
		expect(f.physical).toBe(false);
		if (!f.physical) expect(f.reason).toMatch(/4ac − b² = .* ≤ 0/);
	});

	it('throws for fewer than three distinct planes, a diameter ≤ 0 and a bad wavelength', () => {
		expect(() => fitCaustic([{ z_m: 0, d_m: 1e-3 }, { z_m: 0, d_m: 1.1e-3 }, { z_m: 1, d_m: 2e-3 }])).toThrow(/planes at different z must number at least 3 for a caustic fit — got 2/);
		expect(() => fitCaustic([{ z_m: 0, d_m: 1e-3 }, { z_m: 0.5, d_m: -1e-3 }, { z_m: 1, d_m: 2e-3 }])).toThrow(/plane 2: diameter must be > 0 m/);
		expect(() => fitCaustic(planes(1e-3, 0, 1, lambda, isoPlan), { wavelength_m: -5e-7 })).toThrow(/wavelength must be > 0 m — got -5e-7 m/);
		expect(() => fitCaustic([{ z_m: NaN, d_m: 1e-3 }, { z_m: 0.5, d_m: 1e-3 }, { z_m: 1, d_m: 2e-3 }])).toThrow(/plane 1: z must be a finite/);
	});

	it('gives residuals d − d_fit that are zero for exact data and never non-finite', () => {
		const f = fitCaustic(planes(1e-3, 0.2, 1.3, lambda, isoPlan), { wavelength_m: lambda }) as PhysicalFit;
		expect(f.residuals).toHaveLength(10);
		for (const r of f.residuals) {
			expect(Math.abs(r.residual_m)).toBeLessThan(1e-12);
			expect(Number.isFinite(r.dFit_m)).toBe(true);
		}
		expect(f.rmsRelativeResidual).toBeLessThan(1e-9);
	});
});

describe('causticDiameter_m', () => {
	it('matches the docblock example: d0 1 mm, M² 1, 1064 nm, 1 m from the waist', () => {
		// Θ = 4λ/(π·d0) = 1.3547 mrad; d = √(d0² + Θ²·z²)
		const theta = (4 * 1064e-9) / (Math.PI * 1e-3);
		expectClose(causticDiameter_m(1e-3, 0, 1, 1064e-9, 1), Math.sqrt(1e-6 + theta * theta), 1e-12);
		expectClose(theta, 1.3547e-3, 1e-4, 'Θ, from memory');
	});

	it('throws for a waist, M² or wavelength ≤ 0', () => {
		expect(() => causticDiameter_m(0, 0, 1, 1e-6, 0)).toThrow(/waist diameter must be > 0 m/);
		expect(() => causticDiameter_m(1e-3, 0, 0, 1e-6, 0)).toThrow(/M² must be > 0/);
		expect(() => causticDiameter_m(1e-3, 0, 1, 0, 0)).toThrow(/wavelength must be > 0 m/);
	});
});

describe('sampleCaustic', () => {
	it('samples the fitted hyperbola at evenly spaced z for plots', () => {
		const f = fitCaustic(planes(1e-3, 0, 1, lambda, isoPlan), { wavelength_m: lambda });
		const s = sampleCaustic(f, -1, 1, 5);
		expect(Array.from(s.z_m)).toEqual([-1, -0.5, 0, 0.5, 1]);
		expectClose(s.d_m[2], 1e-3, 1e-9);
		expectClose(s.d_m[4], caustic(1e-3, 0, 1, lambda, 1), 1e-9);
	});

	it('throws for an empty range or fewer than two samples', () => {
		const f = fitCaustic(planes(1e-3, 0, 1, lambda, isoPlan), { wavelength_m: lambda });
		expect(() => sampleCaustic(f, 1, 1)).toThrow(/end > start/);
		expect(() => sampleCaustic(f, 0, 1, 1)).toThrow(/integer ≥ 2/);
	});
});
