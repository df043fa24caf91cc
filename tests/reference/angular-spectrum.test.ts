/**
 * An independent numerical check of the q engine: a sampled Gaussian field is focused by a thin-lens
 * phase and propagated with the angular-spectrum method (J. W. Goodman, "Introduction to Fourier
 * Optics", transfer function H(kx) = exp(i·d·sqrt(k² − kx²)), eq. 3-74 form, number from memory),
 * using the general-purpose FFT library fft.js. The second-moment radius w = 2·sqrt(<x²>) of the
 * intensity (ISO 11146-1:2005, second-moment width; equal to the 1/e² radius for a Gaussian) is
 * compared with the engine's propagate() at the same planes.
 *
 * One transverse axis is enough: the paraxial Gaussian field and the thin-lens phase are separable
 * in x and y, and the engine treats each axis on its own (common practice).
 */
import { describe, it, expect } from 'vitest';
import FFT from 'fft.js';
import { expectClose } from '../helpers';
import { beamAt, propagate, type SourceSpec } from '../../src/lib/optics';

const N = 8192;
const fft = new FFT(N);

interface Setup {
	wavelength_m: number;
	/** Waist radius of the input beam, m, and its distance before the lens (0: waist at the lens). */
	w0_m: number;
	waistBeforeLens_m: number;
	f_m: number;
	/** Half-width of the sampled window, m. */
	halfWidth_m: number;
}

/**
 * Field at the lens plane: a Gaussian of waist w0 whose waist lies `waistBeforeLens_m` upstream.
 * Goodman's convention (time factor exp(−iωt), a diverging wave has phase +k·x²/(2R)) is used throughout,
 * so the Gaussian reads E(x) = exp(−x²/w²)·exp(+i·k·x²/(2R)), i.e. the complex conjugate of Siegman's
 * exp(−i·k·x²/(2q)) with q = z + i·zR (Kogelnik & Li 1966; Siegman 1986, ch. 16, from memory),
 * times the thin-lens phase exp(−i·k·x²/(2f)) (Goodman, ch. 5, lens transmittance, from memory).
 */
function fieldAfterLens(s: Setup): { data: number[]; dx: number } {
	const k = (2 * Math.PI) / s.wavelength_m;
	const zR = (Math.PI * s.w0_m * s.w0_m) / s.wavelength_m;
	const dx = (2 * s.halfWidth_m) / N;
	const data = fft.createComplexArray() as number[];
	// 1/q = (z − i·zR)/(z² + zR²)
	const z = s.waistBeforeLens_m;
	const den = z * z + zR * zR;
	const invQre = z / den;
	const invQim = -zR / den;
	for (let j = 0; j < N; j++) {
		const x = (j - N / 2) * dx;
		const x2 = x * x;
		// conj(exp(−i k x²/(2q))) = exp(k x² Im(1/q)/2) · exp(+i k x² Re(1/q)/2), Re(1/q) = 1/R
		const amp = Math.exp((k * x2 * invQim) / 2);
		const phase = (k * x2 * invQre) / 2 - (k * x2) / (2 * s.f_m);
		data[2 * j] = amp * Math.cos(phase);
		data[2 * j + 1] = amp * Math.sin(phase);
	}
	return { data, dx };
}

/** Propagate a sampled field a distance d with the exact angular-spectrum transfer function. */
function angularSpectrum(field: number[], dx: number, d: number, wavelength_m: number): number[] {
	const k = (2 * Math.PI) / wavelength_m;
	const spec = fft.createComplexArray() as number[];
	fft.transform(spec, field);
	const dk = (2 * Math.PI) / (N * dx);
	for (let j = 0; j < N; j++) {
		const kx = (j < N / 2 ? j : j - N) * dk;
		const kz2 = k * k - kx * kx;
		// Evanescent components decay; none carry power at these sampling steps, but keep the form exact.
		const re = spec[2 * j];
		const im = spec[2 * j + 1];
		if (kz2 >= 0) {
			const ph = d * Math.sqrt(kz2);
			const c = Math.cos(ph);
			const sn = Math.sin(ph);
			spec[2 * j] = re * c - im * sn;
			spec[2 * j + 1] = re * sn + im * c;
		} else {
			const decay = Math.exp(-d * Math.sqrt(-kz2));
			spec[2 * j] = re * decay;
			spec[2 * j + 1] = im * decay;
		}
	}
	const out = fft.createComplexArray() as number[];
	fft.inverseTransform(out, spec);
	return out;
}

/** Second-moment radius w = 2·sqrt(<(x − x̄)²>) of |E|² (ISO 11146-1:2005, clause 3). */
function secondMomentRadius(field: number[], dx: number): number {
	let p = 0;
	let px = 0;
	let pxx = 0;
	for (let j = 0; j < N; j++) {
		const x = (j - N / 2) * dx;
		const i = field[2 * j] ** 2 + field[2 * j + 1] ** 2;
		p += i;
		px += i * x;
		pxx += i * x * x;
	}
	const mean = px / p;
	return 2 * Math.sqrt(pxx / p - mean * mean);
}

function engineRadius(s: Setup, d: number): number {
	const lensAt = 0.05;
	const axis = { m2: 1, spec: { kind: 'waist' as const, w0_m: s.w0_m, z0_m: lensAt - s.waistBeforeLens_m } };
	const source: SourceSpec = { wavelength_m: s.wavelength_m, index: 1, x: axis, y: axis };
	const p = propagate({ source, elements: [{ id: 'l', label: 'L', z_m: lensAt, aperture_m: null, spec: { kind: 'thinLens', f_m: s.f_m } }], end_m: lensAt + 1 });
	return beamAt(p, lensAt + d).x.w_m;
}

describe('angular-spectrum propagation (Goodman, "Introduction to Fourier Optics") agrees with the q engine to better than 0.5 %', () => {
	const cases: Array<{ name: string; setup: Setup; planes: number[] }> = [
		{
			name: '1064 nm, 1 mm waist at the lens, f = 100 mm (focus w ≈ 34 µm)',
			setup: { wavelength_m: 1064e-9, w0_m: 1e-3, waistBeforeLens_m: 0, f_m: 0.1, halfWidth_m: 6e-3 },
			planes: [0.02, 0.06, 0.095, 0.099, 0.1, 0.101, 0.105, 0.15, 0.19]
		},
		{
			name: '632.8 nm, 0.4 mm waist 0.3 m before the lens, f = 200 mm',
			setup: { wavelength_m: 632.8e-9, w0_m: 0.4e-3, waistBeforeLens_m: 0.3, f_m: 0.2, halfWidth_m: 5e-3 },
			planes: [0.05, 0.15, 0.2, 0.21, 0.22, 0.25, 0.35]
		},
		{
			name: '1064 nm, 0.5 mm waist, diverging lens f = −50 mm',
			setup: { wavelength_m: 1064e-9, w0_m: 0.5e-3, waistBeforeLens_m: 0.1, f_m: -0.05, halfWidth_m: 8e-3 },
			planes: [0.01, 0.05, 0.1]
		}
	];

	for (const { name, setup, planes } of cases) {
		it(name, () => {
			const { data, dx } = fieldAfterLens(setup);
			// At the lens plane the sampled field already has the engine's radius.
			expectClose(secondMomentRadius(data, dx), engineRadius(setup, 0), 5e-3, 'at the lens');
			for (const d of planes) {
				const w = secondMomentRadius(angularSpectrum(data, dx, d, setup.wavelength_m), dx);
				expectClose(w, engineRadius(setup, d), 5e-3, `${d} m after the lens`);
			}
		});
	}

	it('samples finely enough: the focused spot spans many grid points and the window holds the whole beam', () => {
		const s = cases[0].setup;
		const dx = (2 * s.halfWidth_m) / N;
		const wFocus = engineRadius(s, s.f_m);
		expect(wFocus / dx).toBeGreaterThan(10);
		// Field at the window edge is negligible (exp(−(halfWidth/w)²) at the widest plane).
		expect(Math.exp(-((s.halfWidth_m / engineRadius(s, 0.19)) ** 2))).toBeLessThan(1e-10);
	});
});
