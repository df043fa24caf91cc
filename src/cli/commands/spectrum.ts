import { allowOnly, optInteger, parseArgs } from '../args';
import { readSetupFile } from '../setupFile';
import { compileLabForCli } from './labShared';

export const summary = 'Cavity spectrum for the setup’s beam into its match-target cavity: FSR, round-trip Gouy phase and transverse-mode spacing per axis, finesse, linewidth, and each TEM_mn with its frequency and injected power fraction.';
export const usage = 'npx beamwright spectrum setup.json [--max-order 4]   (reflectivities and loss from match.lab; defaults 99 %, 99 %, 0 %)';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['max-order'], { files: { max: 1, label: 'setup', example: 'npx beamwright spectrum setup.json' } });
	const maxOrder = optInteger(args, 'max-order', 0, 6, 4);
	const doc = await readSetupFile(args.positionals[0], 'spectrum');
	const { report } = compileLabForCli(doc, args.positionals[0]);
	const s = report.spectrum!;
	const c = report.content!;
	const power = (m: number, n: number) => c.x.fractions[m] * c.y.fractions[n];
	return {
		fsr_Hz: s.fsr_Hz,
		gouy_rad: s.gouy_rad,
		transverseSpacing_Hz: s.transverseSpacing_Hz,
		finesse: s.finesse,
		linewidth_Hz: s.linewidth_Hz,
		modes: s.modes.filter((m) => m.m + m.n <= maxOrder).map((m) => ({ m: m.m, n: m.n, frequency_Hz: m.frequency_Hz, power: power(m.m, m.n), folded_Hz: m.folded_Hz })),
		peakTransmission: s.peakTransmission,
		warnings: [...s.warnings, ...(c.caveat ? [c.caveat] : [])]
	};
}
