/**
 * Turn a setup document (text with units) into engine input (SI numbers), collecting every field
 * error with the path of the field, so the UI can show each message beside its input.
 */
import { parseQuantity, type FieldSpec } from '../units/parse';
import type { AxisSource, AxisSourceSpec, SourceSpec } from '../optics/source';
import type { TrainElement, TrainInput } from '../optics/train';
import { kindByName, parseParam } from './elementKinds';
import { autoPlotEnd } from './plotRange';
import type { AxisSourceDoc, SetupDoc } from './schema';

export interface FieldError {
	/** e.g. "source.wavelength", "source.x.waist", "elements.<id>.f", "elements.<id>.at" */
	path: string;
	message: string;
}

/** `autoEnd`: "Plot to" was left empty and `input.end_m` is the automatic end (plotRange.ts). */
export type Compiled = { ok: true; input: TrainInput; autoEnd?: boolean } | { ok: false; errors: FieldError[] };

export const sourceFields = {
	wavelength: { label: 'Wavelength', kind: 'length', min_si: 100e-9, max_si: 1e-3 },
	index: { label: 'Medium index', kind: 'dimensionless', min_si: 1, max_si: 5 },
	m2: { label: 'M²', kind: 'dimensionless', min_si: 1, max_si: 1000 },
	waist: { label: 'Waist radius', kind: 'length', above_si: 0, max_si: 1 },
	waistAt: { label: 'Waist location', kind: 'length', min_si: -1e3, max_si: 1e3 },
	diameter: { label: 'Beam diameter', kind: 'length', above_si: 0, max_si: 2 },
	at: { label: 'Measured at', kind: 'length', min_si: -1e3, max_si: 1e3 },
	fullDivergence: { label: 'Full divergence', kind: 'angle', above_si: 0, max_si: 1 },
	d1: { label: 'Diameter 1', kind: 'length', above_si: 0, max_si: 2 },
	z1: { label: 'Plane 1', kind: 'length', min_si: -1e3, max_si: 1e3 },
	d2: { label: 'Diameter 2', kind: 'length', above_si: 0, max_si: 2 },
	z2: { label: 'Plane 2', kind: 'length', min_si: -1e3, max_si: 1e3 }
} satisfies Record<string, FieldSpec>;

export const positionField: FieldSpec = { label: 'Position', kind: 'length', min_si: -1e3, max_si: 1e3 };
export const apertureField: FieldSpec = { label: 'Clear aperture', kind: 'length', above_si: 0, max_si: 10 };
export const endField: FieldSpec = { label: 'Plot to', kind: 'length', above_si: 0, max_si: 1e4 };

function collect(errors: FieldError[], path: string, text: string, spec: FieldSpec): number {
	const r = parseQuantity(text, spec);
	if (!r.ok) {
		errors.push({ path, message: r.message });
		return NaN;
	}
	return r.value_si;
}

function compileAxis(errors: FieldError[], prefix: string, a: AxisSourceDoc): AxisSource {
	const f = sourceFields;
	const m2 = collect(errors, `${prefix}.m2`, a.m2, f.m2);
	let spec: AxisSourceSpec;
	if (a.kind === 'waist') {
		spec = { kind: 'waist', w0_m: collect(errors, `${prefix}.waist`, a.waist, f.waist), z0_m: collect(errors, `${prefix}.waistAt`, a.waistAt, f.waistAt) };
	} else if (a.kind === 'divergence') {
		spec = {
			kind: 'divergence',
			d_m: collect(errors, `${prefix}.diameter`, a.diameter, f.diameter),
			at_m: collect(errors, `${prefix}.at`, a.at, f.at),
			fullDivergence_rad: collect(errors, `${prefix}.fullDivergence`, a.fullDivergence, f.fullDivergence),
			converging: a.converging
		};
	} else {
		spec = {
			kind: 'twoDiameters',
			d1_m: collect(errors, `${prefix}.d1`, a.d1, f.d1),
			z1_m: collect(errors, `${prefix}.z1`, a.z1, f.z1),
			d2_m: collect(errors, `${prefix}.d2`, a.d2, f.d2),
			z2_m: collect(errors, `${prefix}.z2`, a.z2, f.z2)
		};
	}
	return { m2, spec };
}

/** Compile the source section alone (used by workspaces that need only the beam). */
export function compileSource(doc: SetupDoc, errors: FieldError[] = []): SourceSpec {
	const s = doc.source;
	const wavelength_m = collect(errors, 'source.wavelength', s.wavelength, sourceFields.wavelength);
	const index = collect(errors, 'source.index', s.index, sourceFields.index);
	const x = compileAxis(errors, 'source.x', s.x);
	const y = s.astigmatic ? compileAxis(errors, 'source.y', s.y) : x;
	return { wavelength_m, index, x, y };
}

/** Compile the whole setup; errors name each field's path and the accepted range. */
export function compileSetup(doc: SetupDoc): Compiled {
	const errors: FieldError[] = [];
	const source = compileSource(doc, errors);
	const elements: TrainElement[] = [];
	for (const e of doc.elements) {
		const def = kindByName[e.kind];
		const values: Record<string, number | string> = {};
		for (const p of def.params) {
			const r = parseParam(p, e.params[p.key] ?? '');
			if (r.ok) values[p.key] = r.value;
			else errors.push({ path: `elements.${e.id}.${p.key}`, message: `${e.label || def.name}: ${r.message}` });
		}
		const z = collect(errors, `elements.${e.id}.at`, e.at, { ...positionField, label: `${e.label || def.name} position` });
		let aperture: number | null = null;
		if (e.aperture.trim() !== '') aperture = collect(errors, `elements.${e.id}.aperture`, e.aperture, { ...apertureField, label: `${e.label || def.name} clear aperture` });
		if (errors.length === 0) elements.push({ id: e.id, label: e.label || def.name, z_m: z, aperture_m: aperture, spec: def.build(values) });
	}
	// An empty "Plot to" means automatic: past the last element to the last real waist.
	const autoEnd = doc.view.end.trim() === '';
	const end_m = autoEnd ? 0 : collect(errors, 'view.end', doc.view.end, endField);
	if (errors.length) return { ok: false, errors };
	if (autoEnd) return { ok: true, input: { source, elements, end_m: autoPlotEnd({ source, elements, end_m }) }, autoEnd };
	return { ok: true, input: { source, elements, end_m } };
}
