/**
 * Thin elements immersed in a medium, and the beam inside a tilted plate.
 * Expected values come from closed forms computed here, never from the engine.
 *
 * Sources:
 * - S. A. Self, "Focusing of spherical Gaussian beams", Appl. Opt. 22, 658 (1983): for a thin lens of
 *   focal length f and an input waist at distance s before it (Rayleigh range zR, all in one medium),
 *   the output waist lies at s′ = f + (s − f)·f²/((s − f)² + zR²) with magnification
 *   m = f/√((s − f)² + zR²), w0′ = m·w0, zR′ = m²·zR (equation numbers from memory). In a medium of
 *   index n the same holds with λ → λ/n, i.e. with the medium's zR = π·n·w0²/(M²·λ0).
 * - A. E. Siegman, "Lasers" (1986), §15.2 (reduced slope n·r′) and ch. 15 mirror matrix: reflection is
 *   geometric, a mirror of radius R focuses at R/2 in any medium (1/q′ = 1/q − 2/R on the physical q).
 *   Kogelnik & Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966), Table I.
 * - H. Kogelnik, E. P. Ippen, A. Dienes, C. V. Shank, "Astigmatically compensated cavities for CW dye
 *   lasers", IEEE J. Quantum Electron. 8, 373 (1972): at a tilted flat interface n1 → n2 the tangential
 *   width scales by cosθ2/cosθ1; the tangential ray matrix of the interface is
 *   [[cosθ2/cosθ1, 0], [0, n1·cosθ1/(n2·cosθ2)]] on (r, r′) (also Siegman 1986, §15.4; from memory),
 *   so the physical q inside is q2 = n2/n1·(cos²θ2/cos²θ1)·q1 on the tangential axis and n2/n1·q1 on
 *   the sagittal one.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { beamAt, elementMatrices, propagate, type ElementSpec, type Propagation, type SourceSpec } from '../../src/lib/optics';

const lam = 1064e-9;

function source(w0_m: number, z0_m: number, m2: number, index: number): SourceSpec {
	const axis = { m2, spec: { kind: 'waist' as const, w0_m, z0_m } };
	return { wavelength_m: lam, index, x: axis, y: axis };
}

/** Self (1983): output waist of a thin lens f for an input waist at distance s before it, in one medium. */
function selfFocus(s_m: number, f_m: number, zR_m: number, w0_m: number) {
	const den = (s_m - f_m) ** 2 + zR_m ** 2;
	const m = f_m / Math.sqrt(den);
	return { after_m: f_m + ((s_m - f_m) * f_m * f_m) / den, w0_m: m * w0_m, zR_m: m * m * zR_m };
}

function lastWaist(p: Propagation, axis: 'x' | 'y') {
	const last = p.segments.length - 1;
	const w = p.waists.find((o) => o.segment === last && o.axis === axis);
	if (!w) throw new Error('no waist in the last segment');
	return w;
}

describe('a curved mirror and thin lenses inside a medium focus at their geometric focal length (Siegman 1986, §15.2; Self 1983)', () => {
	// Issue example: source index 1.5, λ 1064 nm, M² 1.3, w0 0.5 mm at −0.3 m; mirror R = 0.2 m at 0.4 m.
	const n = 1.5;
	const m2 = 1.3;
	const w0 = 0.5e-3;
	const zR = (Math.PI * n * w0 * w0) / (m2 * lam);
	const s = 0.4 - -0.3;
	const run = (spec: ElementSpec) => propagate({ source: source(w0, -0.3, m2, n), elements: [{ id: 'e', label: 'E', z_m: 0.4, aperture_m: null, spec }], end_m: 1 });

	it('mirror R = 0.2 m at normal incidence: waist at 0.50553 m, w0 = 47.99 µm, zR = 7.847 mm (f = R/2 in the medium)', () => {
		const want = selfFocus(s, 0.1, zR, w0);
		// The figures, reproduced by hand from Self's formula.
		expectClose(0.4 + want.after_m, 0.50553, 1e-5);
		expectClose(want.w0_m, 47.99e-6, 1e-4);
		expectClose(want.zR_m, 7.847e-3, 1e-4);
		const p = run({ kind: 'mirror', r_m: 0.2, angle_rad: 0, plane: 'x' });
		for (const axis of ['x', 'y'] as const) {
			const w = lastWaist(p, axis);
			expectClose(w.z_m, 0.4 + want.after_m, 1e-9, `${axis} waist position`);
			expectClose(w.w0_m, want.w0_m, 1e-9, `${axis} waist radius`);
			expectClose(w.zR_m, want.zR_m, 1e-9, `${axis} Rayleigh range`);
		}
	});

	it('reduced mirror matrix in a medium n has C = −2n/R (Siegman 1986, ch. 15)', () => {
		const m = elementMatrices({ kind: 'mirror', r_m: 0.2, angle_rad: 0, plane: 'x' }, n);
		expectClose(m.x[2], (-2 * n) / 0.2, 1e-14);
		expectClose(m.y[2], (-2 * n) / 0.2, 1e-14);
	});

	it('a tilted mirror in a medium focuses at f·cosθ (tangential) and f/cosθ (sagittal) (Kogelnik et al. 1972, eq. 1, from memory)', () => {
		const theta = (20 * Math.PI) / 180;
		const p = run({ kind: 'mirror', r_m: 0.2, angle_rad: theta, plane: 'x' });
		const t = selfFocus(s, 0.1 * Math.cos(theta), zR, w0);
		const sg = selfFocus(s, 0.1 / Math.cos(theta), zR, w0);
		expectClose(lastWaist(p, 'x').z_m, 0.4 + t.after_m, 1e-9, 'tangential');
		expectClose(lastWaist(p, 'y').z_m, 0.4 + sg.after_m, 1e-9, 'sagittal');
		expectClose(lastWaist(p, 'x').w0_m, t.w0_m, 1e-9, 'tangential w0');
	});

	it('thin, cylindrical and thermal lenses: f is the focal length in the medium they sit in', () => {
		const f = 0.15;
		const want = selfFocus(s, f, zR, w0);
		const thin = run({ kind: 'thinLens', f_m: f });
		const cyl = run({ kind: 'cylLens', f_m: f, axis: 'y' });
		const thermal = run({ kind: 'thermalLens', fx_m: 0.25, fy_m: f });
		for (const p of [thin, cyl, thermal]) {
			expectClose(lastWaist(p, 'y').z_m, 0.4 + want.after_m, 1e-9);
			expectClose(lastWaist(p, 'y').w0_m, want.w0_m, 1e-9);
		}
		expectClose(lastWaist(thermal, 'x').z_m, 0.4 + selfFocus(s, 0.25, zR, w0).after_m, 1e-9);
		// The cylindrical lens leaves x alone: still the source waist, seen at −0.3 m.
		expectClose(lastWaist(cyl, 'x').z_m, -0.3, 1e-9);
	});

	it('an immersed thin lens equals a zero-thickness thick lens of the same power: f = n0/((nL − n0)(1/R1 − 1/R2)) (lensmaker equation for an immersed lens; Hecht, "Optics", §5.2, from memory)', () => {
		const nL = 1.8;
		const r1 = 0.1;
		const r2 = -0.2;
		const f = n / ((nL - n) * (1 / r1 - 1 / r2));
		const thick = elementMatrices({ kind: 'thickLens', r1_m: r1, r2_m: r2, thickness_m: 0, index: nL }, n);
		const thin = elementMatrices({ kind: 'thinLens', f_m: f }, n);
		for (let i = 0; i < 4; i++) expectClose(thin.x[i], thick.x[i], 1e-12, `entry ${i}`);
	});

	it('in air (n = 1) nothing changes: mirror R focuses at R/2 (Kogelnik & Li 1966, Table I)', () => {
		const zR1 = (Math.PI * w0 * w0) / (m2 * lam);
		const p = propagate({ source: source(w0, -0.3, m2, 1), elements: [{ id: 'm', label: 'M', z_m: 0.4, aperture_m: null, spec: { kind: 'mirror', r_m: 0.2, angle_rad: 0, plane: 'x' } }], end_m: 1 });
		const want = selfFocus(s, 0.1, zR1, w0);
		expectClose(lastWaist(p, 'x').z_m, 0.4 + want.after_m, 1e-9);
		expectClose(lastWaist(p, 'x').w0_m, want.w0_m, 1e-9);
	});
});

describe('the beam inside a tilted plate (Kogelnik, Ippen, Dienes & Shank 1972)', () => {
	// Brewster plate, 10 mm thick, n = 1.5, plane of incidence x (x tangential); a focused beam whose
	// in-air waist would lie 2 mm after the entrance face.
	const n = 1.5;
	const t = 10e-3;
	const theta1 = Math.atan(n);
	const theta2 = Math.asin(Math.sin(theta1) / n);
	const c1 = Math.cos(theta1);
	const c2 = Math.cos(theta2);
	const path = t / c2;
	const zPlate = 0.1;
	const w0 = 30e-6;
	const d = 2e-3;
	const zR1 = (Math.PI * w0 * w0) / lam;
	const p = propagate({
		source: source(w0, zPlate + d, 1, 1),
		elements: [{ id: 'p', label: 'P', z_m: zPlate, aperture_m: null, spec: { kind: 'plate', thickness_m: t, index: n, angle_rad: theta1, plane: 'x' } }],
		end_m: 0.2
	});
	const inside = p.segments.findIndex((s) => s.insideId === 'p');
	// Physical q at the entrance (air) and inside, per axis.
	const q1 = { re: -d, im: zR1 };
	const scaleT = n * (c2 / c1) ** 2;
	const qIn = { x: { re: q1.re * scaleT, im: q1.im * scaleT }, y: { re: q1.re * n, im: q1.im * n } };

	it('the tangential waist inside has w0² = λ·zR/(π·n) with zR and position from q2 = n·(cos²θ2/cos²θ1)·q1', () => {
		for (const axis of ['x', 'y'] as const) {
			const w = p.waists.find((o) => o.segment === inside && o.axis === axis)!;
			const q = qIn[axis];
			expectClose(w.z_m, zPlate - q.re, 1e-9, `${axis} waist position along the path`);
			expectClose(w.zR_m, q.im, 1e-9, `${axis} Rayleigh range inside`);
			expectClose(w.w0_m, Math.sqrt((lam * q.im) / (Math.PI * n)), 1e-9, `${axis} waist radius inside`);
			expect(w.virtual).toBe(false);
		}
	});

	it('at the waist inside, the tangential width is the in-air waist × cosθ2/cosθ1 (= × n at Brewster), the sagittal one unchanged', () => {
		const wx = p.waists.find((o) => o.segment === inside && o.axis === 'x')!;
		const wy = p.waists.find((o) => o.segment === inside && o.axis === 'y')!;
		// For a waist inside, the waist of the equivalent in-air beam is w0 itself (same Im q / zR ratio).
		expectClose(wx.w0_m, w0 * (c2 / c1), 1e-9);
		expectClose(wx.w0_m, w0 * n, 1e-9);
		expectClose(wy.w0_m, w0, 1e-9);
	});

	it('the widths along the path inside follow the physical q2 (w² = λ·|q|²/(π·n·Im q))', () => {
		for (const frac of [0.25, 0.5, 0.9]) {
			const sIn = frac * path;
			const b = beamAt(p, zPlate + sIn);
			for (const axis of ['x', 'y'] as const) {
				const q = { re: qIn[axis].re + sIn, im: qIn[axis].im };
				const w = Math.sqrt((lam * (q.re * q.re + q.im * q.im)) / (Math.PI * n * q.im));
				expectClose(b[axis].w_m, w, 1e-9, `${axis} width at ${frac} of the path`);
			}
		}
	});

	it('the beam after the plate is unchanged by the fix: the waists outside follow the effective reduced lengths (eqs. 4–5)', () => {
		// Effective tangential length t·√(n²+1)/n⁴ and sagittal t·√(n²+1)/n² at Brewster (Kogelnik et al. 1972).
		const eff = { x: (t * Math.sqrt(n * n + 1)) / n ** 4, y: (t * Math.sqrt(n * n + 1)) / n ** 2 };
		const last = p.segments.length - 1;
		for (const axis of ['x', 'y'] as const) {
			const w = p.waists.find((o) => o.segment === last && o.axis === axis)!;
			// The in-air waist, 2 mm after the entrance, moves by the path minus the effective length.
			expectClose(w.z_m, zPlate + d + path - eff[axis], 1e-9, `${axis} waist after the plate`);
			expectClose(w.w0_m, w0, 1e-9, `${axis} waist radius after the plate`);
		}
	});
});
