/**
 * Test inputs written from the published formulas, independent of the engine's own generators
 * (src/lib/optics/iso11146/synthetic.ts and causticDiameter_m are under test, so tests never take
 * their data or expected values from them).
 */

/**
 * Second-moment diameter along z of a beam with waist diameter d0 at z0, beam-propagation ratio M²,
 * vacuum wavelength λ (all SI): d(z) = d0·√(1 + ((z − z0)/zR)²), zR = π·d0²/(4·M²·λ).
 * Source: ISO 11146-1:2005, clause 3 definitions and clause 9 hyperbola (from memory); A. E. Siegman,
 * "Lasers" (1986), §17.1, embedded-Gaussian beam (from memory).
 * Example: d0 = 1 mm, M² = 1, λ = 1064 nm → zR = 0.7381 m, d(zR) = √2 mm.
 */
export function caustic(d0_m: number, z0_m: number, m2: number, lambda_m: number, z_m: number): number {
	const zR = (Math.PI * d0_m * d0_m) / (4 * m2 * lambda_m);
	return d0_m * Math.sqrt(1 + ((z_m - z0_m) / zR) ** 2);
}

/** Uniform deviates in [0, 1) from a 32-bit seed (the public-domain "mulberry32" mixer; common practice). */
function uniform(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

/** Standard normal deviates by the Box–Muller transform (Box & Muller, Ann. Math. Stat. 29, 610, 1958). */
function normal(seed: number): () => number {
	const u = uniform(seed);
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

export interface GaussianImageSpec {
	width: number;
	height: number;
	/** Beam centre, pixels (column, row). */
	x0: number;
	y0: number;
	/** 1/e² intensity radii along the angle and across it, pixels. */
	w1: number;
	w2: number;
	/** Orientation of the w1 axis, rad, from +x towards +y (y down). */
	angle_rad?: number;
	peak: number;
	offset?: number;
	tiltX?: number;
	tiltY?: number;
	noise?: number;
	/** 8 or 16 (rounded and clamped integers) or 0 (floating point); default 16. */
	bits?: 0 | 8 | 16;
	seed?: number;
}

/**
 * An elliptical TEM00 intensity profile sampled at pixel centres, I = peak·exp(−2u²/w1² − 2v²/w2²)
 * (Siegman 1986, §17.1, from memory) on a background offset + tilt, plus seeded Gaussian noise.
 * Its second-moment (D4σ) diameters are 2·w1 and 2·w2 (ISO 11146-1:2005, clause 3, from memory).
 */
export function gaussianImage(spec: GaussianImageSpec): { width: number; height: number; data: Uint8Array | Uint16Array | Float64Array; maxValue?: number } {
	const { width: W, height: H, x0, y0, w1, w2, peak } = spec;
	const bits = spec.bits ?? 16;
	const a = spec.angle_rad ?? 0;
	const [ca, sa] = [Math.cos(a), Math.sin(a)];
	const gauss = normal(spec.seed ?? 1);
	const top = bits === 0 ? Infinity : 2 ** bits - 1;
	const data = bits === 8 ? new Uint8Array(W * H) : bits === 16 ? new Uint16Array(W * H) : new Float64Array(W * H);
	for (let r = 0; r < H; r++) {
		for (let c = 0; c < W; c++) {
			const u = (c - x0) * ca + (r - y0) * sa;
			const v = -(c - x0) * sa + (r - y0) * ca;
			let val = peak * Math.exp((-2 * u * u) / (w1 * w1) + (-2 * v * v) / (w2 * w2)) + (spec.offset ?? 0) + (spec.tiltX ?? 0) * (c - (W - 1) / 2) + (spec.tiltY ?? 0) * (r - (H - 1) / 2);
			if (spec.noise) val += spec.noise * gauss();
			if (bits !== 0) val = Math.min(top, Math.max(0, Math.round(val)));
			data[r * W + c] = val;
		}
	}
	return bits === 0 ? { width: W, height: H, data } : { width: W, height: H, data, maxValue: top };
}
