/**
 * Pulsed eyewear (per-pulse exposure at the worst point, OD from each pulse rule, which rule sets it),
 * the skin limit and nominal skin hazard distance beside the eye results, and several lines in one
 * beam combined per tissue. Expected values are written out here in closed form:
 *   aperture-averaged exposure of a round Gaussian, Q·(1 − exp(−2a²/w²))/(π·a²) (Siegman, Lasers, 1986, §17.1);
 *   limits from Directive 2006/25/EC Annex II Tables 2.2 and 2.4 (read in the French labour code
 *   reproduction) and Table 2.3 (from memory: not reachable as text);
 *   OD = log10(exposure ÷ limit), rounded up (IEC TR 60825-14 form, from memory);
 *   additivity over lines on the same tissue, Σ exposureᵢ ÷ limitᵢ ≤ 1 (IEC 60825-1 / ICNIRP, from memory).
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { assessBeam, assessLines } from '../../src/lib/safety';
import { run as hazard } from '../../src/cli/commands/hazard';

/** Q·(1 − exp(−2a²/w²))/(π·a²) over an aperture of diameter D, beam radius w. */
const averaged = (Q: number, D: number, w: number) => (Q * -Math.expm1((-2 * (D / 2) ** 2) / w ** 2)) / (Math.PI * (D / 2) ** 2);

describe('pulsed eyewear: per-pulse exposure at the worst point and the OD of each rule', () => {
	// 532 nm, 1 mJ, 10 ns at 10 kHz, 0.25 s; waist 2 mm at the exit (the worst point), 1 mrad.
	const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 532e-9, pulseEnergy_J: 1e-3, pulseWidth_s: 10e-9, repetitionRate_Hz: 1e4, duration_s: 0.25, diameter_m: 2e-3, fullDivergence_rad: 1e-3 });
	const H = averaged(1e-3, 7e-3, 1e-3); // Table 2.2 aperture 7 mm, 400–1400 nm
	const N = 2500;
	const limits = {
		'single pulse': 5e-3, // Table 2.2 row 400–700 nm, 10⁻⁹–1.8·10⁻⁵ s: 5·10⁻³ C_E
		'average power': (18 * 0.25 ** 0.75) / N, // Table 2.2, 18 t^0.75 over 0.25 s shared by N pulses (Table 2.6 rule 2)
		'repetitive pulse (C_P)': 5e-3 * N ** -0.25 // Table 2.6 rule 3
	} as const;
	it('per-pulse radiant exposure at the exit beside the average irradiance', () => {
		expectClose(a.eyewear.perPulse_J_m2!, H, 1e-12);
		expectClose(a.eyewear.averageIrradiance_W_m2, H * 1e4, 1e-9);
	});
	it('OD from each rule = log10(H ÷ that rule’s per-pulse limit); rule 3 sets it', () => {
		for (const [rule, lim] of Object.entries(limits)) {
			const r = a.eyewear.byRule.find((x) => x.rule === rule)!;
			expectClose(r.od, Math.log10(H / lim), 1e-9, rule);
		}
		expect(a.eyewear.setBy).toBe('repetitive pulse (C_P)');
		expect(a.odWhole).toBe(Math.ceil(Math.log10(H / limits['repetitive pulse (C_P)'])));
	});
});

describe('skin beside the eye', () => {
	// 532 nm, 2 W CW, waist 2 mm at the exit, 1 mrad; skin default 10 s (common practice).
	const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 532e-9, power_W: 2, diameter_m: 2e-3, fullDivergence_rad: 1e-3 });
	const E = 2e3; // Table 2.4 rows 400–1400 nm, 10–3·10⁴ s: E = 2·10³ C_A W/m², C_A = 1 below 700 nm (Table 2.5)
	const D = 3.5e-3; // Table 2.4 aperture column
	it('skin limit, aperture and its source', () => {
		expect(a.skin.ok).toBe(true);
		expect(a.skin.duration_s).toBe(10);
		expectClose(a.skin.mpe_W_m2!, E, 1e-12);
		expect(a.skin.limitingAperture_m).toBe(D);
		expect(a.skin.provenance).toBe('published-text');
		expect(a.skin.limitSource).toMatch(/Table 2\.4/);
	});
	it('nominal skin hazard distance: where P(1 − exp(−2a²/w²))/(πa²) falls to the limit, w² = w0² + (θz)²', () => {
		const aR = D / 2;
		const wStar2 = (-2 * aR * aR) / Math.log(1 - (E * Math.PI * aR * aR) / 2);
		const z = Math.sqrt(wStar2 - 1e-3 ** 2) / 0.5e-3;
		expectClose(a.skin.nshd_m!, z, 1e-9);
		expectClose(averaged(2, D, Math.hypot(1e-3, 0.5e-3 * z)), E, 1e-9);
	});
});

describe('several lines in one beam', () => {
	const common = { standard: 'eu-2006-25' as const, diameter_m: 2e-3, fullDivergence_rad: 1e-3 };
	const r = assessLines(common, [{ wavelength_m: 532e-9, power_W: 2 }, { wavelength_m: 1064e-9, power_W: 0.05 }, { wavelength_m: 10.6e-6, power_W: 1 }]);
	const E532 = (18 * 0.25 ** 0.75) / 0.25; // Table 2.2, 0.25 s (aversion response, common practice)
	const E1064 = 10 * 5 * 1; // Table 2.3, 700–1400 nm, α < 1.5 mrad, 10 s: E = 10 C_A C_C (from memory), C_A = 5, C_C = 1 (Table 2.5)
	it('each line keeps its own limit; retina lines 532 and 1064 nm combine, 10.6 µm acts on the cornea (Table 2.1, read)', () => {
		expectClose(r.lines[0].result.mpe_W_m2, E532, 1e-12);
		expectClose(r.lines[1].result.mpe_W_m2, E1064, 1e-12);
		const retina = r.combined.find((c) => c.tissue === 'retina')!;
		expect(retina.lines).toEqual([0, 1]);
		expect(r.combined.find((c) => c.tissue === 'cornea and lens')!.lines).toEqual([2]);
		expect(r.combined.find((c) => c.tissue === 'skin')!.lines).toEqual([0, 1, 2]);
		expect(r.additivityClause).toMatch(/from memory/);
	});
	it('sum of exposure ÷ limit at the exit, and = 1 at the combined hazard distance (beyond either line alone)', () => {
		const retina = r.combined.find((c) => c.tissue === 'retina')!;
		const sum = (z: number) => { const w = Math.hypot(1e-3, 0.5e-3 * z); return averaged(2, 7e-3, w) / E532 + averaged(0.05, 7e-3, w) / E1064; };
		expectClose(retina.sumAtExit, sum(0), 1e-9);
		expectClose(sum(retina.hazardDistance_m), 1, 1e-6);
		expect(retina.hazardDistance_m).toBeGreaterThan(retina.worstSingle_m);
	});
});

describe('CLI hazard --line', () => {
	it('evaluates each line and combines per tissue, with the caution', async () => {
		const j = (await hazard(['--standard', 'eu-2006-25', '--line', '532nm:2W', '--line', '1064nm:50mW', '--diameter', '2mm', '--divergence', '1mrad'])) as { lines: unknown[]; combined: Array<{ tissue: string }>; caution: string };
		expect(j.lines).toHaveLength(2);
		expect(j.combined.map((c) => c.tissue)).toEqual(['retina', 'skin']);
		expect(j.caution).toMatch(/First-pass estimate/);
	});
	it('refuses a malformed line naming the option and the accepted form', async () => {
		await expect(hazard(['--line', '532nm', '--diameter', '2mm', '--divergence', '1mrad'])).rejects.toThrow(/--line \(1\): "532nm" is not WAVELENGTH:POWER — accepted: WAVELENGTH:POWER, e\.g\. 532nm:2W/);
		await expect(hazard(['--line', '532nm:2W', '--power', '1W', '--diameter', '2mm', '--divergence', '1mrad'])).rejects.toThrow(/--power: not taken with --line/);
	});
});
