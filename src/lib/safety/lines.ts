/**
 * Several laser lines in one beam (a frequency-doubled laser with residual fundamental and pump, a
 * multi-line ion laser): each line is assessed on its own (eye and skin), and lines that act on the
 * same tissue are combined: the exposure of each, as a fraction of its own limit, adds up, and the
 * sum must stay ≤ 1.
 *
 * Tissue per wavelength band: Directive 2006/25/EC Annex II Table 2.1 (read in the French labour code
 * reproduction): 180–400 nm eye (cornea, lens: photochemical and thermal); 400–1400 nm eye (retina);
 * 1400 nm–1 mm eye (cornea, thermal); skin at every wavelength.
 * The additivity rule (Σ exposureᵢ ÷ limitᵢ ≤ 1 for lines acting on the same tissue) is not in any
 * clause of Annex II that was read: it is the rule for multiple wavelengths of IEC 60825-1 and ICNIRP,
 * from memory.
 */
import { caution } from './cautions';
import { assessBeam, type BeamAssessment, type BeamAssessmentInput } from './assess';
import { exposureAtDistance } from './hazard';

export interface LaserLine {
	wavelength_m: number;
	/** Continuous power of this line, W. */
	power_W: number;
}

export type Tissue = 'retina' | 'cornea and lens' | 'skin';

export const tissueSource =
	'Directive 2006/25/EC Annex II Table 2.1 (read in the French labour code reproduction, Code du travail, partie réglementaire, 4e partie, livre IV, titre V, chapitre II, annexe II)';
export const additivityClause =
	'Σ exposureᵢ ÷ limitᵢ ≤ 1 over lines acting on the same tissue: the multiple-wavelength rule of IEC 60825-1 and ICNIRP (from memory; no clause of Directive 2006/25/EC Annex II read states it)';

/** Tissue a line acts on in the eye. */
export function eyeTissue(wavelength_m: number): Tissue {
	const nm = wavelength_m * 1e9;
	return nm >= 400 && nm < 1400 ? 'retina' : 'cornea and lens';
}

export interface CombinedTissue {
	tissue: Tissue;
	target: 'eye' | 'skin';
	/** Indexes of the lines combined. */
	lines: number[];
	/** Σ exposure ÷ limit at the exit aperture (each line over its own limiting aperture). */
	sumAtExit: number;
	/** Distance beyond which the sum stays ≤ 1, m (0 when it is ≤ 1 at the exit). */
	hazardDistance_m: number;
	/** Distance of the worst single line of the group, for comparison, m. */
	worstSingle_m: number;
}

export interface LinesAssessment {
	lines: Array<{ line: LaserLine; eyeTissue: Tissue; result: BeamAssessment }>;
	combined: CombinedTissue[];
	tissueSource: string;
	additivityClause: string;
	caution: string;
}

/** Σ exposureᵢ(z) ÷ limitᵢ of the given line results, each over its own aperture. */
function sumAt(z_m: number, parts: Array<{ P: number; mpe: number; aperture_m: number }>, d_m: number, div_rad: number): number {
	let s = 0;
	for (const p of parts) s += exposureAtDistance({ amount: p.P, diameter_m: d_m, fullDivergence_rad: div_rad, distance_m: z_m, aperture_m: p.aperture_m }).averaged / p.mpe;
	return s;
}

/** Where the summed ratio falls to 1 (it falls monotonically with distance for a waist at the exit). */
function distanceWhereSumIsOne(parts: Array<{ P: number; mpe: number; aperture_m: number }>, d_m: number, div_rad: number): number {
	if (sumAt(0, parts, d_m, div_rad) <= 1) return 0;
	let hi = 1;
	while (sumAt(hi, parts, d_m, div_rad) > 1) {
		hi *= 2;
		if (hi > 1e12) return Infinity;
	}
	let lo = hi / 2 > 0 && sumAt(hi / 2, parts, d_m, div_rad) > 1 ? hi / 2 : 0;
	for (let i = 0; i < 200 && hi - lo > 1e-9 * hi; i++) {
		const mid = (lo + hi) / 2;
		if (sumAt(mid, parts, d_m, div_rad) > 1) lo = mid;
		else hi = mid;
	}
	return hi;
}

/**
 * Assess several continuous lines sharing one beam geometry (waist at the exit aperture).
 * Example: 532 nm 2 W and 1064 nm 50 mW, d = 2 mm, Θ = 1 mrad, Directive: the retina group sums the
 * two lines' fractions; each line keeps its own limit, aperture and eyewear OD.
 */
export function assessLines(common: Omit<BeamAssessmentInput, 'wavelength_m' | 'power_W' | 'pulseEnergy_J' | 'pulseWidth_s' | 'repetitionRate_Hz' | 'path'>, lines: readonly LaserLine[]): LinesAssessment {
	if (lines.length === 0) throw new RangeError('lines must hold at least one line — got none');
	const results = lines.map((line, i) => {
		try {
			return { line, eyeTissue: eyeTissue(line.wavelength_m), result: assessBeam({ ...common, wavelength_m: line.wavelength_m, power_W: line.power_W }) };
		} catch (e) {
			throw new RangeError(`line ${i + 1} (${+(line.wavelength_m * 1e9).toPrecision(6)} nm): ${(e as Error).message}`);
		}
	});
	const combined: CombinedTissue[] = [];
	const d = common.diameter_m;
	const div = common.fullDivergence_rad;
	for (const tissue of ['retina', 'cornea and lens'] as const) {
		const idx = results.map((r, i) => (r.eyeTissue === tissue ? i : -1)).filter((i) => i >= 0);
		if (!idx.length) continue;
		const parts = idx.map((i) => ({ P: results[i].result.power_W, mpe: results[i].result.mpe_W_m2, aperture_m: results[i].result.limitingAperture_m }));
		combined.push({
			tissue,
			target: 'eye',
			lines: idx,
			sumAtExit: sumAt(0, parts, d, div),
			hazardDistance_m: distanceWhereSumIsOne(parts, d, div),
			worstSingle_m: Math.max(...idx.map((i) => results[i].result.nohd_m))
		});
	}
	const skinIdx = results.map((r, i) => (r.result.skin.ok ? i : -1)).filter((i) => i >= 0);
	if (skinIdx.length) {
		const parts = skinIdx.map((i) => ({ P: results[i].result.power_W, mpe: results[i].result.skin.mpe_W_m2!, aperture_m: results[i].result.skin.limitingAperture_m! }));
		combined.push({
			tissue: 'skin',
			target: 'skin',
			lines: skinIdx,
			sumAtExit: sumAt(0, parts, d, div),
			hazardDistance_m: distanceWhereSumIsOne(parts, d, div),
			worstSingle_m: Math.max(...skinIdx.map((i) => results[i].result.skin.nshd_m!))
		});
	}
	return { lines: results, combined, tissueSource, additivityClause, caution };
}
