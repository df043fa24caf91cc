/**
 * The default edition choice, "the stricter of both", is never less strict than Directive 2006/25/EC:
 * over a grid of wavelengths (180 nm–1 mm), durations (100 fs–3·10⁴ s), eye and skin, point and
 * extended sources, and pulse trains, its limit is never above the Directive's and its limiting
 * aperture never wider (a wider aperture lowers the averaged exposure of a small beam). A fixed grid,
 * no random draws. Source of the requirement: common practice (the stricter limit protects under both).
 */
import { describe, expect, it } from 'vitest';
import { evaluateLimit, evaluatePulseTrain } from '../../src/lib/safety';

const logGrid = (a: number, b: number, n: number) => Array.from({ length: n }, (_, i) => a * (b / a) ** (i / (n - 1)));
const wavelengths_nm = [...logGrid(180, 1e6, 41), 302.5, 303, 308, 314, 315, 400, 700, 1050, 1150, 1200, 1400, 1500, 1800, 2600, 1e5];
const durations_s = [...logGrid(1e-13, 3e4, 36), 1e-9, 1.8e-5, 5e-5, 1e-3, 0.25, 0.3, 0.35, 10, 100, 1e4];
const targets = ['eye', 'skin'] as const;
const angles_rad = [0, 0.02, 0.2];

describe('stricter of both ≤ Directive 2006/25/EC, CW and single exposures', () => {
	it(`${wavelengths_nm.length} wavelengths × ${durations_s.length} durations × eye/skin × 3 source angles`, () => {
		let n = 0;
		const bad: string[] = [];
		for (const nm of wavelengths_nm)
			for (const t of durations_s)
				for (const target of targets)
					for (const alpha_rad of target === 'eye' ? angles_rad : [0]) {
						const input = { wavelength_m: nm * 1e-9, duration_s: t, target, alpha_rad };
						const eu = evaluateLimit('eu-2006-25', input);
						const st = evaluateLimit('stricter', input);
						n++;
						if (st.radiantExposure_J_m2 > eu.radiantExposure_J_m2 * (1 + 1e-12)) bad.push(`limit ${nm} nm ${t} s ${target} α=${alpha_rad}: ${st.radiantExposure_J_m2} > ${eu.radiantExposure_J_m2}`);
						if (st.limitingAperture_m > eu.limitingAperture_m * (1 + 1e-12)) bad.push(`aperture ${nm} nm ${t} s ${target}: ${st.limitingAperture_m} > ${eu.limitingAperture_m}`);
					}
		expect(bad.slice(0, 5)).toEqual([]);
		expect(n).toBeGreaterThan(5000);
	});
});

describe('stricter of both ≤ Directive 2006/25/EC, pulse trains', () => {
	it('per-pulse limit and aperture over wavelengths × pulse widths × rates × durations × eye/skin', () => {
		const bad: string[] = [];
		let n = 0;
		for (const nm of logGrid(180, 1e6, 25).concat([308, 532, 1064, 1550, 10600]))
			for (const tau of [100e-15, 10e-12, 10e-9, 1e-6, 1e-3])
				for (const f of [10, 1e3, 1e5, 80e6])
					for (const T of [0.25, 10, 3e4])
						for (const target of targets) {
							if (tau * f > 1 || T < tau) continue;
							const input = { wavelength_m: nm * 1e-9, duration_s: T, target, pulseWidth_s: tau, repetitionRate_Hz: f };
							const eu = evaluatePulseTrain('eu-2006-25', input);
							const st = evaluatePulseTrain('stricter', input);
							n++;
							if (st.perPulse_J_m2 > eu.perPulse_J_m2 * (1 + 1e-12)) bad.push(`per pulse ${nm} nm τ=${tau} f=${f} T=${T} ${target}: ${st.perPulse_J_m2} > ${eu.perPulse_J_m2}`);
							if (st.limitingAperture_m > eu.limitingAperture_m * (1 + 1e-12)) bad.push(`aperture ${nm} nm τ=${tau} f=${f} T=${T} ${target}`);
						}
		expect(bad.slice(0, 5)).toEqual([]);
		expect(n).toBeGreaterThan(1000);
	});
});
