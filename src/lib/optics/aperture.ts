/**
 * Transmission of an elliptical Gaussian beam (1/e² radii wx, wy, centred) through a round clear
 * aperture of radius a. In polar coordinates the power outside radius a is
 *   P_out/P = (2/(π·wx·wy)) ∫₀^{2π} exp(−2a²·g(φ)) / (4·g(φ)) dφ,  g = cos²φ/wx² + sin²φ/wy²,
 * which for wx = wy = w reduces to exp(−2a²/w²) (Siegman 1986, eq. 17.9; the round case is common practice
 * for clipping estimates). The angular integral is done with the composite Simpson rule (128 panels).
 */
export function clippedTransmission(a_m: number, wx_m: number, wy_m: number): number {
	if (!(a_m > 0)) return 0;
	if (Math.abs(wx_m - wy_m) <= 1e-12 * wx_m) return 1 - Math.exp((-2 * a_m * a_m) / (wx_m * wx_m));
	const n = 128; // even
	const h = (Math.PI / 2) / n; // quarter period suffices by symmetry
	let sum = 0;
	for (let i = 0; i <= n; i++) {
		const phi = i * h;
		const c = Math.cos(phi);
		const s = Math.sin(phi);
		const g = (c * c) / (wx_m * wx_m) + (s * s) / (wy_m * wy_m);
		const f = Math.exp(-2 * a_m * a_m * g) / (4 * g);
		sum += (i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2) * f;
	}
	const quarter = (sum * h) / 3;
	const outside = (2 / (Math.PI * wx_m * wy_m)) * 4 * quarter;
	return Math.min(1, Math.max(0, 1 - outside));
}
