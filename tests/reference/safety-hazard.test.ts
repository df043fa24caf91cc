/**
 * Hazard distances and eyewear against the published formula forms:
 *  - NOHD = (√(4P/(π·E_MPE)) − a)/φ, a and φ the 1/e beam diameter and full divergence
 *    (IEC TR 60825-14:2004 and ANSI Z136.1 formula form; quoted here from memory);
 *  - OD = log10(H/H_MPE) (same sources, from memory);
 *  - diffuse reflection r = √(ρ·P·cosθ/(π·E_MPE)) (ANSI Z136.1 form, from memory);
 *  - aided viewing gain τ·min(M², (D_o/D_pupil)²) (IEC TR 60825-14 form, from memory);
 *  - the Gaussian beam radius law w(z) = w_f·√(1 + ((z − z_f)/z_R)²), z_R = π·w_f²/λ
 *    (H. Kogelnik, T. Li, Applied Optics 5(10) 1550 (1966), eqs. 17–18) and the power in a circle
 *    1 − exp(−2a²/w²) (A. E. Siegman, "Lasers" (1986), §17.1).
 * The checks compute the expected numbers from these forms here, independently of the engine.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import {
	apertureFraction,
	assessBeam,
	beamPathExposure,
	cautionLines,
	defaultExposureDuration,
	diffuseHazardDistance_m,
	exposureAtDistance,
	gaussianNohd_m,
	gaussianRadius,
	nohdFormula,
	opticalGain,
	requiredOpticalDensity
} from '../../src/lib/safety';

/** Abramowitz & Stegun 7.1.26 erf (|error| < 1.5·10⁻⁷), for the line-beam check. */
function erf(x: number): number {
	const t = 1 / (1 + 0.3275911 * Math.abs(x));
	const y = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
	return x >= 0 ? y : -y;
}

// The 514.5 nm, 5 W beam of the issue: 1/e diameter a = 2 mm and divergence φ = 1 mrad, i.e. 1/e² values ×√2.
const P = 5;
const E_MPE = (18 * 0.25 ** 0.75) / 0.25; // Directive 2006/25/EC Table 2.2, row 400–700 nm, 1.8·10⁻⁵–10 s (read in the French labour code reproduction): 25.46 W/m²
const d = 2e-3 * Math.SQRT2;
const Th = 1e-3 * Math.SQRT2;

describe('nohdFormula — IEC TR 60825-14 / ANSI Z136.1 form', () => {
	it('5 W, a = 2 mm, φ = 1 mrad, E_MPE = 25.46 W/m² → (√(4P/(πE)) − a)/φ = 498.1 m', () => {
		const expected = (Math.sqrt((4 * P) / (Math.PI * E_MPE)) - 2e-3) / 1e-3;
		expectClose(expected, 498.09, 1e-4);
		expectClose(nohdFormula({ power_W: P, mpe_W_m2: E_MPE, diameter_m: d, fullDivergence_rad: Th }).nohd_m, expected, 1e-12);
	});
	it('is zero when the beam is already below the limit at the exit aperture', () => {
		expect(nohdFormula({ power_W: 1e-6, mpe_W_m2: E_MPE, diameter_m: 5e-3, fullDivergence_rad: 1e-3 }).nohd_m).toBe(0);
	});
	it('refuses a collimated beam (zero divergence): the formula has no finite answer', () => {
		expect(() => nohdFormula({ power_W: P, mpe_W_m2: E_MPE, diameter_m: d, fullDivergence_rad: 0 })).toThrow(/beam divergence must be a finite number > 0 rad — got 0/);
	});
});

describe('requiredOpticalDensity — OD = log10(H/H_MPE), IEC TR 60825-14 / ANSI Z136.1 form', () => {
	it('whole beam into the 7 mm aperture: E = P/(π·3.5²mm²), OD = log10(E/E_MPE) = 3.708 → 4', () => {
		const E = P / (Math.PI * 3.5e-3 ** 2);
		const od = requiredOpticalDensity(E, E_MPE);
		expectClose(od.od, Math.log10(E / E_MPE), 1e-12);
		expectClose(od.od, 3.7079, 1e-4);
		expect(od.odWhole).toBe(4);
	});
	it('an exact power of ten needs exactly that OD; below the limit none', () => {
		expect(requiredOpticalDensity(1000, 1).odWhole).toBe(3);
		expect(requiredOpticalDensity(0.5, 1)).toEqual({ od: 0, odWhole: 0 });
	});
	it('rounded up, never to the nearest: OD 3.2 needs eyewear of OD 4 (common practice: the marked OD is at or above the need)', () => {
		const od = requiredOpticalDensity(10 ** 3.2, 1);
		expectClose(od.od, 3.2, 1e-12);
		expect(od.odWhole).toBe(4);
	});
});

describe('aided viewing and diffuse reflection (formula forms)', () => {
	it('7×50 binoculars, τ = 0.9, 7 mm pupil: gain τ·min(M², (D_o/D)²) = 0.9·49', () => {
		expectClose(opticalGain({ objective_m: 50e-3, magnification: 7, transmission: 0.9 }, 7e-3), 0.9 * 49, 1e-12);
		expectClose(opticalGain({ objective_m: 21e-3, magnification: 7, transmission: 1 }, 7e-3), 9, 1e-12);
	});
	it('aided NOHD = (√(4·P·K/(π·E)) − a)/φ', () => {
		const K = 0.9 * 49;
		const expected = (Math.sqrt((4 * P * K) / (Math.PI * E_MPE)) - 2e-3) / 1e-3;
		const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 514.5e-9, power_W: P, diameter_m: d, fullDivergence_rad: Th, duration_s: 0.25, optic: { objective_m: 50e-3, magnification: 7, transmission: 0.9 } });
		expectClose(a.aided!.nohdFormula_m, expected, 1e-12);
		// Along the beam, far field: the objective collects τ·P·2r_c²/w² — agrees with the formula to 0.5 %.
		expectClose(a.aided!.nohd_m, expected, 5e-3);
	});
	it('diffuse: r = √(ρ·P·cosθ/(π·E_MPE)), 60° halves the cosine', () => {
		expectClose(diffuseHazardDistance_m({ power_W: P, mpe_W_m2: E_MPE, reflectance: 0.9, viewingAngle_rad: 0 }), Math.sqrt((0.9 * P) / (Math.PI * E_MPE)), 1e-12);
		expectClose(diffuseHazardDistance_m({ power_W: P, mpe_W_m2: E_MPE, reflectance: 0.9, viewingAngle_rad: Math.PI / 3 }), Math.sqrt((0.45 * P) / (Math.PI * E_MPE)), 1e-12);
		expect(() => diffuseHazardDistance_m({ power_W: P, mpe_W_m2: E_MPE, reflectance: 1.2, viewingAngle_rad: 0 })).toThrow(/reflectance must be within 0–1 — got 1.2/);
	});
});

describe('exposureAtDistance — peak and aperture-averaged (Siegman 1986 §17.1)', () => {
	it('w(z) = √((d/2)² + (Θz/2)²), peak 2P/(πw²), averaged P(1 − exp(−2(D/2)²/w²))/(π(D/2)²)', () => {
		const z = 100;
		const w = Math.sqrt((d / 2) ** 2 + ((Th * z) / 2) ** 2);
		const r = exposureAtDistance({ amount: P, diameter_m: d, fullDivergence_rad: Th, distance_m: z, aperture_m: 7e-3 });
		expectClose(r.w_m, w, 1e-12);
		expectClose(r.peak, (2 * P) / (Math.PI * w * w), 1e-12);
		expectClose(r.averaged, (P * (1 - Math.exp((-2 * 3.5e-3 ** 2) / w ** 2))) / (Math.PI * 3.5e-3 ** 2), 1e-12);
		// In the far field the averaged value tends to the peak (beam ≫ aperture).
		expect(r.averaged / r.peak).toBeGreaterThan(0.99);
	});
	it('near the exit a beam smaller than the aperture averages far below its peak', () => {
		const r = exposureAtDistance({ amount: P, diameter_m: 1e-3, fullDivergence_rad: 1e-3, distance_m: 0, aperture_m: 7e-3 });
		expectClose(r.averaged, P / (Math.PI * 3.5e-3 ** 2), 1e-12);
		expect(r.peak / r.averaged).toBeGreaterThan(20);
	});
});

describe('aperture averaging (Siegman 1986 §17.1)', () => {
	it('round beam: power fraction 1 − exp(−2a²/w²)', () => {
		expectClose(apertureFraction(1e-3, 1e-3), 1 - Math.exp(-2), 1e-12);
	});
	it('a line beam (w_x ≪ a ≪ w_y) passes the 1-D Gaussian fraction erf(√2·a/w_y)', () => {
		expectClose(apertureFraction(1e-3, 1e-6, 20e-3), erf((Math.SQRT2 * 1e-3) / 20e-3), 2e-3);
	});
	it('is symmetric in x and y and reaches 1 for a large aperture', () => {
		expectClose(apertureFraction(1e-3, 1e-3, 3e-3), apertureFraction(1e-3, 3e-3, 1e-3), 1e-12);
		expectClose(apertureFraction(1, 1e-3, 3e-3), 1, 1e-12);
	});
});

describe('propagated, aperture-averaged NOHD', () => {
	it('agrees with the far-field formula where the hazard distance is far beyond a/φ (to 1 %)', () => {
		const f = nohdFormula({ power_W: P, mpe_W_m2: E_MPE, diameter_m: d, fullDivergence_rad: Th }).nohd_m;
		const path = beamPathExposure({ beam: gaussianRadius(d, Th), power_W: P, mpe_W_m2: E_MPE, aperture_m: 7e-3, from_m: 0, to_m: 2000 });
		expect(path.beyondRange).toBe(false);
		expectClose(path.nohd_m, f, 1e-2);
		expectClose(path.nohd_m, gaussianNohd_m({ power_W: P, mpe_W_m2: E_MPE, aperture_m: 7e-3, waistRadius_m: d / 2, halfAngle_rad: Th / 2 }), 1e-8);
	});
	it('a focused beam whose hazard lies past the focus: the NOHD is the far edge, from the Kogelnik–Li w(z)', () => {
		const lambda = 1064e-9;
		const wf = 50e-6;
		const zf = 2;
		const zR = (Math.PI * wf * wf) / lambda;
		const w = (z: number) => wf * Math.sqrt(1 + ((z - zf) / zR) ** 2);
		const power = 0.01;
		const mpe = 50; // E_MPE for 1064 nm, 10 s (Directive Table 2.3, 10·C_A W/m², from memory)
		const D = 7e-3;
		// Averaged exposure P(1 − exp(−2(D/2)²/w²))/(π(D/2)²) = E at w*:
		const q = (mpe * Math.PI * (D / 2) ** 2) / power;
		const wStar = Math.sqrt((-2 * (D / 2) ** 2) / Math.log(1 - q));
		const expected = zf + zR * Math.sqrt((wStar / wf) ** 2 - 1);
		const path = beamPathExposure({ beam: w, power_W: power, mpe_W_m2: mpe, aperture_m: D, from_m: 0, to_m: 10, samples: 64 });
		expect(path.zones.length).toBe(1);
		expect(path.zones[0].from_m).toBeGreaterThan(0); // safe at the lens, hazardous near the focus
		expect(path.nohd_m).toBeGreaterThan(zf);
		expectClose(path.nohd_m, expected, 1e-7);
		// At the focus the whole beam enters the aperture: the worst point holds P(1 − exp(−2(D/2)²/w_f²))/(π(D/2)²).
		expectClose(path.worst.averaged_W_m2, (power * (1 - Math.exp((-2 * (D / 2) ** 2) / wf ** 2))) / (Math.PI * (D / 2) ** 2), 1e-9);
		expect(Math.abs(path.worst.z_m - zf)).toBeLessThan(0.1);
	});
	it('finds a focus narrower than the grid spacing (refined local maxima)', () => {
		const wf = 2e-6;
		const zR = (Math.PI * wf * wf) / 532e-9;
		const w = (z: number) => wf * Math.sqrt(1 + ((z - 3.3) / zR) ** 2);
		const path = beamPathExposure({ beam: w, power_W: 5e-3, mpe_W_m2: 25.46, aperture_m: 7e-3, from_m: 0, to_m: 10, samples: 16 });
		// No grid point (every 0.625 m) lies in the hazard zone; only the refinement finds it.
		expect(path.points.filter((p) => Math.abs((p.z_m / 0.625) % 1) < 1e-9 && p.ratio > 1)).toEqual([]);
		expect(path.zones.length).toBe(1);
		expect(path.zones[0].from_m).toBeLessThan(3.3);
		expect(path.nohd_m).toBeGreaterThan(3.3);
	});
	it('a sampled beam (arrays) gives the same NOHD as the function it samples', () => {
		const f = gaussianRadius(d, Th);
		const z = Array.from({ length: 401 }, (_, i) => i * 5);
		const a = beamPathExposure({ beam: { z_m: z, wx_m: z.map(f) }, power_W: P, mpe_W_m2: E_MPE, aperture_m: 7e-3 });
		const b = beamPathExposure({ beam: f, power_W: P, mpe_W_m2: E_MPE, aperture_m: 7e-3, from_m: 0, to_m: 2000 });
		expectClose(a.nohd_m, b.nohd_m, 1e-6);
	});
	it('reports a hazard that continues past the examined range without an infinite distance', () => {
		const path = beamPathExposure({ beam: gaussianRadius(d, Th), power_W: P, mpe_W_m2: E_MPE, aperture_m: 7e-3, from_m: 0, to_m: 100 });
		expect(path.beyondRange).toBe(true);
		expect(path.nohd_m).toBe(100);
		for (const p of path.points) expect(Number.isFinite(p.ratio)).toBe(true);
	});
	it('refuses bad inputs with the value and the rule', () => {
		expect(() => beamPathExposure({ beam: gaussianRadius(d, Th), power_W: -1, mpe_W_m2: E_MPE, aperture_m: 7e-3, from_m: 0, to_m: 1 })).toThrow(/power must be a finite number > 0 W — got -1 W/);
		expect(() => beamPathExposure({ beam: { z_m: [0, 0], wx_m: [1e-3, 1e-3] }, power_W: 1, mpe_W_m2: 1, aperture_m: 7e-3 })).toThrow(/sampled beam distances must increase/);
	});
});

describe('assessBeam — the issue example (514.5 nm, 5 W, 2.83 mm, 1.41 mrad, 0.25 s)', () => {
	const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 514.5e-9, power_W: 5, diameter_m: 2.83e-3, fullDivergence_rad: 1.41e-3, duration_s: 0.25 });
	it('uses the Directive limit 18·t^0.75/t and the 7 mm aperture', () => {
		expectClose(a.mpe_W_m2, E_MPE, 1e-12);
		expect(a.limitingAperture_m).toBe(7e-3);
	});
	it('reports both NOHDs and uses the larger', () => {
		expectClose(a.nohdFormula_m, (Math.sqrt((4 * 5) / (Math.PI * E_MPE)) - 2.83e-3 / Math.SQRT2) / (1.41e-3 / Math.SQRT2), 1e-12);
		expect(a.hazardDistance_m).toBe(Math.max(a.nohd_m, a.nohdFormula_m));
	});
	it('OD at the exit aperture from the aperture-averaged irradiance', () => {
		const w0 = 2.83e-3 / 2;
		const E = (5 * (1 - Math.exp((-2 * 3.5e-3 ** 2) / w0 ** 2))) / (Math.PI * 3.5e-3 ** 2);
		expectClose(a.odRequired, Math.log10(E / E_MPE), 1e-12);
		expect(a.odWhole).toBe(4);
	});
	it('carries every caution sentence', () => {
		for (const line of cautionLines) expect(a.caution).toContain(line);
	});
	it('a single pulse compares the pulse energy with the single-pulse limit', () => {
		const s = assessBeam({ standard: 'eu-2006-25', wavelength_m: 532e-9, pulseEnergy_J: 1e-3, pulseWidth_s: 10e-9, diameter_m: 2e-3, fullDivergence_rad: 1e-3 });
		expect(s.emission).toBe('single pulse');
		expectClose(s.mpe_J_m2, 5e-3, 1e-12);
		// Energy-based formula: (√(4Q/(π·H)) − a)/φ
		expectClose(s.nohdFormula_m, (Math.sqrt((4 * 1e-3) / (Math.PI * 5e-3)) - 2e-3 / Math.SQRT2) / (1e-3 / Math.SQRT2), 1e-9);
	});
});

describe('default exposure durations (common practice; IEC TR 60825-14 §5.1 for 100 s and 30 000 s)', () => {
	it('visible accidental: 0.25 s aversion response', () => expect(defaultExposureDuration(532e-9).duration_s).toBe(0.25));
	it('invisible accidental: 10 s', () => expect(defaultExposureDuration(1064e-9).duration_s).toBe(10));
	it('worst case above 400 nm: 100 s', () => expect(defaultExposureDuration(1064e-9, 'worst-case').duration_s).toBe(100));
	it('UV and deliberate viewing: 30 000 s', () => {
		expect(defaultExposureDuration(355e-9).duration_s).toBe(3e4);
		expect(defaultExposureDuration(633e-9, 'deliberate').duration_s).toBe(3e4);
	});
	it('each default says why', () => expect(defaultExposureDuration(532e-9).basis).toMatch(/aversion/));
	it('is overridable: a given duration wins', () => {
		const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 532e-9, power_W: 1e-3, diameter_m: 1e-3, fullDivergence_rad: 1e-3, duration_s: 5 });
		expect(a.exposure).toMatchObject({ duration_s: 5, isDefault: false });
	});
});

describe('assessBeam along a given path (a focused beam)', () => {
	it('takes the NOHD past the focus and the OD at the focus, the formula from the last element', () => {
		const lambda = 1064e-9;
		const wf = 50e-6;
		const zf = 2;
		const zR = (Math.PI * wf * wf) / lambda;
		const w = (z: number) => wf * Math.sqrt(1 + ((z - zf) / zR) ** 2);
		const a = assessBeam({
			standard: 'eu-2006-25',
			wavelength_m: lambda,
			power_W: 0.01,
			diameter_m: 2 * w(1),
			fullDivergence_rad: (2 * wf) / zR,
			duration_s: 10,
			path: { beam: w, from_m: 0, to_m: 10, peaks_m: [zf], exitAt_m: 1 }
		});
		// E_MPE = 10·C_A W/m² at 1064 nm (Directive Table 2.3, from memory; C_A = 5 from Table 2.5, read)
		expectClose(a.mpe_W_m2, 50, 1e-12);
		const D = 7e-3;
		const q = (50 * Math.PI * (D / 2) ** 2) / 0.01;
		const wStar = Math.sqrt((-2 * (D / 2) ** 2) / Math.log(1 - q));
		expectClose(a.nohd_m, zf + zR * Math.sqrt((wStar / wf) ** 2 - 1), 1e-7);
		// Worst point: the whole beam inside the aperture at the focus.
		expectClose(a.odRequired, Math.log10((0.01 * (1 - Math.exp((-2 * (D / 2) ** 2) / wf ** 2))) / (Math.PI * (D / 2) ** 2) / 50), 1e-9);
		expect(w(a.odAt_m)).toBeLessThan(D / 6); // on the plateau around the focus, beam well inside the aperture
		expect(a.nohdFormula_m).toBeGreaterThanOrEqual(1);
	});
});
