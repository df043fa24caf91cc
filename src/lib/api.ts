/**
 * Beamwright as a library for scripts: `import { propagate, twoMirrorCavity, mpe } from 'beamwright'`.
 * Engine and safety code only (no DOM, no Svelte); SI units in and out, with the unit in every
 * number's name. Built to `dist/index.js` with types in `dist/types/` by `npm run build:cli`.
 */
import { caution } from './safety/cautions';
import { evaluateLimit, type StandardChoice } from './safety/limits/index';
import type { LimitInput, LimitResult } from './safety/limits/types';

export { propagate, beamAt } from './optics/train';
export type { TrainInput, TrainElement, Propagation } from './optics/train';
export type { SourceSpec } from './optics/source';
export { twoMirrorCavity } from './optics/cavity';
export type { TwoMirrorCavity } from './optics/cavity';
export { rayleighRange_m, farFieldHalfAngle_rad } from './optics/beam';
export { standardChoices, type StandardChoice } from './safety/limits/index';
export type { LimitInput, LimitResult } from './safety/limits/types';
export { caution } from './safety/cautions';

/**
 * Exposure limit (MPE) for one wavelength and exposure duration, by one standard edition or the
 * stricter of both (default). A first-pass estimate, not a hazard evaluation: the applicable standard,
 * local regulations and the laser safety officer decide — the result carries that caution.
 * Example: mpe({ standard: 'eu-2006-25', wavelength_m: 532e-9, duration_s: 0.25 }).irradiance_W_m2 → 25.46.
 * Throws RangeError outside the edition's tables (never extrapolates).
 */
export function mpe(input: LimitInput & { standard?: StandardChoice }): LimitResult & { caution: string } {
	const { standard = 'stricter', ...rest } = input;
	return { ...evaluateLimit(standard, rest), caution };
}
