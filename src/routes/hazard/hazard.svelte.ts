/**
 * Hazard workspace state: reads the `safety` section of the setup document, parses the typed fields at
 * the edge, and derives the assessment, the exposure profile for the plot and the whole-lab table by
 * calling the safety engine. Components render these and dispatch edits; no physics here beyond
 * wiring the bench's propagated beam into the engine's beam-radius callback.
 */
import { parseQuantity, type FieldSpec } from '$lib/units/parse';
import type { SetupStore } from '$lib/document/store.svelte';
import { beamAt, radiusAt, type Propagation } from '$lib/optics/train';
import {
	assessBeam,
	assessInventory,
	beamPathExposure,
	gaussianRadius,
	type BeamAssessment,
	type BeamAssessmentInput,
	type BeamPathResult,
	type BeamPathSpec,
	type InventoryTable,
	type StandardChoice,
	type ViewingCase
} from '$lib/safety';
import { assessFurtherLines } from './lines';
import { readSafety, type SafetyDoc, type SafetyKey } from './safetyDoc';

export const fieldSpecs = {
	wavelength: { label: 'Wavelength', kind: 'length', min_si: 180e-9, max_si: 1e-3 },
	power: { label: 'Power', kind: 'power', above_si: 0, max_si: 1e15 },
	pulseEnergy: { label: 'Pulse energy', kind: 'energy', above_si: 0, max_si: 1e9 },
	pulseWidth: { label: 'Pulse width', kind: 'time', min_si: 1e-13, max_si: 3e4 },
	repRate: { label: 'Repetition rate', kind: 'frequency', above_si: 0, max_si: 1e15 },
	diameter: { label: 'Beam diameter (1/e², at exit)', kind: 'length', above_si: 0, max_si: 10 },
	divergence: { label: 'Divergence (1/e², full angle)', kind: 'angle', above_si: 0, max_si: Math.PI },
	duration: { label: 'Exposure duration', kind: 'time', min_si: 1e-13, max_si: 3e4 },
	sourceAngle: { label: 'Apparent source angle α', kind: 'angle', min_si: 0, max_si: Math.PI },
	opticAperture: { label: 'Objective diameter', kind: 'length', above_si: 0, max_si: 10 },
	opticMagnification: { label: 'Magnification', kind: 'dimensionless', above_si: 0, max_si: 1e4 },
	opticTransmission: { label: 'Transmission', kind: 'dimensionless', above_si: 0, max_si: 1 },
	reflectance: { label: 'Reflectance', kind: 'dimensionless', min_si: 0, max_si: 1 },
	viewingAngle: { label: 'Viewing angle from normal', kind: 'angle', min_si: 0, max_si: Math.PI / 2 }
} satisfies Partial<Record<SafetyKey, FieldSpec>>;

type FieldName = keyof typeof fieldSpecs;

export interface ProfileSeries {
	label: string;
	dash: boolean;
	path: BeamPathResult;
}

export interface BenchBeam {
	ok: boolean;
	message?: string;
	/** The bench setup this beam comes from, named in the results and the printed summary. */
	setupName?: string;
	laserLabel?: string;
	wavelength_m?: number;
	path?: BeamPathSpec;
	exitDiameter_m?: number;
	exitDivergence_rad?: number;
}

export class HazardState {
	#store: SetupStore;
	constructor(store: SetupStore) {
		this.#store = store;
	}

	read = $derived.by(() => readSafety(this.#store.doc.safety));
	s: SafetyDoc = $derived(this.read.doc);

	/** Change one input; typing in one field is one undo step. */
	set<K extends SafetyKey>(key: K, value: SafetyDoc[K]): void {
		this.#store.update((d) => {
			const cur = readSafety(d.safety).doc;
			d.safety = { ...cur, [key]: value };
		}, `safety.${String(key)}`);
	}

	/** Parsed fields (SI) and their messages. Empty optional fields are simply absent. */
	parsed = $derived.by(() => {
		void this.#store.unitsVersion;
		const s = this.s;
		const values: Partial<Record<FieldName, number>> = {};
		const errors: Partial<Record<FieldName, string>> = {};
		const optional = new Set<FieldName>(['duration', 'sourceAngle', 'repRate']);
		const needed = new Set<FieldName>(['wavelength', 'diameter', 'divergence']);
		if (s.beamFrom === 'bench') {
			needed.delete('wavelength');
			needed.delete('diameter');
			needed.delete('divergence');
		}
		if (s.emission === 'cw') needed.add('power');
		else {
			needed.add('pulseEnergy');
			needed.add('pulseWidth');
		}
		if (s.opticOn) ['opticAperture', 'opticMagnification', 'opticTransmission'].forEach((k) => needed.add(k as FieldName));
		if (s.diffuseOn) ['reflectance', 'viewingAngle'].forEach((k) => needed.add(k as FieldName));
		for (const k of Object.keys(fieldSpecs) as FieldName[]) {
			const text = s[k];
			const use = needed.has(k) || (optional.has(k) && text.trim() !== '' && (k !== 'repRate' || s.emission === 'pulsed'));
			if (!use) continue;
			const r = parseQuantity(text, fieldSpecs[k] as FieldSpec);
			if (r.ok) values[k] = r.value_si;
			else errors[k] = r.message;
		}
		return { values, errors };
	});

	/** The bench's beam, when the user chose it. */
	bench: BenchBeam = $derived.by(() => {
		if (this.s.beamFrom !== 'bench') return { ok: false };
		const o = this.#store.outcome;
		const names = { setupName: this.#store.doc.name, laserLabel: this.#store.doc.source.label };
		if (!o.ok) return { ok: false, ...names, message: `The Bench setup “${names.setupName}” has errors; fix them on the Bench to use its beam here.` };
		return { ...benchBeam(o.result), ...names };
	});

	input: BeamAssessmentInput | null = $derived.by(() => {
		const { values: x, errors } = this.parsed;
		if (Object.keys(errors).length) return null;
		const s = this.s;
		const b = this.bench;
		if (s.beamFrom === 'bench' && !b.ok) return null;
		const base = {
			standard: s.standard as StandardChoice,
			wavelength_m: s.beamFrom === 'bench' ? b.wavelength_m! : x.wavelength!,
			diameter_m: s.beamFrom === 'bench' ? b.exitDiameter_m! : x.diameter!,
			fullDivergence_rad: s.beamFrom === 'bench' ? b.exitDivergence_rad! : x.divergence!,
			duration_s: x.duration,
			viewing: s.viewing as ViewingCase,
			alpha_rad: x.sourceAngle,
			optic: s.opticOn ? { objective_m: x.opticAperture!, magnification: x.opticMagnification!, transmission: x.opticTransmission! } : undefined,
			diffuse: s.diffuseOn ? { reflectance: x.reflectance!, viewingAngle_rad: x.viewingAngle! } : undefined
		};
		const emission = s.emission === 'cw' ? { power_W: x.power } : { pulseEnergy_J: x.pulseEnergy, pulseWidth_s: x.pulseWidth, repetitionRate_Hz: x.repRate };
		return { ...base, ...emission };
	});

	/** The assessment, or the engine's reason for refusing the inputs. */
	outcome: { ok: true; a: BeamAssessment } | { ok: false; message: string } = $derived.by(() => {
		const input = this.input;
		if (!input) {
			if (this.s.beamFrom === 'bench' && this.bench.message) return { ok: false, message: this.bench.message };
			return { ok: false, message: 'Fix the marked inputs to see results.' };
		}
		try {
			let a = assessBeam(input);
			const b = this.bench;
			if (this.s.beamFrom === 'bench' && b.path) {
				// Examine the path far enough to hold the formula's distance as well.
				const to = Math.max(b.path.to_m, 1.5 * a.nohdFormula_m + 1, b.path.exitAt_m + 1);
				a = assessBeam({ ...input, path: { ...b.path, to_m: to } });
			}
			return { ok: true, a };
		} catch (e) {
			if (e instanceof RangeError) return { ok: false, message: e.message };
			throw e;
		}
	});

	/** Further lines combined with the main one (null when none are given). */
	lines = $derived.by(() => {
		void this.#store.unitsVersion;
		return assessFurtherLines(this.s.extraLines, this.input, this.s.emission === 'cw', this.s.beamFrom === 'exit');
	});

	/** Exposure ÷ limit along the beam, ready for the plot. */
	profile: ProfileSeries[] = $derived.by(() => {
		const o = this.outcome;
		const input = this.input;
		if (!o.ok || !input) return [];
		const a = o.a;
		const b = this.bench;
		const beam = this.s.beamFrom === 'bench' && b.path ? b.path.beam : gaussianRadius(input.diameter_m, input.fullDivergence_rad);
		const from = this.s.beamFrom === 'bench' && b.path ? b.path.from_m : 0;
		const span = Math.max(a.hazardDistance_m, a.aided?.hazardDistance_m ?? 0, a.diffuse?.distance_m ?? 0);
		const to = Math.max(from + 0.5, 1.25 * span, this.s.beamFrom === 'bench' && b.path ? b.path.to_m : 0);
		const common = { beam, power_W: a.power_W, mpe_W_m2: a.mpe_W_m2, aperture_m: a.limitingAperture_m, from_m: from, to_m: to, samples: 400, peaks_m: b.path?.peaks_m };
		const out: ProfileSeries[] = [{ label: 'naked eye', dash: false, path: beamPathExposure(common) }];
		if (input.optic) out.push({ label: 'through the optic', dash: true, path: beamPathExposure({ ...common, optic: input.optic }) });
		return out;
	});

	/** The whole-lab table for the stored CSV. */
	inventory: InventoryTable | null = $derived.by(() => {
		void this.#store.unitsVersion;
		const csv = this.s.inventoryCsv;
		if (!csv.trim()) return null;
		return assessInventory(csv, this.s.standard as StandardChoice);
	});
}

/**
 * The bench's propagated beam as the safety engine's path: radius per axis from the propagation, the
 * formula's exit aperture at the last element's exit, with the beam's diameter there and the far-field
 * full divergence 2·w0/zR of the last stretch (the axis with the smaller divergence, which gives the
 * longer formula distance).
 */
export function benchBeam(p: Propagation): BenchBeam {
	const last = p.elements[p.elements.length - 1];
	const exitAt = last ? last.z_m + last.length_m : p.start_m;
	const at = beamAt(p, exitAt);
	const ax = at.x.w0_m / at.x.zR_m <= at.y.w0_m / at.y.zR_m ? at.x : at.y;
	const peaks = p.waists.filter((w) => !w.virtual).map((w) => w.z_m);
	return {
		ok: true,
		wavelength_m: p.wavelength_m,
		exitDiameter_m: 2 * ax.w_m,
		exitDivergence_rad: (2 * ax.w0_m) / ax.zR_m,
		path: {
			beam: (z: number) => ({ wx_m: radiusAt(p, z, 'x'), wy_m: radiusAt(p, z, 'y') }),
			from_m: p.start_m,
			to_m: p.end_m,
			peaks_m: peaks,
			exitAt_m: exitAt
		}
	};
}
