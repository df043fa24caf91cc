/**
 * Exposure along the real beam: the irradiance averaged over the limiting aperture at every distance,
 * its ratio to the exposure limit, the hazard zones where the ratio exceeds 1, and the propagated NOHD
 * (the far end of the last hazard zone — past a focus when the hazard lies there).
 *
 * The beam enters as its radius w(z) (1/e², per axis), either a function or sampled arrays, so this
 * module does not depend on the optics engine: the workspace feeds it from the bench propagation,
 * the CLI from `gaussianRadius` below.
 */
import { apertureFraction, peakIrradiance_W_m2 } from './aperture';
import type { ViewingOptic } from './hazard';
import { checkOptic } from './hazard';

export type BeamRadius = { wx_m: number; wy_m: number };
export type RadiusFunction = (z_m: number) => number | BeamRadius;
export interface SampledBeam {
	z_m: ArrayLike<number>;
	wx_m: ArrayLike<number>;
	wy_m?: ArrayLike<number>;
}

export interface BeamPathInput {
	beam: RadiusFunction | SampledBeam;
	power_W: number;
	mpe_W_m2: number;
	/** Limiting aperture diameter, m. */
	aperture_m: number;
	/** Range searched, m (a sampled beam defaults to its own range). */
	from_m?: number;
	to_m?: number;
	/** Uniform grid points for a function beam (default 1024). */
	samples?: number;
	/** Distances that must be examined closely (waists, foci), m. */
	peaks_m?: readonly number[];
	/** Viewing aid in the beam (binoculars, telescope). */
	optic?: ViewingOptic;
}

/**
 * Gaussian beam radius from the exit aperture (where the waist is): w(z) = √(w0² + (θ·z)²) with
 * w0 = d/2 and θ = Θ/2 (1/e² values). Far-field form of the Gaussian beam law (Siegman 1986, §17.1).
 */
export function gaussianRadius(diameter_m: number, fullDivergence_rad: number): (z_m: number) => number {
	const w0 = diameter_m / 2;
	const th = fullDivergence_rad / 2;
	return (z) => Math.sqrt(w0 * w0 + th * th * z * z);
}

function toFunction(beam: RadiusFunction | SampledBeam): { at: (z: number) => BeamRadius; grid?: number[] } {
	if (typeof beam === 'function')
		return {
			at: (z) => {
				const r = beam(z);
				return typeof r === 'number' ? { wx_m: r, wy_m: r } : r;
			}
		};
	const zs = Array.from(beam.z_m);
	const wx = Array.from(beam.wx_m);
	const wy = beam.wy_m ? Array.from(beam.wy_m) : wx;
	if (zs.length < 2 || wx.length !== zs.length || wy.length !== zs.length) throw new RangeError(`sampled beam needs ≥ 2 points with as many radii as distances — got ${zs.length} distances, ${wx.length} and ${wy.length} radii`);
	for (let i = 1; i < zs.length; i++) if (!(zs[i] > zs[i - 1])) throw new RangeError(`sampled beam distances must increase — got ${zs[i - 1]} m then ${zs[i]} m`);
	// w² of a Gaussian is quadratic in z; interpolating w² linearly keeps it positive and close.
	const at = (z: number): BeamRadius => {
		let i = 0;
		let j = zs.length - 1;
		if (z <= zs[0]) j = 1;
		else if (z >= zs[j]) i = j - 1;
		else {
			while (j - i > 1) {
				const m = (i + j) >> 1;
				if (zs[m] <= z) i = m;
				else j = m;
			}
		}
		const u = (z - zs[i]) / (zs[j] - zs[i]);
		const lerp2 = (w: number[]) => Math.sqrt(Math.max(w[i] * w[i] + u * (w[j] * w[j] - w[i] * w[i]), 1e-300));
		return { wx_m: lerp2(wx), wy_m: lerp2(wy) };
	};
	return { at, grid: zs };
}

/** Averaged irradiance at z (with the viewing aid, if any), W/m². */
function averagedAt(r: BeamRadius, input: BeamPathInput): number {
	const a = input.aperture_m / 2;
	if (!input.optic) return (input.power_W * apertureFraction(a, r.wx_m, r.wy_m)) / (Math.PI * a * a);
	const { objective_m, magnification, transmission } = input.optic;
	const collect = Math.min(objective_m, magnification * input.aperture_m) / 2;
	return (transmission * input.power_W * apertureFraction(collect, r.wx_m, r.wy_m)) / (Math.PI * a * a);
}

export interface BeamPathPoint {
	z_m: number;
	wx_m: number;
	wy_m: number;
	peak_W_m2: number;
	averaged_W_m2: number;
	/** averaged ÷ limit. */
	ratio: number;
}

export interface BeamPathResult {
	points: BeamPathPoint[];
	/** Intervals where the averaged exposure exceeds the limit, m. */
	zones: Array<{ from_m: number; to_m: number }>;
	/** End of the last hazard zone (0 when there is none), m. */
	nohd_m: number;
	/** True when the hazard continues past the end of the examined range (nohd_m is then that end). */
	beyondRange: boolean;
	/** Point of highest averaged exposure (the worst reachable point in the range). */
	worst: BeamPathPoint;
	from_m: number;
	to_m: number;
}

function check(input: BeamPathInput) {
	const ok = (v: number) => Number.isFinite(v) && v > 0;
	if (!ok(input.power_W)) throw new RangeError(`power must be a finite number > 0 W — got ${input.power_W} W`);
	if (!ok(input.mpe_W_m2)) throw new RangeError(`exposure limit must be a finite number > 0 W/m² — got ${input.mpe_W_m2} W/m²`);
	if (!ok(input.aperture_m)) throw new RangeError(`limiting aperture must be a finite number > 0 m — got ${input.aperture_m} m`);
	if (input.optic) checkOptic(input.optic);
}

/**
 * Exposure ÷ limit along the beam, hazard zones and the propagated NOHD.
 * The grid is refined around every local maximum (golden-section search) so a narrow focus between
 * grid points is not missed, and each zone edge is found by bisection to 1e-9 relative.
 * Example: the 5 W, 2.83 mm, 1.41 mrad beam with E_MPE = 25.46 W/m² and a 7 mm aperture: NOHD 501.5 m,
 * the far-field formula gives 499.5 m.
 */
export function beamPathExposure(input: BeamPathInput): BeamPathResult {
	check(input);
	const { at, grid } = toFunction(input.beam);
	const from = input.from_m ?? (grid ? grid[0] : 0);
	const to = input.to_m ?? (grid ? grid[grid.length - 1] : NaN);
	if (!(Number.isFinite(from) && Number.isFinite(to) && to > from)) throw new RangeError(`beam path range must have to > from — got ${from} m to ${to} m`);
	const point = (z: number): BeamPathPoint => {
		const r = at(z);
		const averaged = averagedAt(r, input);
		const peak = peakIrradiance_W_m2(input.power_W * (input.optic ? input.optic.transmission * input.optic.magnification ** 2 : 1), r.wx_m, r.wy_m);
		return { z_m: z, wx_m: r.wx_m, wy_m: r.wy_m, peak_W_m2: peak, averaged_W_m2: averaged, ratio: averaged / input.mpe_W_m2 };
	};
	const n = Math.max(8, Math.min(1e5, Math.round(input.samples ?? 1024)));
	const zs = new Set<number>();
	if (grid) {
		for (const z of grid) if (z >= from && z <= to) zs.add(z);
	} else {
		for (let i = 0; i <= n; i++) zs.add(from + ((to - from) * i) / n);
	}
	zs.add(from);
	zs.add(to);
	for (const z of input.peaks_m ?? []) if (z > from && z < to) zs.add(z);
	let pts = [...zs].sort((a, b) => a - b).map(point);
	// Refine local maxima of the ratio (a focus between grid points).
	const extra: BeamPathPoint[] = [];
	for (let i = 1; i < pts.length - 1; i++) {
		if (pts[i].ratio >= pts[i - 1].ratio && pts[i].ratio >= pts[i + 1].ratio) {
			let a = pts[i - 1].z_m;
			let b = pts[i + 1].z_m;
			const g = (Math.sqrt(5) - 1) / 2;
			for (let k = 0; k < 60 && b - a > 1e-12 * Math.max(1, Math.abs(b)); k++) {
				const c = b - g * (b - a);
				const d = a + g * (b - a);
				if (point(c).ratio > point(d).ratio) b = d;
				else a = c;
			}
			extra.push(point((a + b) / 2));
		}
	}
	if (extra.length) pts = [...pts, ...extra].sort((a, b) => a.z_m - b.z_m);
	const edge = (lo: BeamPathPoint, hi: BeamPathPoint): number => {
		let a = lo.z_m;
		let b = hi.z_m;
		const aAbove = lo.ratio > 1;
		for (let k = 0; k < 200 && b - a > 1e-9 * Math.max(1, Math.abs(b)); k++) {
			const m = (a + b) / 2;
			if (point(m).ratio > 1 === aAbove) a = m;
			else b = m;
		}
		return (a + b) / 2;
	};
	const zones: Array<{ from_m: number; to_m: number }> = [];
	let start: number | null = pts[0].ratio > 1 ? pts[0].z_m : null;
	for (let i = 1; i < pts.length; i++) {
		const p = pts[i - 1];
		const q = pts[i];
		if (p.ratio > 1 !== q.ratio > 1) {
			const z = edge(p, q);
			if (start === null) start = z;
			else {
				zones.push({ from_m: start, to_m: z });
				start = null;
			}
		}
	}
	const beyondRange = start !== null;
	if (start !== null) zones.push({ from_m: start, to_m: to });
	const worst = pts.reduce((a, b) => (b.averaged_W_m2 > a.averaged_W_m2 ? b : a));
	return { points: pts, zones, nohd_m: zones.length ? zones[zones.length - 1].to_m : 0, beyondRange, worst, from_m: from, to_m: to };
}

/**
 * Propagated, aperture-averaged NOHD of a round Gaussian beam with its waist w0 at z_w, solved in
 * closed form: the averaged irradiance P(1 − exp(−2(D/2)²/w²))/(π(D/2)²) falls as w grows, so it
 * equals the limit at one radius w*, reached at z = z_w + √(w*² − w0²)/θ past the waist.
 * With a viewing optic the objective collects through radius r_c = min(D_o, M·D)/2 and passes τ of it
 * into the eye's aperture: τ·P(1 − exp(−2r_c²/w²))/(π(D/2)²).
 * Returns 0 when the beam is below the limit everywhere past the waist.
 * Example: 5 W, w0 = 1.415 mm, θ = 0.705 mrad, E_MPE = 25.46 W/m², D = 7 mm → 501.51 m
 * (with E_MPE = 18·0.25^0.75/0.25 = 25.456 W/m² unrounded: 501.55 m).
 */
export function gaussianNohd_m(input: { power_W: number; mpe_W_m2: number; aperture_m: number; waistRadius_m: number; halfAngle_rad: number; waistAt_m?: number; optic?: ViewingOptic }): number {
	const { power_W, mpe_W_m2, aperture_m, waistRadius_m: w0, halfAngle_rad: th, waistAt_m = 0, optic } = input;
	for (const [v, name] of [[power_W, 'power'], [mpe_W_m2, 'exposure limit'], [aperture_m, 'limiting aperture'], [w0, 'waist radius'], [th, 'divergence half-angle']] as const)
		if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a finite number > 0 — got ${v}`);
	if (optic) checkOptic(optic);
	const a = aperture_m / 2;
	const rc = optic ? Math.min(optic.objective_m, optic.magnification * aperture_m) / 2 : a;
	const q = (mpe_W_m2 * Math.PI * a * a) / (power_W * (optic ? optic.transmission : 1));
	if (q >= 1) return 0;
	const wStar2 = (-2 * rc * rc) / Math.log1p(-q);
	if (wStar2 <= w0 * w0) return 0;
	return waistAt_m + Math.sqrt(wStar2 - w0 * w0) / th;
}
