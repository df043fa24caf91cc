import { describe, expect, it } from 'vitest';
import { axisEigenmode, linearRoundTrip, roundTripEigenmode, roundTripMatrices, twoMirrorCavity } from '../../src/lib/optics/cavity';
import { radiusAt_m, curvatureAt_m } from '../../src/lib/optics/beam';
import { expectClose } from '../helpers';

const lam = 1064e-9;

describe('twoMirrorCavity', () => {
	it('symmetric cavity: w0² = (λ/2π)·sqrt(L(2R − L)) at the centre (Kogelnik & Li, "Laser Beams and Resonators", 1966, symmetric-resonator eq. 65)', () => {
		const c = twoMirrorCavity(1, 1, 0.5, lam);
		expect(c.stable).toBe(true);
		expectClose(c.g1, 0.5, 1e-15);
		expectClose(c.w0_m!, Math.sqrt((lam / (2 * Math.PI)) * Math.sqrt(0.5 * 1.5)), 1e-12);
		expectClose(c.waistFromMirror1_m!, 0.25, 1e-15);
	});
	it('spot on each mirror follows w(z) = w0·sqrt(1 + (z/zR)²) from the waist (Kogelnik & Li 1966, eq. 20)', () => {
		const c = twoMirrorCavity(0.75, 2, 0.6, lam);
		expect(c.stable).toBe(true);
		expectClose(c.wMirror1_m!, radiusAt_m(c.w0_m!, c.waistFromMirror1_m!, c.zR_m!), 1e-10);
		expectClose(c.wMirror2_m!, radiusAt_m(c.w0_m!, 0.6 - c.waistFromMirror1_m!, c.zR_m!), 1e-10);
	});
	it('the mode’s wavefronts fit the mirrors: R(z) equals each mirror radius (Kogelnik & Li 1966, §V condition eq. 58)', () => {
		const c = twoMirrorCavity(0.75, 2, 0.6, lam);
		expectClose(curvatureAt_m(c.waistFromMirror1_m!, c.zR_m!), 0.75, 1e-10);
		expectClose(curvatureAt_m(0.6 - c.waistFromMirror1_m!, c.zR_m!), 2, 1e-10);
	});
	it('flat–concave: waist on the flat mirror, w0² = (λ/π)·sqrt(L(R − L)) (Siegman, "Lasers", 1986, §19.3, from memory)', () => {
		const c = twoMirrorCavity(Infinity, 1, 0.5, lam);
		expect(c.g1).toBe(1);
		expectClose(c.waistFromMirror1_m!, 0, 1e-12);
		expectClose(c.w0_m!, Math.sqrt((lam / Math.PI) * Math.sqrt(0.5 * 0.5)), 1e-12);
	});
	it('reports an unstable cavity (g1·g2 > 1) with no mode and no NaN (Kogelnik & Li 1966, stability 0 < g1g2 < 1)', () => {
		const c = twoMirrorCavity(0.2, 0.2, 0.5, lam);
		expect(c.stable).toBe(false);
		expect(c.reason).toMatch(/unstable/);
		expect([c.w0_m, c.wMirror1_m, c.wMirror2_m, c.waistFromMirror1_m]).toEqual([null, null, null, null]);
		expect(twoMirrorCavity(Infinity, Infinity, 0.3, lam).stable).toBe(false);
	});
	it('throws a RangeError naming the length rule', () => {
		expect(() => twoMirrorCavity(1, 1, 0, lam)).toThrow(/cavity length must be > 0 m/);
	});
});

describe('round-trip eigenmode', () => {
	it('(A + D)/2 of a two-mirror round trip is 2·g1·g2 − 1 (Siegman 1986, §21.1, from memory)', () => {
		const m = roundTripMatrices(linearRoundTrip(0.75, 2, [{ kind: 'space', length_m: 0.6 }]));
		const g1 = 1 - 0.6 / 0.75;
		const g2 = 1 - 0.6 / 2;
		expectClose((m.x[0] + m.x[3]) / 2, 2 * g1 * g2 - 1, 1e-12);
	});
	it('agrees with the Kogelnik & Li closed form on mirror 1 (Kogelnik & Li 1966, eqs. 61–64)', () => {
		const e = roundTripEigenmode(linearRoundTrip(0.75, 2, [{ kind: 'space', length_m: 0.6 }]), lam);
		const c = twoMirrorCavity(0.75, 2, 0.6, lam);
		expect(e.stable).toBe(true);
		expectClose(e.x.w_m!, c.wMirror1_m!, 1e-9);
		expectClose(e.x.toWaist_m!, c.waistFromMirror1_m!, 1e-9);
	});
	it('a folded cavity with a tilted curved mirror is astigmatic: f_t = f·cosθ, f_s = f/cosθ (Kogelnik, Ippen, Dienes & Shank 1972, eq. 1)', () => {
		const theta = (10 * Math.PI) / 180;
		const parts = linearRoundTrip(Infinity, Infinity, [
			{ kind: 'space', length_m: 0.3 },
			{ kind: 'element', spec: { kind: 'mirror', r_m: 0.2, angle_rad: theta, plane: 'x' } },
			{ kind: 'space', length_m: 0.105 }
		]);
		const e = roundTripEigenmode(parts, lam);
		expect(e.x.halfTrace).not.toBeCloseTo(e.y.halfTrace, 6);
		// Same round trip written with the focal lengths as plain lenses on each axis.
		const lens = (f: number) => linearRoundTrip(Infinity, Infinity, [{ kind: 'space', length_m: 0.3 }, { kind: 'element', spec: { kind: 'thinLens', f_m: f } }, { kind: 'space', length_m: 0.105 }]);
		const tx = roundTripMatrices(lens(0.1 * Math.cos(theta))).x;
		const sy = roundTripMatrices(lens(0.1 / Math.cos(theta))).x;
		expectClose(e.x.halfTrace, (tx[0] + tx[3]) / 2, 1e-12);
		expectClose(e.y.halfTrace, (sy[0] + sy[3]) / 2, 1e-12);
	});
	it('an unstable axis has no mode (|A + D|/2 ≥ 1)', () => {
		const m = axisEigenmode([1.5, 1, 1.25, 1.5], lam);
		expect(m.stable).toBe(false);
		expect(m.w_m).toBeNull();
	});
});
