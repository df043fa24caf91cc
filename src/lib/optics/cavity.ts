/**
 * Resonator eigenmodes.
 *
 * Two-mirror linear cavity (Kogelnik & Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966),
 * §V, eqs. 61–64): g_i = 1 − L/R_i; stable when 0 < g1·g2 < 1; mirror radii R > 0 for concave mirrors,
 * Infinity for a flat mirror. The mode is the TEM00 mode of wavelength λ in a medium of index 1.
 *
 * General cavities (ring, folded, with tilted curved mirrors and plates) are given as the list of parts
 * met in one round trip; the round-trip reduced matrix M = [A B; C D] per axis fixes the eigenmode
 * q = (A·q + B)/(C·q + D), stable when |(A + D)/2| < 1 (Siegman, "Lasers", 1986, §21.1, eqs. 21.8–21.12):
 * 1/q = (D − A)/(2B) − i·sqrt(1 − m²)/|B| with m = (A + D)/2.
 */
import { beamFromQ, type QHat } from './beam';
import { requirePositive, requireThat } from './constants';
import { elementMatrices, freeSpaceMatrix, identity, mul, type ElementSpec, type Mat2 } from './elements';

export interface TwoMirrorCavity {
	stable: boolean;
	/** 'boundary': g1·g2 = 0 or 1, the edge of the stability region (not stable: no mode is fixed by the mirrors). */
	status: 'stable' | 'boundary' | 'unstable';
	/** Why the cavity has no mode ('unstable', 'on the stability boundary …'), or null. */
	reason: string | null;
	/** On the boundary: the mode's limit as the cavity approaches it from the stable side; null otherwise. */
	limit: BoundaryLimit | null;
	g1: number;
	g2: number;
	/** null when the cavity has no confined mode. */
	w0_m: number | null;
	waistFromMirror1_m: number | null;
	wMirror1_m: number | null;
	wMirror2_m: number | null;
	zR_m: number | null;
}

/**
 * Limit of a two-mirror cavity's mode at the stability boundary, approached from the stable side.
 * A null figure grows without bound there (named in `unbounded`); 0 is a point focus.
 */
export interface BoundaryLimit {
	/** Which boundary: 'confocal' (g1 = g2 = 0), 'centre-on-mirror' (one g = 0, e.g. hemispherical), 'concentric' (g1 = g2 = −1), 'planar' (g1 = g2 = 1) or 'g1g2=1'. */
	kind: 'confocal' | 'centre-on-mirror' | 'concentric' | 'planar' | 'g1g2=1';
	/** How the limit is approached, in words. */
	approach: string;
	w0_m: number | null;
	waistFromMirror1_m: number | null;
	wMirror1_m: number | null;
	wMirror2_m: number | null;
	/** Names of the figures that grow without bound at the limit. */
	unbounded: string[];
	/** true when the limit mode is finite (a waist > 0 and finite spots): only the confocal cavity. */
	finite: boolean;
}

/**
 * The stability boundary of a two-mirror cavity (Kogelnik & Li 1966, §V, the g1–g2 stability diagram;
 * Siegman 1986, §19.3): g1·g2 = 0 or 1. There the round-trip half trace (A + D)/2 = 2g1g2 − 1 is ±1 and
 * the round trip does not fix a Gaussian mode; the limits below follow from eqs. 61–64 as g1·g2 → 0⁺ or
 * → 1⁻ along the path named in `approach`.
 */
function boundaryLimit(g1: number, g2: number, L: number, wavelength_m: number, eps: number): { limit: BoundaryLimit; reason: string } {
	const k = (wavelength_m * L) / Math.PI;
	const z = (v: number) => Math.abs(v) <= eps;
	const edge = 'it sits on the edge of the stability region 0 < g1·g2 < 1, so a small error in a radius or the length makes it unstable';
	if (z(g1) && z(g2)) {
		// Symmetric limit R1 = R2 → L: w0² = (λL/2π)·sqrt((1 + g)/(1 − g)) → λL/2π, mirror spots² → λL/π.
		return {
			limit: { kind: 'confocal', approach: 'R1 = R2 → L (symmetric)', w0_m: Math.sqrt(k / 2), waistFromMirror1_m: L / 2, wMirror1_m: Math.sqrt(k), wMirror2_m: Math.sqrt(k), unbounded: [], finite: true },
			reason: `on the stability boundary (confocal, g1 = g2 = 0): the round-trip matrix is −1 ((A+D)/2 = −1): every ray comes back inverted and every Gaussian beam reproduces itself, so the mirrors alone do not fix a mode; ${edge}. The figures given are the limit of the symmetric cavity R1 = R2 → L, the mode commonly matched to`
		};
	}
	if (z(g1) || z(g2)) {
		// One mirror's centre of curvature lies on the other mirror (e.g. hemispherical, g1 = 1, g2 = 0):
		// as g_i → 0⁺ the waist shrinks to a point on the other mirror and the spot on mirror i grows without bound.
		const at2 = z(g1);
		return {
			limit: {
				kind: 'centre-on-mirror',
				approach: `L → R${at2 ? 1 : 2} from below`,
				w0_m: 0,
				waistFromMirror1_m: at2 ? L : 0,
				wMirror1_m: at2 ? null : 0,
				wMirror2_m: at2 ? 0 : null,
				unbounded: [at2 ? 'wMirror1_m' : 'wMirror2_m'],
				finite: false
			},
			reason: `on the stability boundary (g${at2 ? 1 : 2} = 0: mirror ${at2 ? 1 : 2}'s centre of curvature lies on mirror ${at2 ? 2 : 1}${!at2 && z(g1 - 1) ? ', the hemispherical cavity' : at2 && z(g2 - 1) ? ', the hemispherical cavity' : ''}): g1·g2 = 0 and (A+D)/2 = −1; approached with L → R${at2 ? 1 : 2} from below, the waist shrinks to a point on mirror ${at2 ? 2 : 1} and the spot on mirror ${at2 ? 1 : 2} grows without bound, so there is no confined mode to match; ${edge}`
		};
	}
	// g1·g2 = 1.
	if (z(g1 - 1) && z(g2 - 1)) {
		return {
			limit: { kind: 'planar', approach: 'R1 = R2 → ∞ (flat mirrors)', w0_m: null, waistFromMirror1_m: null, wMirror1_m: null, wMirror2_m: null, unbounded: ['w0_m', 'wMirror1_m', 'wMirror2_m'], finite: false },
			reason: `on the stability boundary (plane-parallel, g1 = g2 = 1): g1·g2 = 1 and (A+D)/2 = 1; as the mirrors flatten the mode grows without bound, so there is no confined mode to match; ${edge}`
		};
	}
	if (z(g1 + 1) && z(g2 + 1)) {
		return {
			limit: { kind: 'concentric', approach: 'R1 = R2 → L/2 from above', w0_m: 0, waistFromMirror1_m: L / 2, wMirror1_m: null, wMirror2_m: null, unbounded: ['wMirror1_m', 'wMirror2_m'], finite: false },
			reason: `on the stability boundary (concentric, g1 = g2 = −1): g1·g2 = 1 and (A+D)/2 = 1; approached from the stable side the waist shrinks to a point at the common centre and the spots on the mirrors grow without bound, so there is no confined mode to match; ${edge}`
		};
	}
	// Elsewhere on g1·g2 = 1 (g1 + g2 ≠ 2): w0² ∝ sqrt(p(1 − p)) → 0 at t1 = L·g2(1 − g1)/(g1 + g2 − 2g1g2).
	const den = g1 + g2 - 2;
	return {
		limit: { kind: 'g1g2=1', approach: 'g1·g2 → 1 from below', w0_m: 0, waistFromMirror1_m: (L * g2 * (1 - g1)) / den, wMirror1_m: null, wMirror2_m: null, unbounded: ['wMirror1_m', 'wMirror2_m'], finite: false },
		reason: `on the stability boundary (g1·g2 = 1, (A+D)/2 = 1): the spots on the mirrors grow without bound as it is approached, so there is no confined mode to match; ${edge}`
	};
}

/**
 * Two-mirror cavity mode (Kogelnik & Li 1966, eqs. 61–64):
 * w1² = (λL/π)·sqrt(g2/(g1(1 − g1g2))), w2² = (λL/π)·sqrt(g1/(g2(1 − g1g2))),
 * w0² = (λL/π)·sqrt(g1g2(1 − g1g2)/(g1 + g2 − 2g1g2)²), t1 = L·g2(1 − g1)/(g1 + g2 − 2g1g2).
 * The symmetric cavity (g1 = g2 = g) uses w0² = (λL/2π)·sqrt((1 + g)/(1 − g)), t1 = L/2. On the stability
 * boundary (g1·g2 = 0 or 1: confocal, hemispherical, planar, concentric) the cavity is reported as such,
 * not stable, with the limit of its mode (`limit`) and the reason.
 * Example: R1 = R2 = 1 m, L = 0.5 m, λ = 1064 nm → g = 0.5, w0 = 0.38295 mm at 0.25 m, w on the mirrors 0.44220 mm.
 */
export function twoMirrorCavity(r1_m: number, r2_m: number, length_m: number, wavelength_m: number): TwoMirrorCavity {
	requirePositive(length_m, 'cavity length', 'm');
	requirePositive(wavelength_m, 'wavelength', 'm');
	requireThat(r1_m !== 0 && !Number.isNaN(r1_m), 'mirror 1 radius', 'non-zero (Infinity for flat)', r1_m, 'm');
	requireThat(r2_m !== 0 && !Number.isNaN(r2_m), 'mirror 2 radius', 'non-zero (Infinity for flat)', r2_m, 'm');
	const L = length_m;
	const g1 = 1 - (Number.isFinite(r1_m) ? L / r1_m : 0);
	const g2 = 1 - (Number.isFinite(r2_m) ? L / r2_m : 0);
	const none = (reason: string): TwoMirrorCavity => ({ stable: false, status: 'unstable', reason, limit: null, g1, g2, w0_m: null, waistFromMirror1_m: null, wMirror1_m: null, wMirror2_m: null, zR_m: null });
	const p = g1 * g2;
	const eps = 1e-12;
	const k = (wavelength_m * L) / Math.PI;
	if (p < -eps || p > 1 + eps) return none('unstable: g1·g2 must lie between 0 and 1');
	if (p <= eps || p >= 1 - eps) {
		const b = boundaryLimit(g1, g2, L, wavelength_m, eps);
		return { ...none(b.reason), status: 'boundary', limit: b.limit };
	}
	if (Math.abs(g1 - g2) <= eps) {
		const g = g1;
		const w0sq = (k / 2) * Math.sqrt((1 + g) / (1 - g));
		const wm = Math.sqrt(k / Math.sqrt(1 - g * g));
		return { stable: true, status: 'stable', reason: null, limit: null, g1, g2, w0_m: Math.sqrt(w0sq), waistFromMirror1_m: L / 2, wMirror1_m: wm, wMirror2_m: wm, zR_m: (Math.PI * w0sq) / wavelength_m };
	}
	const den = g1 + g2 - 2 * p;
	const w0sq = k * Math.sqrt((p * (1 - p)) / (den * den));
	return {
		stable: true,
		status: 'stable',
		reason: null,
		limit: null,
		g1,
		g2,
		w0_m: Math.sqrt(w0sq),
		waistFromMirror1_m: (L * g2 * (1 - g1)) / den,
		wMirror1_m: Math.sqrt(k * Math.sqrt(g2 / (g1 * (1 - p)))),
		wMirror2_m: Math.sqrt(k * Math.sqrt(g1 / (g2 * (1 - p)))),
		zR_m: (Math.PI * w0sq) / wavelength_m
	};
}

/** One part of a round trip: a stretch of medium, or an element (curved mirror at an angle, plate, lens…). */
export type RoundTripPart = { kind: 'space'; length_m: number; index?: number } | { kind: 'element'; spec: ElementSpec };

export interface AxisEigenmode {
	/** (A + D)/2 of the round trip on this axis. */
	halfTrace: number;
	stable: boolean;
	/** |(A + D)/2| = 1 (to 1e-9): on the stability boundary, where the round trip fixes no Gaussian mode. */
	boundary: boolean;
	/** Eigen q̂ at the reference plane (the start of the round trip), null when unstable. */
	q: QHat | null;
	w_m: number | null;
	/** Wavefront radius at the reference plane; null for a flat wavefront or no mode. */
	R_m: number | null;
	w0_m: number | null;
	/** Distance from the reference plane to the waist, + downstream (along the first part). */
	toWaist_m: number | null;
}

export interface RoundTripEigenmode {
	x: AxisEigenmode;
	y: AxisEigenmode;
	matrices: { x: Mat2; y: Mat2 };
	stable: boolean;
}

/** Reduced round-trip matrices per axis; parts are listed in the order the beam meets them. */
export function roundTripMatrices(parts: RoundTripPart[]): { x: Mat2; y: Mat2 } {
	requireThat(parts.length > 0, 'round trip', 'at least one part', parts.length);
	let x: Mat2 = identity;
	let y: Mat2 = identity;
	for (const p of parts) {
		if (p.kind === 'space') {
			requireThat(Number.isFinite(p.length_m) && p.length_m >= 0, 'round-trip distance', '≥ 0 m', p.length_m, 'm');
			const f = freeSpaceMatrix(p.length_m, p.index ?? 1);
			x = mul(f, x);
			y = mul(f, y);
		} else {
			const m = elementMatrices(p.spec);
			x = mul(m.x, x);
			y = mul(m.y, y);
		}
	}
	return { x, y };
}

/**
 * Eigenmode of one axis from its round-trip matrix (Siegman 1986, eqs. 21.8–21.12).
 * Example: confocal two-mirror round trip at λ = 1064 nm (R = L = 1 m, reference plane at a mirror)
 * is on the boundary (|m| = 1): reported not stable, with `boundary` set.
 */
export function axisEigenmode(m: Mat2, wavelength_m: number): AxisEigenmode {
	requirePositive(wavelength_m, 'wavelength', 'm');
	const [A, B, C, D] = m;
	const half = (A + D) / 2;
	const boundary = Math.abs(Math.abs(half) - 1) <= 1e-9;
	const none: AxisEigenmode = { halfTrace: half, stable: false, boundary, q: null, w_m: null, R_m: null, w0_m: null, toWaist_m: null };
	if (!(Math.abs(half) < 1 - 1e-12) || Math.abs(B) < 1e-300) return none;
	const s = Math.sqrt(1 - half * half);
	const invRe = (D - A) / (2 * B);
	const invIm = -s / Math.abs(B);
	const den = invRe * invRe + invIm * invIm;
	const q = { re: invRe / den, im: -invIm / den };
	void C;
	const b = beamFromQ(q, { wavelength_m, m2: 1 });
	return { halfTrace: half, stable: true, boundary: false, q, w_m: b.w_m, R_m: Number.isFinite(b.R_m) ? b.R_m : null, w0_m: b.w0_m, toWaist_m: b.toWaist_m };
}

/** Eigenmode of a general cavity given as one round trip; x and y separately (simple astigmatism). */
export function roundTripEigenmode(parts: RoundTripPart[], wavelength_m: number): RoundTripEigenmode {
	const matrices = roundTripMatrices(parts);
	const x = axisEigenmode(matrices.x, wavelength_m);
	const y = axisEigenmode(matrices.y, wavelength_m);
	return { x, y, matrices, stable: x.stable && y.stable };
}

/**
 * Round trip of a linear two-mirror cavity with optional parts between the mirrors, starting just after
 * mirror 1 towards mirror 2: one way, mirror 2, the way back, mirror 1. Mirrors at normal incidence.
 * `oneWay` lists what lies between mirror 1 and mirror 2 (spaces and symmetric elements: lenses, plates).
 */
export function linearRoundTrip(r1_m: number, r2_m: number, oneWay: RoundTripPart[]): RoundTripPart[] {
	const back = [...oneWay].reverse().map((p): RoundTripPart => {
		if (p.kind === 'element' && p.spec.kind === 'thickLens') return { kind: 'element', spec: { ...p.spec, r1_m: -p.spec.r2_m, r2_m: -p.spec.r1_m } };
		if (p.kind === 'element' && p.spec.kind === 'interface') throw new RangeError('intracavity part must be symmetric on the way back — got an interface; use a medium or a plate');
		if (p.kind === 'element' && p.spec.kind === 'abcd') {
			const r = (m: Mat2): Mat2 => [m[3], m[1], m[2], m[0]];
			return { kind: 'element', spec: { kind: 'abcd', x: r(p.spec.x), y: r(p.spec.y) } };
		}
		return p;
	});
	const mirror = (r: number): RoundTripPart => ({ kind: 'element', spec: { kind: 'mirror', r_m: r, angle_rad: 0, plane: 'x' } });
	return [...oneWay, mirror(r2_m), ...back, mirror(r1_m)];
}

/** A mirror of a ring or folded cavity: radius (> 0 concave, Infinity flat) and angle of incidence. */
export interface CavityMirror {
	r_m: number;
	angle_rad: number;
}

/** Where a part of a mirror round trip lies: arm i runs from mirror i to mirror i + 1 (0-based). */
export interface RoundTripPlace {
	arm: number;
	/** true on the way from mirror i to mirror i + 1; a folded cavity also meets each arm backwards. */
	forward: boolean;
}

/**
 * Round trip of a cavity of mirrors joined by straight arms, starting just after mirror `startArm`,
 * along arm `startArm` (the arm from that mirror to the next). All mirrors fold the beam in one plane,
 * whose tangential axis is x (a planar ring or fold; Kogelnik, Ippen, Dienes & Shank 1972, eq. 1 for the
 * per-axis focal lengths of each tilted mirror).
 * - 'ring': arms_m[i] joins mirror i to mirror (i + 1) mod n; the beam goes once around (n ≥ 2 arms).
 * - 'folded' (standing wave): arms_m[i] joins mirror i to mirror i + 1 (n − 1 arms); mirrors 0 and n − 1
 *   are the end mirrors (normal incidence), the beam goes there and back. `startArm` must be < n − 1.
 * Returns the parts with, for each space part, the arm it crosses (null for mirror parts).
 */
export function mirrorRoundTrip(kind: 'ring' | 'folded', mirrors: CavityMirror[], arms_m: number[], startArm: number): { parts: RoundTripPart[]; places: (RoundTripPlace | null)[] } {
	const n = mirrors.length;
	requireThat(n >= 2, 'cavity', 'at least 2 mirrors', n);
	const nArms = kind === 'ring' ? n : n - 1;
	requireThat(arms_m.length === nArms, 'arm lengths', `${nArms} values for ${n} mirrors (${kind})`, arms_m.length);
	arms_m.forEach((a, i) => requireThat(Number.isFinite(a) && a > 0, `arm ${i + 1} length`, '> 0 m', a, 'm'));
	mirrors.forEach((m, i) => {
		requireThat(m.r_m !== 0 && !Number.isNaN(m.r_m), `mirror ${i + 1} radius`, 'non-zero (Infinity for flat)', m.r_m, 'm');
		requireThat(m.angle_rad >= 0 && m.angle_rad < Math.PI / 2, `mirror ${i + 1} angle of incidence`, '≥ 0° and < 90°', m.angle_rad, 'rad');
	});
	requireThat(Number.isInteger(startArm) && startArm >= 0 && startArm < nArms, 'start arm', `a whole number from 0 to ${nArms - 1}`, startArm);
	const mirror = (i: number): RoundTripPart => ({ kind: 'element', spec: { kind: 'mirror', r_m: mirrors[i].r_m, angle_rad: mirrors[i].angle_rad, plane: 'x' } });
	const space = (i: number): RoundTripPart => ({ kind: 'space', length_m: arms_m[i] });
	// The whole cycle from just after mirror 0, then rotated to start at the forward pass of startArm.
	const parts: RoundTripPart[] = [];
	const places: (RoundTripPlace | null)[] = [];
	if (kind === 'ring') {
		for (let i = 0; i < n; i++) {
			parts.push(space(i), mirror((i + 1) % n));
			places.push({ arm: i, forward: true }, null);
		}
	} else {
		for (let i = 0; i < n - 1; i++) {
			parts.push(space(i), mirror(i + 1));
			places.push({ arm: i, forward: true }, null);
		}
		for (let i = n - 2; i >= 0; i--) {
			parts.push(space(i), mirror(i));
			places.push({ arm: i, forward: false }, null);
		}
	}
	const k = places.findIndex((p) => p !== null && p.arm === startArm && p.forward);
	return { parts: [...parts.slice(k), ...parts.slice(0, k)], places: [...places.slice(k), ...places.slice(0, k)] };
}

/** The eigenmode's waist inside one space part of the round trip, per axis (null: no waist inside). */
export interface PartWaist {
	/** Index of the space part in the round trip. */
	part: number;
	/** Beam radius at the start and the end of the part. */
	wStart_m: number;
	wEnd_m: number;
	waist: { w0_m: number; fromStart_m: number } | null;
}

/**
 * Follow a stable eigen q̂ of one axis through its round trip (q̂' = (A·q̂ + B)/(C·q̂ + D), the ABCD law,
 * Kogelnik & Li 1966, eq. 30) and report, for every space part, the beam radius at both ends and the
 * waist inside it, if any (distances physical, in the part's medium).
 */
export function eigenmodeAlong(parts: RoundTripPart[], q0: QHat, wavelength_m: number, axis: 'x' | 'y'): PartWaist[] {
	requirePositive(wavelength_m, 'wavelength', 'm');
	requireThat(Number.isFinite(q0.re) && Number.isFinite(q0.im) && q0.im > 0, 'eigen q̂', 'finite with Im > 0 (a stable mode)', `${q0.re} + ${q0.im}i`, 'm');
	const props = { wavelength_m, m2: 1 };
	const out: PartWaist[] = [];
	let q = { ...q0 };
	const apply = (m: Mat2) => {
		const [A, B, C, D] = m;
		const nr = A * q.re + B;
		const ni = A * q.im;
		const dr = C * q.re + D;
		const di = C * q.im;
		const den = dr * dr + di * di;
		q = { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den };
	};
	parts.forEach((p, i) => {
		if (p.kind === 'space') {
			const n = p.index ?? 1;
			const b = beamFromQ(q, props, n);
			const L = p.length_m;
			apply(freeSpaceMatrix(L, n));
			const e = beamFromQ(q, props, n);
			const inside = b.toWaist_m >= -1e-12 * Math.max(L, 1e-3) && b.toWaist_m <= L + 1e-12 * Math.max(L, 1e-3);
			out.push({ part: i, wStart_m: b.w_m, wEnd_m: e.w_m, waist: inside ? { w0_m: b.w0_m, fromStart_m: Math.min(Math.max(b.toWaist_m, 0), L) } : null });
		} else apply(elementMatrices(p.spec)[axis]);
	});
	return out;
}
