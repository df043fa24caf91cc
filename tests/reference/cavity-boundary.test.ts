/**
 * Two-mirror cavities on the stability boundary g1·g2 = 0 or 1 (hemispherical, confocal, planar,
 * concentric) are reported as such, with the limit of their mode and the reason.
 *
 * Sources:
 * - H. Kogelnik & T. Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966), §V: stability
 *   0 < g1·g2 < 1 (the g1–g2 diagram, whose boundary is the axes and the hyperbola g1·g2 = 1) and the
 *   mode eqs. 61–64: w1² = (λL/π)·sqrt(g2/(g1(1 − g1g2))), w2² = (λL/π)·sqrt(g1/(g2(1 − g1g2))),
 *   w0² = (λL/π)·sqrt(g1g2(1 − g1g2)/(g1 + g2 − 2g1g2)²), t1 = L·g2(1 − g1)/(g1 + g2 − 2g1g2).
 * - G. D. Boyd & J. P. Gordon, "Confocal multimode resonator for millimeter through optical wavelength
 *   masers", Bell Syst. Tech. J. 40, 489 (1961): the symmetric confocal mode w0 = sqrt(λL/2π),
 *   w on the mirrors = sqrt(λL/π) (from memory).
 * - A. E. Siegman, "Lasers" (1986), §21.1: the round trip fixes a Gaussian mode only when |(A + D)/2| < 1.
 * Expected values are computed here from these closed forms.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { axisEigenmode, linearRoundTrip, roundTripEigenmode, twoMirrorCavity } from '../../src/lib/optics/cavity';

const lam = 1064e-9;

/** Kogelnik & Li 1966, eqs. 61–64, for a stable (g1, g2). */
function kogelnikLi(g1: number, g2: number, L: number) {
	const k = (lam * L) / Math.PI;
	const p = g1 * g2;
	const den = g1 + g2 - 2 * p;
	return {
		w1: Math.sqrt(k * Math.sqrt(g2 / (g1 * (1 - p)))),
		w2: Math.sqrt(k * Math.sqrt(g1 / (g2 * (1 - p)))),
		w0: Math.sqrt(k * Math.sqrt((p * (1 - p)) / (den * den))),
		t1: (L * g2 * (1 - g1)) / den
	};
}

describe('hemispherical cavity (g1 = 1, g2 = 0): on the stability boundary (Kogelnik & Li 1966, §V)', () => {
	const L = 0.5;
	const c = twoMirrorCavity(Infinity, L, L, lam);

	it('is reported on the boundary, not stable and not plainly unstable, with the reason', () => {
		expect(c.g1).toBe(1);
		expect(c.g2).toBe(0);
		expect(c.status).toBe('boundary');
		expect(c.stable).toBe(false);
		expect(c.reason).toMatch(/stability boundary/);
		expect(c.reason).toMatch(/hemispherical/);
		expect([c.w0_m, c.wMirror1_m, c.wMirror2_m]).toEqual([null, null, null]);
	});

	it('limit values: the waist shrinks to a point on the flat mirror, the spot on the curved mirror grows without bound', () => {
		// Eqs. 61–64 just inside the stable region (L = R2·(1 − δ)): w0 and w1 → 0, t1 → 0, w2 → ∞ as δ → 0.
		const near = [1e-2, 1e-4, 1e-6].map((d) => kogelnikLi(1, d, L));
		expect(near[2].w0).toBeLessThan(near[1].w0);
		expect(near[1].w0).toBeLessThan(near[0].w0);
		expect(near[2].w2).toBeGreaterThan(near[1].w2);
		expect(near[2].t1).toBe(0);
		const lim = c.limit!;
		expect(lim.w0_m).toBe(0);
		expect(lim.waistFromMirror1_m).toBe(0);
		expect(lim.wMirror1_m).toBe(0);
		expect(lim.wMirror2_m).toBeNull();
		expect(lim.unbounded).toEqual(['wMirror2_m']);
		expect(lim.finite).toBe(false);
	});

	it('its round trip has (A + D)/2 = −1 and is flagged as the boundary (Siegman 1986, §21.1)', () => {
		const m = roundTripEigenmode(linearRoundTrip(Infinity, L, [{ kind: 'space', length_m: L }]), lam).x;
		expectClose(m.halfTrace, -1, 1e-12);
		expect(m.stable).toBe(false);
		expect(m.boundary).toBe(true);
	});
});

describe('confocal cavity (g1 = g2 = 0): on the stability boundary, with the symmetric limit mode (Boyd & Gordon 1961)', () => {
	const L = 0.5;
	const c = twoMirrorCavity(L, L, L, lam);

	it('is reported on the boundary, not stable, and says why (round-trip matrix −1)', () => {
		expect(c.status).toBe('boundary');
		expect(c.stable).toBe(false);
		expect(c.reason).toMatch(/stability boundary/);
		expect(c.reason).toMatch(/confocal/);
	});

	it('limit values: w0 = sqrt(λL/2π) at L/2, w on the mirrors = sqrt(λL/π)', () => {
		const lim = c.limit!;
		expect(lim.finite).toBe(true);
		expectClose(lim.w0_m!, Math.sqrt((lam * L) / (2 * Math.PI)), 1e-12);
		expectClose(lim.waistFromMirror1_m!, L / 2, 1e-15);
		expectClose(lim.wMirror1_m!, Math.sqrt((lam * L) / Math.PI), 1e-12);
		expectClose(lim.wMirror2_m!, Math.sqrt((lam * L) / Math.PI), 1e-12);
		// The same limit from Kogelnik & Li's symmetric cavity just inside (g = ±1e-8).
		for (const g of [1e-8, -1e-8]) {
			const k = (lam * L) / Math.PI;
			expectClose(lim.w0_m!, Math.sqrt((k / 2) * Math.sqrt((1 + g) / (1 - g))), 1e-7);
		}
	});

	it('its round trip is −1: every q̂ reproduces itself, flagged as the boundary', () => {
		const e = roundTripEigenmode(linearRoundTrip(L, L, [{ kind: 'space', length_m: L }]), lam);
		const [A, B, C, D] = e.matrices.x;
		expectClose(A, -1, 1e-12);
		expectClose(D, -1, 1e-12);
		expect(Math.abs(B)).toBeLessThan(1e-12);
		expect(Math.abs(C)).toBeLessThan(1e-12);
		expect(e.x.boundary).toBe(true);
		expect(axisEigenmode([-1, 0, 0, -1], lam).boundary).toBe(true);
	});
});

describe('the other boundaries and the stable/unstable sides keep their verdicts (Kogelnik & Li 1966, §V)', () => {
	it('planar (g1 = g2 = 1) and concentric (g1 = g2 = −1) are on the boundary with unbounded spots', () => {
		const planar = twoMirrorCavity(Infinity, Infinity, 0.3, lam);
		expect([planar.status, planar.limit!.kind]).toEqual(['boundary', 'planar']);
		expect(planar.limit!.unbounded).toContain('wMirror1_m');
		const conc = twoMirrorCavity(0.25, 0.25, 0.5, lam);
		expectClose(conc.g1, -1, 1e-15);
		expect([conc.status, conc.limit!.kind, conc.limit!.w0_m]).toEqual(['boundary', 'concentric', 0]);
		expectClose(conc.limit!.waistFromMirror1_m!, 0.25, 1e-15);
	});

	it('just inside the boundary the cavity is stable with the Kogelnik & Li mode; just outside it is unstable', () => {
		const L = 0.5;
		const inside = twoMirrorCavity(Infinity, L * 1.001, L, lam);
		expect(inside.status).toBe('stable');
		const want = kogelnikLi(1, 1 - 1 / 1.001, L);
		expectClose(inside.w0_m!, want.w0, 1e-9);
		expectClose(inside.wMirror2_m!, want.w2, 1e-9);
		const outside = twoMirrorCavity(Infinity, L * 0.999, L, lam);
		expect(outside.status).toBe('unstable');
		expect(outside.limit).toBeNull();
	});
});

describe('CLI `cavity` reports the boundary with its limit values', () => {
	it('hemispherical: status "boundary", the reason and the limit (null = grows without bound)', async () => {
		const { runCli } = await import('../cli');
		const out = JSON.parse((await runCli('cavity', '--r1', 'flat', '--r2', '0.5m', '--length', '0.5m', '--wavelength', '1064nm')).stdout);
		expect(out.stable).toBe(false);
		expect(out.status).toBe('boundary');
		expect(out.reason).toMatch(/stability boundary/);
		expect(out.limit.w0_m).toBe(0);
		expect(out.limit.wMirror2_m).toBeNull();
		expect(out.limit.unbounded).toEqual(['wMirror2_m']);
		const conf = JSON.parse((await runCli('cavity', '--r1', '0.5m', '--r2', '0.5m', '--length', '0.5m', '--wavelength', '1064nm')).stdout);
		expect(conf.status).toBe('boundary');
		// Boyd & Gordon 1961: w0 = sqrt(λL/2π).
		expectClose(conf.limit.w0_m, Math.sqrt((lam * 0.5) / (2 * Math.PI)), 1e-12);
	});
});
