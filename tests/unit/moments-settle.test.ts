/**
 * A turned, noisy elliptical Gaussian must let the integration area settle: with the area turned to
 * the principal axes, whole-pixel areas can cycle among a few pixel sets (moments differing only by
 * noise); the iteration stops there and takes their mean. Expected widths from the closed form:
 * D4σ = 2w along each principal axis for exp(−2(a²/wa² + b²/wb²)) (Siegman, "Lasers" 1986, §17.1).
 */
import { describe, expect, it } from 'vitest';
import { beamMoments } from '../../src/lib/optics/iso11146/index';

function frame(seed: number) {
	const W = 320, H = 240;
	const d = new Float32Array(W * H);
	let a = seed >>> 0;
	const uni = () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	const g = () => Math.sqrt(-2 * Math.log(uni() || 1e-12)) * Math.cos(2 * Math.PI * uni());
	const c = Math.cos((20 * Math.PI) / 180), s = Math.sin((20 * Math.PI) / 180);
	for (let y = 0; y < H; y++)
		for (let x = 0; x < W; x++) {
			const dx = x - 155, dy = y - 122;
			const pa = dx * c + dy * s, pb = -dx * s + dy * c;
			d[y * W + x] = Math.round(40 + 170 * Math.exp(-2 * ((pa * pa) / 900 + (pb * pb) / 324)) + 1.5 * g());
		}
	return { width: W, height: H, data: d };
}

describe('integration area on a turned beam', () => {
	it('settles for every noise draw, with widths within 3 % and the angle within 2° of the beam drawn', () => {
		for (let seed = 1; seed <= 6; seed++) {
			const m = beamMoments(frame(seed), { pixelPitch_m: 1 });
			expect(m.converged, `seed ${seed}`).toBe(true);
			expect(m.warnings.join(' ')).not.toMatch(/did not settle/);
			expect(Math.abs(m.dxPrincipal_m / 60 - 1)).toBeLessThan(0.03);
			expect(Math.abs(m.dyPrincipal_m / 36 - 1)).toBeLessThan(0.03);
			expect(Math.abs((m.orientation_rad * 180) / Math.PI - 20)).toBeLessThan(2);
		}
	});
});
