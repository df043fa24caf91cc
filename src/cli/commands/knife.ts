/**
 * `beamwright knife scan.csv [--kind knife|slit] [--x-unit mm] [--p-unit W]`
 * Beam radius and second-moment diameter from a knife-edge (or slit) scan of power against blade
 * position along one axis: error-function (or Gaussian) least-squares fit with uncertainties, and the
 * 10/90 % and 16/84 % clip distances converted to D4σ with the Gaussian factors.
 */
import { readText } from '../readText';
import { CliInputError, allowOnly, optChoice, optString, parseArgs } from '../args';
import { parseQuantity } from '../../lib/units/parse';
import { parseScanTable } from '../../lib/io/scanTable';
import { fitKnifeEdge, MIN_SCAN_POINTS, type ScanKind } from '../../lib/optics/iso11146/knifeEdge';
import { unitScale } from './fit';

export const summary = 'Beam radius w (1/e²), D4σ diameter, centre and 10/90 % clip distance from a knife-edge or slit scan (x, P).';
export const usage =
	'npx beamwright knife scan.csv [--kind knife|slit] [--x-unit mm] [--p-unit W]\n' +
	'  scan.csv: a header naming columns x and P, units in brackets, e.g. "x (mm),P (mW)"; one line per blade position.';

function powerScale(option: string, unit: string): number {
	const r = parseQuantity(`1 ${unit}`, { label: option, kind: 'power', above_si: 0 });
	if (!r.ok) throw new CliInputError(`${option}: "${unit}" is not a power unit — accepted: W, mW, uW, nW`);
	return r.value_si;
}

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['kind', 'x-unit', 'p-unit'], { files: { max: 1, label: 'scan file', example: 'npx beamwright knife scan.csv' } });
	const file = args.positionals[0];
	if (!file) throw new CliInputError('scan file: required — e.g. npx beamwright knife scan.csv');
	const kind = optChoice<ScanKind>(args, 'kind', ['knife', 'slit'], 'knife');
	const xUnit = optString(args, 'x-unit');
	const pUnit = optString(args, 'p-unit');
	let text: string;
	try {
		text = await readText(file);
	} catch {
		throw new CliInputError(`scan file: cannot read "${file}" — give the path of a CSV file with columns x and P`);
	}
	let table;
	try {
		table = parseScanTable(text, {
			xUnit_m: xUnit === undefined ? undefined : unitScale('--x-unit', xUnit),
			pUnit_W: pUnit === undefined ? undefined : powerScale('--p-unit', pUnit),
			resolveUnit: (u, k) => {
				const r = parseQuantity(`1 ${u}`, { label: 'unit', kind: k, above_si: 0 });
				return r.ok ? r.value_si : null;
			}
		});
	} catch (e) {
		if (e instanceof RangeError) throw new CliInputError(`${file}: ${e.message}`);
		throw e;
	}
	if (table.points.length < MIN_SCAN_POINTS) {
		const f = table.flags[0];
		throw new CliInputError(
			`${file}: a scan needs at least ${MIN_SCAN_POINTS} readable lines — got ${table.points.length}${f ? ` (${table.flags.length} flagged; first: line ${f.line}: ${f.problem})` : ''}`
		);
	}
	let r;
	try {
		r = fitKnifeEdge(table.points, kind);
	} catch (e) {
		if (e instanceof RangeError) throw new CliInputError(`${file}: ${e.message}`);
		throw e;
	}
	return {
		kind: r.kind,
		w_m: r.w_m,
		d4sigma_m: r.d4sigma_m,
		d4sigmaFrom: r.d4sigmaFrom,
		center_m: r.center_m,
		clip10_90_m: r.clip10_90_m,
		clip16_84_m: r.clip16_84_m,
		uncertainty: r.uncertainty,
		residualRms_W: r.residualRms_W,
		baseline_W: r.baseline_W,
		amplitude_W: r.amplitude_W,
		points: r.points,
		warnings: r.warnings,
		flagged: table.flags,
		notes: table.notes,
		factors: {
			clip10_90_to_d4sigma: 1.5606,
			source: 'Gaussian beam: D4σ = 2·Δx/Φ⁻¹(1 − p) for the clip pair p, 1 − p (Siegman, Sasnett & Johnston 1991, IEEE J. Quantum Electron. 27, 1098)'
		}
	};
}
