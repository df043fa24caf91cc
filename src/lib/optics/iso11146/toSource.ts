/**
 * Turn a width fit into the bench's source: per axis a waist (radius w0 = d0/2, location z0) and M²,
 * in the SourceSpec shape of ../source.ts (kind 'waist').
 */
import type { SourceSpec } from '../source';
import type { PhysicalFit } from './fit';
import type { WidthsResult } from './widths';

export interface MeasuredSource {
	source: SourceSpec;
	/** Remarks on the conversion (e.g. M² slightly below 1 taken as 1). */
	notes: string[];
}

export interface ToSourceOptions {
	/** Position of the measurement's z = 0 on the bench's z axis (from the source's reference plane), m; default 0. */
	zOffset_m?: number;
	/** Refractive index of the medium the beam was measured in; default 1. */
	index?: number;
}

function axisOf(result: WidthsResult, name: 'd' | 'x' | 'y', wavelength_m: number, index: number, zOffset: number, notes: string[]) {
	const r = result.axes[name];
	if (!r) throw new RangeError(`fit result must have a ${name} axis — it has ${Object.keys(result.axes).join(', ')}`);
	if (!r.fit.physical) throw new RangeError(`the ${name} fit must be physical to become a source — ${r.fit.reason}`);
	const fit = r.fit as PhysicalFit;
	// M² = π·n·d0·Θ/(4λ0): ISO 11146-1:2005, clause 9 for n = 1; the medium index as in the q convention of DEVELOPERS.md.
	let m2 = (Math.PI * index * fit.d0_m * fit.fullDivergence_rad) / (4 * wavelength_m);
	const u = fit.m2 !== null && fit.uncertainty?.m2 != null && fit.m2 > 0 ? (fit.uncertainty.m2 * m2) / fit.m2 : 0;
	if (m2 < 1) {
		if (m2 + 2 * u >= 1) {
			notes.push(`${name}: fitted M² ${m2.toFixed(3)} ± ${u.toFixed(3)} is consistent with 1 and is used as 1`);
			m2 = 1;
		} else {
			throw new RangeError(
				`${name}: M² must be ≥ 1 for a real beam — fitted ${m2.toFixed(3)}${u ? ` ± ${u.toFixed(3)}` : ''}; check the wavelength and that the widths are second-moment (D4σ) diameters`
			);
		}
	}
	return { m2, spec: { kind: 'waist' as const, w0_m: fit.d0_m / 2, z0_m: fit.z0_m + zOffset } };
}

/**
 * Bench source from a width fit: w0 = d0/2, z0 (+ zOffset_m), M² = π·n·d0·Θ/(4λ0) per axis; a single-diameter fit
 * gives the same waist to x and y.
 * Units: m. Example: x fit d0 = 1 mm at z0 = 0.2 m with Θ = 1.761 mrad at λ = 1064 nm →
 * source.x = { m2: 1.3, spec: { kind: 'waist', w0_m: 5e-4, z0_m: 0.2 } }.
 * Source: w = d/2 for the second-moment diameter (ISO 11146-1:2005, clause 3, from memory);
 * M² = π·d0·Θ/(4λ) (ISO 11146-1:2005, clause 9, from memory).
 */
export function toBenchSource(result: WidthsResult, wavelength_m: number, options: ToSourceOptions = {}): MeasuredSource {
	if (!(Number.isFinite(wavelength_m) && wavelength_m > 0)) throw new RangeError(`wavelength must be > 0 m — got ${wavelength_m} m`);
	const zOffset = options.zOffset_m ?? 0;
	if (!Number.isFinite(zOffset)) throw new RangeError(`z offset must be a finite number of metres — got ${zOffset}`);
	const index = options.index ?? 1;
	if (!(Number.isFinite(index) && index >= 1)) throw new RangeError(`medium index must be ≥ 1 — got ${index}`);
	const notes: string[] = [];
	if (result.columns === 'd') {
		const a = axisOf(result, 'd', wavelength_m, index, zOffset, notes);
		return { source: { wavelength_m, index, x: a, y: { m2: a.m2, spec: { ...a.spec } } }, notes };
	}
	return { source: { wavelength_m, index, x: axisOf(result, 'x', wavelength_m, index, zOffset, notes), y: axisOf(result, 'y', wavelength_m, index, zOffset, notes) }, notes };
}
