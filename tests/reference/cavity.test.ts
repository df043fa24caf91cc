import { describe, expect, it } from 'vitest';
import { axisEigenmode, eigenmodeAlong, linearRoundTrip, mirrorRoundTrip, roundTripEigenmode, roundTripMatrices, twoMirrorCavity, type CavityMirror } from '../../src/lib/optics/cavity';
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
	it('spot on each mirror follows w(z) = w0·sqrt(1 + (z/zR)²) from the waist (Kogelnik & Li 1966, eq. 20, number from memory)', () => {
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

describe('ring and folded cavities of tilted mirrors', () => {
	const deg = Math.PI / 180;
	// A planar bow-tie: two curved mirrors (R, at θ) joined by the short arm d1; two flat mirrors share the long way d2.
	const bowTie = (R: number, theta: number, d1: number, long: [number, number, number]): { mirrors: CavityMirror[]; arms: number[] } => ({
		mirrors: [
			{ r_m: R, angle_rad: theta },
			{ r_m: R, angle_rad: theta },
			{ r_m: Infinity, angle_rad: theta },
			{ r_m: Infinity, angle_rad: theta }
		],
		arms: [d1, ...long]
	});
	// Per-axis focal length of a tilted spherical mirror: f·cosθ tangential (x), f/cosθ sagittal (y), f = R/2
	// (Kogelnik, Ippen, Dienes & Shank, "Astigmatically compensated cavities for CW dye lasers", IEEE JQE 8, 373, 1972, eq. 1).
	const fAxis = (R: number, theta: number) => ({ x: (R / 2) * Math.cos(theta), y: R / 2 / Math.cos(theta) });

	it('equal arms: each axis is the unfolded symmetric resonator of radius 2·f_axis — w0² = (λ/2π)·sqrt(d(2R − d)) at the middle of each arm, (A+D)/2 = 2g² − 1 (Kogelnik & Li, "Laser Beams and Resonators", 1966, §IV lens waveguide ≡ §V symmetric resonator; KIDS 1972 eq. 1)', () => {
		const R = 0.1;
		const theta = 12 * deg;
		const d = 0.18;
		const c = bowTie(R, theta, d, [0.05, 0.08, 0.05]);
		const { parts, places } = mirrorRoundTrip('ring', c.mirrors, c.arms, 0);
		const e = roundTripEigenmode(parts, lam);
		expect(e.stable).toBe(true);
		for (const a of ['x', 'y'] as const) {
			const Ra = 2 * fAxis(R, theta)[a];
			const g = 1 - d / Ra;
			expectClose(e[a].halfTrace, 2 * g * g - 1, 1e-12, `${a} (A+D)/2`);
			const w0 = Math.sqrt((lam / (2 * Math.PI)) * Math.sqrt(d * (2 * Ra - d)));
			const along = eigenmodeAlong(parts, e[a].q!, lam, a);
			const waists = along.filter((p) => p.waist).map((p) => ({ arm: places[p.part]!.arm, at: p.waist!.fromStart_m, w0: p.waist!.w0_m }));
			// One waist in the middle of the short arm, one in the middle of the long way (50 mm + 40 mm into arm 3).
			expect(waists.map((w) => w.arm)).toEqual([0, 2]);
			expectClose(waists[0].at, d / 2, 1e-9, `${a} waist place, short arm`);
			expectClose(waists[1].at, 0.04, 1e-9, `${a} waist place, long way`);
			for (const w of waists) expectClose(w.w0, w0, 1e-9, `${a} waist size`);
		}
		expect(e.x.w0_m).not.toBeCloseTo(e.y.w0_m!, 7);
	});

	it('unequal arms: (A+D)/2 = 2(1 − d1/2f)(1 − d2/2f) − 1 per axis, and the tangential stability edge d1 = 2f_t + 4f_t²/(d2 − 2f_t) (periodic lens guide with alternating spacings, Kogelnik & Li 1966 §IV, stability |(A+D)/2| < 1; f per axis from KIDS 1972 eq. 1; edge derived, from memory)', () => {
		const R = 0.1;
		const theta = 15 * deg;
		const long: [number, number, number] = [0.11, 0.16, 0.11];
		const d2 = 0.38;
		for (const d1 of [0.1, 0.115, 0.125]) {
			const c = bowTie(R, theta, d1, long);
			const e = roundTripEigenmode(mirrorRoundTrip('ring', c.mirrors, c.arms, 1).parts, lam);
			for (const a of ['x', 'y'] as const) {
				const f = fAxis(R, theta)[a];
				expectClose(e[a].halfTrace, 2 * (1 - d1 / (2 * f)) * (1 - d2 / (2 * f)) - 1, 1e-12, `${a} at d1 = ${d1}`);
			}
		}
		// Between R·cosθ and R/cosθ only the tangential axis is stable: the ring as a whole has no mode.
		const mid = bowTie(R, theta, 0.1, long);
		const e = roundTripEigenmode(mirrorRoundTrip('ring', mid.mirrors, mid.arms, 0).parts, lam);
		expect([e.x.stable, e.y.stable, e.stable]).toEqual([true, false, false]);
		expect(e.y.q).toBeNull();
		// Either side of the tangential upper edge.
		const ft = fAxis(R, theta).x;
		const edge = 2 * ft + (4 * ft * ft) / (d2 - 2 * ft);
		const inside = bowTie(R, theta, edge - 1e-4, long);
		const outside = bowTie(R, theta, edge + 1e-4, long);
		expect(roundTripEigenmode(mirrorRoundTrip('ring', inside.mirrors, inside.arms, 0).parts, lam).x.stable).toBe(true);
		expect(roundTripEigenmode(mirrorRoundTrip('ring', outside.mirrors, outside.arms, 0).parts, lam).x.stable).toBe(false);
	});

	it('the mode does not depend on where the round trip starts: the q after arm 1 from mirror 1 is the eigen q of the round trip from mirror 2 (Siegman, "Lasers", 1986, §21.1, eigen q at any plane; from memory)', () => {
		const c = bowTie(0.1, 8 * deg, 0.115, [0.11, 0.16, 0.11]);
		const from1 = mirrorRoundTrip('ring', c.mirrors, c.arms, 0);
		const from2 = mirrorRoundTrip('ring', c.mirrors, c.arms, 1);
		for (const a of ['x', 'y'] as const) {
			const e1 = roundTripEigenmode(from1.parts, lam)[a];
			const e2 = roundTripEigenmode(from2.parts, lam)[a];
			const along = eigenmodeAlong(from1.parts, e1.q!, lam, a);
			// wEnd of arm 1 is the spot on mirror 2, where the second round trip starts.
			expectClose(along[0].wEnd_m, e2.w_m!, 1e-9, a);
			expectClose(e1.halfTrace, e2.halfTrace, 1e-12, a);
		}
	});

	it('a folded cavity flat – fold mirror (R at θ) – flat: (A+D)/2 = 2(1 − L1/f)(1 − L2/f) − 1 per axis (unfolded: a lens guide of spacings 2L1, 2L2, Kogelnik & Li 1966 §IV; KIDS 1972 eq. 1 for f per axis)', () => {
		const R = 0.2;
		const theta = 10 * deg;
		const L1 = 0.3;
		const L2 = 0.105;
		const { parts } = mirrorRoundTrip('folded', [{ r_m: Infinity, angle_rad: 0 }, { r_m: R, angle_rad: theta }, { r_m: Infinity, angle_rad: 0 }], [L1, L2], 0);
		const e = roundTripEigenmode(parts, lam);
		for (const a of ['x', 'y'] as const) {
			const f = fAxis(R, theta)[a];
			expectClose(e[a].halfTrace, 2 * (1 - L1 / f) * (1 - L2 / f) - 1, 1e-12, a);
		}
	});

	it('a folded cavity with a flat fold at 0° is the plain two-mirror cavity (Kogelnik & Li 1966, eqs. 61–64)', () => {
		const { parts } = mirrorRoundTrip('folded', [{ r_m: 0.75, angle_rad: 0 }, { r_m: Infinity, angle_rad: 0 }, { r_m: 2, angle_rad: 0 }], [0.25, 0.35], 0);
		const e = roundTripEigenmode(parts, lam);
		const c = twoMirrorCavity(0.75, 2, 0.6, lam);
		expectClose(e.x.w_m!, c.wMirror1_m!, 1e-9);
		expectClose(e.y.w_m!, c.wMirror1_m!, 1e-9);
		const along = eigenmodeAlong(parts, e.x.q!, lam, 'x');
		const w = along.find((p) => p.waist)!;
		expectClose(w.waist!.w0_m, c.w0_m!, 1e-9);
		expectClose((w.part === 0 ? 0 : 0.25) + w.waist!.fromStart_m, c.waistFromMirror1_m!, 1e-9);
	});

	it('refuses bad geometry with a RangeError naming the value and the rule', () => {
		const m: CavityMirror[] = [{ r_m: 0.1, angle_rad: 0 }, { r_m: 0.1, angle_rad: 0 }, { r_m: Infinity, angle_rad: 0 }];
		expect(() => mirrorRoundTrip('ring', m, [0.1, 0.1], 0)).toThrow(/arm lengths must be 3 values/);
		expect(() => mirrorRoundTrip('ring', m, [0.1, 0, 0.1], 0)).toThrow(/arm 2 length must be > 0 m/);
		expect(() => mirrorRoundTrip('folded', m, [0.1, 0.1], 2)).toThrow(/start arm must be a whole number from 0 to 1/);
		expect(() => mirrorRoundTrip('ring', [{ r_m: 0.1, angle_rad: Math.PI / 2 }, ...m.slice(1)], [0.1, 0.1, 0.1], 0)).toThrow(/mirror 1 angle of incidence/);
	});
});
