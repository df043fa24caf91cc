import { allowOnly, CliInputError, optChoice, optInteger, parseArgs } from '../args';
import { compileSource, type FieldError } from '../../lib/document/compile';
import { readSetupFile } from '../setupFile';
import { searchMatches } from '../../lib/optics/solve';
import { compileMatch } from '../../lib/document/match';

export const summary = 'Mode matching from the lens inventory of a setup document’s "match" section: ranked lens placements, efficiency, tolerances.';
export const usage = 'npx beamwright match setup.json [--rank robust|efficiency|tolerance|length] [--top 10]';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['rank', 'top'], { files: { max: 1, label: 'setup', example: 'npx beamwright match setup.json' } });
	const file = args.positionals[0];
	const doc = await readSetupFile(file, 'match');
	if (!doc.match) throw new CliInputError(`setup: ${file} has no "match" section (target, inventory, rail)`);
	const errs: FieldError[] = [];
	const source = compileSource(doc, errs);
	if (errs.length) throw new CliInputError(`setup: ${errs[0].path}: ${errs[0].message}`);
	const c = compileMatch(doc.match, source);
	if (!c.ok) throw new CliInputError(`setup: ${c.errors[0]}`);
	const rank = optChoice(args, 'rank', ['robust', 'efficiency', 'tolerance', 'length'] as const, (c.problem.rankBy ?? 'robust') as 'robust');
	const top = optInteger(args, 'top', 1, 100, 10);
	const solutions = searchMatches({ ...c.problem, rankBy: rank, keep: top });
	return {
		target: c.problem.target.what,
		rankedBy: rank,
		efficiencyMeans: 'TEM00 overlap of the embedded Gaussian with the target × aperture transmission (the same at every plane); fundamentalModePower = efficiency × 2/(1+M²x) × 2/(1+M²y), the power of the fundamental mode of a Gaussian Schell-model beam coupled in',
		solutions: solutions.map((s, i) => ({
			rank: i + 1,
			efficiency: s.efficiency,
			fundamentalModePower: s.fundamentalModePower,
			fundamentalFraction: s.fundamentalFraction,
			couplingX: s.couplingX,
			couplingY: s.couplingY,
			transmitted: s.transmitted,
			sensitivity: s.sensitivity,
			length_m: s.length_m,
			targetTolerance: s.targetTolerance,
			lenses: s.lenses.map((l) => ({ label: l.label, f_m: l.f_m, z_m: l.z_m, lossPer1mm: l.positionLoss, lossPer1pctFocal: l.focalLoss, shiftFor1pct_m: l.shiftFor1pct_m }))
		}))
	};
}
