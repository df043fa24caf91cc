/**
 * Waist placement with one thin lens: the exact focal lengths and positions that image the input waist
 * onto the target waist (one axis, embedded Gaussian).
 *
 * With Rayleigh ranges zR1 (input) and zR2 (target), f0² = zR1·zR2 and waist-to-lens distances
 * d1 = f ± sqrt(zR1/zR2)·sqrt(f² − f0²), d2 = f ± sqrt(zR2/zR1)·sqrt(f² − f0²) (same sign)
 * (Kogelnik & Li 1966, §VI, eqs. 70–71 written with f0 = π·w1·w2/λ = sqrt(zR1·zR2)).
 * For a fixed waist-to-waist distance D = d1 + d2 this gives (4 − k)·f² − 4D·f + D² + k·f0² = 0 with
 * k = (zR1 + zR2)²/(zR1·zR2).
 */
import type { QHat } from '../beam';

export interface SingleLensExact {
	f_m: number;
	/** Lens position, m (bench coordinate). */
	z_m: number;
}

/**
 * Input waist from the input q̂ at z = 0 and target q at plane zt (air). Returns 0, 1 or 2 solutions.
 * Example: w1 = 0.5 mm at 0, w2 = 50 µm at 0.5 m, λ = 1064 nm → f ≈ 0.1225 m at z ≈ 0.3775 m and f ≈ 0.0503… (see tests).
 */
export function singleLensExact(inputQ: QHat, targetQ: QHat, targetZ_m: number): SingleLensExact[] {
	const z1 = -inputQ.re;
	const zr1 = inputQ.im;
	const z2 = targetZ_m - targetQ.re;
	const zr2 = targetQ.im;
	const D = z2 - z1;
	const f0sq = zr1 * zr2;
	const k = (zr1 + zr2) ** 2 / f0sq;
	const a = 4 - k;
	const cands: number[] = [];
	if (Math.abs(a) < 1e-12) {
		if (D !== 0) cands.push((D * D + k * f0sq) / (4 * D));
	} else {
		const disc = 16 * D * D - 4 * a * (D * D + k * f0sq);
		if (disc >= 0) {
			const s = Math.sqrt(disc);
			cands.push((4 * D + s) / (2 * a), (4 * D - s) / (2 * a));
		}
	}
	const out: SingleLensExact[] = [];
	for (const f of cands) {
		if (!(f * f >= f0sq) || f <= 0) continue;
		const r = Math.sqrt(f * f - f0sq);
		for (const sign of [1, -1]) {
			const d1 = f + sign * Math.sqrt(zr1 / zr2) * r;
			const d2 = f + sign * Math.sqrt(zr2 / zr1) * r;
			if (Math.abs(d1 + d2 - D) <= 1e-9 * Math.max(1, Math.abs(D)) && !out.some((o) => Math.abs(o.f_m - f) < 1e-12 && Math.abs(o.z_m - (z1 + d1)) < 1e-12)) {
				out.push({ f_m: f, z_m: z1 + d1 });
			}
		}
	}
	return out.sort((p, q) => p.f_m - q.f_m);
}
