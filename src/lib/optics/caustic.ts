/**
 * Caustic sampling for plots: one shared z grid for x and y, dense near every real waist (points
 * spaced evenly in Gouy phase, so the hyperbola is resolved whatever its Rayleigh range) and at every
 * segment boundary (elements), uniform elsewhere. Charts receive these arrays ready-made.
 */
import { radiusAt, type Propagation } from './train';

export interface Caustic {
	z_m: Float64Array;
	wx_m: Float64Array;
	wy_m: Float64Array;
}

/**
 * Sample w_x(z) and w_y(z) over [from, to] (defaults: the propagation's range).
 * `base` uniform points plus `perWaist` points around each real waist within ±3 zR.
 */
export function sampleCaustic(p: Propagation, options: { from_m?: number; to_m?: number; base?: number; perWaist?: number } = {}): Caustic {
	const from = options.from_m ?? p.start_m;
	const to = options.to_m ?? p.end_m;
	const base = options.base ?? 200;
	const perWaist = options.perWaist ?? 40;
	const zs: number[] = [];
	const span = to - from;
	for (let i = 0; i <= base; i++) zs.push(from + (span * i) / base);
	for (const s of p.segments) {
		zs.push(s.z0_m, s.z1_m);
	}
	const maxPhase = Math.atan(3);
	for (const w of p.waists) {
		if (w.virtual) continue;
		const s = p.segments[w.segment];
		zs.push(w.z_m);
		for (let i = 0; i < perWaist; i++) {
			const z = w.z_m + w.zR_m * Math.tan(-maxPhase + (2 * maxPhase * i) / (perWaist - 1));
			if (z >= s.z0_m && z <= s.z1_m) zs.push(z);
		}
	}
	const sorted = zs.filter((z) => z >= from && z <= to).sort((a, b) => a - b);
	const uniq: number[] = [];
	for (const z of sorted) if (uniq.length === 0 || z - uniq[uniq.length - 1] > 1e-12 * Math.max(1, Math.abs(span))) uniq.push(z);
	const n = uniq.length;
	const out: Caustic = { z_m: new Float64Array(n), wx_m: new Float64Array(n), wy_m: new Float64Array(n) };
	for (let i = 0; i < n; i++) {
		out.z_m[i] = uniq[i];
		out.wx_m[i] = radiusAt(p, uniq[i], 'x');
		out.wy_m[i] = radiusAt(p, uniq[i], 'y');
	}
	return out;
}
