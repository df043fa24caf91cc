/**
 * Synthetic beam images for checks, benchmarks and the demo: an elliptical Gaussian of known 1/e²
 * radii and orientation on a background with offset, tilt and Gaussian noise, quantised to 8 or 16
 * bits. Seeded, so a test sees the same image every run.
 *
 *   I(x, y) = peak·exp(−2u²/w1² − 2v²/w2²) + offset + tiltX·(x − xc) + tiltY·(y − yc) + noise,
 *   u =  (x − x0)·cos α + (y − y0)·sin α,   v = −(x − x0)·sin α + (y − y0)·cos α,
 *
 * with (xc, yc) the image centre, α turning from +x towards +y (clockwise as displayed, y down).
 * Values are samples at pixel centres, rounded and clamped to [0, 2^bits − 1].
 * Expected second-moment widths: 2·w1 along α and 2·w2 across it (A. E. Siegman, "Lasers" 1986, §17.1).
 */
import type { GreyImage } from './image';

export interface SyntheticBeam {
	width: number;
	height: number;
	/** Beam centre, pixels (col, row). */
	x0: number;
	y0: number;
	/** 1/e² radii along α and across it, pixels. */
	w1: number;
	w2: number;
	/** Orientation of the w1 axis, rad, from +x towards +y. */
	angle_rad?: number;
	/** Peak above background, counts. */
	peak: number;
	/** Background at the image centre, counts; default 0. */
	offset?: number;
	/** Background slope, counts per pixel along x and along y; default 0. */
	tiltX?: number;
	tiltY?: number;
	/** rms of added Gaussian noise, counts; default 0. */
	noise?: number;
	/** 8 or 16 (integers, clamped) or 0 (floating point, no rounding); default 16. */
	bits?: 0 | 8 | 16;
	seed?: number;
}

/**
 * Uniform numbers in [0, 1) from a 32-bit seed (the public-domain "mulberry32" mixer; common practice).
 * Example: seededRandom(1)() gives the same number on every run and platform.
 */
export function seededRandom(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

/**
 * Standard normal deviates (mean 0, σ 1) by the Box–Muller transform: r = √(−2 ln u1),
 * values r·cos(2πu2) and r·sin(2πu2). Example: seededNormal(42) gives one fixed sequence.
 * Source: G. E. P. Box, M. E. Muller, Ann. Math. Stat. 29(2), 610–611 (1958).
 */
export function seededNormal(seed: number): () => number {
	const u = seededRandom(seed);
	let spare: number | null = null;
	return () => {
		if (spare !== null) {
			const s = spare;
			spare = null;
			return s;
		}
		let a = u();
		while (a <= 1e-300) a = u();
		const b = u();
		const r = Math.sqrt(-2 * Math.log(a));
		spare = r * Math.sin(2 * Math.PI * b);
		return r * Math.cos(2 * Math.PI * b);
	};
}

/**
 * Make the image described by `spec` (see the module comment).
 * Example: makeBeamImage({ width: 64, height: 64, x0: 32, y0: 32, w1: 8, w2: 8, peak: 1000 })
 * has the value 1000 at pixel (32, 32) and 1000·e⁻² ≈ 135 at (40, 32).
 */
export function makeBeamImage(spec: SyntheticBeam): GreyImage {
	const { width: W, height: H, x0, y0, w1, w2, peak } = spec;
	if (!(Number.isInteger(W) && W >= 8 && Number.isInteger(H) && H >= 8)) throw new RangeError(`image must be at least 8 × 8 pixels — got ${W} × ${H}`);
	if (!(w1 > 0 && w2 > 0)) throw new RangeError(`beam radii must be > 0 pixels — got ${w1} and ${w2}`);
	const bits = spec.bits ?? 16;
	const a = spec.angle_rad ?? 0;
	const ca = Math.cos(a);
	const sa = Math.sin(a);
	const k1 = -2 / (w1 * w1);
	const k2 = -2 / (w2 * w2);
	const off = spec.offset ?? 0;
	const tx = spec.tiltX ?? 0;
	const ty = spec.tiltY ?? 0;
	const noise = spec.noise ?? 0;
	const gauss = seededNormal(spec.seed ?? 1);
	const xc = (W - 1) / 2;
	const yc = (H - 1) / 2;
	const top = bits === 0 ? Infinity : 2 ** bits - 1;
	const data = bits === 8 ? new Uint8Array(W * H) : bits === 16 ? new Uint16Array(W * H) : new Float64Array(W * H);
	for (let r = 0; r < H; r++) {
		const dy = r - y0;
		for (let c = 0; c < W; c++) {
			const dx = c - x0;
			const u = dx * ca + dy * sa;
			const v = -dx * sa + dy * ca;
			let val = peak * Math.exp(k1 * u * u + k2 * v * v) + off + tx * (c - xc) + ty * (r - yc);
			if (noise > 0) val += noise * gauss();
			if (bits !== 0) val = Math.min(top, Math.max(0, Math.round(val)));
			data[r * W + c] = val;
		}
	}
	return { width: W, height: H, data, maxValue: bits === 0 ? undefined : top };
}
