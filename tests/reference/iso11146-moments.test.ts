/**
 * Second-moment widths of beam images, checked on synthetic images made in the test by the documented
 * generator gaussianImage (tests/beams.ts, written from the formula, not the engine's); no binary fixtures.
 * Sources:
 * - ISO 11146-1:2005, clause 3 (first and second moments, d_x = 4σx, principal axes, azimuth
 *   φ = ½·arctan(2σxy/(σx² − σy²)), ellipticity, circular when ε > 0.87, d = 2√2·√(σx² + σy²)); from memory.
 * - ISO/TR 11146-3:2004, clause 3 (background subtraction, integration area 3× the widths, iterated); from memory.
 * - A. E. Siegman, "Lasers", University Science Books (1986), §17.1: for a Gaussian exp(−2r²/w²),
 *   σ = w/2, so the D4σ diameter equals 2w.
 * - Second moment of a uniform disc of radius R about a diameter: ⟨x²⟩ = R²/4 (handbook integral,
 *   e.g. the area moment of inertia πR⁴/4 divided by the area πR²), so D4σ = 2R.
 * - Rotation of a second-moment tensor: σx² = σ1²·cos²α + σ2²·sin²α (handbook; common practice).
 */
import { describe, expect, it } from 'vitest';
import { encode } from 'fast-png';
import { expectClose } from '../helpers';
import { beamMoments, estimateBackground, fitWidths, planesFromImages, type PhysicalFit } from '../../src/lib/optics/iso11146/index';
import { caustic, gaussianImage } from '../beams';
import { decodeBeamPng, parseMatrixCsv, decodeBeamImage } from '../../src/lib/io/beamImage';

const deg = Math.PI / 180;

describe('beamMoments', () => {
	it('gives D4σ = 2w for a clean round Gaussian (Siegman 1986 §17.1; ISO 11146-1 clause 3, from memory)', () => {
		const img = gaussianImage({ width: 256, height: 256, x0: 128, y0: 120, w1: 40, w2: 40, peak: 1000, offset: 500, bits: 0 });
		const m = beamMoments(img, { pixelPitch_m: 5.5e-6 });
		expectClose(m.dx_m, 80 * 5.5e-6, 1e-6, 'd_x');
		expectClose(m.dy_m, 80 * 5.5e-6, 1e-6, 'd_y');
		expectClose(m.centroid_px.x, 128, 1e-9, 'x̄');
		expectClose(m.centroid_px.y, 120, 1e-9, 'ȳ');
		expectClose(m.centroid_m.x, 128 * 5.5e-6, 1e-9, 'x̄ in m');
		expectClose(m.dCircular_m, 80 * 5.5e-6, 1e-6, 'd = 2√2·√(σx² + σy²)');
		expectClose(m.ellipticity, 1, 1e-6, 'ε');
		expect(m.circular).toBe(true);
		expect(m.converged).toBe(true);
		expect(m.warnings).toEqual([]);
	});

	it('gives widths within 1 % after removing an offset, a tilted background and noise (16-bit; ISO/TR 11146-3 clause 3, from memory)', () => {
		// Noise 80 counts on a 40 000-count peak (SNR 500). Expected scatter of d at this SNR is about
		// 0.2 % (noise inside the 3× area plus the offset error left from ~80 000 background pixels).
		for (const seed of [1, 2, 3, 4, 5]) {
			const img = gaussianImage({
				width: 400, height: 320, x0: 190.3 + seed, y0: 161.7 - seed, w1: 45, w2: 30, peak: 40000,
				offset: 3000, tiltX: 2.5, tiltY: -1.5, noise: 80, bits: 16, seed
			});
			const m = beamMoments(img, { pixelPitch_m: 1e-6 });
			expectClose(m.dx_m, 90e-6, 0.01, `seed ${seed} d_x`);
			expectClose(m.dy_m, 60e-6, 0.01, `seed ${seed} d_y`);
			expect(Math.abs(m.centroid_px.x - (190.3 + seed))).toBeLessThan(0.2);
			expect(Math.abs(m.centroid_px.y - (161.7 - seed))).toBeLessThan(0.2);
			expectClose(m.background.slopeX_countsPerPx, 2.5, 0.02, 'tilt x');
			expectClose(m.background.slopeY_countsPerPx, -1.5, 0.03, 'tilt y');
			expectClose(m.background.noise_counts, 80, 0.05, 'noise');
			expect(m.background.region).toBe('outsideArea');
			expect(m.warnings).toEqual([]);
		}
	});

	it('is unbiased at a lower SNR: over 20 noisy images the mean width error stays below 0.3 %', () => {
		// Noise 200 counts on 40 000 (SNR 200): single images scatter by about 0.5 %, the mean must not drift.
		const ex: number[] = [];
		for (let seed = 1; seed <= 20; seed++) {
			const img = gaussianImage({ width: 400, height: 320, x0: 190 + (seed % 5), y0: 160, w1: 45, w2: 30, peak: 40000, offset: 3000, tiltX: 2.5, noise: 200, seed });
			ex.push(beamMoments(img, { pixelPitch_m: 1e-6 }).dx_m / 90e-6 - 1);
		}
		const mean = ex.reduce((a, b) => a + b, 0) / ex.length;
		const sd = Math.sqrt(ex.reduce((a, b) => a + (b - mean) ** 2, 0) / (ex.length - 1));
		expect(Math.abs(mean)).toBeLessThan(0.003);
		expect(sd).toBeLessThan(0.008);
	});

	it('needs the background removed: the same image without subtraction would be far off', () => {
		// Guard that the check above can fail: offset 3000 counts left in a 3× area inflates σ² several-fold.
		const img = gaussianImage({ width: 400, height: 320, x0: 190, y0: 160, w1: 45, w2: 30, peak: 40000, offset: 3000, bits: 16 });
		const m = beamMoments(img, { pixelPitch_m: 1e-6 });
		expectClose(m.dx_m, 90e-6, 0.01);
		const crude = { ...img, data: img.data };
		// Total second moment over the whole frame with no background handling:
		let p = 0, sx = 0, sxx = 0;
		for (let r = 0; r < crude.height; r++) for (let c = 0; c < crude.width; c++) {
			const v = crude.data[r * crude.width + c];
			p += v; sx += v * c; sxx += v * c * c;
		}
		const naive = 4 * Math.sqrt(sxx / p - (sx / p) ** 2);
		expect(naive / 90).toBeGreaterThan(1.5);
	});

	it('gives the orientation and principal widths of a turned elliptical Gaussian (ISO 11146-1 clause 3, from memory)', () => {
		for (const a of [25, -30, 10]) {
			const img = gaussianImage({ width: 384, height: 384, x0: 192, y0: 190, w1: 60, w2: 25, angle_rad: a * deg, peak: 20000, offset: 500, noise: 50, seed: 9 });
			const m = beamMoments(img, { pixelPitch_m: 1e-6 });
			expect(Math.abs(m.orientation_rad / deg - a)).toBeLessThan(0.3);
			expectClose(m.dxPrincipal_m, 120e-6, 0.01, `${a}° d_x'`);
			expectClose(m.dyPrincipal_m, 50e-6, 0.01, `${a}° d_y'`);
			expectClose(m.ellipticity, 50 / 120, 0.02, `${a}° ε`);
			expect(m.circular).toBe(false);
			// Lab-frame widths follow the rotated tensor: σx² = σ1²cos²α + σ2²sin²α (handbook).
			const c = Math.cos(a * deg), s = Math.sin(a * deg);
			expectClose(m.dx_m, 2 * Math.sqrt(60 ** 2 * c * c + 25 ** 2 * s * s) * 1e-6, 0.01, `${a}° d_x`);
			expectClose(m.dy_m, 2 * Math.sqrt(60 ** 2 * s * s + 25 ** 2 * c * c) * 1e-6, 0.01, `${a}° d_y`);
		}
	});

	it('reports φ for the principal axis nearest x: a beam whose long axis is at 60° has φ = −30° and d_x\' the short width', () => {
		const img = gaussianImage({ width: 384, height: 384, x0: 192, y0: 192, w1: 60, w2: 25, angle_rad: 60 * deg, peak: 20000, bits: 0 });
		const m = beamMoments(img, { pixelPitch_m: 1e-6 });
		expectClose(m.orientation_rad, -30 * deg, 1e-4, 'φ');
		expectClose(m.dxPrincipal_m, 50e-6, 1e-4, "d_x'");
		expectClose(m.dyPrincipal_m, 120e-6, 1e-4, "d_y'");
	});

	it('gives D4σ = 2R for a uniform disc (⟨x²⟩ = R²/4, handbook)', () => {
		const W = 300, R = 60;
		const data = new Float64Array(W * W);
		for (let r = 0; r < W; r++) for (let c = 0; c < W; c++) data[r * W + c] = (c - 150) ** 2 + (r - 140) ** 2 <= R * R ? 1000 : 0;
		const m = beamMoments({ width: W, height: W, data }, { pixelPitch_m: 1e-6 });
		expectClose(m.dx_m, 2 * R * 1e-6, 0.005, 'd_x');
		expectClose(m.dy_m, 2 * R * 1e-6, 0.005, 'd_y');
	});

	it('reads an 8-bit greyscale PNG made by fast-png and keeps widths within 1 %', () => {
		const img = gaussianImage({ width: 400, height: 400, x0: 200, y0: 205, w1: 60, w2: 50, peak: 220, offset: 15, noise: 1.2, bits: 8, seed: 7 });
		const png = encode({ width: 400, height: 400, data: img.data as Uint8Array, depth: 8, channels: 1 });
		const back = decodeBeamPng(png);
		expect(back.maxValue).toBe(255);
		expect(back.data).toBeInstanceOf(Uint8Array);
		const m = beamMoments(back, { pixelPitch_m: 3.45e-6 });
		expectClose(m.dx_m, 120 * 3.45e-6, 0.01, 'd_x');
		expectClose(m.dy_m, 100 * 3.45e-6, 0.01, 'd_y');
	});

	it('reads a 16-bit greyscale PNG (with alpha) and a CSV matrix to the same widths', () => {
		const img = gaussianImage({ width: 96, height: 80, x0: 47, y0: 41, w1: 12, w2: 9, peak: 50000, offset: 100, bits: 16 });
		const ga = new Uint16Array(96 * 80 * 2);
		for (let i = 0; i < 96 * 80; i++) {
			ga[2 * i] = img.data[i];
			ga[2 * i + 1] = 65535;
		}
		const fromPng = decodeBeamImage(encode({ width: 96, height: 80, data: ga, depth: 16, channels: 2 }));
		expect(fromPng.maxValue).toBe(65535);
		const rows: string[] = [];
		for (let r = 0; r < 80; r++) rows.push(Array.from(img.data.subarray(r * 96, (r + 1) * 96)).join(','));
		const fromCsv = decodeBeamImage(new TextEncoder().encode('# made in the test\n' + rows.join('\n')));
		const a = beamMoments(fromPng, { pixelPitch_m: 1e-6 });
		const b = beamMoments(fromCsv, { pixelPitch_m: 1e-6 });
		expectClose(a.dx_m, 24e-6, 0.01);
		expectClose(b.dx_m, a.dx_m, 1e-12);
		expectClose(b.dy_m, a.dy_m, 1e-12);
	});

	it('warns when the beam is cut by the image edge or saturated', () => {
		const cut = gaussianImage({ width: 128, height: 128, x0: 10, y0: 64, w1: 20, w2: 20, peak: 1000, offset: 10 });
		expect(beamMoments(cut, { pixelPitch_m: 1e-6 }).warnings.join(' ')).toMatch(/cut by the image edge/);
		const sat = gaussianImage({ width: 128, height: 128, x0: 64, y0: 64, w1: 15, w2: 15, peak: 400, offset: 10, bits: 8 });
		expect(beamMoments(sat, { pixelPitch_m: 1e-6 }).warnings.join(' ')).toMatch(/saturated/);
	});

	it('zeroing noise below 3σ (clip) shrinks a Gaussian, which is why clipping is off by default', () => {
		const img = gaussianImage({ width: 300, height: 300, x0: 150, y0: 150, w1: 40, w2: 40, peak: 5000, offset: 1000, noise: 20, seed: 3 });
		const plain = beamMoments(img, { pixelPitch_m: 1e-6 });
		const clipped = beamMoments(img, { pixelPitch_m: 1e-6, clip_sigma: 3 });
		expectClose(plain.dx_m, 80e-6, 0.01);
		// Zeroing below 3σ = 60 counts (1.2 % of the peak) removes the wings beyond r = 1.49w: for a
		// Gaussian that takes about 6 % of σ² (∫ u·e^−u du from u = ln 83), i.e. ~3 % of the width.
		expect(clipped.dx_m).toBeLessThan(0.98 * plain.dx_m);
	});

	it('throws for an image with no beam, a bad pixel pitch and a tiny image', () => {
		const flat = gaussianImage({ width: 64, height: 64, x0: 32, y0: 32, w1: 5, w2: 5, peak: 0, offset: 100, noise: 5, seed: 1 });
		expect(() => beamMoments(flat, { pixelPitch_m: 1e-6 })).toThrow(/image must show a beam above the background noise/);
		expect(() => beamMoments(flat, { pixelPitch_m: 0 })).toThrow(/pixel pitch must be > 0 m — got 0 m/);
		expect(() => beamMoments({ width: 4, height: 4, data: new Uint8Array(16) }, { pixelPitch_m: 1e-6 })).toThrow(/at least 8 × 8 pixels — got 4 × 4/);
		expect(() => parseMatrixCsv('1,2,3\n4,x,6')).toThrow(/matrix line 2, column 2: "x" is not a number/);
		expect(() => parseMatrixCsv('1,2,3\n4,5')).toThrow(/matrix line 2 must have 3 values/);
	});
});

describe('estimateBackground', () => {
	it('recovers a plane 100 + 0.5·x exactly (docblock example)', () => {
		const W = 64;
		const data = new Float64Array(W * W);
		for (let r = 0; r < W; r++) for (let c = 0; c < W; c++) data[r * W + c] = 100 + 0.5 * c;
		const b = estimateBackground({ width: W, height: W, data }, { frame_px: 4 });
		expectClose(b.offset_counts, 115.75, 1e-12);
		expectClose(b.slopeX_countsPerPx, 0.5, 1e-12);
		expect(Math.abs(b.slopeY_countsPerPx)).toBeLessThan(1e-12);
		expect(b.noise_counts).toBe(0);
	});

	it('throws for a frame wider than a quarter of the image', () => {
		const img = gaussianImage({ width: 32, height: 32, x0: 16, y0: 16, w1: 3, w2: 3, peak: 10 });
		expect(() => estimateBackground(img, { frame_px: 9 })).toThrow(/from 1 to 8/);
	});
});

describe('images along z feed the caustic fit', () => {
	it('recovers M² from ten synthetic images at known z (ISO 11146-1 clause 9, from memory)', () => {
		const lam = 1064e-9, pitch = 12e-6;
		const truth = { x: { d0: 0.6e-3, z0: 0.25, m2: 1.2 }, y: { d0: 0.5e-3, z0: 0.24, m2: 1.4 } };
		const zRx = truth.x.d0 / ((4 * truth.x.m2 * lam) / (Math.PI * truth.x.d0));
		const zs = [-0.9, -0.5, -0.2, 0.2, 0.6, -2.6, -2.2, 2.2, 2.6, 3.0].map((k) => truth.x.z0 + k * zRx);
		const images = zs.map((z, i) => {
			const dx = caustic(truth.x.d0, truth.x.z0, truth.x.m2, lam, z);
			const dy = caustic(truth.y.d0, truth.y.z0, truth.y.m2, lam, z);
			const img = gaussianImage({ width: 700, height: 700, x0: 350, y0: 345, w1: dx / 2 / pitch, w2: dy / 2 / pitch, peak: 30000, offset: 800, noise: 60, seed: i + 1 });
			const moments = beamMoments(img, { pixelPitch_m: pitch });
			expect(moments.warnings).toEqual([]);
			return { z_m: z, moments, label: `#${i + 1}` };
		});
		const { planes, cautions } = planesFromImages(images);
		expect(cautions).toEqual([]);
		const res = fitWidths(planes, 'xy', { wavelength_m: lam });
		const fx = res.axes.x!.fit as PhysicalFit;
		const fy = res.axes.y!.fit as PhysicalFit;
		expectClose(fx.m2!, truth.x.m2, 0.01, 'M²x');
		expectClose(fy.m2!, truth.y.m2, 0.01, 'M²y');
		expectClose(fx.d0_m, truth.x.d0, 0.01, 'd0x');
		expectClose(fy.d0_m, truth.y.d0, 0.01, 'd0y');
		expect(Math.abs(fy.z0_m - truth.y.z0)).toBeLessThan(0.02 * fy.zR_m);
		expect(res.axes.x!.plan!.ok).toBe(true);
	});
});
