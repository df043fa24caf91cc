/**
 * `npx beamwright hazard`: hazard distances and eyewear OD for one beam, or the whole-lab table from a
 * CSV (`--inventory lasers.csv [--format csv]`). JSON (or CSV) with the caution.
 */
import { readText } from '../readText';
import { allowOnly, CliInputError, optAll, optChoice, optQuantity, optString, parseArgs, requireQuantity } from '../args';
import { assessBeam } from '../../lib/safety/assess';
import { assessLines, type LaserLine } from '../../lib/safety/lines';
import { parseQuantity } from '../../lib/units/parse';
import { viewingCases } from '../../lib/safety/exposure';
import { assessInventory, inventoryColumns, inventoryToCsv } from '../../lib/safety/inventory';
import { standardChoices } from '../../lib/safety/limits/index';
import { durationSpec, wavelengthSpec } from './mpe';

export const summary = 'Laser hazard distances (NOHD by formula and along the beam), eyewear OD, aided viewing and diffuse reflection — or a whole-lab table from a CSV. A first-pass estimate.';
export const usage = [
	'npx beamwright hazard --standard eu-2006-25|iec-60825-1-2014|stricter --wavelength 514.5nm --power 5W --diameter 2.83mm --divergence 1.41mrad [--duration 0.25s | --viewing accidental|worst-case|deliberate]',
	'      [--pulse-energy 1mJ --pulse-width 10ns [--repetition-rate 10Hz]] [--source-angle 1.5mrad]',
	'   or several lines in one beam: --line 532nm:2W --line 1064nm:50mW … (instead of --wavelength and --power; continuous lines)',
	'      [--optic-aperture 50mm --optic-magnification 7 --optic-transmission 0.9] [--reflectance 0.9 [--viewing-angle 0deg]]',
	'   or: npx beamwright hazard --inventory lasers.csv [--standard …] [--format json|csv]',
	`      CSV columns (header line, any order): ${inventoryColumns.map((c) => (c.required ? c.name + '*' : c.name)).join(', ')} (* needed); a bare number takes the column's default unit (nm, W, J, s, Hz, mm, mrad)`
].join('\n');

const single = ['line', 'standard', 'wavelength', 'power', 'pulse-energy', 'pulse-width', 'repetition-rate', 'diameter', 'divergence', 'duration', 'viewing', 'source-angle', 'optic-aperture', 'optic-magnification', 'optic-transmission', 'reflectance', 'viewing-angle'];

async function inventory(argv: ReturnType<typeof parseArgs>) {
	allowOnly(argv, ['inventory', 'standard', 'format']);
	const path = optString(argv, 'inventory', 'the path of a CSV file, e.g. --inventory lasers.csv')!;
	const standard = optChoice(argv, 'standard', standardChoices, 'stricter');
	const format = optChoice(argv, 'format', ['json', 'csv'] as const, 'json');
	let text: string;
	try {
		text = await readText(path);
	} catch (e) {
		throw new CliInputError(`--inventory: cannot read "${path}" — ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
	}
	const table = assessInventory(text, standard);
	if (table.refused || table.rows.length === 0) {
		const first = table.issues[0];
		throw new CliInputError(`--inventory: no laser could be read from "${path}"${first ? ` — line ${first.line}: ${first.message}` : ''}`);
	}
	if (format === 'csv') return inventoryToCsv(table);
	return {
		standard: table.standard,
		lasers: table.rows.map((r) =>
			r.ok
				? {
						line: r.line,
						name: r.name,
						room: r.room,
						ok: true,
						wavelength_m: r.result.wavelength_m,
						emission: r.result.emission,
						exposure_s: r.result.exposure.duration_s,
						exposureBasis: r.result.exposure.basis,
						standardId: r.result.standardId,
						provenance: r.result.provenance,
						limitSource: r.result.limitSource,
						mpe_W_m2: r.result.mpe_W_m2,
						mpe_J_m2: r.result.mpe_J_m2,
						rule: r.result.rule,
						limitingAperture_m: r.result.limitingAperture_m,
						nohdFormula_m: r.result.nohdFormula_m,
						nohd_m: r.result.nohd_m,
						hazardDistance_m: r.result.hazardDistance_m,
						odRequired: r.result.odRequired,
						odWhole: r.result.odWhole,
						note: r.note
					}
				: { line: r.line, name: r.name, room: r.room, ok: false, message: r.message, note: r.note }
		),
		issues: table.issues,
		caution: table.caution
	};
}

/** Parse one `--line WAVELENGTH:POWER` value; the message names the option, the value and the accepted form. */
export function parseLine(text: string, n: number): LaserLine {
	const accepted = 'WAVELENGTH:POWER, e.g. 532nm:2W — wavelength 180 nm–1 mm, power > 0';
	const k = text.lastIndexOf(':');
	if (k <= 0 || k === text.length - 1) throw new CliInputError(`--line (${n}): "${text}" is not WAVELENGTH:POWER — accepted: ${accepted}`);
	const read = (part: string, spec: Parameters<typeof parseQuantity>[1]): number => {
		const r = parseQuantity(part, spec);
		if (r.ok) return r.value_si;
		if (r.pending) throw new CliInputError(r.message); // main() loads the unit engine and runs again
		throw new CliInputError(`--line (${n}) "${text}": ${r.message} — accepted: ${accepted}`);
	};
	const wavelength_m = read(text.slice(0, k), { label: 'wavelength', kind: 'length', min_si: wavelengthSpec.min_si, max_si: wavelengthSpec.max_si });
	const power_W = read(text.slice(k + 1), { label: 'power', kind: 'power', above_si: 0, max_si: 1e15 });
	return { wavelength_m, power_W };
}

async function severalLines(args: ReturnType<typeof parseArgs>, standard: (typeof standardChoices)[number], texts: string[]) {
	for (const o of ['wavelength', 'power', 'pulse-energy', 'pulse-width', 'repetition-rate', 'optic-aperture', 'optic-magnification', 'optic-transmission', 'reflectance', 'viewing-angle'])
		if (args.options.has(o)) throw new CliInputError(`--${o}: not taken with --line — each --line gives its wavelength and continuous power (WAVELENGTH:POWER)`);
	const lines = texts.map((t, i) => parseLine(t, i + 1));
	const diameter_m = requireQuantity(args, 'diameter', { kind: 'length', above_si: 0, max_si: 10 }, '2.83mm');
	const fullDivergence_rad = requireQuantity(args, 'divergence', { kind: 'angle', above_si: 0, max_si: Math.PI }, '1.41mrad');
	const duration_s = optQuantity(args, 'duration', durationSpec);
	if (duration_s !== undefined && args.options.has('viewing')) throw new CliInputError('--viewing: sets the default duration — give it or --duration, not both');
	const viewing = optChoice(args, 'viewing', viewingCases, 'accidental');
	const alpha_rad = optQuantity(args, 'source-angle', { kind: 'angle', min_si: 0, max_si: Math.PI });
	const r = assessLines({ standard, diameter_m, fullDivergence_rad, duration_s, viewing, alpha_rad }, lines);
	return {
		lines: r.lines.map(({ line, eyeTissue, result: a }) => ({
			wavelength_m: line.wavelength_m,
			power_W: line.power_W,
			eyeTissue,
			standardId: a.standardId,
			exposure_s: a.exposure.duration_s,
			mpe_W_m2: a.mpe_W_m2,
			limitingAperture_m: a.limitingAperture_m,
			nohd_m: a.nohd_m,
			hazardDistance_m: a.hazardDistance_m,
			odRequired: a.odRequired,
			odWhole: a.odWhole,
			skin: a.skin,
			provenance: a.provenance,
			limitSource: a.limitSource,
			provenanceLine: a.provenanceLine
		})),
		combined: r.combined,
		tissueSource: r.tissueSource,
		additivityClause: r.additivityClause,
		notes: ['Each line is evaluated on its own; lines acting on the same tissue are combined (sum of exposure ÷ limit ≤ 1). Eyewear must give each line its own OD at its wavelength.'],
		caution: r.caution
	};
}

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	if (args.options.has('inventory')) return inventory(args);
	allowOnly(args, single, { repeatable: ['line'] });
	const standard = optChoice(args, 'standard', standardChoices, 'stricter');
	const lineTexts = optAll(args, 'line', 'WAVELENGTH:POWER, e.g. 532nm:2W (180 nm–1 mm, power > 0)');
	if (lineTexts.length) return severalLines(args, standard, lineTexts);
	const wavelength_m = requireQuantity(args, 'wavelength', wavelengthSpec, '514.5nm');
	const power_W = optQuantity(args, 'power', { kind: 'power', above_si: 0, max_si: 1e15 }, '5W');
	const pulseEnergy_J = optQuantity(args, 'pulse-energy', { kind: 'energy', above_si: 0, max_si: 1e9 }, '1mJ');
	const pulseWidth_s = optQuantity(args, 'pulse-width', { kind: 'time', min_si: 1e-13, max_si: 3e4 }, '10ns');
	const repetitionRate_Hz = optQuantity(args, 'repetition-rate', { kind: 'frequency', above_si: 0, max_si: 1e15 }, '10Hz');
	if (power_W === undefined && pulseEnergy_J === undefined) throw new CliInputError('--power: required — e.g. --power 5W (or --pulse-energy 1mJ --pulse-width 10ns for a pulsed laser)');
	if (power_W !== undefined && (pulseEnergy_J !== undefined || pulseWidth_s !== undefined || repetitionRate_Hz !== undefined))
		throw new CliInputError('--power: give either --power (CW) or --pulse-energy with --pulse-width [--repetition-rate], not both');
	if (pulseEnergy_J !== undefined && pulseWidth_s === undefined) throw new CliInputError('--pulse-width: required with --pulse-energy — e.g. --pulse-width 10ns');
	if (pulseEnergy_J === undefined && (pulseWidth_s !== undefined || repetitionRate_Hz !== undefined)) throw new CliInputError('--pulse-energy: required with --pulse-width/--repetition-rate — e.g. --pulse-energy 1mJ');
	const diameter_m = requireQuantity(args, 'diameter', { kind: 'length', above_si: 0, max_si: 10 }, '2.83mm');
	const fullDivergence_rad = requireQuantity(args, 'divergence', { kind: 'angle', above_si: 0, max_si: Math.PI }, '1.41mrad');
	const duration_s = optQuantity(args, 'duration', durationSpec, '0.25s');
	if (duration_s !== undefined && pulseEnergy_J !== undefined && repetitionRate_Hz === undefined)
		throw new CliInputError('--duration: a single pulse is exposed for its width — leave --duration out, or give --repetition-rate for a pulse train');
	if (duration_s !== undefined && args.options.has('viewing')) throw new CliInputError('--viewing: sets the default duration — give it or --duration, not both');
	const viewing = optChoice(args, 'viewing', viewingCases, 'accidental');
	const alpha_rad = optQuantity(args, 'source-angle', { kind: 'angle', min_si: 0, max_si: Math.PI }, '1.5mrad');
	const oa = optQuantity(args, 'optic-aperture', { kind: 'length', above_si: 0, max_si: 10 }, '50mm');
	const om = optQuantity(args, 'optic-magnification', { kind: 'dimensionless', above_si: 0, max_si: 1e4 }, '7');
	const ot = optQuantity(args, 'optic-transmission', { kind: 'dimensionless', above_si: 0, max_si: 1 }, '0.9');
	const opticGiven = [oa, om].filter((x) => x !== undefined).length;
	if (opticGiven === 1) throw new CliInputError(`--${oa === undefined ? 'optic-aperture' : 'optic-magnification'}: required with the other optic option — e.g. --optic-aperture 50mm --optic-magnification 7`);
	const optic = oa !== undefined && om !== undefined ? { objective_m: oa, magnification: om, transmission: ot ?? 1 } : undefined;
	const reflectance = optQuantity(args, 'reflectance', { kind: 'dimensionless', min_si: 0, max_si: 1 }, '0.9');
	const viewingAngle_rad = optQuantity(args, 'viewing-angle', { kind: 'angle', min_si: 0, max_si: Math.PI / 2 }, '0deg');
	if (viewingAngle_rad !== undefined && reflectance === undefined) throw new CliInputError('--reflectance: required with --viewing-angle — e.g. --reflectance 0.9');
	const diffuse = reflectance !== undefined ? { reflectance, viewingAngle_rad: viewingAngle_rad ?? 0 } : undefined;
	const a = assessBeam({ standard, wavelength_m, power_W, pulseEnergy_J, pulseWidth_s, repetitionRate_Hz, diameter_m, fullDivergence_rad, duration_s, viewing, alpha_rad, optic, diffuse });
	return {
		mpe_W_m2: a.mpe_W_m2,
		nohdFormula_m: a.nohdFormula_m,
		nohd_m: a.nohd_m,
		odRequired: a.odRequired,
		odWhole: a.odWhole,
		eyewear: a.eyewear,
		skin: a.skin,
		hazardDistance_m: a.hazardDistance_m,
		hazardDistanceFrom: a.hazardDistanceFrom,
		mpe_J_m2: a.mpe_J_m2,
		limitingAperture_m: a.limitingAperture_m,
		rule: a.rule,
		mechanism: a.mechanism,
		limitSource: a.limitSource,
		provenance: a.provenance,
		provenanceLine: a.provenanceLine,
		factors: a.factors,
		pulseRules: a.pulseRules,
		standard: a.standard,
		standardId: a.standardId,
		wavelength_m: a.wavelength_m,
		emission: a.emission,
		power_W: a.power_W,
		exposure: a.exposure,
		exit: a.exit,
		odAt_m: a.odAt_m,
		aided: a.aided,
		diffuse: a.diffuse,
		notes: [
			'nohd_m: aperture-averaged, along the beam propagated from its waist at the exit aperture; nohdFormula_m: far-field formula with 1/e diameter and divergence (d/√2, Θ/√2); hazardDistance_m is the larger.',
			...a.notes
		],
		caution: a.caution
	};
}
