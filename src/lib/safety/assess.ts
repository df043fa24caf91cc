/**
 * One laser beam, assessed end to end: exposure duration (default or given), exposure limit (CW,
 * single pulse or pulse train), NOHD by the far-field formula and along the propagated beam
 * (aperture-averaged; the larger is used), eyewear OD at the worst reachable point, and optionally
 * aided viewing and a diffuse reflection. Used by the CLI `hazard` command, the whole-lab table and
 * the hazard workspace.
 *
 * The beam leaves the exit aperture with its waist there: 1/e² diameter d and 1/e² full divergence Θ
 * (w(z) = √((d/2)² + (Θz/2)²)); the worst reachable point is the exit aperture itself.
 */
import { caution } from './cautions';
import { apertureAveragedIrradiance_W_m2, peakIrradiance_W_m2 } from './aperture';
import { defaultExposureDuration, evaluatePulseTrain, type PulseRule, type ViewingCase } from './exposure';
import { diffuseHazardDistance_m, nohdFormula, opticalGain, requiredOpticalDensity, type ViewingOptic } from './hazard';
import { evaluateLimit, type StandardChoice } from './limits/index';
import type { FactorReport, LimitResult, Mechanism, Provenance, StandardId } from './limits/types';
import { beamPathExposure, gaussianNohd_m, type RadiusFunction, type SampledBeam } from './propagated';

/**
 * A beam known along its path (e.g. propagated by the bench through lenses and an expander) instead of
 * a waist at the exit aperture. Distances are positions on the path's z axis.
 */
export interface BeamPathSpec {
	beam: RadiusFunction | SampledBeam;
	from_m: number;
	to_m: number;
	/** Waists and foci to examine closely, m. */
	peaks_m?: readonly number[];
	/** Where the far-field formula's exit aperture sits (the last element), m; `diameter_m` and `fullDivergence_rad` describe the beam there. */
	exitAt_m: number;
}

export interface BeamAssessmentInput {
	standard: StandardChoice;
	wavelength_m: number;
	/** Continuous-wave power, W (give this, or pulse energy and width). */
	power_W?: number;
	pulseEnergy_J?: number;
	pulseWidth_s?: number;
	/** Without a rate a pulse is a single pulse. */
	repetitionRate_Hz?: number;
	/** 1/e² diameter at the exit aperture, m. */
	diameter_m: number;
	/** 1/e² full-angle divergence, rad. */
	fullDivergence_rad: number;
	/** Exposure duration, s; default by common practice from `viewing`. */
	duration_s?: number;
	viewing?: ViewingCase;
	alpha_rad?: number;
	optic?: ViewingOptic;
	diffuse?: { reflectance: number; viewingAngle_rad: number };
	/** The beam along its path; without it the waist is at the exit aperture (z = 0). */
	path?: BeamPathSpec;
}

export type EmissionKind = 'continuous' | 'single pulse' | 'pulse train';

export interface BeamAssessment {
	standardId: StandardId;
	standard: string;
	wavelength_m: number;
	emission: EmissionKind;
	/** Power compared with `mpe_W_m2`: CW power, average power of a train, or pulse energy ÷ width. */
	power_W: number;
	exposure: { duration_s: number; basis: string; source: string; isDefault: boolean };
	/** Limit as an irradiance over the exposure (average irradiance for a train), W/m². */
	mpe_W_m2: number;
	/** Limit as a radiant exposure: over the duration (CW) or per pulse, J/m². */
	mpe_J_m2: number;
	rule: string;
	mechanism: Mechanism;
	/** Table + row + the text it was read from (or why it is recalled), and the aperture's source. */
	limitSource: string;
	provenance: Provenance;
	/** One line on where the limit comes from (e.g. IEC values recalled), shown with every figure. */
	provenanceLine: string;
	limitingAperture_m: number;
	factors: FactorReport[];
	/** Each pulse rule's per-pulse limit (pulse trains only). */
	pulseRules?: Array<{ rule: string; applies: boolean; perPulse_J_m2: number; detail: string }>;
	nohdFormula_m: number;
	/** Aperture-averaged NOHD along the propagated beam. */
	nohd_m: number;
	/** True when the hazard continues past the end of the examined path (nohd_m is that end). */
	nohdBeyondRange: boolean;
	/** The larger of the two, and which it is. */
	hazardDistance_m: number;
	hazardDistanceFrom: 'beam' | 'formula';
	exit: { peak_W_m2: number; averaged_W_m2: number };
	odRequired: number;
	odWhole: number;
	/** Where the OD applies: the worst point on the path (the exit aperture when no path is given), m. */
	odAt_m: number;
	/** Aperture-averaged irradiance at that point, W/m². */
	odExposure_W_m2: number;
	/**
	 * Eyewear in detail: the exposure at the worst point (per pulse for pulsed lasers, beside the average
	 * irradiance), the OD each pulse rule asks for (each over its own limiting aperture) and which sets it.
	 */
	eyewear: EyewearDetail;
	/** Skin: the skin exposure limit and the nominal skin hazard distance for the same beam. */
	skin: SkinAssessment;
	aided?: { gain: number; nohdFormula_m: number; nohd_m: number; hazardDistance_m: number };
	diffuse?: { reflectance: number; viewingAngle_rad: number; distance_m: number };
	notes: readonly string[];
	caution: string;
}

export interface EyewearRuleOd {
	rule: string;
	/** Exposure compared: per pulse (J/m²) for pulsed lasers, irradiance (W/m²) for CW. */
	exposure: number;
	limit: number;
	unit: 'J/m²' | 'W/m²';
	limitingAperture_m: number;
	od: number;
	odWhole: number;
}

export interface EyewearDetail {
	/** Per-pulse radiant exposure at the worst point, averaged over the limiting aperture, J/m² (null for CW). */
	perPulse_J_m2: number | null;
	/** Average irradiance at the worst point, averaged over the limiting aperture, W/m². */
	averageIrradiance_W_m2: number;
	byRule: EyewearRuleOd[];
	/** The rule whose OD is the largest. */
	setBy: string;
	basis: string;
}

export interface SkinAssessment {
	ok: boolean;
	/** Why there is no skin result (ok = false). */
	message?: string;
	duration_s?: number;
	durationBasis?: string;
	mpe_W_m2?: number;
	mpe_J_m2?: number;
	rule?: string;
	limitingAperture_m?: number;
	/** Aperture-averaged exposure at the worst point ÷ skin limit. */
	ratioAtWorst?: number;
	/** Nominal skin hazard distance along the beam (aperture-averaged), m. */
	nshd_m?: number;
	provenance?: Provenance;
	limitSource?: string;
	provenanceLine?: string;
}

function positive(v: number | undefined, name: string, unit: string): number {
	if (!(v !== undefined && Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a finite number > 0 ${unit} — got ${v} ${unit}`);
	return v;
}

/**
 * Assess one beam.
 * Example: 514.5 nm, 5 W, d = 2.83 mm, Θ = 1.41 mrad, 0.25 s, EU 2006/25 → E_MPE = 25.46 W/m²,
 * NOHD formula 499.6 m, along the beam 501.6 m, OD 3.71 (4).
 */
export function assessBeam(input: BeamAssessmentInput): BeamAssessment {
	const { wavelength_m, standard, diameter_m, fullDivergence_rad } = input;
	positive(diameter_m, 'beam diameter', 'm');
	positive(fullDivergence_rad, 'beam divergence', 'rad');
	const pulsed = input.pulseEnergy_J !== undefined || input.pulseWidth_s !== undefined || input.repetitionRate_Hz !== undefined;
	if (pulsed && input.power_W !== undefined) throw new RangeError('give either a CW power or pulse energy and width — got both');
	if (!pulsed && input.power_W === undefined) throw new RangeError('power is required — give a CW power, or pulse energy and width');
	const target = 'eye' as const;
	let emission: EmissionKind = 'continuous';
	let exposure: BeamAssessment['exposure'];
	if (pulsed && input.repetitionRate_Hz === undefined) {
		const tau = positive(input.pulseWidth_s, 'pulse width', 's');
		emission = 'single pulse';
		if (input.duration_s !== undefined && Math.abs(input.duration_s - tau) > 1e-9 * tau)
			throw new RangeError(`a single pulse is exposed for its width (${tau} s) — got exposure duration ${input.duration_s} s; give a repetition rate for a pulse train`);
		exposure = { duration_s: tau, basis: 'A single pulse: the exposure lasts one pulse width.', source: 'common practice', isDefault: input.duration_s === undefined };
	} else {
		if (pulsed) emission = 'pulse train';
		const d = defaultExposureDuration(wavelength_m, input.viewing ?? 'accidental', target);
		exposure = input.duration_s !== undefined
			? { duration_s: input.duration_s, basis: 'Exposure duration given by the user.', source: 'input', isDefault: false }
			: { ...d, isDefault: true };
	}
	const t = exposure.duration_s;
	let power_W: number;
	let mpe_W_m2: number;
	let mpe_J_m2: number;
	let lim: LimitResult;
	let pulseRules: BeamAssessment['pulseRules'];
	let pulseTrainRules: PulseRule[] | undefined;
	let rule: string;
	if (emission === 'pulse train') {
		const Q = positive(input.pulseEnergy_J, 'pulse energy', 'J');
		const f = positive(input.repetitionRate_Hz, 'repetition rate', 'Hz');
		const pt = evaluatePulseTrain(standard, { wavelength_m, duration_s: t, target, alpha_rad: input.alpha_rad, pulseWidth_s: positive(input.pulseWidth_s, 'pulse width', 's'), repetitionRate_Hz: f });
		power_W = Q * f;
		mpe_W_m2 = pt.averageIrradiance_W_m2;
		mpe_J_m2 = pt.perPulse_J_m2;
		rule = pt.rule;
		pulseRules = pt.rules.map(({ rule, applies, perPulse_J_m2, detail }) => ({ rule, applies, perPulse_J_m2, detail }));
		pulseTrainRules = pt.rules;
		lim = { ...pt.singlePulse, standardId: pt.standardId, standard: pt.standard, limitingAperture_m: pt.limitingAperture_m, factors: pt.factors, notes: pt.notes, provenance: pt.provenance, limitSource: pt.limitSource, provenanceLine: pt.provenanceLine };
		lim.mechanism = pt.rule === 'average power' ? pt.average.mechanism : pt.singlePulse.mechanism;
	} else {
		lim = evaluateLimit(standard, { wavelength_m, duration_s: t, target, alpha_rad: input.alpha_rad });
		power_W = emission === 'single pulse' ? positive(input.pulseEnergy_J, 'pulse energy', 'J') / t : positive(input.power_W, 'power', 'W');
		mpe_W_m2 = lim.irradiance_W_m2;
		mpe_J_m2 = lim.radiantExposure_J_m2;
		rule = `${lim.row.expression}${lim.row.condition ? ` (${lim.row.condition})` : ''} — ${lim.mechanism}`;
	}
	const D = lim.limitingAperture_m;
	const w0 = diameter_m / 2;
	const th = fullDivergence_rad / 2;
	const path = input.path;
	const exitAt = path ? path.exitAt_m : 0;
	const nohdF = exitAt + nohdFormula({ power_W, mpe_W_m2, diameter_m, fullDivergence_rad }).nohd_m;
	let nohdB: number;
	let beyond = false;
	let worstAveraged: number;
	let worstAt = 0;
	if (path) {
		const r = beamPathExposure({ beam: path.beam, power_W, mpe_W_m2, aperture_m: D, from_m: path.from_m, to_m: path.to_m, peaks_m: path.peaks_m });
		nohdB = r.nohd_m;
		beyond = r.beyondRange;
		worstAveraged = r.worst.averaged_W_m2;
		worstAt = r.worst.z_m;
	} else {
		nohdB = gaussianNohd_m({ power_W, mpe_W_m2, aperture_m: D, waistRadius_m: w0, halfAngle_rad: th });
		worstAveraged = apertureAveragedIrradiance_W_m2(power_W, D, w0);
	}
	const od = requiredOpticalDensity(worstAveraged, mpe_W_m2);
	let aided: BeamAssessment['aided'];
	if (input.optic) {
		const gain = opticalGain(input.optic, D);
		const f = exitAt + nohdFormula({ power_W, mpe_W_m2, diameter_m, fullDivergence_rad, gain }).nohd_m;
		const b = path
			? beamPathExposure({ beam: path.beam, power_W, mpe_W_m2, aperture_m: D, from_m: path.from_m, to_m: path.to_m, peaks_m: path.peaks_m, optic: input.optic }).nohd_m
			: gaussianNohd_m({ power_W, mpe_W_m2, aperture_m: D, waistRadius_m: w0, halfAngle_rad: th, optic: input.optic });
		aided = { gain, nohdFormula_m: f, nohd_m: b, hazardDistance_m: Math.max(f, b) };
	}
	const diffuse = input.diffuse ? { ...input.diffuse, distance_m: diffuseHazardDistance_m({ power_W, mpe_W_m2, ...input.diffuse }) } : undefined;

	// Eyewear: the exposure at the worst point over each rule's own aperture, and the OD each rule asks for.
	const worstR = path ? (() => {
		const w = beamPathExposure({ beam: path.beam, power_W, mpe_W_m2, aperture_m: D, from_m: path.from_m, to_m: path.to_m, peaks_m: path.peaks_m }).worst;
		return { wx: w.wx_m, wy: w.wy_m };
	})() : { wx: w0, wy: w0 };
	const byRule: EyewearRuleOd[] = [];
	let perPulseWorst: number | null = null;
	if (emission === 'continuous') {
		const E = apertureAveragedIrradiance_W_m2(power_W, D, worstR.wx, worstR.wy);
		const o = requiredOpticalDensity(E, mpe_W_m2);
		byRule.push({ rule: 'continuous', exposure: E, limit: mpe_W_m2, unit: 'W/m²', limitingAperture_m: D, od: o.od, odWhole: o.odWhole });
	} else {
		const Q = positive(input.pulseEnergy_J, 'pulse energy', 'J');
		perPulseWorst = apertureAveragedIrradiance_W_m2(Q, D, worstR.wx, worstR.wy);
		if (emission === 'single pulse') {
			const o = requiredOpticalDensity(perPulseWorst, mpe_J_m2);
			byRule.push({ rule: 'single pulse', exposure: perPulseWorst, limit: mpe_J_m2, unit: 'J/m²', limitingAperture_m: D, od: o.od, odWhole: o.odWhole });
		} else
			for (const r of pulseTrainRules ?? []) {
				if (!r.applies) continue;
				const H = apertureAveragedIrradiance_W_m2(Q, r.limitingAperture_m, worstR.wx, worstR.wy);
				const o = requiredOpticalDensity(H, r.perPulse_J_m2);
				byRule.push({ rule: r.rule, exposure: H, limit: r.perPulse_J_m2, unit: 'J/m²', limitingAperture_m: r.limitingAperture_m, od: o.od, odWhole: o.odWhole });
			}
	}
	const setBy = byRule.reduce((a, b) => (b.od > a.od ? b : a));
	const odFinal = Math.max(od.od, setBy.od);
	const eyewear: EyewearDetail = {
		perPulse_J_m2: perPulseWorst,
		averageIrradiance_W_m2: worstAveraged,
		byRule,
		setBy: setBy.rule,
		basis: 'OD = log10(exposure ÷ limit) per rule, each over its own limiting aperture, at the worst reachable point (IEC TR 60825-14 / ANSI Z136.1 form, from memory); the whole number at or above the largest is the one to mark.'
	};

	// Skin: the same beam against the skin limit (its own default duration unless one was given).
	let skin: SkinAssessment;
	try {
		let skinT: number;
		let skinBasis: string;
		if (emission === 'single pulse') {
			skinT = t;
			skinBasis = exposure.basis;
		} else if (exposure.isDefault) {
			const d = defaultExposureDuration(wavelength_m, input.viewing ?? 'accidental', 'skin');
			skinT = d.duration_s;
			skinBasis = `${d.basis} (${d.source})`;
		} else {
			skinT = t;
			skinBasis = exposure.basis;
		}
		let sE: number;
		let sH: number;
		let sRule: string;
		let sAp: number;
		let sProv: { provenance: Provenance; limitSource: string; provenanceLine: string };
		if (emission === 'pulse train') {
			const st = evaluatePulseTrain(standard, { wavelength_m, duration_s: skinT, target: 'skin', pulseWidth_s: input.pulseWidth_s!, repetitionRate_Hz: input.repetitionRate_Hz!, alpha_rad: input.alpha_rad });
			sE = st.averageIrradiance_W_m2;
			sH = st.perPulse_J_m2;
			sRule = st.rule;
			sAp = st.limitingAperture_m;
			sProv = st;
		} else {
			const sl = evaluateLimit(standard, { wavelength_m, duration_s: skinT, target: 'skin', alpha_rad: input.alpha_rad });
			sE = sl.irradiance_W_m2;
			sH = sl.radiantExposure_J_m2;
			sRule = `${sl.row.expression} — ${sl.mechanism}`;
			sAp = sl.limitingAperture_m;
			sProv = sl;
		}
		const nshd = path
			? beamPathExposure({ beam: path.beam, power_W, mpe_W_m2: sE, aperture_m: sAp, from_m: path.from_m, to_m: path.to_m, peaks_m: path.peaks_m }).nohd_m
			: gaussianNohd_m({ power_W, mpe_W_m2: sE, aperture_m: sAp, waistRadius_m: w0, halfAngle_rad: th });
		skin = {
			ok: true,
			duration_s: skinT,
			durationBasis: skinBasis,
			mpe_W_m2: sE,
			mpe_J_m2: sH,
			rule: sRule,
			limitingAperture_m: sAp,
			ratioAtWorst: apertureAveragedIrradiance_W_m2(power_W, sAp, worstR.wx, worstR.wy) / sE,
			nshd_m: nshd,
			provenance: sProv.provenance,
			limitSource: sProv.limitSource,
			provenanceLine: sProv.provenanceLine
		};
	} catch (e) {
		skin = { ok: false, message: `skin limit not evaluated: ${(e as Error).message}` };
	}
	return {
		standardId: lim.standardId,
		standard: lim.standard,
		wavelength_m,
		emission,
		power_W,
		exposure,
		mpe_W_m2,
		mpe_J_m2,
		rule,
		mechanism: lim.mechanism,
		limitSource: lim.limitSource,
		provenance: lim.provenance,
		provenanceLine: lim.provenanceLine,
		limitingAperture_m: D,
		factors: lim.factors,
		pulseRules,
		nohdFormula_m: nohdF,
		nohd_m: nohdB,
		nohdBeyondRange: beyond,
		hazardDistance_m: Math.max(nohdF, nohdB),
		hazardDistanceFrom: nohdB >= nohdF ? 'beam' : 'formula',
		exit: { peak_W_m2: peakIrradiance_W_m2(power_W, w0), averaged_W_m2: apertureAveragedIrradiance_W_m2(power_W, D, w0) },
		odRequired: odFinal,
		odWhole: Math.max(od.odWhole, setBy.odWhole),
		eyewear,
		skin,
		odAt_m: worstAt,
		odExposure_W_m2: worstAveraged,
		aided,
		diffuse,
		notes: nohdPhysicalNote(Math.max(nohdF, nohdB, aided?.hazardDistance_m ?? 0), lim.notes),
		caution
	};
}

/**
 * Longest hazard distance reported as a plain number, m. Past it no laboratory or outdoor beam path
 * exists (atmospheric attenuation and the Earth's curvature end any line of sight long before), so the
 * figure only says "the beam is hazardous as far as it goes" (common practice: our stated bound).
 */
export const MAX_PHYSICAL_NOHD_m = 1e6;

function nohdPhysicalNote(distance_m: number, notes: readonly string[]): readonly string[] {
	if (distance_m <= MAX_PHYSICAL_NOHD_m) return notes;
	return [
		...notes,
		`The hazard distance computed (${Number.isFinite(distance_m) ? `${+(distance_m / 1000).toPrecision(3)} km` : 'without bound'}) is beyond any physical beam path (more than ${MAX_PHYSICAL_NOHD_m / 1000} km): treat the beam as hazardous along its whole path, and check the inputs.`
	];
}
