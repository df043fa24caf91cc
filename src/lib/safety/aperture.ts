/**
 * Power of a Gaussian beam through a circular aperture centred on the beam, and the irradiance
 * averaged over it — the quantity exposure limits are compared with (the limiting aperture).
 *
 * Beam radius w is the 1/e² intensity radius (DEVELOPERS.md, conventions). Simple astigmatism: w_x and w_y may differ.
 */

/**
 * Fraction of the power of an elliptical Gaussian (radii wx, wy) inside a centred circle of radius a.
 * Round beam: 1 − exp(−2a²/w²) (Siegman 1986, §17.1). Elliptical: in polar coordinates the radial
 * integral is exact, and the substitution tan φ = (wy/wx)·tan u turns the angular one into
 *   f = (2/π)·∫₀^{π/2} [1 − exp(−2a²/(wx²cos²u + wy²sin²u))] du,
 * a bounded, smooth integrand, done with the midpoint rule on a grid fine enough for a/max(w).
 * Example: a = w = 1 mm → 1 − e⁻² = 0.8647.
 */
export function apertureFraction(a_m: number, wx_m: number, wy_m: number = wx_m): number {
	if (!(a_m >= 0)) throw new RangeError(`aperture radius must be ≥ 0 m — got ${a_m} m`);
	if (!(wx_m > 0 && wy_m > 0) || !Number.isFinite(wx_m) || !Number.isFinite(wy_m))
		throw new RangeError(`beam radius must be a finite number > 0 m — got ${wx_m} m, ${wy_m} m`);
	if (a_m === 0) return 0;
	if (Math.abs(wx_m / wy_m - 1) < 1e-9) return -Math.expm1((-2 * a_m * a_m) / (wx_m * wy_m));
	const wMax = Math.max(wx_m, wy_m);
	const n = Math.min(8192, Math.max(64, Math.ceil((32 * wMax) / a_m)));
	const h = Math.PI / 2 / n;
	let sum = 0;
	for (let i = 0; i < n; i++) {
		const u = (i + 0.5) * h;
		const c = Math.cos(u);
		const s = Math.sin(u);
		sum += -Math.expm1((-2 * a_m * a_m) / (wx_m * wx_m * c * c + wy_m * wy_m * s * s));
	}
	return Math.min(1, (2 / Math.PI) * sum * h);
}

/** Peak (on-axis) irradiance of a Gaussian of power P: E0 = 2P/(π·wx·wy), W/m². Example: 1 mW, w = 1 mm → 636.6 W/m². */
export function peakIrradiance_W_m2(power_W: number, wx_m: number, wy_m: number = wx_m): number {
	return (2 * power_W) / (Math.PI * wx_m * wy_m);
}

/**
 * Irradiance averaged over a circular aperture of diameter D: P·f(D/2)/(π(D/2)²), W/m².
 * Example: 5 W, w = 1.415 mm, D = 7 mm → P·(1 − exp(−2·3.5²/1.415²))/(π·3.5²) = 1.299·10⁵ W/m².
 */
export function apertureAveragedIrradiance_W_m2(power_W: number, aperture_m: number, wx_m: number, wy_m: number = wx_m): number {
	if (!(aperture_m > 0)) throw new RangeError(`limiting aperture must be > 0 m — got ${aperture_m} m`);
	const a = aperture_m / 2;
	return (power_W * apertureFraction(a, wx_m, wy_m)) / (Math.PI * a * a);
}
