/**
 * Exposure conditions: default exposure durations (each explained and overridable) and the three
 * rules for repetitively pulsed sources (Directive 2006/25/EC Annex II Table 2.6; IEC 60825-1 Annex A):
 *
 *   1. single pulse — each pulse stays below the limit for one pulse of that width;
 *   2. average power — the whole train of N = f·T pulses stays below the limit for the duration T;
 *   3. repetitive pulse — each pulse stays below the single-pulse thermal limit times C_P = N^−0.25,
 *      where pulses closer together than the edition's grouping time (T_min, T_i) count as one pulse
 *      of that duration. Applies to thermal limits only (retinal thermal only in IEC 60825-1:2014).
 *
 * Every rule's value is returned; the smallest per-pulse radiant exposure limits and is named.
 */
import { caution } from './cautions';
import { editionOf, evaluateEdition, evaluateMechanism, provenanceLineOf, standardIds, type StandardChoice } from './limits/index';
import type { FactorReport, LimitInput, LimitResult, Provenance, StandardId, Target } from './limits/types';

export type ViewingCase = 'accidental' | 'worst-case' | 'deliberate';
export const viewingCases: readonly ViewingCase[] = ['accidental', 'worst-case', 'deliberate'];

export interface DefaultDuration {
	duration_s: number;
	/** Why this duration, in one sentence. */
	basis: string;
	source: string;
}

/**
 * Default exposure duration for a first-pass estimate.
 * Example: 532 nm, eye, accidental → 0.25 s (aversion response); 1064 nm → 10 s; 355 nm → 30 000 s.
 */
export function defaultExposureDuration(wavelength_m: number, viewing: ViewingCase = 'accidental', target: Target = 'eye'): DefaultDuration {
	const nm = wavelength_m * 1e9;
	if (!Number.isFinite(nm) || nm <= 0) throw new RangeError(`wavelength must be > 0 m — got ${wavelength_m} m`);
	if (nm < 400)
		return {
			duration_s: 3e4,
			basis: 'Ultraviolet effects add up over a working day, so the whole day (30 000 s) is assumed.',
			source: 'IEC TR 60825-14 §5.1 (30 000 s below 400 nm); common practice'
		};
	if (viewing === 'deliberate')
		return { duration_s: 3e4, basis: 'Deliberate or long-term viewing: a whole working day (30 000 s) is assumed.', source: 'common practice' };
	if (viewing === 'worst-case')
		return {
			duration_s: 100,
			basis: 'Worst-case accidental exposure above 400 nm: 100 s.',
			source: 'IEC TR 60825-14 §5.1 (100 s above 400 nm)'
		};
	if (target === 'skin') return { duration_s: 10, basis: 'Accidental skin exposure: withdrawal within about 10 s is assumed.', source: 'common practice' };
	if (nm < 700)
		return {
			duration_s: 0.25,
			basis: 'Visible beam, accidental viewing: the aversion response (blink, head movement) ends the exposure within 0.25 s.',
			source: 'common practice (the aversion time used for Class 2 in IEC 60825-1)'
		};
	return {
		duration_s: 10,
		basis: 'Invisible beam, accidental viewing: no aversion response; natural eye movements are assumed to end the exposure within 10 s.',
		source: 'common practice'
	};
}

export interface PulseTrainInput extends LimitInput {
	/** Duration of one pulse, s. */
	pulseWidth_s: number;
	/** Pulse repetition frequency, Hz. */
	repetitionRate_Hz: number;
}

export type PulseRuleName = 'single pulse' | 'average power' | 'repetitive pulse (C_P)';

export interface PulseRule {
	rule: PulseRuleName;
	applies: boolean;
	/** Limit on the radiant exposure of one pulse, J/m² (0 when the rule does not apply). */
	perPulse_J_m2: number;
	/** The same limit as an average irradiance over the train (perPulse·f), W/m². */
	averageIrradiance_W_m2: number;
	limitingAperture_m: number;
	detail: string;
}

export interface PulseTrainResult {
	standardId: StandardId;
	standard: string;
	target: Target;
	wavelength_m: number;
	duration_s: number;
	pulseWidth_s: number;
	repetitionRate_Hz: number;
	/** Pulses in the exposure, N = f·T (at least 1). */
	pulses: number;
	groupingTime_s: number | null;
	grouped: boolean;
	CP: number | null;
	perPulse_J_m2: number;
	averageIrradiance_W_m2: number;
	rule: PulseRuleName;
	rules: PulseRule[];
	/** Smallest aperture among the applicable rules (stricter), m. */
	limitingAperture_m: number;
	singlePulse: LimitResult;
	average: LimitResult;
	factors: FactorReport[];
	cpSource: string;
	groupingSource: string;
	/** Read from the published text, or recalled: of the rows behind the limiting rule (and the grouping time for rule 3). */
	provenance: Provenance;
	/** Table + row + source of the rows behind the limiting rule. */
	limitSource: string;
	provenanceLine: string;
	/** When the default "stricter of both" chose this edition: what the other edition gave (per-pulse limit), else null. */
	comparedWith: { standardId: StandardId; perPulse_J_m2: number; rule: PulseRuleName } | null;
	notes: readonly string[];
	caution: string;
}

/**
 * Exposure limit for a repetitively pulsed source under the three rules.
 * Example: EU 2006/25, 532 nm, 10 ns at 10 kHz for 0.25 s: rule 1 5·10⁻³ J/m², rule 2 6.364/2500 =
 * 2.55·10⁻³ J/m², rule 3 5·10⁻³·2500^−0.25 = 7.07·10⁻⁴ J/m² → rule 3 limits.
 */
export function evaluatePulseTrain(standard: StandardChoice, input: PulseTrainInput): PulseTrainResult {
	const { pulseWidth_s: tau, repetitionRate_Hz: f, duration_s: T } = input;
	if (!(Number.isFinite(tau) && tau > 0)) throw new RangeError(`pulse width must be > 0 s — got ${tau} s`);
	if (!(Number.isFinite(f) && f > 0)) throw new RangeError(`repetition rate must be > 0 Hz — got ${f} Hz`);
	if (tau * f > 1 + 1e-12) throw new RangeError(`pulse width must not exceed the pulse period 1/f = ${1 / f} s — got ${tau} s`);
	if (!(T >= tau)) throw new RangeError(`exposure duration must be at least one pulse width (${tau} s) — got ${T} s`);
	if (standard === 'stricter') {
		const all = standardIds.map((id) => evaluatePulseTrain(id, input));
		const best = all.reduce((a, b) => (b.perPulse_J_m2 < a.perPulse_J_m2 ? b : a));
		const other = all.find((r) => r !== best) ?? null;
		const apMin = Math.min(...all.map((r) => r.limitingAperture_m));
		return {
			...best,
			limitingAperture_m: apMin,
			comparedWith: other && { standardId: other.standardId, perPulse_J_m2: other.perPulse_J_m2, rule: other.rule },
			limitSource: apMin < best.limitingAperture_m ? `${best.limitSource}. Smaller limiting aperture ${+(apMin * 1e3).toPrecision(4)} mm from the other edition (the stricter of both)` : best.limitSource
		};
	}
	const id = standard;
	const edition = editionOf(id);
	const single = evaluateEdition(edition, { ...input, duration_s: tau });
	const average = evaluateEdition(edition, input);
	const N = Math.max(1, f * T);
	const lambda_nm = single.wavelength_m * 1e9;
	const rules: PulseRule[] = [
		{
			rule: 'single pulse',
			applies: true,
			perPulse_J_m2: single.radiantExposure_J_m2,
			averageIrradiance_W_m2: single.radiantExposure_J_m2 * f,
			limitingAperture_m: single.limitingAperture_m,
			detail: `limit for one ${tau} s pulse (${single.row.expression})`
		},
		{
			rule: 'average power',
			applies: true,
			perPulse_J_m2: average.radiantExposure_J_m2 / N,
			averageIrradiance_W_m2: (average.radiantExposure_J_m2 / N) * f,
			limitingAperture_m: average.limitingAperture_m,
			detail: `limit for ${T} s (${average.row.expression}) shared by N = ${+N.toPrecision(6)} pulses`
		}
	];
	const Tg = edition.groupingTime_s(lambda_nm);
	const groupingNote = edition.groupingNote(lambda_nm);
	let CP: number | null = null;
	let grouped = false;
	let thermalRow: { source: string; provenance: Provenance } | null = null;
	const notApplicable = (why: string): PulseRule => ({ rule: 'repetitive pulse (C_P)', applies: false, perPulse_J_m2: 0, averageIrradiance_W_m2: 0, limitingAperture_m: 0, detail: why });
	if (!edition.cpApplies(single.target, lambda_nm, 'thermal')) rules.push(notApplicable(`not applicable: ${edition.cpSource}`));
	else if (!Number.isFinite(Tg)) rules.push(notApplicable('not applicable: the edition lists no pulse-grouping time at this wavelength'));
	else {
		grouped = 1 / f < Tg;
		const groupT = grouped ? Math.min(Tg, T) : tau;
		const perGroup = grouped ? Math.max(1, f * groupT) : 1;
		const groups = grouped ? Math.max(1, T / groupT) : N;
		const thermal = evaluateMechanism(edition, { ...input, duration_s: groupT }, 'thermal');
		if (!thermal) rules.push(notApplicable('not applicable: no thermal limit at this wavelength and duration'));
		else {
			CP = groups ** -0.25;
			const pp = (thermal.radiantExposure_J_m2 * CP) / perGroup;
			rules.push({
				rule: 'repetitive pulse (C_P)',
				applies: true,
				perPulse_J_m2: pp,
				averageIrradiance_W_m2: pp * f,
				limitingAperture_m: edition.aperture_m(single.target, lambda_nm, groupT),
				detail: (grouped
					? `pulses closer than the grouping time ${Tg} s count as one: ${+perGroup.toPrecision(6)} pulses per ${groupT} s group, C_P = ${+groups.toPrecision(6)}^−0.25 = ${+CP.toPrecision(4)} on ${thermal.expression}`
					: `C_P = N^−0.25 = ${+CP.toPrecision(4)} on the single-pulse thermal limit (${thermal.expression})`) + (groupingNote ? ` — ${groupingNote}` : '')
			});
			thermalRow = thermal;
		}
	}
	const applicable = rules.filter((r) => r.applies);
	const limiting = applicable.reduce((a, b) => (b.perPulse_J_m2 < a.perPulse_J_m2 ? b : a));
	const rowBehind: { source: string; provenance: Provenance } = limiting.rule === 'single pulse' ? single.row : limiting.rule === 'average power' ? average.row : thermalRow!;
	const resBehind = limiting.rule === 'average power' ? average : single;
	const provenance: Provenance = rowBehind.provenance === 'recalled' || resBehind.provenance === 'recalled' || edition.provenanceLabel ? 'recalled' : 'published-text';
	const limitSource = `${rowBehind.source}${limiting.rule === 'repetitive pulse (C_P)' ? `; ${edition.cpSource}${groupingNote ? `; ${groupingNote}` : ''}` : ''}`;
	const factors = [...single.factors];
	if (CP !== null) factors.push({ name: 'C_P', iecName: 'C5', value: CP, unit: '', meaning: 'repetitive-pulse correction N^−0.25' });
	return {
		standardId: id,
		standard: edition.title,
		target: single.target,
		wavelength_m: single.wavelength_m,
		duration_s: T,
		pulseWidth_s: tau,
		repetitionRate_Hz: f,
		pulses: N,
		groupingTime_s: Number.isFinite(Tg) ? Tg : null,
		grouped,
		CP,
		perPulse_J_m2: limiting.perPulse_J_m2,
		averageIrradiance_W_m2: limiting.averageIrradiance_W_m2,
		rule: limiting.rule,
		rules,
		limitingAperture_m: Math.min(...applicable.map((r) => r.limitingAperture_m)),
		singlePulse: single,
		average,
		factors,
		cpSource: edition.cpSource,
		groupingSource: edition.groupingSource,
		provenance,
		limitSource,
		provenanceLine: provenanceLineOf(edition, provenance),
		comparedWith: null,
		notes: groupingNote && CP !== null ? [...edition.notes, groupingNote] : edition.notes,
		caution
	};
}
