/**
 * From a width fit to the bench's source (kind 'waist' per axis).
 * Sources: w = d/2 for the second-moment diameter (ISO 11146-1:2005, clause 3, from memory);
 * zR = π·w0²/(M²·λ) for the embedded Gaussian (A. E. Siegman, "Lasers" 1986, eq. 17.5 with M²),
 * which must agree with the fit's zR = d0/Θ (ISO 11146-1:2005, clause 9, from memory).
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { causticDiameter_m, fitWidths, toBenchSource, type PhysicalFit } from '../../src/lib/optics/iso11146/index';
import { resolveAxis } from '../../src/lib/optics/source';
import { rayleighRange_m } from '../../src/lib/optics/beam';

const lam = 1064e-9;
const ks = [-0.9, -0.5, -0.1, 0.3, 0.8, 2.2, 2.6, 3.1, 3.7, 4.5];

function planes(x: { d0: number; z0: number; m2: number }, y: { d0: number; z0: number; m2: number }) {
	const zR = x.d0 / ((4 * x.m2 * lam) / (Math.PI * x.d0));
	return ks.map((k) => {
		const z = x.z0 + k * zR;
		return { z_m: z, d_m: [causticDiameter_m(x.d0, x.z0, x.m2, lam, z), causticDiameter_m(y.d0, y.z0, y.m2, lam, z)] };
	});
}

describe('toBenchSource', () => {
	it('gives per axis w0 = d0/2, z0 and M², which the bench resolves to the same waist', () => {
		const res = fitWidths(planes({ d0: 1e-3, z0: 0.2, m2: 1.3 }, { d0: 0.8e-3, z0: 0.18, m2: 1.6 }), 'xy', { wavelength_m: lam });
		const { source, notes } = toBenchSource(res, lam);
		expect(notes).toEqual([]);
		expect(source.x.spec).toEqual({ kind: 'waist', w0_m: expect.any(Number), z0_m: expect.any(Number) });
		expectClose(source.x.m2, 1.3, 1e-9);
		expectClose(source.y.m2, 1.6, 1e-9);
		const wx = resolveAxis(source.x, source.wavelength_m, source.index);
		expectClose(wx.w0_m, 0.5e-3, 1e-9);
		expectClose(wx.z0_m, 0.2, 1e-9);
		const fx = res.axes.x!.fit as PhysicalFit;
		expectClose(rayleighRange_m(wx.w0_m, lam, wx.m2), fx.zR_m, 1e-9, 'Siegman zR vs fitted zR');
	});

	it('gives a round source from a single diameter column and shifts z by zOffset_m', () => {
		const pts = planes({ d0: 1e-3, z0: 0.2, m2: 1.1 }, { d0: 1e-3, z0: 0.2, m2: 1.1 }).map((p) => ({ z_m: p.z_m, d_m: [p.d_m[0]] }));
		const { source } = toBenchSource(fitWidths(pts, 'd', { wavelength_m: lam }), lam, { zOffset_m: 0.05 });
		expect(source.y).toEqual(source.x);
		expectClose((source.x.spec as { z0_m: number }).z0_m, 0.25, 1e-9);
	});

	it('takes an M² just below 1 that is consistent with 1 as 1, with a note, and refuses one that is not', () => {
		// Widths of an M² = 0.99 caustic with about 1 % scatter give M² ≈ 0.990 ± 0.008 → used as 1.
		const scatter = [0.01, -0.01, 0.008, -0.012, 0.01, -0.01, 0.012, -0.008, 0.01, -0.01];
		const near = planes({ d0: 1e-3, z0: 0.2, m2: 0.99 }, { d0: 1e-3, z0: 0.2, m2: 0.99 }).map((p, i) => ({ z_m: p.z_m, d_m: [p.d_m[0] * (1 + scatter[i])] }));
		const r1 = fitWidths(near, 'd', { wavelength_m: lam });
		const fit = r1.axes.d!.fit as PhysicalFit;
		expect(fit.m2!).toBeLessThan(1);
		expect(fit.m2! + 2 * fit.uncertainty!.m2!).toBeGreaterThanOrEqual(1);
		const out = toBenchSource(r1, lam);
		expect(out.source.x.m2).toBe(1);
		expect(out.notes[0]).toMatch(/consistent with 1 and is used as 1/);
		const far = planes({ d0: 1e-3, z0: 0.2, m2: 0.7 }, { d0: 1e-3, z0: 0.2, m2: 0.7 }).map((p) => ({ z_m: p.z_m, d_m: [p.d_m[0]] }));
		expect(() => toBenchSource(fitWidths(far, 'd', { wavelength_m: lam }), lam)).toThrow(/the d fit must be physical to become a source — the fitted M² = 0\.700( ± [0-9.]+)? is below 1/);
	});

	it('refuses a fit that is not physical and a bad wavelength', () => {
		const bad = [0, 0.1, 0.2, 0.3, 0.4].map((z) => ({ z_m: z, d_m: [Math.sqrt(1e-6 * (1 - z * z))] }));
		expect(() => toBenchSource(fitWidths(bad, 'd', { wavelength_m: lam }), lam)).toThrow(/the d fit must be physical to become a source/);
		const good = fitWidths(planes({ d0: 1e-3, z0: 0, m2: 1.2 }, { d0: 1e-3, z0: 0, m2: 1.2 }), 'xy', { wavelength_m: lam });
		expect(() => toBenchSource(good, 0)).toThrow(/wavelength must be > 0 m — got 0 m/);
	});
});
