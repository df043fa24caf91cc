/**
 * Exposure limits by standard edition. The user picks an edition; where none is picked the stricter
 * of the two is used and named: the smaller limit, averaged over the smaller of the two editions'
 * limiting apertures (a smaller aperture never lowers the averaged exposure of a beam).
 */
import { eu200625 } from './eu-2006-25';
import { iec608251_2014 } from './iec-60825-1-2014';
import { evaluateEdition } from './evaluate';
import type { Edition, LimitInput, LimitResult, StandardId } from './types';

export * from './types';
export { evaluateEdition, evaluateMechanism, checkLimitInput, matchingRows, provenanceLineOf, wavelengthRange_nm, durationRange_s } from './evaluate';
export { eu200625, euFactors, euUvDoses, euApertureRule, T23_SEARCHED } from './eu-2006-25';
export { iec608251_2014, iecFactors, iecAlphaMax_mrad, iecApertureRule } from './iec-60825-1-2014';
export { limitingAperture_m, farIrBands, type ApertureRule } from './shared';

export const editions: Record<StandardId, Edition> = {
	'eu-2006-25': eu200625,
	'iec-60825-1-2014': iec608251_2014
};

export const standardIds = Object.keys(editions) as StandardId[];

/** Choice offered to users: an edition, or the stricter of both. */
export type StandardChoice = StandardId | 'stricter';
export const standardChoices: readonly StandardChoice[] = ['stricter', ...standardIds];

export function editionOf(id: StandardId): Edition {
	const e = editions[id];
	if (!e) throw new RangeError(`standard must be one of ${standardIds.join(', ')} — got ${String(id)}`);
	return e;
}

/**
 * Exposure limit of one edition, or the stricter (smaller radiant exposure) of both.
 * Example: evaluateLimit('eu-2006-25', { wavelength_m: 532e-9, duration_s: 0.25 }).irradiance_W_m2 → 25.46.
 */
export function evaluateLimit(standard: StandardChoice, input: LimitInput): LimitResult {
	if (standard !== 'stricter') return evaluateEdition(editionOf(standard), input);
	const all = standardIds.map((id) => evaluateEdition(editions[id], input));
	return stricterOf(all);
}

/**
 * The stricter of results of several editions: the smallest limit, with the smallest limiting aperture
 * of all (named in `limitSource` when it comes from another edition).
 */
export function stricterOf(all: LimitResult[]): LimitResult {
	const best = all.reduce((a, b) => (b.radiantExposure_J_m2 < a.radiantExposure_J_m2 ? b : a));
	const apMin = all.reduce((a, b) => (b.limitingAperture_m < a.limitingAperture_m ? b : a));
	if (!(apMin.limitingAperture_m < best.limitingAperture_m)) return best;
	return {
		...best,
		limitingAperture_m: apMin.limitingAperture_m,
		limitSource: `${best.limitSource}. Smaller limiting aperture ${+(apMin.limitingAperture_m * 1e3).toPrecision(4)} mm taken from ${apMin.standard} (the stricter of both)`,
		provenance: best.provenance === 'recalled' || apMin.provenance === 'recalled' ? 'recalled' : 'published-text'
	};
}

/** The edition that `evaluateLimit(choice, input)` used. */
export function resolveStandard(standard: StandardChoice, input: LimitInput): StandardId {
	return standard === 'stricter' ? evaluateLimit('stricter', input).standardId : standard;
}
