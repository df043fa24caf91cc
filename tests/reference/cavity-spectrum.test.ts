import { describe, expect, it } from 'vitest';
import { linearRoundTrip, mirrorRoundTrip, roundTripMatrices } from '../../src/lib/optics/cavity';
import { airyLine, cavitySpectrum, roundTripGouy_rad } from '../../src/lib/optics/spectrum';
import { expectClose } from '../helpers';

const c = 299_792_458; // speed of light, m/s (exact, SI 2019)

function twoMirror(r1: number, r2: number, L: number, refl = 0.99) {
	const matrices = roundTripMatrices(linearRoundTrip(r1, r2, [{ kind: 'space', length_m: L }]));
	return cavitySpectrum({ kind: 'linear', roundTrip_m: 2 * L, matrices, reflectivity1: refl, reflectivity2: refl, maxOrder: 3 });
}

/**
 * Two-mirror cavity: ν_qmn = (c/2L)·(q + 1 + (m + n + 1)·arccos(±sqrt(g1·g2))/π), + for g1, g2 > 0, − for
 * g1, g2 < 0 (H. Kogelnik, T. Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966), eq. 66 and the
 * note below it, from memory; A. E. Siegman, "Lasers", 1986, eqs. 19.18–19.20). So FSR = c/2L and the
 * transverse-mode spacing is FSR·arccos(±sqrt(g1g2))/π.
 */
function closedSpacing(r1: number, r2: number, L: number) {
	const g1 = 1 - (Number.isFinite(r1) ? L / r1 : 0);
	const g2 = 1 - (Number.isFinite(r2) ? L / r2 : 0);
	const s = Math.sqrt(g1 * g2) * (g1 < 0 ? -1 : 1);
	return ((c / (2 * L)) * Math.acos(s)) / Math.PI;
}

describe('cavity spectrum: FSR and transverse-mode spacing against closed forms', () => {
	it('confocal (R1 = R2 = L): spacing = FSR/2, every second order falls on TEM00 and is flagged (Siegman 1986, §19.2, confocal degeneracy)', () => {
		const s = twoMirror(0.5, 0.5, 0.5);
		expectClose(s.fsr_Hz, c / 1.0, 1e-12, 'FSR = c/2L');
		expectClose(s.transverseSpacing_Hz.x, s.fsr_Hz / 2, 1e-12, 'spacing');
		expectClose(s.gouy_rad.y, Math.PI, 1e-12, 'round-trip Gouy');
		expect(s.degeneracies.some((d) => d.order === 2 && d.ratio === '1/2')).toBe(true);
		expect(s.warnings.join(' ')).toMatch(/Near-degenerate/);
	});
	it('half-symmetric (flat + R, L = R/4 and L = R/2): spacing = FSR·arccos(sqrt(1 − L/R))/π (Kogelnik & Li 1966, eq. 66)', () => {
		for (const [R, L, frac] of [
			[1, 0.25, 1 / 6], // arccos(sqrt(0.75)) = π/6
			[1, 0.5, 1 / 4] // half-confocal: arccos(sqrt(0.5)) = π/4
		]) {
			const s = twoMirror(Infinity, R, L);
			expectClose(s.fsr_Hz, c / (2 * L), 1e-12, 'FSR');
			expectClose(s.transverseSpacing_Hz.x, closedSpacing(Infinity, R, L), 1e-10, 'spacing, closed form');
			expectClose(s.transverseSpacing_Hz.x, s.fsr_Hz * frac, 1e-10, 'spacing, exact fraction');
		}
	});
	it('near-planar (R = 10 m, L = 0.1 m): spacing = FSR·arccos(g)/π ≈ FSR·sqrt(2L/R)/π (Kogelnik & Li 1966, eq. 66; Siegman 1986, §19.2)', () => {
		const s = twoMirror(10, 10, 0.1);
		expectClose(s.transverseSpacing_Hz.x, closedSpacing(10, 10, 0.1), 1e-10);
		expectClose(s.transverseSpacing_Hz.x, (s.fsr_Hz * Math.sqrt(0.02)) / Math.PI, 2e-3, 'small-angle form');
		expectClose(s.modes.find((m) => m.m === 2 && m.n === 1)!.frequency_Hz, 3 * s.transverseSpacing_Hz.x, 1e-12, 'ν_21 − ν_00 = 3·spacing');
	});
	it('near-concentric (g1 = g2 < 0) takes the minus root: spacing = FSR·arccos(−sqrt(g1g2))/π > FSR/2 (Kogelnik & Li 1966, note to eq. 66)', () => {
		const s = twoMirror(0.26, 0.26, 0.5);
		expectClose(s.transverseSpacing_Hz.x, closedSpacing(0.26, 0.26, 0.5), 1e-10);
		expect(s.transverseSpacing_Hz.x).toBeGreaterThan(s.fsr_Hz / 2);
	});
	it('an unstable cavity and a planar–planar cavity are refused, naming the rule', () => {
		expect(() => twoMirror(0.2, 0.2, 0.5)).toThrow(/must be stable.*unstable/);
		expect(() => twoMirror(Infinity, Infinity, 0.5)).toThrow(/stability boundary/);
	});
	it('ring: FSR = c/perimeter; one curved mirror in a ring is a periodic lens guide, cos θ = 1 − P/(2f) (Kogelnik & Li 1966, §III, periodic focusing, from memory)', () => {
		const R = 1;
		const arms = [0.2, 0.15, 0.25];
		const { parts } = mirrorRoundTrip('ring', [{ r_m: Infinity, angle_rad: 0 }, { r_m: Infinity, angle_rad: 0 }, { r_m: R, angle_rad: 0 }], arms, 0);
		const P = 0.6;
		const s = cavitySpectrum({ kind: 'ring', roundTrip_m: P, matrices: roundTripMatrices(parts), reflectivity1: 0.98, reflectivity2: 0.98, reflections: 3 });
		expectClose(s.fsr_Hz, c / P, 1e-12);
		expectClose(s.gouy_rad.x, Math.acos(1 - P / R), 1e-10, 'round-trip Gouy, f = R/2');
		// Three reflections flip the image in the ring's plane: odd m gains half an FSR (Siegman 1986, §21.4, from memory).
		const m10 = s.modes.find((m) => m.m === 1 && m.n === 0)!;
		const m01 = s.modes.find((m) => m.m === 0 && m.n === 1)!;
		expectClose(m10.frequency_Hz, s.transverseSpacing_Hz.x + s.fsr_Hz / 2, 1e-12);
		expectClose(m01.frequency_Hz, s.transverseSpacing_Hz.y, 1e-12);
	});
	it('the Gouy phase has the sign of B: the same half-trace with B < 0 gives 2π − arccos (Siegman 1986, §21.1)', () => {
		const th = 0.7;
		expectClose(roundTripGouy_rad([Math.cos(th), 0.3 * Math.sin(th), -Math.sin(th) / 0.3, Math.cos(th)]), th, 1e-12);
		expectClose(roundTripGouy_rad([Math.cos(th), -0.3 * Math.sin(th), Math.sin(th) / 0.3, Math.cos(th)]), 2 * Math.PI - th, 1e-12);
	});
});

describe('Airy lines: finesse, linewidth, peak transmission', () => {
	it('R1 = R2 = 0.99, lossless: F ≈ π·sqrt(R)/(1 − R) = 312.6, impedance matched: T = 1, R = 0 on resonance (E. Hecht, "Optics", 4th ed. 2002, §9.6.1, eqs. 9.55–9.57; Siegman 1986, eq. 11.24)', () => {
		const s = twoMirror(1, 1, 0.5, 0.99);
		const r = 0.99;
		expectClose(s.finesse, (Math.PI * Math.sqrt(r)) / (1 - r), 1e-4, 'high-finesse form');
		expectClose(s.linewidth_Hz, s.fsr_Hz / s.finesse, 1e-12);
		expectClose(s.peakTransmission, 1, 1e-12);
		expect(s.resonantReflection).toBeLessThan(1e-20);
	});
	it('the linewidth is the full width at half maximum of T(δ) = T1T2/((1 − r)² + 4r·sin²(δ/2)), found by bisection', () => {
		const [R1, R2, loss] = [0.95, 0.9, 0.02];
		const spec = cavitySpectrum({ kind: 'linear', roundTrip_m: 1, matrices: roundTripMatrices(linearRoundTrip(1, 1, [{ kind: 'space', length_m: 0.5 }])), reflectivity1: R1, reflectivity2: R2, roundTripLoss: loss });
		const T = (d: number) => {
			const r = Math.sqrt(R1 * R2 * (1 - loss));
			return ((1 - R1) * (1 - R2)) / ((1 - r) ** 2 + 4 * r * Math.sin(d / 2) ** 2);
		};
		let [lo, hi] = [0, Math.PI];
		for (let i = 0; i < 200; i++) {
			const mid = (lo + hi) / 2;
			if (T(mid) > T(0) / 2) lo = mid;
			else hi = mid;
		}
		expectClose(spec.linewidth_Hz, (spec.fsr_Hz * 2 * lo) / (2 * Math.PI), 1e-9);
		expectClose(airyLine(0, R1, R2, loss).transmitted, T(0), 1e-12);
	});
	it('lossless mirrors conserve power: T + R = 1 at any detuning (Hecht 2002, §9.6.1)', () => {
		for (const d of [0, 0.01, 0.3, 2]) {
			const a = airyLine(d, 0.97, 0.9, 0);
			expectClose(a.transmitted + a.reflected, 1, 1e-12);
		}
	});
	it('refuses a reflectivity ≥ 1 or < 0, naming the mirror and the range', () => {
		expect(() => twoMirror(1, 1, 0.5, 1)).toThrow(/mirror 1 reflectivity must be ≥ 0 and < 1/);
		expect(() => twoMirror(1, 1, 0.5, -0.1)).toThrow(/reflectivity must be ≥ 0 and < 1/);
	});
});

describe('predicted scan', () => {
	it('each mode is an Airy line of height P_mn·T1T2/(1 − r)² at its own frequency, labelled with its indices; lossless mirrors: transmitted + reflected = input everywhere (Hecht 2002, §9.6.1)', async () => {
		const { predictedScan } = await import('../../src/lib/optics/scan');
		const s = twoMirror(Infinity, 1, 0.25, 0.98);
		const modes = [
			{ m: 0, n: 0, power: 0.9 },
			{ m: 1, n: 0, power: 0.06 },
			{ m: 0, n: 2, power: 0.04 }
		];
		const scan = predictedScan(s, modes, { reflectivity1: 0.98, reflectivity2: 0.98 }, 2e-3, { from_Hz: -0.1 * s.fsr_Hz, to_Hz: 1.1 * s.fsr_Hz, points: 4001 });
		// Peak transmission of a symmetric lossless cavity is 1 (T1T2/(1 − R)² with T = 1 − R).
		const p10 = scan.peaks.find((p) => p.m === 1 && p.n === 0)!;
		expectClose(p10.transmitted_W, 0.06 * 2e-3, 1e-12);
		expectClose(p10.detuning_Hz, s.transverseSpacing_Hz.x, 1e-12);
		expect(scan.peaks.filter((p) => p.m === 0 && p.n === 0).map((p) => p.detuning_Hz / s.fsr_Hz)).toEqual([0, 1]);
		for (let i = 0; i < scan.detuning_Hz.length; i += 250) expectClose(scan.transmitted_W[i] + scan.reflected_W[i], 2e-3, 1e-12);
	});

	it('every point of the predicted scan is the power-weighted sum of the Airy lines (Siegman 1986, eqs. 11.20–11.22), lossy and asymmetric mirrors too', async () => {
		const { predictedScan } = await import('../../src/lib/optics/scan');
		const s = twoMirror(Infinity, 1, 0.25, 0.95);
		const modes = [
			{ m: 0, n: 0, power: 0.7 },
			{ m: 1, n: 0, power: 0.2 },
			{ m: 0, n: 2, power: 0.05 }
		];
		const R1 = 0.95, R2 = 0.995, L = 0.01;
		const scan = predictedScan(s, modes, { reflectivity1: R1, reflectivity2: R2, roundTripLoss: L }, 1e-3, { from_Hz: -0.2 * s.fsr_Hz, to_Hz: 1.3 * s.fsr_Hz, points: 1501 });
		// Independent sum: the closed form written out here, with the 5 % of power outside the listed modes reflected.
		const r1 = Math.sqrt(R1), r2 = Math.sqrt(R2 * (1 - L)), r = r1 * r2;
		for (let i = 0; i < scan.detuning_Hz.length; i += 7) {
			let t = 0, ref = 0.05;
			for (const md of modes) {
				const f = s.modes.find((q) => q.m === md.m && q.n === md.n)!.folded_Hz;
				const s2 = Math.sin((Math.PI * (scan.detuning_Hz[i] - f)) / s.fsr_Hz) ** 2;
				const den = (1 - r) ** 2 + 4 * r * s2;
				t += (md.power * ((1 - R1) * (1 - R2))) / den;
				ref += (md.power * ((r2 - r1) ** 2 + 4 * r1 * r2 * s2)) / den;
			}
			expectClose(scan.transmitted_W[i], t * 1e-3, 1e-12);
			expectClose(scan.reflected_W[i], ref * 1e-3, 1e-12);
		}
	});
});
