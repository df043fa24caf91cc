/**
 * The substrate of a curved cavity input mirror as a lens. The beam that enters the cavity crosses the
 * mirror's back face, the substrate (thickness t, index n) and then the coated face, whose radius is the
 * mirror's R1: a concave mirror (R1 > 0 seen from inside the cavity) has its centre of curvature
 * downstream of the beam entering, so in the surface convention of elements.ts that face has radius +R1
 * and bends the entering beam outwards (a plano-concave substrate is a negative lens, f ≈ −R1/(n − 1)).
 *
 * Matrices: refraction at a spherical surface [[1, 0], [−(n2 − n1)/R, 1]] and a length t of index n,
 * reduced form (Siegman, "Lasers", 1986, Table 15.1 and eq. 15.26; Kogelnik & Li 1966, Table I).
 * The target mode inside the cavity at the coated face, q̂_in, comes from the mode outside the back face,
 * q̂_out, through M = [A B; C D]; so q̂_out = (D·q̂_in − B)/(−C·q̂_in + A) (the inverse of a det-1 matrix).
 */
import type { QHat } from './beam';
import { elementMatrices, type Mat2 } from './elements';
import { requireThat } from './constants';
import type { TargetMode } from './solve/types';

export interface MirrorSubstrate {
	/** Centre thickness, m (> 0). */
	thickness_m: number;
	/** Refractive index of the substrate (≥ 1). */
	index: number;
	/** Radius of the back (outer, uncoated) face, + when its centre lies towards the cavity; Infinity: flat. */
	backR_m: number;
}

/** Reduced matrix of the substrate for a beam entering the cavity: back face, thickness, coated face of radius r1_m. */
export function substrateMatrix(r1_m: number, s: MirrorSubstrate): Mat2 {
	requireThat(Number.isFinite(s.thickness_m) && s.thickness_m > 0, 'substrate thickness', '> 0 m', s.thickness_m, 'm');
	requireThat(Number.isFinite(s.index) && s.index >= 1, 'substrate index', '≥ 1', s.index);
	return elementMatrices({ kind: 'thickLens', r1_m: s.backR_m, r2_m: r1_m, thickness_m: s.thickness_m, index: s.index }).x;
}

/** q̂ before a det-1 matrix M that gives q̂_after: q̂ = (D·q̂_after − B)/(−C·q̂_after + A). */
export function qBefore(m: Mat2, q: QHat): QHat {
	const [A, B, C, D] = m;
	const nr = D * q.re - B;
	const ni = D * q.im;
	const dr = -C * q.re + A;
	const di = -C * q.im;
	const den = dr * dr + di * di;
	return { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den };
}

/**
 * A cavity target given at the coated face of input mirror 1 (radius r1_m), seen from outside: the
 * target plane moves to the back face (z − t) and each axis's q̂ is taken back through the substrate.
 */
export function targetOutsideSubstrate(target: TargetMode, r1_m: number, s: MirrorSubstrate): TargetMode {
	const m = substrateMatrix(r1_m, s);
	return { ...target, z_m: target.z_m - s.thickness_m, x: qBefore(m, target.x), y: qBefore(m, target.y) };
}
