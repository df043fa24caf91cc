/**
 * Knife-edge and slit scans against closed forms computed here, independently of the engine:
 * the Gaussian's error-function integral by Simpson's rule, and the normal quantile by bisection on it.
 */
import { describe, expect, it } from 'vitest';
import { clipFactor, erf, fitKnifeEdge, normalQuantile, type ScanPoint } from '../../src/lib/optics/iso11146/knifeEdge';
import { expectClose } from '../helpers';

/** erf by composite Simpson's rule of 2/√π·∫₀ˣ e^(−t²) dt (4000 intervals; error ≪ 1e-12 for |x| ≤ 6). */
function erfSimpson(x: number): number {
	const n = 4000;
	const h = x / n;
	let s = 1 + Math.exp(-x * x);
	for (let k = 1; k < n; k++) s += (k % 2 ? 4 : 2) * Math.exp(-(k * h) * (k * h));
	return ((2 / Math.sqrt(Math.PI)) * s * h) / 3;
}
/** Standard normal distribution Φ(t) from the Simpson erf. */
const Phi = (t: number) => 0.5 * (1 + erfSimpson(t / Math.SQRT2));
/** Φ⁻¹(p) by bisection on the Simpson Φ. */
function quantileBisect(p: number): number {
	let lo = -10, hi = 10;
	for (let i = 0; i < 80; i++) {
		const mid = (lo + hi) / 2;
		if (Phi(mid) < p) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

/** Small seeded generator (mulberry32) and Box–Muller normal deviates, so the noisy checks are repeatable. */
function rng(seed: number) {
	let a = seed >>> 0;
	const u = () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	return () => Math.sqrt(-2 * Math.log(u() || 1e-12)) * Math.cos(2 * Math.PI * u());
}

/** Knife scan of a Gaussian of 1/e² radius w at centre c: power passed = B + A·Φ((x − c)/σ), σ = w/2 (integral of the profile). */
function knifeScan(w: number, c: number, from: number, to: number, n: number, B = 0.01, A = 1, noise = 0, seed = 1): ScanPoint[] {
	const g = rng(seed);
	return Array.from({ length: n }, (_, i) => {
		const x = from + ((to - from) * i) / (n - 1);
		return { x_m: x, P_W: B + A * Phi((x - c) / (w / 2)) + noise * g() };
	});
}

describe('error function and clip factors', () => {
	it('erf matches the Simpson integral of the Gaussian (definition of erf; Abramowitz & Stegun 1964, eq. 7.1.1)', () => {
		for (const x of [-4.5, -2.2, -0.7, 0.05, 0.5, 1, 1.7, 2.99, 3.01, 4, 5.5]) expectClose(erf(x), erfSimpson(x), 1e-11, `erf(${x})`);
	});

	it('normal quantile matches bisection on Φ (Φ(t) = ½[1 + erf(t/√2)], definition)', () => {
		for (const p of [0.1, 0.16, 0.5, 0.84, 0.9, 0.975]) expect(normalQuantile(p)).toBeCloseTo(quantileBisect(p), 9);
	});

	it('10/90 factor is 2/Φ⁻¹(0.9) ≈ 1.5606 and 16/84 is 2/Φ⁻¹(0.84) ≈ 2.0111 (derived from the Gaussian knife-edge integral; Siegman, Sasnett & Johnston 1991, IEEE JQE 27, 1098, abstract)', () => {
		expectClose(clipFactor(0.1), 2 / quantileBisect(0.9), 1e-9, '10/90');
		expectClose(clipFactor(0.16), 2 / quantileBisect(0.84), 1e-9, '16/84');
		expect(clipFactor(0.1)).toBeCloseTo(1.5606, 4);
		expect(clipFactor(0.16)).toBeCloseTo(2.0111, 4);
		// The clip pair at ±1σ (15.87/84.13 %) is exactly w apart, so the factor is 2 (D4σ = 2w).
		expectClose(clipFactor(1 - Phi(1)), 2, 1e-9, '±1σ pair');
	});
});

describe('knife-edge fit on synthetic scans', () => {
	it('noiseless scan: w, centre, and the 10/90 and 16/84 clip distances of a Gaussian (Δx = 2σ·Φ⁻¹(1 − p), σ = w/2)', () => {
		const w = 0.8e-3, c = 2.1e-3;
		const r = fitKnifeEdge(knifeScan(w, c, 0, 4.2e-3, 421));
		expectClose(r.w_m, w, 1e-6, 'w');
		expectClose(r.center_m, c, 1e-6, 'centre');
		expectClose(r.clip10_90_m!, w * quantileBisect(0.9), 2e-4, '10/90 clip');
		expectClose(r.clip16_84_m!, w * quantileBisect(0.84), 2e-4, '16/84 clip');
		expectClose(r.d4sigma_m, 2 * w, 2e-4, 'D4σ = 2w for a Gaussian');
		expect(r.d4sigmaFrom).toBe('clip10_90');
		expect(r.warnings).toEqual([]);
	});

	it('a blade that covers the beam (power falling) gives the same width', () => {
		const w = 1.5e-3;
		const pts = knifeScan(w, 0, -5e-3, 5e-3, 201).map((p) => ({ x_m: p.x_m, P_W: 2 - p.P_W }));
		const r = fitKnifeEdge(pts);
		expect(r.amplitude_W).toBeLessThan(0);
		expectClose(r.w_m, w, 1e-6, 'w');
	});

	it('noisy scans: the stated uncertainty of w matches the scatter of repeated fits (1σ within ±35 %)', () => {
		const w = 1e-3;
		const ws: number[] = [];
		const us: number[] = [];
		for (let s = 1; s <= 120; s++) {
			const r = fitKnifeEdge(knifeScan(w, 0.3e-3, -2.5e-3, 2.5e-3, 41, 0.02, 1, 0.01, s));
			ws.push(r.w_m);
			us.push(r.uncertainty.w_m);
		}
		const mean = ws.reduce((a, b) => a + b, 0) / ws.length;
		const sdev = Math.sqrt(ws.reduce((a, b) => a + (b - mean) ** 2, 0) / (ws.length - 1));
		const stated = us.reduce((a, b) => a + b, 0) / us.length;
		expect(Math.abs(mean - w)).toBeLessThan(3 * (sdev / Math.sqrt(ws.length)) + 1e-7);
		expect(stated / sdev).toBeGreaterThan(0.65);
		expect(stated / sdev).toBeLessThan(1.35);
	});

	it('one noisy scan recovers w within 3 stated standard uncertainties', () => {
		const w = 0.45e-3;
		const r = fitKnifeEdge(knifeScan(w, -0.1e-3, -1.5e-3, 1.3e-3, 57, 0.005, 0.8, 0.004, 7));
		expect(Math.abs(r.w_m - w)).toBeLessThan(3 * r.uncertainty.w_m);
		expect(Math.abs(r.d4sigma_m - 2 * w)).toBeLessThan(3 * r.uncertainty.d4sigma_m);
	});

	it('a scan that stops short of the beam says so and still fits', () => {
		const r = fitKnifeEdge(knifeScan(1e-3, 0, -2.5e-3, 0.2e-3, 30));
		expect(r.warnings.join(' ')).toMatch(/does not run from below 5 % to above 95 %/);
		expect(r.clip10_90_m).toBeNull();
		expect(r.d4sigmaFrom).toBe('fit');
	});

	it('slit scan of a Gaussian gives w and D4σ = 2w (profile exp(−2x²/w²), definition of the 1/e² radius)', () => {
		const w = 0.6e-3, c = 0.2e-3;
		const pts = Array.from({ length: 81 }, (_, i) => {
			const x = -2e-3 + (4e-3 * i) / 80;
			return { x_m: x, P_W: 0.003 + 0.5 * Math.exp((-2 * (x - c) ** 2) / (w * w)) };
		});
		const r = fitKnifeEdge(pts, 'slit');
		expectClose(r.w_m, w, 1e-6, 'w');
		expectClose(r.center_m, c, 1e-6, 'centre');
		expectClose(r.d4sigma_m, 2 * w, 1e-6, 'D4σ');
	});

	it('refuses scans that cannot be fitted, naming the problem', () => {
		expect(() => fitKnifeEdge(knifeScan(1e-3, 0, -1e-3, 1e-3, 4))).toThrow(/at least 5 points — got 4/);
		expect(() => fitKnifeEdge([0, 1, 2, 3, 4].map((i) => ({ x_m: i * 1e-4, P_W: 1 })))).toThrow(/must change/);
		expect(() => fitKnifeEdge([0, 1, 1, 3, 4].map((i) => ({ x_m: i * 1e-4, P_W: i })))).toThrow(/appears twice/);
	});
});
