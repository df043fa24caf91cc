/**
 * Weighted least squares for the quadratic y = A + B·u + C·u², with the covariance of (A, B, C).
 * Small and explicit: a 3 × 3 normal-equation solve on centred, scaled abscissae, which keeps the
 * matrix well conditioned for any lab length scale.
 */

export interface QuadraticFit {
	/** Coefficients of y = A + B·u + C·u² (units of y, y per u, y per u²). */
	coef: [number, number, number];
	/** Covariance of coef, row-major 3 × 3, scaled by the residual variance (s² = χ²_w / (n − 3)). */
	cov: number[];
	/** Weighted residual sum of squares Σ wᵢ·(yᵢ − ŷᵢ)². */
	chi2: number;
	/** Degrees of freedom n − 3. */
	dof: number;
}

/**
 * Inverse of a 3 × 3 matrix (row-major) by cofactors: M⁻¹ = adj(M)/det(M); null when det is
 * negligible against the size of the entries (singular design). Unitless.
 * Example: invert3([2, 0, 0, 0, 4, 0, 0, 0, 5]) → [0.5, 0, 0, 0, 0.25, 0, 0, 0, 0.2].
 * Source: the adjugate formula of linear algebra (any handbook, e.g. Press et al., "Numerical Recipes" 2007, §2.0).
 */
export function invert3(m: number[]): number[] | null {
	const [a, b, c, d, e, f, g, h, i] = m;
	const A = e * i - f * h;
	const B = -(d * i - f * g);
	const C = d * h - e * g;
	const det = a * A + b * B + c * C;
	const scale = Math.abs(a * e * i) + Math.abs(b * f * g) + Math.abs(c * d * h) + 1e-300;
	if (!(Math.abs(det) > 1e-14 * scale)) return null;
	const inv = [A, -(b * i - c * h), b * f - c * e, B, a * i - c * g, -(a * f - c * d), C, -(a * h - b * g), a * e - b * d];
	for (let k = 0; k < 9; k++) inv[k] /= det;
	return inv;
}

/**
 * Weighted least-squares fit of y = A + B·u + C·u².
 * Minimises Σ wᵢ·(yᵢ − A − B·uᵢ − C·uᵢ²)²; cov = s²·(XᵀWX)⁻¹ with s² = χ²_w/(n − 3) when n > 3,
 * or the zero matrix when n = 3 (an exact fit carries no residual information).
 * Units: whatever the caller passes; u should already be centred and of order 1.
 * Example: u = [−1, 0, 1], y = [2, 1, 2], w = 1 → coef = [1, 0, 1].
 * Source: the normal equations of linear least squares (e.g. W. H. Press et al., "Numerical Recipes",
 * 3rd ed. 2007, §15.4, eqs. 15.4.8–15.4.15).
 * Returns null when the design is singular (fewer than three distinct u).
 */
export function fitQuadratic(u: ArrayLike<number>, y: ArrayLike<number>, w: ArrayLike<number>): QuadraticFit | null {
	const n = u.length;
	if (n < 3) return null;
	// Sums Σw·u^k (k = 0..4) and Σw·y·u^k (k = 0..2).
	let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
	for (let k = 0; k < n; k++) {
		const wk = w[k];
		const uk = u[k];
		const u2 = uk * uk;
		s0 += wk;
		s1 += wk * uk;
		s2 += wk * u2;
		s3 += wk * u2 * uk;
		s4 += wk * u2 * u2;
		t0 += wk * y[k];
		t1 += wk * y[k] * uk;
		t2 += wk * y[k] * u2;
	}
	const inv = invert3([s0, s1, s2, s1, s2, s3, s2, s3, s4]);
	if (!inv) return null;
	const A = inv[0] * t0 + inv[1] * t1 + inv[2] * t2;
	const B = inv[3] * t0 + inv[4] * t1 + inv[5] * t2;
	const C = inv[6] * t0 + inv[7] * t1 + inv[8] * t2;
	let chi2 = 0;
	for (let k = 0; k < n; k++) {
		const r = y[k] - (A + B * u[k] + C * u[k] * u[k]);
		chi2 += w[k] * r * r;
	}
	const dof = n - 3;
	const s2res = dof > 0 ? chi2 / dof : 0;
	return { coef: [A, B, C], cov: inv.map((v) => v * s2res), chi2, dof };
}
