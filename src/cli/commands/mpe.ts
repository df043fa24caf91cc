/**
 * `npx beamwright mpe`: the exposure limit of one standard edition (or the stricter of both) for one
 * wavelength and exposure, CW or repetitively pulsed. JSON with the caution.
 */
import { allowOnly, CliInputError, optChoice, optQuantity, parseArgs, requireQuantity } from '../args';
import { caution } from '../../lib/safety/cautions';
import { defaultExposureDuration, evaluatePulseTrain, viewingCases } from '../../lib/safety/exposure';
import { evaluateLimit, standardChoices } from '../../lib/safety/limits/index';

export const summary = 'Exposure limit (MPE) of a laser exposure for one standard edition: value, limiting aperture, table row and factors — a first-pass estimate.';
export const usage =
	'npx beamwright mpe --standard eu-2006-25|iec-60825-1-2014|stricter --wavelength 532nm [--duration 0.25s | --viewing accidental|worst-case|deliberate] [--target eye|skin] [--pulse-width 10ns --repetition-rate 10kHz] [--source-angle 1.5mrad]';

export const wavelengthSpec = { kind: 'length', min_si: 180e-9, max_si: 1e-3 } as const;
export const durationSpec = { kind: 'time', min_si: 1e-13, max_si: 3e4 } as const;

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['standard', 'wavelength', 'duration', 'viewing', 'target', 'pulse-width', 'repetition-rate', 'source-angle']);
	const standard = optChoice(args, 'standard', standardChoices, 'stricter');
	const wavelength_m = requireQuantity(args, 'wavelength', wavelengthSpec, '532nm');
	const target = optChoice(args, 'target', ['eye', 'skin'] as const, 'eye');
	const viewing = optChoice(args, 'viewing', viewingCases, 'accidental');
	const given = optQuantity(args, 'duration', durationSpec, '0.25s');
	if (given !== undefined && args.options.has('viewing')) throw new CliInputError('--viewing: sets the default duration — give it or --duration, not both');
	const dflt = defaultExposureDuration(wavelength_m, viewing, target);
	const duration_s = given ?? dflt.duration_s;
	const durationBasis = given !== undefined ? 'given with --duration' : `${dflt.basis} (${dflt.source}; override with --duration)`;
	const alpha_rad = optQuantity(args, 'source-angle', { kind: 'angle', min_si: 0, max_si: Math.PI }, '1.5mrad') ?? 0;
	const pulseWidth_s = optQuantity(args, 'pulse-width', { kind: 'time', min_si: 1e-13, max_si: 3e4 }, '10ns');
	const repetitionRate_Hz = optQuantity(args, 'repetition-rate', { kind: 'frequency', above_si: 0, max_si: 1e15 }, '10kHz');
	if ((pulseWidth_s === undefined) !== (repetitionRate_Hz === undefined))
		throw new CliInputError(`--${pulseWidth_s === undefined ? 'pulse-width' : 'repetition-rate'}: required with --${pulseWidth_s === undefined ? 'repetition-rate' : 'pulse-width'} — a pulse train needs both (a single pulse: give --duration as its width)`);
	if (pulseWidth_s !== undefined && repetitionRate_Hz !== undefined) {
		const r = evaluatePulseTrain(standard, { wavelength_m, duration_s, target, alpha_rad, pulseWidth_s, repetitionRate_Hz });
		return {
			radiantExposure_J_m2: r.perPulse_J_m2,
			irradiance_W_m2: r.averageIrradiance_W_m2,
			limitingAperture_m: r.limitingAperture_m,
			rule: r.rule,
			factors: r.factors,
			standard: r.standard,
			caution,
			standardId: r.standardId,
			provenance: r.provenance,
			limitSource: r.limitSource,
			provenanceLine: r.provenanceLine,
			comparedWith: r.comparedWith,
			basis: 'radiantExposure_J_m2 is the limit per pulse; irradiance_W_m2 the same limit as an average irradiance over the train',
			target: r.target,
			wavelength_m: r.wavelength_m,
			duration_s,
			durationBasis,
			pulseWidth_s,
			repetitionRate_Hz,
			pulses: r.pulses,
			groupingTime_s: r.groupingTime_s,
			C_P: r.CP,
			rules: r.rules,
			ruleSources: { repetitive: r.cpSource, grouping: r.groupingSource },
			notes: r.notes
		};
	}
	const r = evaluateLimit(standard, { wavelength_m, duration_s, target, alpha_rad });
	return {
		radiantExposure_J_m2: r.radiantExposure_J_m2,
		irradiance_W_m2: r.irradiance_W_m2,
		limitingAperture_m: r.limitingAperture_m,
		rule: `${r.row.expression}${r.row.condition ? ` (${r.row.condition})` : ''} — ${r.mechanism}`,
		factors: r.factors,
		standard: r.standard,
		caution,
		standardId: r.standardId,
		provenance: r.provenance,
		limitSource: r.limitSource,
		provenanceLine: r.provenanceLine,
		unitKind: r.kind,
		mechanism: r.mechanism,
		row: r.row,
		candidates: r.candidates,
		target: r.target,
		wavelength_m: r.wavelength_m,
		duration_s,
		durationBasis,
		alpha_rad,
		allFactors: r.allFactors,
		notes: r.notes
	};
}
