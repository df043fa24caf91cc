import { describe, expect, it } from 'vitest';
import { axisModeContent, modeContent, sizeRatioFromBeta, waistDistanceFromBeta } from '../../src/lib/optics/modeContent';
import { diagnosePeaks, walkBeam, knobTurns } from '../../src/lib/optics/diagnose';
import { expectClose } from '../helpers';

const lam = 1064e-9;
const k = (2 * Math.PI) / lam;
const w0 = 0.25e-3;
const zR = (Math.PI * w0 * w0) / lam;
const theta0 = lam / (Math.PI * w0);

/**
 * Independent numerical reference: the overlap integral c_m = ∫ u_m*(x)·E(x) dx on a fine grid
 * (composite trapezoid rule, spectrally accurate for these smooth, fast-decaying integrands), at a plane a
 * distance `d` before the cavity waist. The cavity modes there are the normalised Hermite–Gauss functions
 * u_m = φ_m(√2x/w)·(√2/w)^½·exp(−ikx²/2R) (A. E. Siegman, "Lasers", 1986, eq. 16.54), with φ_m from the
 * recurrence φ_{m+1} = sqrt(2/(m+1))·s·φ_m − sqrt(m/(m+1))·φ_{m−1} (M. Abramowitz, I. A. Stegun, "Handbook
 * of Mathematical Functions", 1964, eq. 22.7.13, normalised); the beam is the Gaussian of waist wb whose
 * waist lies `dz` after the cavity waist, centred at x0 − θ·d and tilted by θ (paraxial ray of the centre;
 * fields ∝ exp(−ikz), so the tilt towards +x is the phase exp(−ikθx) and curvature exp(−ikx²/2R), Siegman 1986, §16.4).
 */
function numericFractions(opts: { wb: number; dz: number; x0: number; theta: number; d: number; maxOrder: number }): number[] {
	const { wb, dz, x0, theta, d, maxOrder } = opts;
	// Cavity mode at the plane (z = −d from its waist).
	const z = -d;
	const w = w0 * Math.sqrt(1 + (z / zR) ** 2);
	const invR = z / (z * z + zR * zR);
	// Beam at the plane: its own waist wb at +dz from the cavity waist.
	const zRb = (Math.PI * wb * wb) / lam;
	const zb = z - dz;
	const wbz = wb * Math.sqrt(1 + (zb / zRb) ** 2);
	const invRb = zb / (zb * zb + zRb * zRb);
	const xc = x0 + theta * z;
	const half = 14 * Math.max(w, wbz) + Math.abs(xc);
	const N = 24001;
	const h = (2 * half) / (N - 1);
	const re = new Float64Array(maxOrder + 1);
	const im = new Float64Array(maxOrder + 1);
	let normE = 0;
	for (let i = 0; i < N; i++) {
		const x = -half + i * h;
		const wt = i === 0 || i === N - 1 ? 0.5 : 1;
		// Beam field.
		const ampE = Math.exp(-((x - xc) ** 2) / (wbz * wbz));
		const phE = -(k * (x - xc) ** 2 * invRb) / 2 - k * theta * x;
		normE += wt * ampE * ampE;
		// Cavity modes (conjugated: phase +k x²/2R).
		const s = (Math.SQRT2 * x) / w;
		const env = Math.sqrt(Math.SQRT2 / w) * Math.exp(-(s * s) / 2);
		let pm = 0;
		let p = Math.pow(Math.PI, -0.25);
		const phU = (k * x * x * invR) / 2;
		for (let m = 0; m <= maxOrder; m++) {
			const u = p * env;
			re[m] += wt * u * ampE * Math.cos(phE + phU);
			im[m] += wt * u * ampE * Math.sin(phE + phU);
			const next = Math.sqrt(2 / (m + 1)) * s * p - Math.sqrt(m / (m + 1)) * pm;
			pm = p;
			p = next;
		}
	}
	normE *= h;
	return Array.from({ length: maxOrder + 1 }, (_, m) => ((re[m] * h) ** 2 + (im[m] * h) ** 2) / normE);
}

function closed(opts: { wb: number; dz: number; x0: number; theta: number; d: number; maxOrder: number }) {
	const { wb, dz, x0, theta, d, maxOrder } = opts;
	const zRb = (Math.PI * wb * wb) / lam;
	// q̂ at the plane d before the cavity waist: mode (−d + i·zR), beam (−d − dz + i·zRb).
	return axisModeContent({ re: -d, im: zR }, { q: { re: -d - dz, im: zRb }, offset_m: x0, tilt_rad: theta }, lam, maxOrder).fractions;
}

function compare(opts: { wb: number; dz: number; x0: number; theta: number; d: number; maxOrder: number }) {
	const a = closed(opts);
	const b = numericFractions(opts);
	for (let m = 0; m <= opts.maxOrder; m++) {
		if (b[m] > 1e-8) expectClose(a[m], b[m], 1e-6, `p_${m}`);
		else expect(Math.abs(a[m] - b[m])).toBeLessThan(1e-13);
	}
}

describe('mode content: closed form against a numerical overlap integral (relative 1e-6)', () => {
	it('waist-size mismatch (wb = 1.3·w0, same place)', () => compare({ wb: 1.3 * w0, dz: 0, x0: 0, theta: 0, d: 0, maxOrder: 8 }));
	it('waist-position mismatch (waist 0.4·zR downstream), evaluated at a plane 0.7·zR before the cavity waist', () => compare({ wb: w0, dz: 0.4 * zR, x0: 0, theta: 0, d: 0.7 * zR, maxOrder: 8 }));
	it('lateral offset (0.35·w0)', () => compare({ wb: w0, dz: 0, x0: 0.35 * w0, theta: 0, d: 0.5 * zR, maxOrder: 8 }));
	it('tilt (0.3·θ0)', () => compare({ wb: w0, dz: 0, x0: 0, theta: 0.3 * theta0, d: 0.3 * zR, maxOrder: 8 }));
	it('all four at once', () => compare({ wb: 0.85 * w0, dz: -0.25 * zR, x0: -0.2 * w0, theta: 0.25 * theta0, d: 0.6 * zR, maxOrder: 8 }));
});

describe('mode content: published closed forms', () => {
	it('size mismatch: TEM00 fraction per axis 2·w1·w2/(w1² + w2²) (H. Kogelnik, "Coupling and conversion coefficients for optical modes", 1964; W. B. Joyce, B. C. DeLoach, Appl. Opt. 23, 4187 (1984), eq. 11 per axis, from memory)', () => {
		const wb = 1.2 * w0;
		const p = axisModeContent({ re: 0, im: zR }, { q: { re: 0, im: (Math.PI * wb * wb) / lam } }, lam, 1).fractions;
		expectClose(p[0], (2 * w0 * wb) / (w0 * w0 + wb * wb), 1e-12);
		expect(p[1]).toBe(0);
	});
	it('matched waists, offset and tilt: Poisson powers exp(−|ε|²)|ε|^2m/m!, ε = x0/w0 + iθ/θ0; first order p1 ≈ (x0/w0)² + (θ/θ0)² (D. Z. Anderson, Appl. Opt. 23, 2944 (1984), from memory)', () => {
		const [a, t] = [0.1, 0.08];
		const p = axisModeContent({ re: 0.02, im: zR }, { q: { re: 0.02, im: zR }, offset_m: a * w0, tilt_rad: t * theta0 }, lam, 3).fractions;
		const e2 = a * a + t * t;
		[1, 1, 2, 6].forEach((f, m) => expectClose(p[m], (Math.exp(-e2) * e2 ** m) / f, 1e-10, `p_${m}`));
		expect(Math.abs(p[1] - e2)).toBeLessThan(e2 * e2 * 1.01);
	});
	it('a round beam in a round cavity: P_mn = p_m·p_n and the listed fractions add up to nearly 1', () => {
		const c = modeContent({ x: { re: 0, im: zR }, y: { re: 0, im: zR } }, { x: { q: { re: 0.1 * zR, im: zR * 1.1 }, offset_m: 0.1 * w0 }, y: { q: { re: 0.1 * zR, im: zR * 1.1 } } }, lam, 8);
		expect(c.listed).toBeGreaterThan(0.999999);
		expect(c.listed).toBeLessThanOrEqual(1 + 1e-12);
		const m11 = c.modes.find((m) => m.m === 1 && m.n === 1)!;
		expectClose(m11.power, c.x.fractions[1] * c.y.fractions[1], 1e-12);
		expect(c.caveat).toBeNull();
	});
	it('|β| to a pure size or position error: |β| = |r² − 1|/(r² + 1) and |β| = |d|/sqrt(4zR² + d²) (derived from the same Gaussian integral; checked against the numerical p0 = sqrt(1 − |β|²))', () => {
		const wb = 1.25 * w0;
		const pSize = numericFractions({ wb, dz: 0, x0: 0, theta: 0, d: 0, maxOrder: 0 })[0];
		const bSize = Math.sqrt(1 - pSize * pSize);
		expectClose(sizeRatioFromBeta(bSize), 1.25, 1e-6);
		const dz = 0.6 * zR;
		const pPos = numericFractions({ wb: w0, dz, x0: 0, theta: 0, d: 0, maxOrder: 0 })[0];
		expectClose(waistDistanceFromBeta(Math.sqrt(1 - pPos * pPos), zR), dz, 1e-6);
	});
});

/** Deterministic normal deviates (Box–Muller on a fixed linear congruential sequence; Numerical Recipes 2007, §7.1 and §7.3.4). */
function gaussians(seed: number, n: number): number[] {
	let s = seed >>> 0;
	const u = () => ((s = (Math.imul(1664525, s) + 1013904223) >>> 0) + 0.5) / 4294967296;
	return Array.from({ length: n }, () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u()));
}

describe('inverse: peak heights back to misalignment and mismatch', () => {
	function peaksOf(x: number[], y: number[], S: number) {
		return { p00: S * x[0] * y[0], p10: S * x[1] * y[0], p01: S * x[0] * y[1], p20: S * x[2] * y[0], p02: S * x[0] * y[2], p11: S * x[1] * y[1] };
	}
	it('recovers a known offset (x) and tilt (y) from synthetic peaks with 0.5 % noise, within 3σ of its stated uncertainty', () => {
		const mode = { re: 0, im: zR };
		const [ox, ty] = [0.3 * w0, 0.2 * theta0];
		const x = axisModeContent(mode, { q: mode, offset_m: ox }, lam, 2).fractions;
		const y = axisModeContent(mode, { q: mode, tilt_rad: ty }, lam, 2).fractions;
		for (const seed of [1, 2, 3]) {
			const p = peaksOf(x, y, 2.0);
			const top = p.p00;
			const g = gaussians(seed, 6);
			const noisy = { p00: p.p00 + 0.005 * top * g[0], p10: p.p10 + 0.005 * top * g[1], p01: p.p01 + 0.005 * top * g[2], p20: Math.max(0, p.p20 + 0.005 * top * g[3]), p02: Math.max(0, p.p02 + 0.005 * top * g[4]), p11: Math.max(0, p.p11 + 0.005 * top * g[5]), noise: 0.005 };
			const d = diagnosePeaks(noisy);
			expect(Math.abs(d.misalignment.x.value * w0 - ox)).toBeLessThanOrEqual(3 * d.misalignment.x.sigma * w0);
			expect(Math.abs(d.misalignment.y.value * theta0 - ty)).toBeLessThanOrEqual(3 * d.misalignment.y.sigma * theta0);
			expect(d.misalignment.x.sigma).toBeGreaterThan(0);
		}
		// Without noise the recovery is exact.
		const d0 = diagnosePeaks({ ...peaksOf(x, y, 2.0), noise: 0.005 });
		expectClose(d0.misalignment.x.value, 0.3, 1e-6);
		expectClose(d0.misalignment.y.value, 0.2, 1e-6);
		expectClose(d0.scale.value, 2.0, 1e-6);
	});
	it('recovers a waist-size mismatch (wb = 1.2·w0, both axes) as |β| and as the size ratio', () => {
		const mode = { re: 0, im: zR };
		const wb = 1.2 * w0;
		const beam = { q: { re: 0, im: (Math.PI * wb * wb) / lam } };
		const x = axisModeContent(mode, beam, lam, 2).fractions;
		const d = diagnosePeaks({ ...peaksOf(x, x, 1), sum: 1 });
		expectClose(sizeRatioFromBeta(d.mismatch.x.value), 1.2, 1e-5);
		expectClose(sizeRatioFromBeta(d.mismatch.y.value), 1.2, 1e-5);
		expect(d.misalignment.x.value).toBeLessThan(1e-4);
	});
	it('a power scan cannot tell the sign: offsets +x0 and −x0 give the same peaks (so the estimate says so)', () => {
		const mode = { re: 0.01, im: zR };
		const a = axisModeContent(mode, { q: { re: 0.01, im: zR * 1.1 }, offset_m: 0.2 * w0 }, lam, 4).fractions;
		const b = axisModeContent(mode, { q: { re: 0.01, im: zR * 1.1 }, offset_m: -0.2 * w0 }, lam, 4).fractions;
		a.forEach((v, i) => expectClose(v, b[i], 1e-12));
		expect(diagnosePeaks({ p00: 1, p10: 0.01, p01: 0, p20: 0, p02: 0 }).ambiguity).toMatch(/sign/);
	});
	it('refuses peaks adding up to more than the given total, and negative heights', () => {
		expect(() => diagnosePeaks({ p00: 0.9, p10: 0.1, p01: 0.1, p20: 0, p02: 0, sum: 1 })).toThrow(/peak heights must be no more in total than the sum/);
		expect(() => diagnosePeaks({ p00: 0.9, p10: -0.1, p01: 0.1, p20: 0, p02: 0 })).toThrow(/TEM10 must be ≥ 0/);
	});
});

describe('beam walking with two steering mirrors', () => {
	it('the two angles cancel offset and tilt at the waist, checked by tracing the centre ray (ray matrices of free space, Siegman 1986, §15.1; reflection turns the beam by 2φ, common practice)', () => {
		const [L1, L2] = [0.8, 0.35]; // mirror → waist distances
		const [x0, t0] = [120e-6, -0.4e-3];
		const s = walkBeam([1, L1, 0, 1], [1, L2, 0, 1], x0, t0);
		// Centre ray after both turns: tilt adds 2φ at each mirror, offset 2φ·L at the waist.
		expect(Math.abs(x0 + 2 * s.mirror1_rad * L1 + 2 * s.mirror2_rad * L2)).toBeLessThan(1e-15);
		expect(Math.abs(t0 + 2 * s.mirror1_rad + 2 * s.mirror2_rad)).toBeLessThan(1e-15);
		expectClose(knobTurns(s.mirror1_rad, 8e-3), s.mirror1_rad / 8e-3, 1e-15);
	});
	it('refuses two mirrors at one place (offset and tilt cannot be set independently)', () => {
		expect(() => walkBeam([1, 0.5, 0, 1], [1, 0.5, 0, 1], 1e-4, 0)).toThrow(/steering mirrors must be far enough apart/);
	});
});
