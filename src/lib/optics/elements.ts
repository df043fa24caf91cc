/**
 * Element kinds of an optical train and their reduced ABCD matrices for the x and y axes.
 *
 * Reduced matrices (Siegman, "Lasers", 1986, §15.2) act on (r, n·r′) and have determinant 1, so that
 * interfaces and media need no special case in the q law q̂′ = (A·q̂ + B)/(C·q̂ + D)
 * (Kogelnik & Li, Appl. Opt. 5, 1550 (1966), eq. 26).
 *
 * Every element compiles into a short list of primitive steps along z: `travel` (a length of
 * medium, possibly with different reduced lengths on x and y) and `kick` (a zero-length matrix).
 * The train walks those steps, which also gives the beam inside thick elements.
 *
 * Sign conventions: a surface radius is positive when its centre of curvature lies downstream (+z);
 * a mirror radius is positive for a concave (focusing) mirror, f = R/2. The plane of incidence of a
 * tilted element names its tangential axis ('x' means x is tangential, y sagittal).
 * A thin element immersed in a medium of index n (thin, cylindrical and thermal lenses, curved mirrors)
 * has its focal length measured in that medium: reduced kick C = −n/f, and −2n/R for a mirror.
 */
import { requireFinite, requirePositive, requireThat } from './constants';

/** A reduced ray-transfer matrix [A, B, C, D] (B in metres, C in 1/m). */
export type Mat2 = readonly [number, number, number, number];

export type Axis = 'x' | 'y';

export type ElementSpec =
	| { kind: 'thinLens'; f_m: number }
	| { kind: 'thickLens'; r1_m: number; r2_m: number; thickness_m: number; index: number }
	| { kind: 'mirror'; r_m: number; angle_rad: number; plane: Axis }
	| { kind: 'foldMirror'; angle_rad: number; plane: Axis }
	| { kind: 'cylLens'; f_m: number; axis: Axis }
	| { kind: 'interface'; indexAfter: number; r_m: number }
	| { kind: 'plate'; thickness_m: number; index: number; angle_rad: number; plane: Axis }
	| { kind: 'thermalLens'; fx_m: number; fy_m: number }
	| { kind: 'medium'; length_m: number; index: number }
	| { kind: 'abcd'; x: Mat2; y: Mat2 };

export type ElementKind = ElementSpec['kind'];

/** A primitive step along z. */
export type Step =
	| { op: 'travel'; length_m: number; reducedX_m: number; reducedY_m: number; index: number }
	| { op: 'kick'; x: Mat2; y: Mat2 };

export const identity: Mat2 = [1, 0, 0, 1];

/** Thin lens of focal length f: [[1, 0], [−1/f, 1]] (Kogelnik & Li 1966, Table I). Infinite f is a window. */
export function thinLensMatrix(f_m: number): Mat2 {
	return [1, 0, -1 / f_m, 1];
}

/**
 * Reduced matrix of a thin lens (or a mirror's equivalent lens) of focal length f immersed in a medium
 * of index n: f is measured in that medium (a collimated beam focuses at distance f), so the ray slope
 * obeys r′ → r′ − r/f and the reduced slope n·r′ gets C = −n/f (Siegman 1986, §15.2: reduced slope;
 * Kogelnik & Li 1966, Table I for n = 1). A mirror's focal length is R/2 in any medium, since reflection
 * is geometric: the physical q obeys 1/q′ = 1/q − 2/R, hence C = −2n/R in the reduced form.
 */
export function reducedThinLensMatrix(f_m: number, index: number): Mat2 {
	return [1, 0, -index / f_m, 1];
}

/** Reduced free-space matrix: [[1, d/n], [0, 1]] (Siegman 1986, eq. 15.26). */
export function freeSpaceMatrix(length_m: number, index = 1): Mat2 {
	return [1, length_m / index, 0, 1];
}

/** Reduced refraction at a spherical surface n1 → n2 of radius R: [[1, 0], [−(n2 − n1)/R, 1]] (Siegman 1986, Table 15.1). */
export function interfaceMatrix(n1: number, n2: number, r_m: number): Mat2 {
	return [1, 0, Number.isFinite(r_m) ? -(n2 - n1) / r_m : 0, 1];
}

/** Product M2·M1 (M1 acts first). */
export function mul(m2: Mat2, m1: Mat2): Mat2 {
	return [
		m2[0] * m1[0] + m2[1] * m1[2],
		m2[0] * m1[1] + m2[1] * m1[3],
		m2[2] * m1[0] + m2[3] * m1[2],
		m2[2] * m1[1] + m2[3] * m1[3]
	];
}

export function det(m: Mat2): number {
	return m[0] * m[3] - m[1] * m[2];
}

/**
 * Tangential and sagittal focal lengths of a spherical mirror at angle of incidence θ:
 * f_t = f·cosθ, f_s = f/cosθ with f = R/2 (Kogelnik, Ippen, Dienes & Shank, IEEE JQE 8, 373 (1972), eq. 1).
 */
export function mirrorFocalLengths(r_m: number, angle_rad: number): { tangential_m: number; sagittal_m: number } {
	const f = r_m / 2;
	return { tangential_m: f * Math.cos(angle_rad), sagittal_m: f / Math.cos(angle_rad) };
}

/**
 * Reduced path lengths through a plate of thickness t, index n, tilted at θ1 in a medium of index n0
 * (Kogelnik et al. 1972, eqs. 4–5): L = t/cosθ2, sagittal L/n, tangential L·cos²θ1/(n·cos²θ2),
 * with n·sinθ2 = n0·sinθ1 and n taken relative to n0 (exact for n0 = 1).
 * Example: Brewster plate, n = 1.5, t = 1 mm → sagittal 0.8012 mm, tangential 0.3561 mm.
 */
export function plateReducedLengths(thickness_m: number, index: number, angle_rad: number, n0 = 1) {
	const nRel = index / n0;
	const sin2 = Math.sin(angle_rad) / nRel;
	const cos2 = Math.sqrt(1 - sin2 * sin2);
	const cos1 = Math.cos(angle_rad);
	const path = thickness_m / cos2;
	return {
		path_m: path,
		sagittal_m: path / nRel / n0,
		tangential_m: (path * cos1 * cos1) / (nRel * cos2 * cos2) / n0
	};
}

/**
 * Effective focal length of a thick lens in a medium n0 (lensmaker's equation, Saleh & Teich,
 * "Fundamentals of Photonics", ch. 1): 1/f = (n/n0 − 1)·(1/R1 − 1/R2 + (n/n0 − 1)·t/(n/n0·R1·R2)).
 */
export function thickLensFocalLength_m(r1_m: number, r2_m: number, thickness_m: number, index: number, n0 = 1): number {
	const nr = index / n0;
	const c1 = Number.isFinite(r1_m) ? 1 / r1_m : 0;
	const c2 = Number.isFinite(r2_m) ? 1 / r2_m : 0;
	const p = (nr - 1) * (c1 - c2 + ((nr - 1) * thickness_m * c1 * c2) / nr);
	return 1 / p;
}

function validate(spec: ElementSpec): void {
	switch (spec.kind) {
		case 'thinLens':
		case 'cylLens':
			requireThat(spec.f_m !== 0 && !Number.isNaN(spec.f_m), 'focal length', 'non-zero', spec.f_m, 'm');
			break;
		case 'thermalLens':
			requireThat(spec.fx_m !== 0 && !Number.isNaN(spec.fx_m), 'thermal focal length (x)', 'non-zero', spec.fx_m, 'm');
			requireThat(spec.fy_m !== 0 && !Number.isNaN(spec.fy_m), 'thermal focal length (y)', 'non-zero', spec.fy_m, 'm');
			break;
		case 'thickLens':
			requireThat(spec.thickness_m >= 0 && Number.isFinite(spec.thickness_m), 'lens thickness', '≥ 0 m', spec.thickness_m, 'm');
			requireThat(spec.index >= 1 && Number.isFinite(spec.index), 'lens index', '≥ 1', spec.index);
			requireThat(spec.r1_m !== 0 && spec.r2_m !== 0, 'surface radius', 'non-zero (use Infinity for flat)', spec.r1_m === 0 ? spec.r1_m : spec.r2_m, 'm');
			break;
		case 'mirror':
		case 'foldMirror':
			requireThat(spec.angle_rad >= 0 && spec.angle_rad < Math.PI / 2, 'angle of incidence', '≥ 0° and < 90°', spec.angle_rad, 'rad');
			if (spec.kind === 'mirror') requireThat(spec.r_m !== 0 && !Number.isNaN(spec.r_m), 'mirror radius', 'non-zero (use Infinity for flat)', spec.r_m, 'm');
			break;
		case 'interface':
			requireThat(spec.indexAfter >= 1 && Number.isFinite(spec.indexAfter), 'index after the interface', '≥ 1', spec.indexAfter);
			requireThat(spec.r_m !== 0 && !Number.isNaN(spec.r_m), 'interface radius', 'non-zero (use Infinity for flat)', spec.r_m, 'm');
			break;
		case 'plate':
			requirePositive(spec.thickness_m, 'plate thickness', 'm');
			requireThat(spec.index >= 1 && Number.isFinite(spec.index), 'plate index', '≥ 1', spec.index);
			requireThat(spec.angle_rad >= 0 && spec.angle_rad < Math.PI / 2, 'plate angle', '≥ 0° and < 90°', spec.angle_rad, 'rad');
			break;
		case 'medium':
			requireThat(spec.length_m >= 0 && Number.isFinite(spec.length_m), 'medium length', '≥ 0 m', spec.length_m, 'm');
			requireThat(spec.index >= 1 && Number.isFinite(spec.index), 'medium index', '≥ 1', spec.index);
			break;
		case 'abcd':
			for (const [axis, m] of [['x', spec.x], ['y', spec.y]] as const) {
				for (const v of m) requireFinite(v, `ABCD (${axis}) entry`);
				requireThat(Math.abs(det(m) - 1) < 1e-6, `ABCD (${axis}) determinant`, '1 (reduced matrix, AD − BC = 1)', det(m).toPrecision(6));
			}
			break;
	}
}

/**
 * Compile one element into primitive steps, given the index of the medium it sits in.
 * Returns the steps, the element's length along the axis and the index after it.
 */
export function compileElement(spec: ElementSpec, n0: number): { steps: Step[]; length_m: number; indexAfter: number } {
	validate(spec);
	const kick = (x: Mat2, y: Mat2 = x): Step => ({ op: 'kick', x, y });
	switch (spec.kind) {
		// Thin lenses and mirrors: f is the focal length in the medium n0 they sit in, so the reduced
		// kick is C = −n0/f (see reducedThinLensMatrix).
		case 'thinLens':
			return { steps: [kick(reducedThinLensMatrix(spec.f_m, n0))], length_m: 0, indexAfter: n0 };
		case 'cylLens': {
			const m = reducedThinLensMatrix(spec.f_m, n0);
			return { steps: [spec.axis === 'x' ? kick(m, identity) : kick(identity, m)], length_m: 0, indexAfter: n0 };
		}
		case 'thermalLens':
			return { steps: [kick(reducedThinLensMatrix(spec.fx_m, n0), reducedThinLensMatrix(spec.fy_m, n0))], length_m: 0, indexAfter: n0 };
		case 'mirror': {
			const { tangential_m, sagittal_m } = mirrorFocalLengths(spec.r_m, spec.angle_rad);
			const t = reducedThinLensMatrix(tangential_m, n0);
			const s = reducedThinLensMatrix(sagittal_m, n0);
			return { steps: [spec.plane === 'x' ? kick(t, s) : kick(s, t)], length_m: 0, indexAfter: n0 };
		}
		case 'foldMirror':
			return { steps: [kick(identity)], length_m: 0, indexAfter: n0 };
		case 'interface':
			return { steps: [kick(interfaceMatrix(n0, spec.indexAfter, spec.r_m))], length_m: 0, indexAfter: spec.indexAfter };
		case 'thickLens': {
			const t = spec.thickness_m;
			const steps: Step[] = [kick(interfaceMatrix(n0, spec.index, spec.r1_m))];
			if (t > 0) steps.push({ op: 'travel', length_m: t, reducedX_m: t / spec.index, reducedY_m: t / spec.index, index: spec.index });
			steps.push(kick(interfaceMatrix(spec.index, n0, spec.r2_m)));
			return { steps, length_m: t, indexAfter: n0 };
		}
		case 'plate': {
			// Snell: n·sinθ2 = n0·sinθ1 has no real θ2 past the critical angle (total internal reflection).
			requireThat(
				n0 * Math.sin(spec.angle_rad) < spec.index,
				'plate angle',
				`below the critical angle (${((Math.asin(Math.min(1, spec.index / n0)) * 180) / Math.PI).toPrecision(4)}° for plate index ${spec.index} in a medium of index ${n0})`,
				spec.angle_rad,
				'rad'
			);
			const p = plateReducedLengths(spec.thickness_m, spec.index, spec.angle_rad, n0);
			const tx = spec.plane === 'x' ? p.tangential_m : p.sagittal_m;
			const ty = spec.plane === 'x' ? p.sagittal_m : p.tangential_m;
			return {
				steps: [{ op: 'travel', length_m: p.path_m, reducedX_m: tx, reducedY_m: ty, index: spec.index }],
				length_m: p.path_m,
				indexAfter: n0
			};
		}
		case 'medium': {
			const L = spec.length_m;
			const steps: Step[] = L > 0 ? [{ op: 'travel', length_m: L, reducedX_m: L / spec.index, reducedY_m: L / spec.index, index: spec.index }] : [];
			return { steps, length_m: L, indexAfter: n0 };
		}
		case 'abcd':
			return { steps: [kick(spec.x, spec.y)], length_m: 0, indexAfter: n0 };
	}
}

/** The overall reduced matrices (x, y) of one element in a medium of index n0, including any inner travel. */
export function elementMatrices(spec: ElementSpec, n0 = 1): { x: Mat2; y: Mat2 } {
	const { steps } = compileElement(spec, n0);
	let x = identity;
	let y = identity;
	for (const s of steps) {
		if (s.op === 'kick') {
			x = mul(s.x, x);
			y = mul(s.y, y);
		} else {
			x = mul(freeSpaceMatrix(s.reducedX_m), x);
			y = mul(freeSpaceMatrix(s.reducedY_m), y);
		}
	}
	return { x, y };
}
