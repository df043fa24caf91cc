/**
 * Properties of the ISO 11146-1 caustic fit, the plan check and the moment widths over many random
 * beams. Sources: ISO 11146-1:2005, clauses 3 and 9 (from memory); Siegman, "Lasers" (1986) §17.1
 * (D4σ = 2w for a Gaussian).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import './seed';
import { beamMoments, checkPlan, fitCaustic, type PhysicalFit } from '../../src/lib/optics/iso11146/index';
import { caustic, gaussianImage } from '../beams';

describe('fitCaustic (property)', () => {
	it('recovers d0, z0, M² of any embedded-Gaussian caustic sampled at ten or more planes', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 10e-6, max: 5e-3, noNaN: true }),
				fc.double({ min: -1, max: 1, noNaN: true }),
				fc.double({ min: 1, max: 30, noNaN: true }),
				fc.double({ min: 250e-9, max: 11e-6, noNaN: true }),
				// Ten to twenty distinct planes anywhere in z0 ± 5 zR, in steps of 0.1 zR.
				fc.uniqueArray(fc.integer({ min: -50, max: 50 }), { minLength: 10, maxLength: 20 }),
				fc.constantFrom('relative' as const, 'plain' as const),
				(d0, z0, m2, lam, steps, weighting) => {
					const zR = (Math.PI * d0 * d0) / (4 * m2 * lam);
					const pts = steps.map((k) => ({ z_m: z0 + 0.1 * k * zR, d_m: caustic(d0, z0, m2, lam, z0 + 0.1 * k * zR) }));
					const f = fitCaustic(pts, { wavelength_m: lam, weighting });
					expect(f.physical).toBe(true);
					const p = f as PhysicalFit;
					expect(Math.abs(p.d0_m / d0 - 1)).toBeLessThan(1e-6);
					expect(Math.abs(p.m2! / m2 - 1)).toBeLessThan(1e-6);
					expect(Math.abs(p.z0_m - z0) / zR).toBeLessThan(1e-6);
					expect(Math.abs(p.zR_m / zR - 1)).toBeLessThan(1e-6);
				}
			),
			{ numRuns: 300, seed: 11146 }
		);
	});

	it('never returns a non-finite number in a physical fit of noisy data', () => {
		fc.assert(
			fc.property(fc.array(fc.tuple(fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 1e-5, max: 1e-2, noNaN: true })), { minLength: 3, maxLength: 15 }), (rows) => {
				const pts = rows.map(([z, d]) => ({ z_m: z, d_m: d }));
				fc.pre(new Set(pts.map((p) => p.z_m)).size >= 3);
				let f;
				try {
					f = fitCaustic(pts, { wavelength_m: 1064e-9 });
				} catch (e) {
					// Only a degenerate design (three z too close to separate) may throw, and only as a RangeError.
					expect(e).toBeInstanceOf(RangeError);
					return;
				}
				const walk = (v: unknown): void => {
					if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
					else if (v && typeof v === 'object') Object.values(v).forEach(walk);
				};
				walk(f);
			}),
			{ numRuns: 300, seed: 7 }
		);
	});
});

describe('checkPlan (property)', () => {
	it('adding the proposed planes always satisfies the rule', () => {
		fc.assert(
			fc.property(fc.array(fc.double({ min: -6, max: 6, noNaN: true }), { minLength: 0, maxLength: 14 }), fc.double({ min: 1e-3, max: 2, noNaN: true }), (ks, zR) => {
				const z = ks.map((k) => k * zR);
				const p = checkPlan(z, { z0_m: 0, zR_m: zR });
				const after = checkPlan([...z, ...p.add.flatMap((s) => s.at_m)], { z0_m: 0, zR_m: zR });
				expect(after.ok).toBe(true);
				expect(after.planes).toBeGreaterThanOrEqual(10);
			}),
			{ numRuns: 300, seed: 3 }
		);
	});
});

describe('beamMoments (property)', () => {
	it('finds D4σ = 2w within 1 % for Gaussians of any size, position and orientation that fit the frame', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 5, max: 25, noNaN: true }),
				fc.double({ min: 5, max: 25, noNaN: true }),
				fc.double({ min: -Math.PI / 2, max: Math.PI / 2, noNaN: true }),
				fc.double({ min: -20, max: 20, noNaN: true }),
				fc.double({ min: -20, max: 20, noNaN: true }),
				fc.integer({ min: 1, max: 1000 }),
				(w1, w2, angle, ox, oy, seed) => {
					// Beams at least 10 pixels wide (the engine warns below that), SNR 1500.
					const img = gaussianImage({ width: 200, height: 200, x0: 100 + ox, y0: 100 + oy, w1, w2, angle_rad: angle, peak: 30000, offset: 400, noise: 20, seed });
					const m = beamMoments(img, { pixelPitch_m: 1 });
					const big = Math.max(m.dxPrincipal_m, m.dyPrincipal_m);
					const small = Math.min(m.dxPrincipal_m, m.dyPrincipal_m);
					expect(Math.abs(big / (2 * Math.max(w1, w2)) - 1)).toBeLessThan(0.01);
					expect(Math.abs(small / (2 * Math.min(w1, w2)) - 1)).toBeLessThan(0.01);
					expect(Math.abs(m.centroid_px.x - (100 + ox))).toBeLessThan(0.1);
				}
			),
			{ numRuns: 40, seed: 5 }
		);
	});
});
