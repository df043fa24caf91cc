/**
 * `beamwright fit widths.csv --wavelength 1064nm [--z-unit mm] [--d-unit um] [--weighting relative|plain]`
 * Caustic fit per ISO 11146-1 of measured second-moment diameters; prints per axis d0, z0, full
 * divergence, zR and M² with uncertainties, the measurement-plan check and any flagged lines.
 */
import { readText } from '../readText';
import { CliInputError, allowOnly, optChoice, optString, parseArgs, requireQuantity } from '../args';
import { parseQuantity } from '../../lib/units/parse';
import { parseWidthTable } from '../../lib/io/widthTable';
import { fitWidths, type AxisResult, type Weighting } from '../../lib/optics/iso11146/index';

export const summary = 'Fit d²(z) = a + b·z + c·z² (ISO 11146-1) to measured beam diameters: waist, divergence, Rayleigh length, M², plan check.';
export const usage =
	'npx beamwright fit widths.csv --wavelength 1064nm [--z-unit mm] [--d-unit um] [--weighting relative|plain]\n' +
	'  widths.csv: a header naming columns z and d, or z, dx and dy (second-moment diameters); one line per plane.';

const lengthUnits = 'a length unit such as nm, um, mm, cm, m, in';

/** Metres per unit for a unit name such as "mm" or "um"; the message names the option. */
export function unitScale(option: string, unit: string): number {
	const r = parseQuantity(`1 ${unit}`, { label: option, kind: 'length', above_si: 0 });
	if (!r.ok) throw new CliInputError(`${option}: "${unit}" is not a length unit — accepted: ${lengthUnits}`);
	return r.value_si;
}

function axisJson(r: AxisResult) {
	const f = r.fit;
	if (!f.physical) {
		const out: Record<string, unknown> = { physical: false, reason: f.reason, planes: f.n, a_m2: f.a_m2, b_m: f.b_m, c: f.c };
		// M² below 1: the likely causes, and the hyperbola's figures for diagnosis (not a real beam).
		if (f.likelyCauses) out.likelyCauses = f.likelyCauses;
		if (f.figures) out.figures = { ...f.figures, uncertainty: f.figureUncertainty ?? null };
		return out;
	}
	return {
		physical: true,
		d0_m: f.d0_m,
		z0_m: f.z0_m,
		fullDivergence_rad: f.fullDivergence_rad,
		zR_m: f.zR_m,
		m2: f.m2,
		uncertainty: f.uncertainty,
		planes: f.n,
		weighting: f.weighting,
		rmsRelativeResidual: f.rmsRelativeResidual,
		...(f.note ? { note: f.note } : {})
	};
}

function planJson(r: AxisResult) {
	if (!r.plan) return { ok: false, findings: ['the fit is not physical, so the waist and Rayleigh length that place the zones are unknown; spread planes across the focus and well beyond it'] };
	const p = r.plan;
	return {
		ok: p.ok,
		planes: p.planes,
		withinOneRayleighLength: p.near,
		beyondTwoRayleighLengths: p.far,
		between: p.between,
		findings: p.findings,
		add: p.add.map((s) => ({ zone: s.zone, count: s.count, from_m: s.from_m, to_m: s.to_m, at_m: s.at_m })),
		rule: p.rule
	};
}

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['wavelength', 'z-unit', 'd-unit', 'weighting'], { files: { max: 1, label: 'widths file', example: 'npx beamwright fit widths.csv --wavelength 1064nm' } });
	const file = args.positionals[0];
	if (!file) throw new CliInputError('widths file: required — e.g. npx beamwright fit widths.csv --wavelength 1064nm');
	const wavelength_m = requireQuantity(args, 'wavelength', { kind: 'length', min_si: 100e-9, max_si: 1e-3 }, '1064nm');
	const zUnit = optString(args, 'z-unit', lengthUnits);
	const dUnit = optString(args, 'd-unit', lengthUnits);
	const weighting = optChoice<Weighting>(args, 'weighting', ['relative', 'plain'], 'relative');
	let text: string;
	try {
		text = await readText(file);
	} catch {
		throw new CliInputError(`widths file: cannot read "${file}" — give the path of a CSV file with columns z and d, or z, dx and dy`);
	}
	let table;
	try {
		table = parseWidthTable(text, {
			zUnit_m: zUnit === undefined ? undefined : unitScale('--z-unit', zUnit),
			dUnit_m: dUnit === undefined ? undefined : unitScale('--d-unit', dUnit),
			resolveUnit: (u) => {
				const r = parseQuantity(`1 ${u}`, { label: 'unit', kind: 'length', above_si: 0 });
				return r.ok ? r.value_si : null;
			}
		});
	} catch (e) {
		if (e instanceof RangeError) throw new CliInputError(`${file}: ${e.message}`);
		throw e;
	}
	const flagged = table.flags.map((f) => ({ line: f.line, problem: f.problem, text: f.text }));
	const distinct = new Set(table.rows.map((r) => r.z_m)).size;
	if (distinct < 3) {
		const lines = table.flags.map((f) => f.line).join(', ');
		throw new CliInputError(
			`${file}: a fit needs at least 3 planes at different z — got ${distinct} usable${table.flags.length ? ` (${table.flags.length} line${table.flags.length === 1 ? '' : 's'} flagged: ${lines}; first: line ${table.flags[0].line}: ${table.flags[0].problem})` : ''}`
		);
	}
	const result = fitWidths(table.rows, table.columns, { wavelength_m, weighting });
	const out: Record<string, unknown> = {};
	const plan: Record<string, unknown> = {};
	for (const [name, r] of Object.entries(result.axes)) {
		out[name] = axisJson(r!);
		plan[name] = planJson(r!);
	}
	out.plan = plan;
	out.wavelength_m = wavelength_m;
	out.units = { z_m_per_unit: table.zUnit_m, d_m_per_unit: table.dUnit_m };
	out.flagged = flagged;
	if (table.notes.length) out.notes = table.notes;
	return out;
}
