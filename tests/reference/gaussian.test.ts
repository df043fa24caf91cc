/**
 * Reference checks of the Gaussian-beam engine against published formulas.
 * Each check names its source beside it. Equation numbers are given from memory unless stated;
 * the formulas themselves are the standard ones printed in the cited works.
 */
import { describe, it, expect } from 'vitest';
import { expectClose } from '../helpers';
import {
	beamAt,
	clippedTransmission,
	curvatureAt_m,
	elementMatrices,
	farFieldHalfAngle_rad,
	mirrorFocalLengths,
	plateReducedLengths,
	propagate,
	radiusAt_m,
	rayleighRange_m,
	resolveAxis,
	thickLensFocalLength_m,
	waistFromDivergence,
	waistFromTwoDiameters,
	type AxisSourceSpec,
	type ElementSpec,
	type Propagation,
	type SourceSpec,
	type TrainElement
} from '../../src/lib/optics';

const HeNe = 632.8e-9;
const NdYAG = 1064e-9;

/** A round source with its waist w0 at z0 (both axes), M², in a medium of index n. */
function roundSource(w0_m: number, z0_m: number, wavelength_m = HeNe, m2 = 1, index = 1): SourceSpec {
	const axis = { m2, spec: { kind: 'waist', w0_m, z0_m } as AxisSourceSpec };
	return { wavelength_m, index, x: axis, y: axis };
}

function el(id: string, z_m: number, spec: ElementSpec, aperture_m: number | null = null): TrainElement {
	return { id, label: id.toUpperCase(), z_m, aperture_m, spec };
}

/** The real waist on `axis` in the last segment of a propagation. */
function lastWaist(p: Propagation, axis: 'x' | 'y' = 'x') {
	const last = p.segments.length - 1;
	const w = p.waists.find((o) => o.segment === last && o.axis === axis);
	if (!w) throw new Error('no waist in the last segment');
	return w;
}

describe('Rayleigh range and far-field angle (Kogelnik & Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550, 1966; Siegman, "Lasers", 1986, ch. 17)', () => {
	it('zR = π·w0²/λ for a TEM00 beam in vacuum (Kogelnik & Li 1966, eq. 22, number from memory)', () => {
		const w0 = 0.5e-3;
		expectClose(rayleighRange_m(w0, HeNe), (Math.PI * w0 * w0) / HeNe, 1e-14);
		// Worked by hand: π·(0.5 mm)²/632.8 nm = 1.2411 m.
		expectClose(rayleighRange_m(w0, HeNe), 1.2411, 1e-4);
	});

	it('zR = π·n·w0²/(M²·λ0) for the embedded Gaussian of a real beam in a medium (Siegman 1986, §17.7, from memory)', () => {
		expectClose(rayleighRange_m(0.3e-3, NdYAG, 1.7, 1.45), (Math.PI * 1.45 * 0.09e-6) / (1.7 * NdYAG), 1e-14);
	});

	it('θ = M²·λ0/(π·n·w0) is the far-field half-angle and equals lim w(z)/z (Siegman 1986, eq. 17.16, from memory)', () => {
		const w0 = 0.5e-3;
		const theta = farFieldHalfAngle_rad(w0, HeNe);
		expectClose(theta, HeNe / (Math.PI * w0), 1e-14);
		const p = propagate({ source: roundSource(w0, 0), elements: [], end_m: 1 });
		const zFar = 1e5 * ((Math.PI * w0 * w0) / HeNe); // 10⁵ zR, zR = π·w0²/λ
		expectClose(beamAt(p, zFar).x.w_m / zFar, theta, 1e-9);
	});

	it('θ = M²·λ0/(π·n·w0) for a real beam (M² > 1) in a medium (n ≠ 1) (Siegman 1986, eq. 17.16, from memory)', () => {
		// Worked by hand: M² = 1.7, λ0 = 1064 nm, n = 1.45, w0 = 0.3 mm → θ = 1.7·1064e-9/(π·1.45·3e-4) = 1.3236 mrad.
		const theta = farFieldHalfAngle_rad(0.3e-3, NdYAG, 1.7, 1.45);
		expectClose(theta, (1.7 * NdYAG) / (Math.PI * 1.45 * 0.3e-3), 1e-14);
		expectClose(theta, 1.3236e-3, 1e-4);
		// Without M² it would be 1.7 times smaller; in vacuum, 1.45 times larger.
		expectClose(farFieldHalfAngle_rad(0.3e-3, NdYAG, 1.7, 1), (1.7 * NdYAG) / (Math.PI * 0.3e-3), 1e-14);
	});

	it('refuses a non-positive waist or wavelength and M² < 1 with a message naming the rule', () => {
		expect(() => rayleighRange_m(0, HeNe)).toThrow(/waist radius must be > 0/);
		expect(() => rayleighRange_m(1e-3, -5e-7)).toThrow(/wavelength must be > 0/);
		expect(() => rayleighRange_m(1e-3, HeNe, 0.9)).toThrow(/M² must be ≥ 1/);
	});
});

describe('free-space propagation of q (Kogelnik & Li 1966: q = z + i·zR, w(z), R(z); Siegman 1986: Gouy phase)', () => {
	const w0 = 0.5e-3;
	const zR = (Math.PI * w0 * w0) / HeNe;
	const p = propagate({ source: roundSource(w0, 0.2), elements: [], end_m: 5 });

	for (const z of [0.2, 0.2 + 1e-4, 0.2 + zR / 3, 0.2 + zR, 3.7, 0]) {
		it(`at z = ${z.toFixed(4)} m (waist at 0.2 m): w, R, Gouy phase and q match the closed forms`, () => {
			const b = beamAt(p, z).x;
			const dz = z - 0.2;
			// w(z) = w0·sqrt(1 + (z/zR)²) — Kogelnik & Li 1966, eq. 20 (number from memory).
			expectClose(b.w_m, w0 * Math.sqrt(1 + (dz / zR) ** 2), 1e-12);
			// R(z) = z·(1 + (zR/z)²) — Kogelnik & Li 1966, eq. 21 (number from memory); flat at the waist.
			if (dz === 0) expect(b.R_m).toBe(Infinity);
			else expectClose(b.R_m, dz * (1 + (zR / dz) ** 2), 1e-12);
			// Gouy phase atan(z/zR) relative to the waist — Siegman 1986, eq. 17.5 (from memory).
			expectClose(b.gouy_rad, Math.atan(dz / zR), 1e-12);
			// q = z + i·zR — Kogelnik & Li 1966, eq. 18 (from memory); q̂ = q/n with n = 1.
			expectClose(b.q.re, dz, 1e-12);
			expectClose(b.q.im, zR, 1e-12);
			// The closed-form helpers agree with the q read-out.
			expectClose(radiusAt_m(w0, dz, zR), b.w_m, 1e-14);
			if (dz !== 0) expectClose(curvatureAt_m(dz, zR), b.R_m, 1e-12);
		});
	}

	it('R(z) has its minimum 2·zR at z = zR (Siegman 1986, ch. 17, from memory)', () => {
		const b = beamAt(p, 0.2 + zR).x;
		expectClose(b.R_m, 2 * zR, 1e-12);
		expectClose(b.w_m, Math.SQRT2 * w0, 1e-12);
		expectClose(b.gouy_rad, Math.PI / 4, 1e-12);
	});

	it('1/q = 1/R − i·λ/(π·w²) holds at any plane (Kogelnik & Li 1966, eq. 19, from memory)', () => {
		const b = beamAt(p, 1.3).x;
		const den = b.q.re ** 2 + b.q.im ** 2;
		expectClose(b.q.re / den, 1 / b.R_m, 1e-12);
		expectClose(-b.q.im / den, -HeNe / (Math.PI * b.w_m ** 2), 1e-12);
	});

	it('an M² beam follows w(z) = w0·sqrt(1 + (z·M²λ/(π·w0²))²), the embedded-Gaussian law (Siegman 1986, §17.7, from memory)', () => {
		const m2 = 2.4;
		const q = propagate({ source: roundSource(w0, 0, NdYAG, m2), elements: [], end_m: 5 });
		for (const z of [0, 0.1, 0.7, 4]) {
			expectClose(beamAt(q, z).x.w_m, w0 * Math.sqrt(1 + ((z * m2 * NdYAG) / (Math.PI * w0 * w0)) ** 2), 1e-12);
		}
		// The waist-divergence product is M² times that of the Gaussian (Siegman 1986, ch. 17).
		const wst = lastWaist(q);
		expectClose((wst.w0_m * wst.w0_m) / wst.zR_m, (m2 * NdYAG) / Math.PI, 1e-12);
	});

	it('the Gouy phase advances by π across a focus from far before to far after (Siegman 1986, §17.4, from memory)', () => {
		const f = 0.1;
		const q = propagate({ source: roundSource(1e-3, 0), elements: [el('l', 0, { kind: 'thinLens', f_m: f })], end_m: 1 });
		const wst = lastWaist(q);
		const far = 1e6 * wst.zR_m;
		const before = propagate({ source: roundSource(wst.w0_m, 0), elements: [], end_m: 1 });
		const phase = beamAt(before, far).x.gouy_rad - beamAt(before, -far).x.gouy_rad;
		expectClose(phase, Math.PI, 1e-5);
		// Through the train: lens plane → a plane past the focus, compared with atan of the new waist's law.
		const z = wst.z_m + 3 * wst.zR_m;
		const got = beamAt(q, z).x.gouy_rad - beamAt(q, 0).x.gouy_rad;
		const want = Math.atan((z - wst.z_m) / wst.zR_m) - Math.atan((0 - wst.z_m) / wst.zR_m);
		expectClose(got, want, 1e-9);
	});
});

describe('thin lens: the Self 1983 lens equation (S. A. Self, "Focusing of spherical Gaussian beams", Appl. Opt. 22, 658, 1983)', () => {
	// Self 1983, eq. 9: 1/(s + zR²/(s − f)) + 1/s'' = 1/f; eq. 10: m = 1/sqrt((1 − s/f)² + (zR/f)²) (numbers from memory).
	const cases = [
		{ w0: 0.5e-3, s: 0.5, f: 0.2, lam: HeNe },
		{ w0: 0.2e-3, s: 0.05, f: 0.1, lam: NdYAG },
		{ w0: 1e-3, s: 2.0, f: 0.5, lam: NdYAG },
		{ w0: 0.1e-3, s: 0.3, f: 0.3, lam: HeNe }, // object at the focal plane: image waist at f
		{ w0: 0.3e-3, s: 0.1, f: -0.15, lam: HeNe } // diverging lens: virtual image waist
	];
	for (const { w0, s, f, lam } of cases) {
		it(`w0 = ${w0 * 1e3} mm, s = ${s} m, f = ${f} m: image waist position and magnification`, () => {
			const zR = (Math.PI * w0 * w0) / lam;
			const sImage = 1 / (1 / f - 1 / (s + (zR * zR) / (s - f)));
			const m = 1 / Math.sqrt((1 - s / f) ** 2 + (zR / f) ** 2);
			const p = propagate({ source: roundSource(w0, 0, lam), elements: [el('l', s, { kind: 'thinLens', f_m: f })], end_m: s + 3 });
			const wst = lastWaist(p);
			expectClose(wst.z_m - s, sImage, 1e-9);
			expectClose(wst.w0_m, m * w0, 1e-9);
			// The image Rayleigh range scales with m² (Self 1983, from memory).
			expectClose(wst.zR_m, m * m * zR, 1e-9);
			expect(wst.virtual).toBe(f < 0);
		});
	}

	it('a collimated beam (zR ≫ f) focuses at f to w0′ ≈ λf/(π·w0) (Self 1983, limit of eq. 9–10)', () => {
		const w0 = 5e-3;
		const f = 0.1;
		const p = propagate({ source: roundSource(w0, 0, NdYAG), elements: [el('l', 0, { kind: 'thinLens', f_m: f })], end_m: 0.3 });
		const wst = lastWaist(p);
		expectClose(wst.z_m, f, 1e-5);
		expectClose(wst.w0_m, (NdYAG * f) / (Math.PI * w0), 1e-5);
	});
});

describe('thick lens against the lensmaker equation (Saleh & Teich, "Fundamentals of Photonics", ch. 1, ray-transfer matrices)', () => {
	const lenses = [
		{ r1: 0.0515, r2: -0.0515, t: 0.005, n: 1.507 },
		{ r1: 0.1, r2: Infinity, t: 0.004, n: 1.45 },
		{ r1: -0.2, r2: 0.3, t: 0.002, n: 1.8 },
		{ r1: 0.05, r2: 0.08, t: 0.01, n: 1.6 }
	];
	for (const { r1, r2, t, n } of lenses) {
		it(`R1 = ${r1} m, R2 = ${r2} m, t = ${t} m, n = ${n}: C = −1/f with 1/f = (n−1)(1/R1 − 1/R2 + (n−1)t/(n·R1·R2))`, () => {
			const c1 = Number.isFinite(r1) ? 1 / r1 : 0;
			const c2 = Number.isFinite(r2) ? 1 / r2 : 0;
			const fLensmaker = 1 / ((n - 1) * (c1 - c2 + ((n - 1) * t * c1 * c2) / n));
			expectClose(thickLensFocalLength_m(r1, r2, t, n), fLensmaker, 1e-12);
			const m = elementMatrices({ kind: 'thickLens', r1_m: r1, r2_m: r2, thickness_m: t, index: n }).x;
			expectClose(m[2], -1 / fLensmaker, 1e-12);
			// Reduced thickness t/n is the B entry; determinant 1 (Siegman 1986, §15.2).
			expectClose(m[1], t / n, 1e-12);
			expectClose(m[0] * m[3] - m[1] * m[2], 1, 1e-12);
			// Back focal distance = f·(1 − (n−1)·t/(n·R1)) (Saleh & Teich, ch. 1, from memory) = −A/C.
			expectClose(-m[0] / m[2], fLensmaker * (1 - ((n - 1) * t * c1) / n), 1e-12);
		});
	}

	it('a collimated beam through a thick lens focuses at the back focal distance behind the last surface', () => {
		const lens = { kind: 'thickLens', r1_m: 0.0515, r2_m: -0.0515, thickness_m: 0.005, index: 1.507 } as const;
		const f = thickLensFocalLength_m(lens.r1_m, lens.r2_m, lens.thickness_m, lens.index);
		const bfl = f * (1 - ((lens.index - 1) * lens.thickness_m) / (lens.index * lens.r1_m));
		const p = propagate({ source: roundSource(5e-3, 0, NdYAG), elements: [el('l', 0.1, lens)], end_m: 0.3 });
		expectClose(lastWaist(p).z_m - (0.1 + lens.thickness_m), bfl, 1e-5);
	});

	it('zero thickness reduces to the thin-lens lensmaker equation 1/f = (n−1)(1/R1 − 1/R2)', () => {
		const m = elementMatrices({ kind: 'thickLens', r1_m: 0.1, r2_m: -0.15, thickness_m: 0, index: 1.5 }).x;
		expectClose(m[2], -0.5 * (10 + 1 / 0.15), 1e-12);
	});
});

describe('interfaces and media (Siegman 1986, §15.2 reduced matrices; Saleh & Teich, ch. 1 and 3)', () => {
	it('a flat interface into index n multiplies R by n and leaves w unchanged (Siegman 1986, §15.2, from memory)', () => {
		const n = 1.52;
		const p = propagate({ source: roundSource(0.3e-3, 0), elements: [el('g', 0.4, { kind: 'interface', indexAfter: n, r_m: Infinity })], end_m: 1 });
		const r = p.elements[0];
		expectClose(r.out.x.w_m, r.in.x.w_m, 1e-14);
		expectClose(r.out.x.R_m, n * r.in.x.R_m, 1e-12);
		expect(r.out.x.index).toBe(n);
	});

	it('a waist inside a medium of index n has zR = π·n·w0²/λ0, n times the vacuum value (Saleh & Teich, ch. 3, from memory)', () => {
		const n = 1.8;
		const w0 = 0.2e-3;
		const p = propagate({ source: roundSource(w0, 0.1, NdYAG, 1, n), elements: [], end_m: 1 });
		const wst = lastWaist(p);
		expectClose(wst.zR_m, (Math.PI * n * w0 * w0) / NdYAG, 1e-12);
		expectClose(beamAt(p, 0.1 + wst.zR_m).x.w_m, Math.SQRT2 * w0, 1e-12);
	});

	it('a beam converging to a waist L behind a flat interface focuses at n·L inside, same w0, zR × n (common practice: paraxial focal shift)', () => {
		const n = 1.45;
		const w0 = 50e-6;
		const L = 0.02;
		const zI = 0.5;
		const p = propagate({ source: roundSource(w0, zI + L, NdYAG), elements: [el('g', zI, { kind: 'interface', indexAfter: n, r_m: Infinity })], end_m: 1 });
		const wst = lastWaist(p);
		expectClose(wst.z_m - zI, n * L, 1e-12);
		expectClose(wst.w0_m, w0, 1e-12);
		expectClose(wst.zR_m, (Math.PI * n * w0 * w0) / NdYAG, 1e-12);
	});

	it('a curved interface images by n1/s + n2/s′ = (n2 − n1)/R (Saleh & Teich, ch. 1, paraxial refraction, from memory)', () => {
		const n1 = 1;
		const n2 = 1.6;
		const R = 0.05;
		const s = 0.3;
		const sp = n2 / ((n2 - n1) / R - n1 / s);
		const m = elementMatrices({ kind: 'interface', indexAfter: n2, r_m: R }, n1).x;
		// Total reduced matrix object → image; imaging means B = 0.
		const B = m[0] * (s / n1) + m[1] + (sp / n2) * (m[2] * (s / n1) + m[3]);
		expect(Math.abs(B)).toBeLessThan(1e-12);
		expectClose(m[2], -(n2 - n1) / R, 1e-14);
	});

	it('a medium block of length L and index n has reduced length L/n and leaves the index unchanged after it', () => {
		const m = elementMatrices({ kind: 'medium', length_m: 0.02, index: 1.8 }).x;
		expectClose(m[1], 0.02 / 1.8, 1e-14);
		const p = propagate({ source: roundSource(0.2e-3, 0), elements: [el('c', 0.1, { kind: 'medium', length_m: 0.02, index: 1.8 })], end_m: 1 });
		expect(p.elements[0].out.x.index).toBe(1);
		// Leaving the block, the beam is the free-space beam shifted by L·(1 − 1/n) (common practice).
		const free = propagate({ source: roundSource(0.2e-3, 0.02 * (1 - 1 / 1.8)), elements: [], end_m: 1 });
		expectClose(beamAt(p, 0.7).x.w_m, beamAt(free, 0.7).x.w_m, 1e-12);
		expectClose(beamAt(p, 0.7).x.R_m, beamAt(free, 0.7).x.R_m, 1e-12);
	});
});

describe('tilted mirrors and Brewster plates (Kogelnik, Ippen, Dienes & Shank, "Astigmatically compensated cavities for CW dye lasers", IEEE JQE 8, 373, 1972)', () => {
	it('a mirror at incidence θ has f_t = f·cosθ and f_s = f/cosθ, f = R/2 (Kogelnik et al. 1972, eq. 1, from memory)', () => {
		const R = 0.5;
		const theta = (10 * Math.PI) / 180;
		const { tangential_m, sagittal_m } = mirrorFocalLengths(R, theta);
		expectClose(tangential_m, (R / 2) * Math.cos(theta), 1e-14);
		expectClose(sagittal_m, R / 2 / Math.cos(theta), 1e-14);
		const mx = elementMatrices({ kind: 'mirror', r_m: R, angle_rad: theta, plane: 'x' });
		expectClose(mx.x[2], -1 / ((R / 2) * Math.cos(theta)), 1e-14);
		expectClose(mx.y[2], -Math.cos(theta) / (R / 2), 1e-14);
		const my = elementMatrices({ kind: 'mirror', r_m: R, angle_rad: theta, plane: 'y' });
		expectClose(my.y[2], mx.x[2], 1e-14);
		expectClose(my.x[2], mx.y[2], 1e-14);
	});

	it('a collimated beam off a tilted mirror focuses at f·cosθ (tangential) and f/cosθ (sagittal)', () => {
		const R = 0.4;
		const theta = (20 * Math.PI) / 180;
		const p = propagate({ source: roundSource(4e-3, 0, NdYAG), elements: [el('m', 0, { kind: 'mirror', r_m: R, angle_rad: theta, plane: 'x' })], end_m: 1 });
		// Self 1983, eq. 9 with s = 0: the waist lies at f/(1 + (f/zR)²), → f for zR ≫ f.
		const zR = (Math.PI * 4e-3 * 4e-3) / NdYAG; // zR = π·w0²/λ
		const at = (f: number) => f / (1 + (f / zR) ** 2);
		expectClose(lastWaist(p, 'x').z_m, at((R / 2) * Math.cos(theta)), 1e-9);
		expectClose(lastWaist(p, 'y').z_m, at(R / 2 / Math.cos(theta)), 1e-9);
		expectClose(lastWaist(p, 'x').z_m, (R / 2) * Math.cos(theta), 1e-4);
	});

	for (const n of [1.45, 1.5, 1.76, 3.4]) {
		it(`a Brewster plate (n = ${n}) has effective lengths t·√(n²+1)/n² sagittal and t·√(n²+1)/n⁴ tangential (Kogelnik et al. 1972, eqs. 4–5, from memory)`, () => {
			const t = 3e-3;
			const brewster = Math.atan(n);
			const r = plateReducedLengths(t, n, brewster);
			expectClose(r.sagittal_m, (t * Math.sqrt(n * n + 1)) / n ** 2, 1e-12);
			expectClose(r.tangential_m, (t * Math.sqrt(n * n + 1)) / n ** 4, 1e-12);
			// Geometric path t/cosθ2 with cosθ2 = n/√(n²+1) at Brewster's angle (common practice).
			expectClose(r.path_m, (t * Math.sqrt(n * n + 1)) / n, 1e-12);
			const m = elementMatrices({ kind: 'plate', thickness_m: t, index: n, angle_rad: brewster, plane: 'y' });
			expectClose(m.y[1], r.tangential_m, 1e-14);
			expectClose(m.x[1], r.sagittal_m, 1e-14);
		});
	}

	it('a plate at normal incidence is a block of reduced length t/n on both axes (common practice)', () => {
		const r = plateReducedLengths(2e-3, 1.5, 0);
		expectClose(r.sagittal_m, 2e-3 / 1.5, 1e-14);
		expectClose(r.tangential_m, 2e-3 / 1.5, 1e-14);
	});
});

describe('clipping by a round clear aperture (Siegman 1986, §17.1: power inside radius a is 1 − exp(−2a²/w²))', () => {
	it('a round beam through aperture radius a transmits 1 − exp(−2a²/w²)', () => {
		for (const [a, w] of [[1e-3, 1e-3], [0.5e-3, 1e-3], [3e-3, 1e-3], [1e-4, 2e-3]]) {
			expectClose(clippedTransmission(a, w, w), 1 - Math.exp((-2 * a * a) / (w * w)), 1e-14);
		}
		// a = w transmits 86.47 % (Siegman 1986, ch. 17, from memory).
		expectClose(clippedTransmission(1e-3, 1e-3, 1e-3), 0.8647, 1e-4);
		expect(clippedTransmission(0, 1e-3, 1e-3)).toBe(0);
	});

	/** Brute-force 2-D midpoint integral of the normalised elliptical Gaussian over the disc r < a. */
	function bruteForce(a: number, wx: number, wy: number, nr = 800, nphi = 800): number {
		const norm = 2 / (Math.PI * wx * wy);
		const dr = a / nr;
		const dphi = (Math.PI / 2) / nphi;
		let sum = 0;
		for (let i = 0; i < nr; i++) {
			const r = (i + 0.5) * dr;
			for (let j = 0; j < nphi; j++) {
				const phi = (j + 0.5) * dphi;
				const x = r * Math.cos(phi);
				const y = r * Math.sin(phi);
				sum += Math.exp(-2 * ((x * x) / (wx * wx) + (y * y) / (wy * wy))) * r;
			}
		}
		return 4 * norm * sum * dr * dphi;
	}

	for (const [a, wx, wy] of [
		[1e-3, 1e-3, 0.5e-3],
		[0.7e-3, 2e-3, 0.4e-3],
		[2e-3, 1.5e-3, 1.2e-3],
		[0.3e-3, 1e-3, 0.1e-3]
	]) {
		it(`an elliptical beam wx = ${wx * 1e3} mm, wy = ${wy * 1e3} mm through a = ${a * 1e3} mm matches a brute-force 2-D integral`, () => {
			expectClose(clippedTransmission(a, wx, wy), bruteForce(a, wx, wy), 2e-5);
		});
	}

	it('propagate() reports the transmitted fraction and a clipping warning naming the element', () => {
		const w0 = 1e-3;
		const p = propagate({ source: roundSource(w0, 0), elements: [el('ap', 0, { kind: 'thinLens', f_m: 1 }, 2 * 1.2e-3)], end_m: 1 });
		const want = 1 - Math.exp((-2 * 1.2e-3 ** 2) / w0 ** 2);
		expectClose(p.elements[0].transmitted, want, 1e-12);
		expectClose(p.transmitted, want, 1e-12);
		const warn = p.warnings.find((w) => w.code === 'clipped');
		expect(warn?.elementId).toBe('ap');
		expectClose(warn!.transmitted!, want, 1e-12);
	});
});

describe('source resolution (Siegman 1986, ch. 17: θ = M²λ/(π·n·w0); Kogelnik & Li 1966: w(z))', () => {
	it('diameter + full divergence gives w0 = M²λ/(π·θ) and a beam of that diameter at the plane, waist behind it', () => {
		const d = 2e-3;
		const full = 1e-3;
		const m2 = 1.2;
		const r = waistFromDivergence(d, 0.3, full, NdYAG, m2);
		expectClose(r.w0_m, (m2 * NdYAG) / (Math.PI * (full / 2)), 1e-14);
		expect(r.z0_m).toBeLessThan(0.3);
		const axis = { m2, spec: { kind: 'divergence', d_m: d, at_m: 0.3, fullDivergence_rad: full } as AxisSourceSpec };
		const p = propagate({ source: { wavelength_m: NdYAG, index: 1, x: axis, y: axis }, elements: [], end_m: 1 });
		expectClose(beamAt(p, 0.3).x.w_m, d / 2, 1e-12);
		const far = 1e8;
		expectClose(beamAt(p, far).x.w_m / far, full / 2, 1e-6);
		expect(beamAt(p, 0.3).x.R_m).toBeGreaterThan(0);
	});

	it('d = 2 mm, Θ = 1 mrad, 1064 nm → w0 = 0.6773 mm, waist 1.4713 m behind (worked by hand: zR = 1.3545 m, sqrt((1/0.6773)² − 1) = 1.0862)', () => {
		const r = waistFromDivergence(2e-3, 0, 1e-3, NdYAG, 1);
		expectClose(r.w0_m, 0.6773e-3, 1e-4);
		expectClose(r.z0_m, -1.4713, 1e-4);
	});

	it('a converging beam puts the waist downstream of the plane', () => {
		const r = waistFromDivergence(2e-3, 0.3, 1e-3, NdYAG, 1, 1, true);
		expect(r.z0_m).toBeGreaterThan(0.3);
	});

	it('a diameter smaller than the waist the divergence allows is refused with a reason', () => {
		expect(() => waistFromDivergence(0.1e-3, 0, 1e-3, NdYAG, 1)).toThrow(/beam diameter must be ≥/);
	});

	const pairs = [
		{ w0: 0.4e-3, z0: -0.5, z1: 0, z2: 1, m2: 1, lam: NdYAG }, // both planes after the waist
		{ w0: 0.2e-3, z0: 0.4, z1: 0, z2: 1, m2: 1.3, lam: HeNe }, // waist between the planes
		{ w0: 1e-3, z0: 2, z1: 0.1, z2: 0.9, m2: 1, lam: NdYAG }, // both planes before the waist
		{ w0: 0.3e-3, z0: 0.5, z1: 0.2, z2: 0.8, m2: 2, lam: NdYAG } // symmetric about the waist
	];
	for (const { w0, z0, z1, z2, m2, lam } of pairs) {
		it(`two diameters at ${z1} m and ${z2} m (true waist ${w0 * 1e3} mm at ${z0} m, M² ${m2}) give a beam through both`, () => {
			const zR = (Math.PI * w0 * w0) / (m2 * lam);
			const d1 = 2 * w0 * Math.sqrt(1 + ((z1 - z0) / zR) ** 2);
			const d2 = 2 * w0 * Math.sqrt(1 + ((z2 - z0) / zR) ** 2);
			const r = waistFromTwoDiameters(d1, z1, d2, z2, lam, m2);
			const zRfit = (Math.PI * r.w0_m ** 2) / (m2 * lam);
			expectClose(2 * radiusAt_m(r.w0_m, z1 - r.z0_m, zRfit), d1, 1e-9);
			expectClose(2 * radiusAt_m(r.w0_m, z2 - r.z0_m, zRfit), d2, 1e-9);
			const axis = { m2, spec: { kind: 'twoDiameters', d1_m: d1, z1_m: z1, d2_m: d2, z2_m: z2 } as AxisSourceSpec };
			const p = propagate({ source: { wavelength_m: lam, index: 1, x: axis, y: axis }, elements: [], end_m: 1 });
			expectClose(2 * beamAt(p, z1).x.w_m, d1, 1e-9);
			expectClose(2 * beamAt(p, z2).x.w_m, d2, 1e-9);
			// Where one beam fits, it is the true one; where two fit, the note says so and the larger waist is used.
			if (r.note) expect(r.w0_m).toBeGreaterThanOrEqual(w0 * (1 - 1e-9));
			else expectClose(r.w0_m, w0, 1e-9);
		});
	}

	it('two diameters no beam of this M² can pass through are refused with a reason', () => {
		// 2 mm at both ends of 1 km: the smallest beam radius at 500 m from any waist is sqrt(λ·500 m/π) ≈ 10 mm
		// (minimum of w0² + (λz/(π·w0))² over w0 — Kogelnik & Li 1966, eq. 20, number from memory).
		expect(() => waistFromTwoDiameters(2e-3, 0, 2e-3, 1000, HeNe, 1)).toThrow(/cannot belong to one beam/);
	});

	it('resolveAxis validates the wavelength, M² and index before resolving', () => {
		const axis = { m2: 1, spec: { kind: 'waist', w0_m: 1e-3, z0_m: 0 } as AxisSourceSpec };
		expect(() => resolveAxis(axis, -1, 1)).toThrow(/wavelength must be > 0/);
		expect(() => resolveAxis({ ...axis, m2: 0.5 }, HeNe, 1)).toThrow(/M² must be ≥ 1/);
		expect(() => resolveAxis(axis, HeNe, 0.9)).toThrow(/index must be ≥ 1/);
	});
});
