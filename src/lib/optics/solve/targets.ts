/**
 * Targets of the matching search as a q at a plane: a free waist, the eigenmode of a two-mirror
 * cavity seen from outside mirror 1, a general round-trip eigenmode, or a fibre mode.
 */
import { rayleighRange_m } from '../beam';
import { twoMirrorCavity, type RoundTripEigenmode } from '../cavity';
import { requireThat } from '../constants';
import type { TargetMode } from './types';

/** A waist w0 (per axis) located at z (the target plane is the waist itself). */
export function waistTarget(wx_m: number, wy_m: number, z_m: number, wavelength_m: number, what = 'waist'): TargetMode {
	return { z_m, x: { re: 0, im: rayleighRange_m(wx_m, wavelength_m) }, y: { re: 0, im: rayleighRange_m(wy_m, wavelength_m) }, what };
}

/**
 * The mode of a two-mirror cavity whose mirror 1 (the input mirror) sits at `mirror1At_m`, as a free beam
 * arriving at mirror 1 (the lens effect of the mirror substrate is left out; common practice for a
 * first layout). Throws when the cavity has no stable mode.
 */
export function cavityTarget(r1_m: number, r2_m: number, length_m: number, mirror1At_m: number, wavelength_m: number): TargetMode {
	const c = twoMirrorCavity(r1_m, r2_m, length_m, wavelength_m);
	if (!c.stable || c.zR_m === null || c.waistFromMirror1_m === null) throw new RangeError(`cavity must be stable to be a target — g1·g2 = ${(c.g1 * c.g2).toPrecision(4)}, ${c.reason}`);
	const q = { re: -c.waistFromMirror1_m, im: c.zR_m };
	return { z_m: mirror1At_m, x: q, y: { ...q }, what: 'cavity' };
}

/** Eigenmode of a general round trip whose reference plane is put at z (per-axis q from the round trip). */
export function roundTripTarget(mode: RoundTripEigenmode, z_m: number): TargetMode {
	requireThat(mode.stable && mode.x.q !== null && mode.y.q !== null, 'cavity', 'stable on both axes to be a target', `(A+D)/2 = ${mode.x.halfTrace.toPrecision(4)} (x), ${mode.y.halfTrace.toPrecision(4)} (y)`);
	return { z_m, x: { ...mode.x.q! }, y: { ...mode.y.q! }, what: 'cavity' };
}

/** A fibre face at z with mode-field diameter mfd: a round waist of radius mfd/2 at the face. */
export function fiberTarget(mfd_m: number, z_m: number, wavelength_m: number): TargetMode {
	return waistTarget(mfd_m / 2, mfd_m / 2, z_m, wavelength_m, 'fibre');
}
